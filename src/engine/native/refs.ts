/**
 * References and literals for formula text in the classic A1 notation that every spreadsheet
 * program reads. Rows and columns are 0-based here, as in the workbook port.
 */
import { a1Absolute, columnLetter } from "../a1";

/** Where a generated block sits: sheet name and 0-based top-left cell. */
export interface BlockOrigin {
  readonly sheet: string;
  readonly row: number;
  readonly col: number;
}

/**
 * A sheet name as it must appear before "!": quoted unless it is a plain identifier. Stricter
 * than the Excel rule of src/engine/a1.ts (names with a dot and TRUE/FALSE are quoted too), as the
 * hand-off formulas are read by other spreadsheet programs as well.
 */
export function quoteSheet(sheet: string): string {
  const plain = /^[A-Za-z_][A-Za-z0-9_]*$/.test(sheet) && !/^[A-Za-z]{1,3}[0-9]+$/.test(sheet) && !/^(TRUE|FALSE)$/i.test(sheet);
  return plain ? sheet : `'${sheet.replace(/'/g, "''")}'`;
}

/** Absolute reference to one cell, e.g. `Takedown!$C$12`. */
export function cellRef(sheet: string, row: number, col: number): string {
  return `${quoteSheet(sheet)}!${a1Absolute(row, col)}`;
}

/** Absolute reference to a single-column range of `rows` cells starting at (row, col). */
export function columnRangeRef(sheet: string, row: number, col: number, rows: number): string {
  const c = columnLetter(col);
  return `${quoteSheet(sheet)}!$${c}$${row + 1}:$${c}$${row + rows}`;
}

/**
 * A number as formula text: the shortest text that reads back as the same double, never in
 * exponent form (every program reads 0.000001; not all read 1e-6 the same way in every locale).
 */
export function num(value: number): string {
  if (!Number.isFinite(value)) return "0";
  const s = String(value);
  if (!/e/i.test(s)) return value < 0 ? `(${s})` : s;
  const fixed = value.toFixed(20).replace(/0+$/, "").replace(/\.$/, "");
  return value < 0 ? `(${fixed})` : fixed;
}

/**
 * The single cells of a one-column range reference, top to bottom (`S!$C$2:$C$4` ->
 * `S!$C$2`, `S!$C$3`, `S!$C$4`). A reference that is not of that form (a defined name, say) gives
 * `INDEX(range, i)` for each row instead. Direct references are preferred: they read better,
 * and one program returns #REF! for INDEX over a one-cell range.
 */
export function cellsOfColumnRange(range: string, rows: number): string[] {
  const m = /^(.*!)?\$?([A-Za-z]{1,3})\$?([0-9]+)(?::\$?([A-Za-z]{1,3})\$?([0-9]+))?$/.exec(range);
  if (m && (m[4] === undefined || m[4].toUpperCase() === m[2]!.toUpperCase())) {
    const first = Number(m[3]);
    const col = m[2]!.toUpperCase();
    return Array.from({ length: rows }, (_, i) => `${m[1] ?? ""}$${col}$${first + i}`);
  }
  return Array.from({ length: rows }, (_, i) => `INDEX(${range},${i + 1})`);
}
