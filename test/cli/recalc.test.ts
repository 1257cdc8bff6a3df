/**
 * `loadpath recalc` end to end: a workbook written with ExcelJS, recalculated by the real command
 * (node bin/loadpath.js, the built dist/cli.js and dist/functions.js), read back with ExcelJS and
 * compared with closed forms worked by hand; then an input changed and the dependents checked
 * again. Reference: AISC Steel Construction Manual (15th ed.), Table 3-23, case 1 (simple beam,
 * uniform load; case number recalled from memory): R = wL/2, Mmax = wL^2/8, deflection
 * 5wL^4/384EI. Needs `npm run build`.
 */
import { spawnSync } from "node:child_process";
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";

const ROOT = resolve(__dirname, "../..");
const BIN = join(ROOT, "bin", "loadpath.js");
const dir = mkdtempSync(join(tmpdir(), "loadpath-cli-"));

function run(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, encoding: "utf8" });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A small member sheet: span, load, E, I as inputs; LOADPATH calls in both spellings. */
async function memberWorkbook(path: string, spanFt: number, wKipPerFt: number): Promise<void> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Beam 1");
  ws.getRow(1).values = ["Span (ft)", "w (kip/ft)", "E (ksi)", "I (in^4)"];
  ws.getRow(2).values = [spanFt, wKipPerFt, 29000, 510];
  ws.getCell("A4").value = { formula: "LOADPATH.MOMENT_MAX(A2,B2)" };
  ws.getCell("B4").value = { formula: "_xldudf_LOADPATH_MOMENT_MAX(A2,B2)" };
  ws.getCell("C4").value = { formula: "LOADPATH.REACTIONS(A2,B2)" };
  ws.getCell("E4").value = { formula: 'LOADPATH.DEFLECTION_MAX(A2,B2,C2,D2,"kip-ft")' };
  ws.getCell("F4").value = { formula: '_xldudf_LOADPATH_DEFLECTION_MAX(A2,B2,C2,D2,"kip-ft")' };
  ws.getCell("G4").value = { formula: "A2*12/E4" };
  await wb.xlsx.writeFile(path);
}

async function readBack(path: string): Promise<ExcelJS.Worksheet> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  return wb.getWorksheet("Beam 1")!;
}

/** Closed forms for span L ft and w kip/ft, deflection worked in inches: w/12 kip/in over 12L in, E = 29000 ksi, I = 510 in^4. */
function expected(L: number, w: number) {
  const wIn = w / 12;
  const LIn = 12 * L;
  const deflectionIn = (5 * wIn * LIn ** 4) / (384 * 29000 * 510);
  return { moment: (w * L * L) / 8, reaction: (w * L) / 2, deflectionIn, ratio: LIn / deflectionIn };
}

function checkSheet(ws: ExcelJS.Worksheet, L: number, w: number): void {
  const e = expected(L, w);
  expect(ws.getCell("A4").result).toBeCloseTo(e.moment, 10);
  expect(ws.getCell("B4").result).toBeCloseTo(e.moment, 10);
  expect(ws.getCell("C4").result).toBeCloseTo(e.reaction, 10);
  expect(ws.getCell("D4").value).toBeCloseTo(e.reaction, 10);
  expect(ws.getCell("E4").result).toBeCloseTo(e.deflectionIn, 12);
  expect(ws.getCell("F4").result).toBeCloseTo(e.deflectionIn, 12);
  expect(ws.getCell("G4").result).toBeCloseTo(e.ratio, 8);
}

describe("loadpath recalc", () => {
  it("computes, caches and writes; recomputes dependents after an input changes", async () => {
    const input = join(dir, "member.xlsx");
    const output = join(dir, "member-out.xlsx");
    await memberWorkbook(input, 24, 1.5);
    const before = readFileSync(input);
    const first = run("recalc", input, "-o", output);
    expect(first.stderr).toBe("");
    expect(first.status).toBe(0);
    expect(first.stdout).toMatch(/6 formulas recalculated \(5 with LOADPATH calls\), 0 with errors; written to/);
    expect(readFileSync(input).equals(before)).toBe(true);
    const ws = await readBack(output);
    checkSheet(ws, 24, 1.5);
    expect(ws.getCell("A4").formula).toBe("_xldudf_LOADPATH_MOMENT_MAX(A2,B2)");

    // Change the span and the load in the recalculated file, recalc again: dependents follow.
    const edited = join(dir, "member-edited.xlsx");
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(output);
    wb.getWorksheet("Beam 1")!.getCell("A2").value = 30;
    wb.getWorksheet("Beam 1")!.getCell("B2").value = 2;
    await wb.xlsx.writeFile(edited);
    const second = run("recalc", edited, "-o", join(dir, "member-edited-out.xlsx"));
    expect(second.status).toBe(0);
    checkSheet(await readBack(join(dir, "member-edited-out.xlsx")), 30, 2);
    expect(expected(30, 2).moment).toBe(225); // the new expected value, worked by hand: 2 x 30^2 / 8
  });

  it("reports LOADPATH errors per cell on stderr and exits 1", async () => {
    const input = join(dir, "bad.xlsx");
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("Members");
    ws.getCell("A1").value = { formula: "LOADPATH.MOMENT_MAX(-1,2)" };
    ws.getCell("A2").value = { formula: "LOADPATH.MOMENT_MAXX(10,2)" };
    ws.getCell("A3").value = { formula: "A1*2" };
    ws.getCell("A4").value = { formula: "LOADPATH.MOMENT_MAX(10,2)" };
    await wb.xlsx.writeFile(input);
    const r = run("recalc", input, "-o", join(dir, "bad-out.xlsx"));
    expect(r.status).toBe(1);
    const lines = r.stderr.trim().split("\n");
    expect(lines).toContain("Members!A1: #VALUE! span: must be greater than 0 (got -1).");
    expect(lines.some((l) => l.startsWith("Members!A2: #NAME? unknown function: ") && l.includes("LOADPATH.MOMENT_MAXX"))).toBe(true);
    expect(lines).toContain("Members!A3: #VALUE! span: must be greater than 0 (got -1). (from Members!A1)");
    expect((await (async () => {
      const out = new ExcelJS.Workbook();
      await out.xlsx.readFile(join(dir, "bad-out.xlsx"));
      return out.getWorksheet("Members")!.getCell("A4").result;
    })())).toBe(25);
  });

  it("an unknown non-LOADPATH function keeps its cached value, is listed and exits 1; cycles are reported", async () => {
    const input = join(dir, "other.xlsx");
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("Sheet 2");
    ws.getCell("A1").value = { formula: "NOSUCHFUNCTION(1)", result: 7 } as ExcelJS.CellValue;
    ws.getCell("B1").value = { formula: "C1+1" };
    ws.getCell("C1").value = { formula: "B1+1" };
    ws.getCell("D1").value = { formula: "LOADPATH.SHEAR_MAX(10,2)" };
    await wb.xlsx.writeFile(input);
    const r = run("recalc", input);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^'Sheet 2'!A1: function NOSUCHFUNCTION is not available headless; not recalculated, the cell keeps its formula and cached value 7\./m);
    expect(r.stderr).toMatch(/^'Sheet 2'!B1: cycle: circular reference/m);
    expect(r.stdout).toMatch(/nothing written \(no -o\)/);
  });

  it("never writes over the input, even when -o names it", async () => {
    const input = join(dir, "inplace.xlsx");
    await memberWorkbook(input, 20, 1);
    const before = readFileSync(input);
    const r = run("recalc", input, "-o", input);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/is the input file/);
    expect(readFileSync(input).equals(before)).toBe(true);
  });

  it("usage and file errors exit 2 with a message", () => {
    const none = run("recalc");
    expect(none.status).toBe(2);
    expect(none.stderr).toMatch(/no input workbook given/);
    const missing = run("recalc", join(dir, "missing.xlsx"), "-o", join(dir, "x.xlsx"));
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/missing.xlsx: no such file/);
    expect(existsSync(join(dir, "x.xlsx"))).toBe(false);
    const badOption = run("recalc", "a.xlsx", "--frobnicate");
    expect(badOption.status).toBe(2);
    const unknownVerb = run("recalculate");
    expect(unknownVerb.status).toBe(2);
    expect(unknownVerb.stderr).toMatch(/unknown verb "recalculate"/);
  });

  it("--help lists the verbs; recalc --help shows its usage", () => {
    const help = run("--help");
    expect(help.status).toBe(0);
    expect(help.stdout).toMatch(/^\s+recalc\s+/m);
    expect(help.stdout).toMatch(/^\s+demo\s+/m);
    const verbHelp = run("recalc", "--help");
    expect(verbHelp.status).toBe(0);
    expect(verbHelp.stdout).toMatch(/Usage: loadpath recalc <in.xlsx>/);
  });

  it("without a build, bin/loadpath.js says to run npm run build", () => {
    const fake = mkdtempSync(join(tmpdir(), "loadpath-nobuild-"));
    mkdirSync(join(fake, "bin"));
    copyFileSync(BIN, join(fake, "bin", "loadpath.js"));
    const r = spawnSync(process.execPath, [join(fake, "bin", "loadpath.js"), "--help"], { encoding: "utf8" });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/run "npm run build" first/);
  });
});
