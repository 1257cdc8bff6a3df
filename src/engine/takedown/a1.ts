/** A1-style addresses for the takedown engine (0-based rows and columns in, Excel text out). */
import { a1Absolute, quoteSheet } from "../a1";
import type { CellRef } from "./types";

export { a1, a1Absolute, columnLetter, quoteSheet } from "../a1";

/** An absolute reference to an input cell from another sheet: Members!$D$7. */
export function sheetCellRef(ref: CellRef): string {
  return `${quoteSheet(ref.sheet)}!${a1Absolute(ref.row, ref.col)}`;
}
