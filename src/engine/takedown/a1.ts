/** A1-style addresses for the takedown engine (0-based rows and columns in, Excel text out). */
import type { CellRef } from "./types";

/** Letters of the first columns, worked out once (the plan asks for them millions of times). */
const LETTERS: string[] = Array.from({ length: 702 }, (_, c) => lettersOf(c));

/** 0 -> "A", 25 -> "Z", 26 -> "AA". */
export function columnLetter(col: number): string {
  return LETTERS[col] ?? lettersOf(col);
}

function lettersOf(col: number): string {
  let n = col + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** (0, 0) -> "A1". */
export function a1(row: number, col: number): string {
  return `${columnLetter(col)}${row + 1}`;
}

/** (0, 0) -> "$A$1". */
export function a1Absolute(row: number, col: number): string {
  return `$${columnLetter(col)}$${row + 1}`;
}

/** A sheet name as a formula writes it: quoted when it is not a plain identifier (My Sheet -> 'My Sheet'). */
export function quoteSheet(sheet: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(sheet) && !/^[A-Za-z]{1,3}[0-9]+$/.test(sheet) ? sheet : `'${sheet.replace(/'/g, "''")}'`;
}

/** An absolute reference to an input cell from another sheet: Members!$D$7. */
export function sheetCellRef(ref: CellRef): string {
  return `${quoteSheet(ref.sheet)}!${a1Absolute(ref.row, ref.col)}`;
}
