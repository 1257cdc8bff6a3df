/**
 * The built bundle against its metadata, the way Excel loads them: every @customfunction in the
 * sources has an entry in dist/functions.json, every entry has a function associated by
 * dist/functions.js, and a mismatch makes the headless loader fail with a message instead of
 * leaving #NAME? in a cell. Needs `npm run build` (npm test builds first).
 */
import { copyFileSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { BundleLoadError, defaultDistDir, loadFunctionsBundle, type FunctionMetadata } from "../../src/workbook/headless";
import { SPILL_RULES } from "../../src/functions/spill";

const dist = defaultDistDir();
const metadata = (JSON.parse(readFileSync(join(dist, "functions.json"), "utf8")) as { functions: FunctionMetadata[] }).functions;

/** Ids declared with @customfunction in the sources, read from the files themselves. */
function declaredIds(): string[] {
  const dir = resolve(__dirname, "../../src/functions");
  return readdirSync(dir)
    .filter((f) => f.endsWith(".ts"))
    .flatMap((f) => [...readFileSync(join(dir, f), "utf8").matchAll(/^\s*\*\s*@customfunction\s+([A-Za-z0-9_.]+)\s*$/gm)].map((m) => m[1]!.toUpperCase()));
}

const BEAM_IDS = ["REACTIONS", "REACTION", "SHEAR_MAX", "MOMENT_MAX", "MOMENT_MIN", "SHEAR_AT", "MOMENT_AT", "DEFLECTION_MAX", "DEFLECTION_AT", "REQUIRED_I", "DIAGRAM"];

describe("functions.json and functions.js agree", () => {
  it("every @customfunction in the sources has metadata, and nothing else is listed", () => {
    expect(metadata.map((f) => f.id.toUpperCase()).sort()).toEqual(declaredIds().sort());
  });
  it("the beam functions of docs/interface.md section 1 are all there, with their arguments in order", () => {
    const byId = new Map(metadata.map((f) => [f.id, f]));
    for (const id of BEAM_IDS) expect(byId.has(id), id).toBe(true);
    const names = (id: string) => byId.get(id)!.parameters.map((p) => (p.optional ? `[${p.name}]` : p.name)).join(", ");
    expect(names("REACTIONS")).toBe("span, loads, [supports], [what]");
    expect(names("REACTION")).toBe("span, loads, index, [supports]");
    expect(names("SHEAR_AT")).toBe("span, loads, x, [supports]");
    expect(names("DEFLECTION_MAX")).toBe("span, loads, E, I, units, [supports]");
    expect(names("DEFLECTION_AT")).toBe("span, loads, E, I, units, x, [supports]");
    expect(names("REQUIRED_I")).toBe("span, loads, E, ratio, units, [supports]");
    expect(names("DIAGRAM")).toBe("span, loads, [supports], [stations]");
  });
  it("ranges are matrix parameters; spilling functions have matrix results and a spill rule", () => {
    for (const f of metadata.filter((m) => BEAM_IDS.includes(m.id))) {
      for (const p of f.parameters) expect(p.dimensionality === "matrix", `${f.id}.${p.name}`).toBe(p.name === "loads" || p.name === "supports");
      const spills = f.result.dimensionality === "matrix";
      expect(spills, f.id).toBe(f.id === "REACTIONS" || f.id === "DIAGRAM");
      if (spills) expect(SPILL_RULES[f.id], f.id).toBeDefined();
    }
  });
  it("every entry has help text for the user and for each argument", () => {
    for (const f of metadata) {
      expect((f.description ?? "").length, f.id).toBeGreaterThan(20);
      for (const p of f.parameters) expect((p.description ?? "").length, `${f.id}.${p.name}`).toBeGreaterThan(3);
    }
  });
  it("every entry has an associated function and every associated function an entry", () => {
    const bundle = loadFunctionsBundle(dist);
    expect([...bundle.functions.keys()].sort()).toEqual(metadata.map((f) => f.id.toUpperCase()).sort());
    expect(bundle.functions.get("MOMENT_MAX")!(24, [[1.5]], null)).toBe((1.5 * 24 * 24) / 8); // AISC Table 3-23, case 1
  });
});

describe("a metadata mistake fails loading with a message", () => {
  function brokenDist(edit: (functions: FunctionMetadata[]) => FunctionMetadata[]): string {
    const dir = mkdtempSync(join(tmpdir(), "loadpath-dist-"));
    copyFileSync(join(dist, "functions.js"), join(dir, "functions.js"));
    writeFileSync(join(dir, "functions.json"), JSON.stringify({ functions: edit(metadata.map((f) => ({ ...f }))) }));
    return dir;
  }
  it("an id in functions.json with no associated function", () => {
    const dir = brokenDist((fs) => [...fs, { ...fs[0]!, id: "MOMENT_MAXIMUM", name: "MOMENT_MAXIMUM" }]);
    expect(() => loadFunctionsBundle(dir)).toThrow(BundleLoadError);
    expect(() => loadFunctionsBundle(dir)).toThrow(/functions.json lists MOMENT_MAXIMUM but functions.js associates no function with it/);
  });
  it("an associated function missing from functions.json", () => {
    const dir = brokenDist((fs) => fs.filter((f) => f.id !== "SHEAR_AT"));
    expect(() => loadFunctionsBundle(dir)).toThrow(/functions.js associates SHEAR_AT but functions.json has no entry for it/);
  });
  it("a spilled result without a spill rule", () => {
    const dir = brokenDist((fs) => fs.map((f) => (f.id === "MOMENT_MAX" ? { ...f, result: { dimensionality: "matrix" } } : f)));
    expect(() => loadFunctionsBundle(dir)).toThrow(/MOMENT_MAX returns a spilled range but src\/functions\/spill.ts has no spill rule/);
  });
  it("a missing build", () => {
    expect(() => loadFunctionsBundle(mkdtempSync(join(tmpdir(), "loadpath-empty-")))).toThrow(/run "npm run build" first/);
  });
});
