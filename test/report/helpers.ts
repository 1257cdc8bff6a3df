/**
 * Helpers of the report tests: the invented framing written as an .xlsx file (plain sheets named
 * Zones, Members and Loads, as an engineer's template might hold them) and the CLI run in process.
 */
import ExcelJS from "exceljs";
import type { RawCellContent } from "hyperformula";
import { main, type CliIO } from "../../src/cli/main";

/** Write sheets of plain values (header row first) as an .xlsx file. */
export async function writeSheets(path: string, sheets: Record<string, RawCellContent[][]>, title?: string): Promise<void> {
  const wb = new ExcelJS.Workbook();
  if (title !== undefined) wb.title = title;
  for (const [name, rows] of Object.entries(sheets)) {
    const ws = wb.addWorksheet(name);
    rows.forEach((r, i) => r.forEach((v, j) => v !== null && v !== undefined && (ws.getCell(i + 1, j + 1).value = v as ExcelJS.CellValue)));
  }
  await wb.xlsx.writeFile(path);
}

/** Run `loadpath <args>` in process; stdout and stderr lines collected. */
export async function cli(...args: string[]): Promise<{ status: number; out: string[]; err: string[] }> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
  const status = await main(args, io);
  return { status, out, err };
}
