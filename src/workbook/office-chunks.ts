/**
 * Pure helpers of the Office.js adapter (office.ts): turning queued blocks into the 2-D arrays
 * Excel takes, splitting them into requests that stay under the payload limit of Excel on the
 * web, and reading the addresses Excel returns. No Office.js calls here, so all of it is tested
 * without a host.
 */
import type { CellInput, CellValue } from "./port";
import { parseCell } from "./a1";

/** One block queued by writeBlock, waiting for flush. */
export interface QueuedBlock {
  readonly sheet: string;
  readonly top: number;
  readonly left: number;
  readonly cells: readonly (readonly CellInput[])[];
}

/** One range write of a request: a rectangle and its formulas array. */
export interface RangeWrite {
  readonly sheet: string;
  readonly top: number;
  readonly left: number;
  readonly rows: number;
  readonly cols: number;
  /** What goes into `range.formulas`: "=..." for formulas, values otherwise, null = leave as is. */
  readonly formulas: (string | number | boolean | null)[][];
}

/**
 * Default size budget of one request in bytes. Excel on the web rejects requests over about
 * 5 MB (Office add-ins documentation, "Resource limits and performance optimization"); a margin
 * is kept for the request envelope, which the per-write overhead below only estimates.
 */
export const DEFAULT_CHUNK_BYTES = 4_000_000;

/** Estimated envelope bytes of one range write in a request (method, address, ids). */
export const WRITE_OVERHEAD_BYTES = 200;

/** Text Excel would read as something other than that text (number, date, formula, boolean). */
function needsTextPrefix(text: string): boolean {
  if (text === "") return false;
  if (/^[=+\-@']/.test(text)) return true;
  if (/^\s*[0-9.]/.test(text)) return true;
  return /^(true|false)$/i.test(text.trim()) || /^#[A-Z/0!?]+/.test(text);
}

/**
 * One cell as Excel's `range.formulas` takes it: formulas get their "=", text that Excel would
 * reinterpret gets the apostrophe prefix so it stays text, non-finite numbers become blank.
 */
export function toFormulaCell(cell: CellInput | undefined): string | number | boolean {
  if (cell === null || cell === undefined) return "";
  if (typeof cell === "object") return "=" + cell.formula;
  if (typeof cell === "number") return Number.isFinite(cell) ? cell : "";
  if (typeof cell === "boolean") return cell;
  return needsTextPrefix(cell) ? "'" + cell : cell;
}

/** Bytes one converted cell adds to a request (its JSON text plus a separator). */
export function cellBytes(cell: string | number | boolean | null): number {
  if (typeof cell === "string") {
    let n = cell.length + 3;
    // Non-ASCII characters take more than one byte in UTF-8 and may be escaped in JSON.
    for (let i = 0; i < cell.length; i++) if (cell.charCodeAt(i) > 127) n += 5;
    return n;
  }
  return String(cell).length + 1;
}

/** A block's rows converted and padded to a rectangle (null pads: Excel leaves those cells alone). */
function toRectangle(cells: readonly (readonly CellInput[])[]): (string | number | boolean | null)[][] {
  const cols = cells.reduce((w, row) => Math.max(w, row.length), 0);
  return cells.map((row) => {
    const out: (string | number | boolean | null)[] = new Array(cols).fill(null);
    for (let c = 0; c < row.length; c++) out[c] = toFormulaCell(row[c]);
    return out;
  });
}

/**
 * Split queued blocks into requests of at most `chunkBytes` each. Blocks keep their order; a
 * block too large for one request is cut between rows. A single row larger than the budget goes
 * alone in its own request (Excel has to take it whole).
 */
export function planChunks(blocks: readonly QueuedBlock[], chunkBytes = DEFAULT_CHUNK_BYTES): RangeWrite[][] {
  const chunks: RangeWrite[][] = [];
  let current: RangeWrite[] = [];
  let used = 0;
  const close = (): void => {
    if (current.length > 0) chunks.push(current);
    current = [];
    used = 0;
  };
  for (const block of blocks) {
    const rect = toRectangle(block.cells);
    const cols = rect[0]?.length ?? 0;
    if (rect.length === 0 || cols === 0) continue;
    const rowBytes = rect.map((row) => row.reduce<number>((s, c) => s + cellBytes(c), 2));
    let start = 0;
    while (start < rect.length) {
      if (used > 0 && used + WRITE_OVERHEAD_BYTES + rowBytes[start]! > chunkBytes) close();
      let bytes = WRITE_OVERHEAD_BYTES + rowBytes[start]!;
      let end = start + 1;
      while (end < rect.length && used + bytes + rowBytes[end]! <= chunkBytes) bytes += rowBytes[end++]!;
      current.push({ sheet: block.sheet, top: block.top + start, left: block.left, rows: end - start, cols, formulas: rect.slice(start, end) });
      used += bytes;
      start = end;
    }
  }
  close();
  return chunks;
}

/** Excel's "" for a blank cell becomes null, as the port reads blanks. */
export function fromExcelValue(value: unknown): CellValue {
  if (value === "" || value === null || value === undefined) return null;
  if (typeof value === "number" || typeof value === "boolean" || typeof value === "string") return value;
  return String(value);
}

/** Split "Sheet1!A1:C3" or "'My sheet'!B2" into the unquoted sheet and the 0-based top-left cell. */
export function parseRangeAddress(address: string): { sheet: string; top: number; left: number } {
  const bang = address.lastIndexOf("!");
  const rawSheet = bang < 0 ? "" : address.slice(0, bang);
  const sheet = rawSheet.startsWith("'") && rawSheet.endsWith("'") ? rawSheet.slice(1, -1).replace(/''/g, "'") : rawSheet;
  const first = address.slice(bang + 1).split(":")[0] ?? "A1";
  const { row, col } = parseCell(first);
  return { sheet, top: row, left: col };
}

/** Split a "Sheet!A1:H20" reference the user typed into sheet and address; null when it has no "!". */
export function splitSheetRef(ref: string): { sheet: string; address: string } | null {
  const bang = ref.lastIndexOf("!");
  if (bang <= 0) return null;
  const raw = ref.slice(0, bang);
  const sheet = raw.startsWith("'") && raw.endsWith("'") ? raw.slice(1, -1).replace(/''/g, "'") : raw;
  return { sheet, address: ref.slice(bang + 1).replace(/\$/g, "") };
}
