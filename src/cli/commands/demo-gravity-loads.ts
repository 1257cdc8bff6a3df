/**
 * Demo part: the "Gravity loads" sheet of sample-workbooks/beam-schedule.xlsx, recalculated
 * headless and printed as a table (cell, item, formula, value, unit), followed by the load
 * combination records (COMBOS spills) found on the sheet.
 */
import { join } from "node:path";
import type ExcelJS from "exceljs";
import { toEngineFormula } from "../../workbook/headless";
import { cacheResults, evaluateWorkbook, problemAddress, readXlsx, type XlsxWorkbook } from "../../workbook/xlsx";
import { EXIT } from "../shared";
import type { DemoPart } from "./demo";

/** The sheet printed by this part. */
export const GRAVITY_SHEET = "Gravity loads";

/** Significant digits of printed values. */
const DIGITS = 6;

/** A cell's value as cached: a formula's result (0 included), else the plain value. */
function cellValue(cell: ExcelJS.Cell): unknown {
  return cell.formula ? cell.result : cell.value;
}

/**
 * A value as printed: numbers to {@link DIGITS} significant digits without trailing zeros,
 * errors as their code, anything else as text.
 * @param v - a cached cell value.
 */
export function printedValue(v: unknown): string {
  if (typeof v === "number") return String(Number(v.toPrecision(DIGITS)));
  if (v === null || v === undefined) return "";
  if (typeof v === "object" && "error" in v) return String((v as { error: string }).error);
  return String(v);
}

/** A formula as an engineer types it: "=LOADPATH.NAME(...)" rather than the file spelling. */
function typedFormula(cell: ExcelJS.Cell): string {
  return cell.formula ? `=${toEngineFormula(cell.formula)}` : "(input)";
}

/** One printed line of the items table: a section heading or an item. */
type ItemLine = { readonly section: string } | { readonly cells: readonly [string, string, string, string, string] };

/** Items of the sheet (columns A-D from row 3): label in A, value in B, unit in C. */
function itemLines(ws: ExcelJS.Worksheet): ItemLine[] {
  const lines: ItemLine[] = [];
  for (let r = 3; r <= ws.rowCount; r++) {
    const label = printedValue(cellValue(ws.getCell(r, 1)));
    const b = ws.getCell(r, 2);
    if (label === "") continue;
    if (cellValue(b) === null || cellValue(b) === undefined) lines.push({ section: label });
    else lines.push({ cells: [b.address, label, typedFormula(b), printedValue(cellValue(b)), printedValue(cellValue(ws.getCell(r, 3)))] });
  }
  return lines;
}

/**
 * Lines of the items table, columns padded to their widest entry, values right-aligned.
 * @param ws - the Gravity loads sheet with cached results.
 */
export function gravityItemsTable(ws: ExcelJS.Worksheet): string[] {
  const header = ["Cell", "Item", "Formula", "Value", "Unit"] as const;
  const items = itemLines(ws);
  const widths = header.map((h, k) => Math.max(h.length, ...items.map((l) => ("cells" in l ? l.cells[k]!.length : 0))));
  const line = (cells: readonly string[]): string => cells.map((c, k) => (k === 3 ? c.padStart(widths[k]!) : c.padEnd(widths[k]!))).join("  ").trimEnd();
  const out = [line(header), line(widths.map((w) => "-".repeat(w)))];
  for (const l of items) out.push("section" in l ? `${"".padEnd(widths[0]!)}  ${l.section}` : line(l.cells));
  return out;
}

/** A COMBOS record on the sheet: its header (row 2) and its label | value rows. */
interface ComboRecord {
  readonly title: string;
  readonly rows: readonly (readonly [string, string])[];
}

/** Every COMBOS spill anchored in row 3, read down until its labels end. */
function comboRecords(ws: ExcelJS.Worksheet): ComboRecord[] {
  const records: ComboRecord[] = [];
  for (let c = 1; c <= ws.columnCount; c++) {
    const anchor = ws.getCell(3, c);
    if (!anchor.formula || !/COMBOS\s*\(/i.test(toEngineFormula(anchor.formula))) continue;
    const rows: [string, string][] = [];
    for (let r = 3; printedValue(cellValue(ws.getCell(r, c))) !== ""; r++) rows.push([printedValue(cellValue(ws.getCell(r, c))), printedValue(cellValue(ws.getCell(r, c + 1)))]);
    records.push({ title: `${printedValue(cellValue(ws.getCell(2, c)))} [${anchor.address}, ${printedValue(cellValue(ws.getCell(2, c + 1)))}]`, rows });
  }
  return records;
}

/**
 * Lines of the combination records side by side (label, value right-aligned).
 * @param ws - the Gravity loads sheet with cached results.
 */
export function comboRecordsTable(ws: ExcelJS.Worksheet): string[] {
  const records = comboRecords(ws);
  if (records.length === 0) return [];
  const valueWidth = Math.max(8, ...records.flatMap((rec) => rec.rows.map(([, v]) => v.length)));
  const labelWidth = Math.max(...records.flatMap((rec) => [rec.title.length - 2 - valueWidth, ...rec.rows.map(([label]) => label.length)]));
  const blockWidth = labelWidth + 2 + valueWidth;
  const height = Math.max(...records.map((rec) => rec.rows.length));
  const out = [records.map((rec) => rec.title.padEnd(blockWidth)).join("   ").trimEnd()];
  for (let i = 0; i < height; i++) {
    const row = records.map((rec) => {
      const entry = rec.rows[i];
      return entry ? `${entry[0].padEnd(labelWidth)}  ${entry[1].padStart(valueWidth)}` : "".padEnd(blockWidth);
    });
    out.push(row.join("   ").trimEnd());
  }
  return out;
}

/**
 * Marks of the members whose inputs refer to the sheet: for each formula on another sheet that
 * names it, the nearest mark at or above it in column A of that sheet.
 */
function linkedMarks(wb: XlsxWorkbook): string[] {
  const marks = new Set<string>();
  for (const f of wb.formulas) {
    if (f.sheet === GRAVITY_SHEET || !f.formula.includes(GRAVITY_SHEET)) continue;
    const ws = wb.excel.getWorksheet(f.sheet)!;
    for (let r = f.row + 1; r >= 2; r--) {
      const mark = printedValue(cellValue(ws.getCell(r, 1)));
      if (mark !== "") {
        marks.add(mark);
        break;
      }
    }
  }
  return [...marks].sort();
}

/** The Gravity loads sheet of the beam schedule sample, recalculated headless. */
export const gravityLoadsPart: DemoPart = {
  title: "Gravity loads (sheet 'Gravity loads' of sample-workbooks/beam-schedule.xlsx, invented building; psf, ft, kip/ft, kip)",
  async run(io, ctx) {
    const wb = await readXlsx(join(ctx.root, "sample-workbooks", "beam-schedule.xlsx"));
    const summary = cacheResults(wb, await evaluateWorkbook(wb));
    const ws = wb.excel.getWorksheet(GRAVITY_SHEET);
    if (!ws) {
      io.err(`beam-schedule.xlsx: no sheet named "${GRAVITY_SHEET}".`);
      return EXIT.failed;
    }
    for (const line of gravityItemsTable(ws)) io.out(line);
    io.out("");
    for (const line of comboRecordsTable(ws)) io.out(line);
    const problems = summary.problems.filter((p) => p.sheet === GRAVITY_SHEET);
    for (const p of problems) io.err(`${problemAddress(p)}: ${p.code} ${p.message}`);
    const count = wb.formulas.filter((f) => f.sheet === GRAVITY_SHEET).length;
    io.out("");
    const linked = linkedMarks(wb);
    io.out(`${count} formulas on this sheet recalculated headless, ${problems.length} errors.${linked.length > 0 ? ` Members of the schedule above with loads linked to it: ${linked.join(", ")}.` : ""}`);
    return problems.some((p) => p.loadpath) ? EXIT.failed : EXIT.ok;
  },
};
