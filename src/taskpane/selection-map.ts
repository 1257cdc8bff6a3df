/**
 * Which member a selected cell stands for: any cell of a member's row in the Members table, or
 * any cell of a member's block of rows on the generated takedown sheet. Pure.
 */
import { parseCell } from "../workbook/a1";
import type { CellSelection } from "../workbook/port";
import type { BuiltTakedown } from "../workbook/takedown-api";

/** A selected cell matched to a member. */
export interface SelectedMember {
  readonly mark: string;
  /** Where the cell is: a row of the Members table, or the member's rows on the takedown sheet. */
  readonly where: "members" | "takedown";
}

/** Sheet (lower case) -> 0-based row -> member mark. */
export type SelectionIndex = ReadonlyMap<string, ReadonlyMap<number, SelectedMember>>;

function rowsOfSheet(index: Map<string, Map<number, SelectedMember>>, sheet: string): Map<number, SelectedMember> {
  const key = sheet.toLowerCase();
  let rows = index.get(key);
  if (!rows) {
    rows = new Map();
    index.set(key, rows);
  }
  return rows;
}

/**
 * Index the rows that stand for members: each member row of the Members table (by the row of
 * its Mark cell) and each row of each member's block on the takedown sheet. Members left out of
 * the takedown (a problem on their row) are not indexed.
 * @param built - the build's model, plan and member rows
 */
export function selectionIndexOf(built: BuiltTakedown): SelectionIndex {
  const index = new Map<string, Map<number, SelectedMember>>();
  for (const m of built.model.members) {
    if (!m.firstOfMark || built.rowsByMember[m.mark] === undefined) continue;
    rowsOfSheet(index, m.markCell.sheet).set(m.markCell.row, { mark: m.mark, where: "members" });
  }
  const own = rowsOfSheet(index, built.plan.sheet);
  for (const [mark, rows] of Object.entries(built.rowsByMember)) {
    for (let r = rows.row; r < rows.row + rows.rows; r++) own.set(r, { mark, where: "takedown" });
  }
  return index;
}

/**
 * The member a selected cell stands for, or null.
 * @param index - from {@link selectionIndexOf}
 * @param selection - the active cell
 */
export function memberAt(index: SelectionIndex, selection: CellSelection): SelectedMember | null {
  const rows = index.get(selection.sheet.toLowerCase());
  if (!rows) return null;
  let row: number;
  try {
    row = parseCell(selection.address.replace(/\$/g, "")).row;
  } catch {
    return null;
  }
  return rows.get(row) ?? null;
}
