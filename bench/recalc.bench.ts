/**
 * Headless recalculation of a workbook with 5,000 LOADPATH formulas (target under 2 s): 1,000
 * invented members, each with a 3-row loads range and five formulas (REACTIONS spilling two
 * cells, MOMENT_MAX, MOMENT_MIN, SHEAR_MAX, DEFLECTION_MAX). Measured: the first full evaluation
 * (engine built from the sheets), a full recalculation after a change every formula depends on,
 * and the whole `loadpath recalc` path through an .xlsx file (read, evaluate, cache, write).
 */
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import type { RawCellContent } from "hyperformula";
import { createHeadless } from "../src/workbook/headless";
import { cacheResults, evaluateWorkbook, fromExcelJs, readXlsx, writeXlsx } from "../src/workbook/xlsx";
import { report, timeMs } from "./timing";

const MEMBERS = 1000;
const ROWS_PER_MEMBER = 3;

/** One member per block of 3 rows: loads in A:E, span in G, formulas in H:M; E and I shared in P1:Q1. */
function memberRows(): RawCellContent[][] {
  const rows: RawCellContent[][] = [];
  for (let m = 0; m < MEMBERS; m++) {
    const top = m * ROWS_PER_MEMBER + 1; // 1-based
    const span = 16 + (m % 17);
    const loads = `A${top}:E${top + ROWS_PER_MEMBER - 1}`;
    const member = `G${top},${loads}`;
    rows.push([
      "line", 0.8 + (m % 5) * 0.1, null, null, null, null, span,
      `=LOADPATH.REACTIONS(${member})`, null,
      `=LOADPATH.MOMENT_MAX(${member})`, `=LOADPATH.MOMENT_MIN(${member})`, `=LOADPATH.SHEAR_MAX(${member})`,
      `=LOADPATH.DEFLECTION_MAX(${member},$P$1,$Q$1,"kip-ft")`,
    ]);
    rows.push(["point", 4 + (m % 7), span / 3, null, null]);
    rows.push(["line", 0.5, span / 4, span / 2, 1.0]);
  }
  rows[0]!.push(null, null, 29000, 800); // N1, O1 blank; P1 = E (ksi), Q1 = I (in^4)
  return rows;
}

/** The same sheet as an ExcelJS workbook (formulas without "="). */
function asExcel(rows: RawCellContent[][]): ExcelJS.Workbook {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Members");
  rows.forEach((r, i) =>
    r.forEach((v, j) => {
      if (v === null || v === undefined) return;
      ws.getCell(i + 1, j + 1).value = typeof v === "string" && v.startsWith("=") ? { formula: v.slice(1) } : (v as ExcelJS.CellValue);
    }),
  );
  return wb;
}

export async function run(): Promise<void> {
  const rows = memberRows();
  const formulas = rows.flat().filter((v) => typeof v === "string" && v.startsWith("=LOADPATH.")).length;
  console.log(`   ${formulas.toLocaleString("en-US")} LOADPATH formulas over ${MEMBERS.toLocaleString("en-US")} members`);
  await createHeadless(); // load and register the bundle once, outside the timings

  let hf: Awaited<ReturnType<typeof createHeadless>>["hf"] | undefined;
  const build = await timeMs(async () => {
    hf = (await createHeadless({ sheets: { Members: rows } })).hf;
  });
  report("first evaluation (engine built from the sheet)", build, "ms", "< 2,000 ms");
  const check = hf!.getCellValue({ sheet: 0, row: 0, col: 9 });
  if (typeof check !== "number") throw new Error(`unexpected result in J1: ${String(check)}`);

  const change = await timeMs(() => hf!.setCellContents({ sheet: 0, row: 0, col: 15 }, 29500));
  report("recalculation after E changes (all deflections)", change, "ms", "< 2,000 ms");
  const spans = await timeMs(() =>
    hf!.batch(() => {
      for (let m = 0; m < MEMBERS; m++) hf!.setCellContents({ sheet: 0, row: m * ROWS_PER_MEMBER, col: 6 }, 20 + (m % 9));
    }),
  );
  report("recalculation after every span changes (all formulas)", spans, "ms", "< 2,000 ms");

  const dir = mkdtempSync(join(tmpdir(), "loadpath-bench-"));
  const file = join(dir, "members.xlsx");
  await writeXlsx(fromExcelJs(asExcel(rows)), file);
  const whole = await timeMs(async () => {
    const wb = await readXlsx(file);
    const summary = cacheResults(wb, await evaluateWorkbook(wb));
    if (summary.problems.length > 0) throw new Error(`${summary.problems.length} formula errors`);
    await writeXlsx(wb, join(dir, "members-out.xlsx"));
  });
  report("loadpath recalc path: read .xlsx, evaluate, cache, write", whole, "ms");
}
