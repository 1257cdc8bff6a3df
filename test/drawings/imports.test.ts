/**
 * The drawings are shared by the pane (src/taskpane) and the report (src/report), and owned by
 * neither: every module in src/drawings imports only other drawing modules or the pure engine
 * (src/engine), never the pane, the report, the CLI, the workbook adapters, Node, React or Office.
 * The scan reads the source text, so a new file or a new import is covered without a list here.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative, resolve, sep } from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = resolve(__dirname, "..", "..");
const DRAWINGS = join(ROOT, "src", "drawings");
const ALLOWED = [join(ROOT, "src", "drawings"), join(ROOT, "src", "engine")];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

/** Every module specifier in a source text: static imports and re-exports, dynamic import(), require(). */
function specifiers(text: string): string[] {
  const found: string[] = [];
  const patterns = [
    /\b(?:import|export)\s[^'";]*?\bfrom\s*["']([^"']+)["']/g,
    /\bimport\s*["']([^"']+)["']/g,
    /\bimport\s*\(\s*["']([^"']+)["']\s*\)/g,
    /\brequire\s*\(\s*["']([^"']+)["']\s*\)/g,
  ];
  for (const re of patterns) for (const m of text.matchAll(re)) found.push(m[1]!);
  return found;
}

/** The specifiers of one file that leave the allowed folders (bare packages always do). */
function forbidden(file: string, text: string): string[] {
  return specifiers(text).filter((spec) => {
    if (!spec.startsWith(".")) return true;
    const target = resolve(dirname(file), spec);
    return !ALLOWED.some((dir) => target === dir || target.startsWith(dir + sep));
  });
}

describe("src/drawings imports only itself and the pure engine", () => {
  const files = sourceFiles(DRAWINGS);

  it("finds the drawing modules and their imports", () => {
    expect(files.length).toBeGreaterThan(10);
    const all = files.flatMap((f) => specifiers(readFileSync(f, "utf8")));
    expect(all).toContain("./svg");
    expect(all.some((s) => s.startsWith("../engine/"))).toBe(true);
  });

  it("no drawing module imports the pane, the report, the CLI, Node, React or Office", () => {
    const bad = files.flatMap((f) => forbidden(f, readFileSync(f, "utf8")).map((s) => `${relative(ROOT, f)}: ${s}`));
    expect(bad).toEqual([]);
  });

  it("the scan flags what it must (imports written the ways TypeScript allows)", () => {
    const file = join(DRAWINGS, "example.ts");
    const text = [
      'import { x } from "../taskpane/session";',
      "import type { Y } from '../report/collect';",
      'export { z } from "../cli/shared";',
      'import "react";',
      'const f = await import("node:fs");',
      'const g = require("../workbook/port");',
      'import {\n  a,\n  b,\n} from "../taskpane/diagrams";',
      'import { ok } from "./svg";',
      'import type { BeamSolution } from "../engine/beam/types";',
    ].join("\n");
    expect(forbidden(file, text)).toEqual([
      "../taskpane/session",
      "../report/collect",
      "../cli/shared",
      "../taskpane/diagrams",
      "react",
      "node:fs",
      "../workbook/port",
    ]);
  });
});
