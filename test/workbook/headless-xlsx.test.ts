/**
 * .xlsx files through the headless evaluator with ExcelJS: what is read (values, formulas,
 * shared formulas, Excel tables with their extent from tableRef), what is written back (formulas
 * with cached results, 0 included; spills as array formulas; styles and tables kept), and that
 * re-reading our own output recomputes the same. Needs `npm run build`.
 */
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { cacheResults, evaluateWorkbook, readXlsx, writeXlsx } from "../../src/workbook/xlsx";

const dir = mkdtempSync(join(tmpdir(), "loadpath-xlsx-"));

/** A workbook as a user might keep it: a table of members, a shared formula, a zero result, text that looks like a number. */
async function userWorkbook(path: string): Promise<void> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Members");
  ws.addTable({
    name: "MemberTable",
    ref: "A1",
    headerRow: true,
    columns: [{ name: "Mark" }, { name: "Span (ft)" }, { name: "w (kip/ft)" }],
    rows: [
      ["B-1", 20, 1],
      ["B-2", 30, 2],
    ],
  });
  ws.getCell("D1").value = "Mmax";
  ws.getCell("D1").font = { bold: true, color: { argb: "FF0000FF" } };
  ws.getCell("D2").value = { formula: "LOADPATH.MOMENT_MAX(B2,C2)", shareType: "shared", ref: "D2:D3", result: 0 } as ExcelJS.CellValue;
  ws.getCell("D3").value = { sharedFormula: "D2", result: 0 } as ExcelJS.CellValue;
  ws.getCell("E2").value = { formula: "LOADPATH.MOMENT_MIN(B2,C2)" };
  ws.getCell("F2").value = { formula: "_xldudf_LOADPATH_REACTIONS(B2,C2)", shareType: "array", ref: "F2:G2", result: 99 } as ExcelJS.CellValue;
  ws.getCell("G2").value = 99; // a stale spilled value, as Excel leaves it
  ws.getCell("A6").value = "007";
  ws.getCell("B6").value = { formula: 'A6&""' };
  ws.getCell("C6").value = new Date(Date.UTC(2026, 0, 2));
  ws.getCell("D6").value = { formula: "C6+1" };
  await wb.xlsx.writeFile(path);
}

describe("reading", () => {
  it("tables with name, sheet, extent and headers; shared formulas expanded; array areas known", async () => {
    const path = join(dir, "read.xlsx");
    await userWorkbook(path);
    const wb = await readXlsx(path);
    expect(wb.tables).toEqual([{ name: "MemberTable", sheet: "Members", ref: "A1:C3", headers: ["Mark", "Span (ft)", "w (kip/ft)"] }]);
    const formulas = Object.fromEntries(wb.formulas.map((f) => [`${f.row},${f.col}`, f]));
    expect(formulas["2,3"]!.formula).toBe("LOADPATH.MOMENT_MAX(B3,C3)");
    expect(formulas["1,5"]!.arrayRef).toBe("F2:G2");
    const rows = wb.sheets[0]!.rows;
    expect(rows[1]![6]).toBeNull(); // the stale spilled value is cleared for the engine
    expect(rows[5]![0]).toBe("'007"); // text stays text
  });
  it("a missing file or a file that is not a workbook is a plain error", async () => {
    await expect(readXlsx(join(dir, "nope.xlsx"))).rejects.toThrow(/no such file/);
    const notXlsx = join(dir, "text.xlsx");
    writeFileSync(notXlsx, "hello");
    await expect(readXlsx(notXlsx)).rejects.toThrow(/text\.xlsx: not an \.xlsx workbook \(not a zip file\)/);
  });
});

describe("evaluating and writing back", () => {
  it("caches every result (0 included), writes LOADPATH calls as Excel stores them, keeps styles, tables and the input file", async () => {
    const input = join(dir, "in.xlsx");
    const output = join(dir, "out.xlsx");
    await userWorkbook(input);
    const before = readFileSync(input);
    const wb = await readXlsx(input);
    const summary = cacheResults(wb, await evaluateWorkbook(wb));
    expect(summary.problems).toEqual([]);
    expect(summary.loadpathCount).toBe(4);
    await writeXlsx(wb, output);
    expect(readFileSync(input).equals(before)).toBe(true);

    const out = new ExcelJS.Workbook();
    await out.xlsx.readFile(output);
    const ws = out.getWorksheet("Members")!;
    // AISC Steel Construction Manual Table 3-23, case 1: wL^2/8 and wL/2
    expect(ws.getCell("D2").result).toBe((1 * 20 * 20) / 8);
    expect(ws.getCell("D3").result).toBe((2 * 30 * 30) / 8);
    expect(ws.getCell("D2").formula).toBe("_xldudf_LOADPATH_MOMENT_MAX(B2,C2)");
    expect(ws.getCell("E2").result).toBe(0); // a zero result is cached (read through cell.result)
    expect(ws.getCell("F2").formula).toBe("_xldudf_LOADPATH_REACTIONS(B2,C2)");
    expect((ws.getCell("F2").value as { shareType?: string; ref?: string }).ref).toBe("F2:G2");
    expect([ws.getCell("F2").result, ws.getCell("G2").value]).toEqual([10, 10]);
    expect(ws.getCell("B6").result).toBe("007");
    expect(ws.getCell("D1").font.bold).toBe(true);
    const tables = (ws as unknown as { tables: Record<string, { table: { tableRef?: string; ref?: string } }> }).tables;
    expect(Object.keys(tables)).toEqual(["MemberTable"]);

    // Our own output reads back and recomputes the same (spill area cleared, array formula re-evaluated).
    const again = await readXlsx(output);
    const summary2 = cacheResults(again, await evaluateWorkbook(again));
    expect(summary2.problems).toEqual([]);
    expect(again.tables[0]!.ref).toBe("A1:C3");
    expect(again.excel.getWorksheet("Members")!.getCell("G2").value).toBe(10);
  });
});
