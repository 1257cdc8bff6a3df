/**
 * The hand-off version of a takedown with loads varying linearly along a member (Loads `End
 * width` and `End magnitude`). The classic functions of the hand-off writer spell uniform loads
 * only, so the members carrying such a load are written as values (their reactions, shear and
 * moment), each cell listed on the notice sheet with its reason; every other result stays a live
 * formula. Gnumeric (`ssconvert --recalc`, outside the project) recalculates the file to the
 * headless add-in takedown's column loads, foundation loads and load balance to 1e-9, with no
 * error cell, and no formula calls the add-in.
 */
import { join } from "node:path";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { exportHandoff, type ExportReport } from "../../src/cli/commands/export";
import { NOTICE_SHEET } from "../../src/engine/native/notice";
import { handoffBuilding } from "./building";
import { inspectXlsx, type PackageReport } from "./package-check";
import { hasGnumeric, readComputed, recalcWithGnumeric, requireInCi, scratchDir } from "./programs";
import { comparedCount, errorCellsOf, headlessTakedown, mismatchedResults, readTakedownSheet, resultsOfJson, writeBuildingWorkbook } from "./workbooks";

const scratch = scratchDir("loadpath-trapezoid-");
afterAll(() => scratch.remove());

const gnumeric = hasGnumeric();
requireInCi("Gnumeric (ssconvert)", gnumeric);

/** The invented building of building.ts with End width and End magnitude columns and three varying loads. */
function building(): ReturnType<typeof handoffBuilding> {
  const sheets = handoffBuilding(false);
  const loads = sheets.Loads!.map((row, i) => [...row, i === 0 ? "End width (ft)" : null, i === 0 ? "End magnitude (plf)" : null]);
  loads.push(["B2-3", "area", "OFFICE", null, 2, 3, 21, 6.5, null]); // a trapezoidal strip of deck
  loads.push(["RB-1", "line", "S", 520, null, 0, 9, null, 0]); // a snow drift against a parapet
  loads.push(["G2-B", "line", "D", 200, null, 2, 24, null, 650]); // a sloping partition
  return { ...sheets, Loads: loads };
}

describe("hand-off version with End width and End magnitude loads", () => {
  let input: string;
  let output: string;
  let report: ExportReport;
  let pkg: PackageReport;

  beforeAll(async () => {
    input = join(scratch.dir, "trapezoids.xlsx");
    await writeBuildingWorkbook(input, building(), { loads: true });
    output = join(scratch.dir, "trapezoids.handoff.xlsx");
    report = await exportHandoff(input, output, { date: "2026-01-15" });
    pkg = await inspectXlsx(output);
  });

  it("exports without problems; the members with a varying load, and only they, are written as values with the reason", () => {
    expect(report.problems).toEqual([]);
    expect(report.ok).toBe(true);
    // Governing values and deflection checks are values for every beam (add-in only); apart from them,
    // only the members carrying a varying load.
    const GOVERNING = /LOADPATH\.(GOVERNING|DEFLECTION_CHECK)\(/;
    const mechanics = report.valueOnly.filter((v) => !GOVERNING.test(v.formula));
    const marks = new Set(mechanics.map((v) => v.mark));
    expect([...marks].sort()).toEqual(["B2-3", "G2-B", "RB-1"]);
    for (const v of mechanics) expect(v.reason).toMatch(/varying linearly along it \(End width or End magnitude\)/);
  });

  it("the notice sheet lists every value-only cell, and no formula calls the add-in", async () => {
    const text = [...(await readComputed(output)).get(NOTICE_SHEET)!.values()].join("\n");
    for (const v of report.valueOnly) expect(text).toContain(`${v.sheet}!${v.address}`);
    const addIn = pkg.formulas.filter((f) => /LOADPATH|_xldudf_/i.test(f.formula));
    expect(addIn.map((f) => `${f.sheet}!${f.address}`)).toEqual([]);
  });

  it.skipIf(!gnumeric)("Gnumeric recalculates every column load, foundation load and the balance to the add-in takedown's, with no error cell", async () => {
    const recalculated = join(scratch.dir, "trapezoids.recalc.xlsx");
    recalcWithGnumeric(output, recalculated);
    const back = new ExcelJS.Workbook();
    await back.xlsx.readFile(recalculated);
    expect(errorCellsOf(back)).toEqual([]);
    const sheet = report.takedowns[0]!.sheet;
    const got = readTakedownSheet((await readComputed(recalculated)).get(sheet)!);
    const reference = resultsOfJson((await headlessTakedown(input)).json, "kip");
    expect(comparedCount(reference)).toBeGreaterThan(10);
    expect(mismatchedResults(reference, got)).toEqual([]);
    // the varying loads reached the results: the same building without them differs
    const plain = join(scratch.dir, "plain.xlsx");
    await writeBuildingWorkbook(plain, handoffBuilding(false), { loads: true });
    const without = resultsOfJson((await headlessTakedown(plain)).json, "kip");
    expect(mismatchedResults(without, got).length).toBeGreaterThan(0);
  });
});
