/**
 * Real spreadsheet programs outside the project, used as independent evaluators of hand-off
 * workbooks: Gnumeric (`ssconvert --recalc`, Debian package gnumeric) and, when installed,
 * LibreOffice Calc headless (`soffice --convert-to`, Debian package libreoffice-calc).
 *
 * Test-only code: uses Node modules and throws on misuse.
 */
import { spawnSync } from "node:child_process";
import { copyFileSync, existsSync, mkdtempSync, mkdirSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join } from "node:path";
import ExcelJS from "exceljs";

/** True when `ssconvert` (Gnumeric) runs on this machine. */
export function hasGnumeric(): boolean {
  const r = spawnSync("ssconvert", ["--version"], { encoding: "utf8" });
  return r.status === 0;
}

/** True when `soffice` (LibreOffice) runs on this machine. */
export function hasLibreOffice(): boolean {
  const r = spawnSync("soffice", ["--version"], { encoding: "utf8", timeout: 60_000 });
  return r.status === 0;
}

/** CI runs must not skip a reference quietly: a missing program fails there. */
export function requireInCi(name: string, present: boolean): void {
  if (!present && process.env.CI) throw new Error(`${name} is required in CI (see .ci/run) but was not found.`);
  if (!present) console.warn(`*** ${name} not installed: its checks are SKIPPED on this machine.`);
}

/** Recalculate an .xlsx in Gnumeric and write the result as .xlsx; throws with Gnumeric's message on failure. */
export function recalcWithGnumeric(input: string, output: string): void {
  const r = spawnSync("ssconvert", ["--recalc", input, output], { encoding: "utf8", timeout: 300_000 });
  if (r.status !== 0 || !existsSync(output)) {
    throw new Error(`ssconvert --recalc failed (${r.status}): ${r.stderr || r.stdout}`);
  }
}

/**
 * Recalculate an .xlsx in LibreOffice Calc headless (recalculation on load forced through a
 * private profile) and write the result as .xlsx into `output`.
 */
export function recalcWithLibreOffice(input: string, output: string): void {
  const work = mkdtempSync(join(tmpdir(), "loadpath-lo-"));
  try {
    const profile = join(work, "profile");
    mkdirSync(join(profile, "user"), { recursive: true });
    writeRecalcProfile(join(profile, "user", "registrymodifications.xcu"));
    const src = join(work, "in-" + basename(input));
    copyFileSync(input, src);
    const outDir = join(work, "out");
    mkdirSync(outDir);
    const r = spawnSync(
      "soffice",
      [`-env:UserInstallation=file://${profile}`, "--headless", "--norestore", "--convert-to", "xlsx:Calc MS Excel 2007 XML", "--outdir", outDir, src],
      { encoding: "utf8", timeout: 600_000 },
    );
    const produced = existsSync(outDir) ? readdirSync(outDir).filter((f) => f.endsWith(".xlsx")) : [];
    if (r.status !== 0 || produced.length === 0) throw new Error(`soffice --convert-to failed (${r.status}): ${r.stderr || r.stdout}`);
    copyFileSync(join(outDir, produced[0]!), output);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** A LibreOffice user profile setting that always recalculates .xlsx formulas on load. */
function writeRecalcProfile(path: string): void {
  const xcu = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;
  writeFileSync(path, xcu);
}

/** A computed cell read back from a recalculated file: a number, text, an error text, or null. */
export type ReadValue = number | string | boolean | null;

/** Computed value of a cell as the program left it (formula results included). */
export function computedValue(cell: ExcelJS.Cell): ReadValue {
  const v = cell.value as unknown;
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") return v;
  if (typeof v === "object") {
    const o = v as { formula?: string; sharedFormula?: string; result?: unknown; error?: string };
    if ("error" in o && typeof o.error === "string") return o.error;
    if (o.formula !== undefined || o.sharedFormula !== undefined) {
      const r = cell.result as unknown;
      if (r === undefined || r === null) return 0;
      if (typeof r === "object" && r !== null && "error" in r) return String((r as { error: string }).error);
      return r as ReadValue;
    }
  }
  return String(v);
}

/** Read every sheet of an .xlsx into address -> computed value maps. */
export async function readComputed(path: string): Promise<Map<string, Map<string, ReadValue>>> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  const out = new Map<string, Map<string, ReadValue>>();
  wb.eachSheet((ws) => {
    const cells = new Map<string, ReadValue>();
    ws.eachRow({ includeEmpty: false }, (row) => {
      row.eachCell({ includeEmpty: false }, (cell) => {
        cells.set(cell.address, computedValue(cell));
      });
    });
    out.set(ws.name, cells);
  });
  return out;
}

/** A scratch directory removed by the returned function. */
export function scratchDir(prefix: string): { dir: string; remove: () => void } {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}
