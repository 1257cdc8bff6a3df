/**
 * A1-style address helpers (0-based rows and columns in, Excel letters out). Writing addresses is
 * the engine's (src/engine/a1.ts); parsing them, which throws on bad text, stays here.
 */
import { a1, a1Absolute, columnOfLetters } from "../engine/a1";

export { columnLetter, quoteSheet as sheetRef } from "../engine/a1";

/** "AA" -> 26. Throws on anything that is not a column of letters. */
export function columnIndex(letters: string): number {
  const col = columnOfLetters(letters);
  if (col === undefined) throw new Error(`not a column: ${letters}`);
  return col;
}

/** (0, 0) -> "A1"; absolute gives "$A$1". */
export function cellAddress(row: number, col: number, absolute = false): string {
  return absolute ? a1Absolute(row, col) : a1(row, col);
}

/** Parse "B7" or "$B$7" into 0-based row/col. */
export function parseCell(address: string): { row: number; col: number } {
  const m = /^\$?([A-Za-z]{1,3})\$?([0-9]+)$/.exec(address.trim());
  if (!m) throw new Error(`not a cell address: ${address}`);
  return { row: Number(m[2]) - 1, col: columnIndex(m[1]!) };
}
