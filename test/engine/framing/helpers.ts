/** Builders of plan tables for the framing tests (2-D arrays as read from a sheet at A1). */
import type { CellValue, TableData } from "../../../src/engine/takedown/types";
import { derivePlan, type Derivation } from "../../../src/engine/framing";

export function table(sheet: string, rows: CellValue[][]): TableData {
  return { sheet, top: 0, left: 0, values: rows };
}

export const FRAMING_HEAD: CellValue[] = ["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"];
export const DECKS_HEAD: CellValue[] = ["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2", "Corners"];

/** Read and derive a plan from rows (without their header rows). */
export function plan(framing: CellValue[][], decks: CellValue[][] = [], grids: CellValue[][] = [], levels: CellValue[][] = [["1", 12]], tolerance?: number): Derivation {
  const tables = {
    framing: table("Framing", [FRAMING_HEAD, ...framing]),
    decks: table("Decks", [DECKS_HEAD, ...decks]),
    grids: table("Grids", [["Grid", "X", "Y"], ...grids]),
    levels: table("Levels", [["Level", "Elevation"], ...levels]),
  };
  return derivePlan(tables, "US", tolerance);
}

/** A member's total deck load per unit area load (ft² or m²) from its pieces. */
export function total(d: Derivation, mark: string): number {
  const m = d.members.find((x) => x.mark === mark);
  return m ? m.tributaryArea : NaN;
}

/** Framing rows of four corner columns C1 (0, 0), C2 (w, 0), C3 (0, h), C4 (w, h) on level 1. */
export function cornerColumns(w: number, h: number): CellValue[][] {
  return [
    ["C1", "column", "1", 0, 0],
    ["C2", "column", "1", w, 0],
    ["C3", "column", "1", 0, h],
    ["C4", "column", "1", w, h],
  ];
}
