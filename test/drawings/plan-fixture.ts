/**
 * A small invented framing plan for the plan drawing's tests: two bays on one level and a roof.
 * Bay 1 (x 0..30, y 0..24) is one-way deck spanning x on beams at x = 0, 10, 20, 30, with an
 * opening 12..18 x 8..14 between B2 and B3; bay 2 (x 30..54) is a two-way 24 x 24 panel on
 * B4, G2, B5, G4. Marks and zone names carry markup, quotes and ampersands on purpose.
 */
import type { CellValue, TableData } from "../../src/engine/takedown/types";
import { derive, readPlan } from "../../src/engine/framing";
import type { FramingPlanModel } from "../../src/drawings/plan";

/** A mark written to break out of markup if it were not escaped. */
export const HOSTILE_MARK = `B2<script>alert("x")</script>&'`;
/** A zone name with markup, quotes and an ampersand. */
export const HOSTILE_ZONE = `Office & "Files" <b>`;

export const GRIDS: CellValue[][] = [["Grid", "X", "Y"], ["A", 0, null], ["B", 30, null], ["C", 54, null], ["1", null, 0], ["2", null, 24]];
export const LEVELS: CellValue[][] = [["Level", "Elevation"], ["2", 14], ["Roof", 28]];

function framingRows(level: string, suffix: string, b2: string): CellValue[][] {
  return [
    [`C1${suffix}`, "column", level, "A", "1"],
    [`C2${suffix}`, "column", level, "B", "1"],
    [`C3${suffix}`, "column", level, "C", "1"],
    [`C4${suffix}`, "column", level, "A", "2"],
    [`C5${suffix}`, "column", level, "B", "2"],
    [`C6${suffix}`, "column", level, "C", "2"],
    [`G1${suffix}`, "girder", level, "A", "1", "B", "1"],
    [`G2${suffix}`, "girder", level, "B", "1", "C", "1"],
    [`G3${suffix}`, "girder", level, "A", "2", "B", "2"],
    [`G4${suffix}`, "girder", level, "B", "2", "C", "2"],
    [`B1${suffix}`, "beam", level, "A", "1", "A", "2"],
    [b2, "beam", level, "A+10", "1", "A+10", "2"],
    [`B3${suffix}`, "beam", level, "A+20", "1", "A+20", "2"],
    [`B4${suffix}`, "beam", level, "B", "1", "B", "2"],
    [`B5${suffix}`, "beam", level, "C", "1", "C", "2"],
  ];
}

export const FRAMING: CellValue[][] = [["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"], ...framingRows("2", "", HOSTILE_MARK), ...framingRows("Roof", "R", "B2R")];

export const DECKS: CellValue[][] = [
  ["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2", "Corners"],
  ["D1", "2", "one-way", HOSTILE_ZONE, "x", "A", "1", "B", "2", null],
  ["O1", "2", "opening", null, null, 12, 8, 18, 14, null],
  ["D2", "2", "two-way", "Office", null, null, null, null, null, "B/1; C/1; C/2; B/2"],
  ["R1", "Roof", "one-way", "Roof", "x", "A", "1", "C", "2", null],
];

const table = (sheet: string, values: CellValue[][]): TableData => ({ sheet, top: 0, left: 0, values });

/** The fixture read and derived (US, ft). */
export function fixtureModel(): FramingPlanModel {
  const r = readPlan({ grids: table("Grids", GRIDS), levels: table("Levels", LEVELS), framing: table("Framing", FRAMING), decks: table("Decks", DECKS) }, "US");
  const derivation = derive(r.plan, { units: "US" });
  return { plan: r.plan, grids: r.grids, derivation, units: "US" };
}
