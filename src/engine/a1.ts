/**
 * A1-style addresses, the one implementation for every layer (0-based rows and columns in, Excel
 * text out). Pure: src/workbook/a1.ts, src/engine/takedown/a1.ts and src/engine/native/refs.ts
 * build on these.
 */

/** Letters of the first columns, worked out once (the sheet plan asks for them millions of times). */
const LETTERS: string[] = Array.from({ length: 702 }, (_, c) => lettersOf(c));

/**
 * Column letters of a 0-based column: 0 -> "A", 25 -> "Z", 26 -> "AA".
 * @param col - 0-based column index
 */
export function columnLetter(col: number): string {
  return LETTERS[col] ?? lettersOf(col);
}

/**
 * The 0-based column of Excel column letters: "A" -> 0, "AA" -> 26 (any case); undefined for
 * anything but one to three letters.
 * @param letters - column letters, e.g. "J"
 */
export function columnOfLetters(letters: string): number | undefined {
  if (!/^[A-Za-z]{1,3}$/.test(letters)) return undefined;
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
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

/**
 * Relative A1 address: (0, 0) -> "A1".
 * @param row - 0-based row index
 * @param col - 0-based column index
 */
export function a1(row: number, col: number): string {
  return `${columnLetter(col)}${row + 1}`;
}

/**
 * Absolute A1 address: (0, 0) -> "$A$1".
 * @param row - 0-based row index
 * @param col - 0-based column index
 */
export function a1Absolute(row: number, col: number): string {
  return `$${columnLetter(col)}$${row + 1}`;
}

/**
 * A sheet name as an Excel formula writes it: quoted when it is not a plain identifier or could
 * be read as a cell address (My Sheet -> 'My Sheet', A1 -> 'A1'), inner quotes doubled.
 * @param sheet - the sheet's name
 */
export function quoteSheet(sheet: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(sheet) && !/^[A-Za-z]{1,3}[0-9]+$/.test(sheet) ? sheet : `'${sheet.replace(/'/g, "''")}'`;
}
