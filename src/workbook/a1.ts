/** A1-style address helpers (0-based rows and columns in, Excel letters out). */

/** 0 -> "A", 25 -> "Z", 26 -> "AA". */
export function columnLetter(col: number): string {
  let n = col + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** "AA" -> 26. Throws on anything that is not a column of letters. */
export function columnIndex(letters: string): number {
  if (!/^[A-Za-z]{1,3}$/.test(letters)) throw new Error(`not a column: ${letters}`);
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** (0, 0) -> "A1"; absolute gives "$A$1". */
export function cellAddress(row: number, col: number, absolute = false): string {
  return absolute ? `$${columnLetter(col)}$${row + 1}` : `${columnLetter(col)}${row + 1}`;
}

/** Quote a sheet name for a formula reference when it needs it: My Sheet -> 'My Sheet'. */
export function sheetRef(sheet: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(sheet) && !/^[A-Za-z]{1,3}[0-9]+$/.test(sheet) ? sheet : `'${sheet.replace(/'/g, "''")}'`;
}

/** Parse "B7" or "$B$7" into 0-based row/col. */
export function parseCell(address: string): { row: number; col: number } {
  const m = /^\$?([A-Za-z]{1,3})\$?([0-9]+)$/.exec(address.trim());
  if (!m) throw new Error(`not a cell address: ${address}`);
  return { row: Number(m[2]) - 1, col: columnIndex(m[1]!) };
}
