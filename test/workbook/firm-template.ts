/**
 * The firm's own takedown template of issue 15, built in the tests: a title block of three rows,
 * a group row ("Start" over G:H, "End" over I:J, as a merged title reads), headers that are not the
 * defaults, two "Supported by (...)" whose parentheses are words, two "Location (ft)" told apart
 * only by their group, and a units row; its matching given once; and the hand statics its
 * results are checked against.
 */
import type { RawCellContent } from "hyperformula";
import { expect } from "vitest";
import type { TakedownJson } from "../../src/workbook/takedown-api";

export const G = [null, null, null, null, null, null, "Start", null, "End", null];
export const H = ["Beam Mark", "Member", "Floor", "Length (ft)", "Area type", "Trib. Width (ft)", "Supported by (start)", "Location (ft)", "Supported by (end)", "Location (ft)"];
export const U = [null, null, null, "(ft)", null, "[ft]", null, "ft", null, "(ft)"];

/** The firm's workbook: Members header on sheet row 5 (title rows 1-3, group row 4, units row 6). */
export const SHEETS: Record<string, RawCellContent[][]> = {
  Zones: [["Area loads (invented office)"], ["Zone", "D (psf)", "L (psf)", "Reducible"], ["F", 50, 80, "no"]],
  Members: [
    ["Gravity load takedown"],
    ["Project: invented two-girder bay", null, null, null, "Job 26-014"],
    ["By: ____", null, null, null, "Checked: ____"],
    G,
    H,
    U,
    ["B1", "beam", "2", 24, "F", 10, "G1", 8, "G2", 18],
    ["G1", "girder", "2", 24, null, null, "C1", null, "C2", null],
    ["G2", "girder", "2", 24, null, null, "C3", null, "C4", null],
    ...[1, 2, 3, 4].map((i) => [`C${i}`, "column", "2", 12, null, null, `F${i}`, null, null, null]),
    ...[1, 2, 3, 4].map((i) => [`F${i}`, "foundation", null, null, null, null, null, null, null, null]),
  ],
};

/** The matching, given once: by header, by Group/Header, by the sheet's column letter. */
export const MAPPING = {
  Mark: "Beam Mark",
  Type: "Member",
  Level: "Floor",
  Span: "Length",
  Zone: "Area type",
  Trib: "Trib. Width",
  "Start support": "Supported by (start)",
  "Start at": "Start/Location",
  "End support": "Supported by (end)",
  "End at": "J",
};
export const MAP_ARGS = Object.entries(MAPPING).flatMap(([k, v]) => ["--map", `members.${k}=${v}`]);

// Hand statics (kip, ft). B1: w = area load x trib width, simple span L = 24:
// R = wL/2 each end (AISC Steel Construction Manual, Table 3-23, case 1; recalled from memory).
export const L = 24;
const w = { D: (50 * 10) / 1000, L: (80 * 10) / 1000 };
const rB = { D: (w.D * L) / 2, L: (w.L * L) / 2 };
// G1 and G2 each carry B1's end reaction as a point load P at a (8 ft on G1, 18 ft on G2):
// R_start = P (L - a) / L, R_end = P a / L (same Table 3-23, case 7; recalled from memory).
const point = (p: number, a: number): [number, number] => [(p * (L - a)) / L, (p * a) / L];
export const hand = {
  B1: { D: [rB.D, rB.D], L: [rB.L, rB.L] },
  G1: { D: point(rB.D, 8), L: point(rB.L, 8) },
  G2: { D: point(rB.D, 18), L: point(rB.L, 18) },
};

export function checkByHand(json: TakedownJson): void {
  for (const mark of ["B1", "G1", "G2"] as const) {
    for (const c of ["D", "L"] as const) {
      const got = json.members[mark]!.reactions[c]!;
      expect(got[0]).toBeCloseTo(hand[mark][c][0], 9);
      expect(got[1]).toBeCloseTo(hand[mark][c][1], 9);
    }
  }
  // B1's largest moment wL^2/8 (Table 3-23, case 1; recalled from memory).
  expect(json.members.B1!.momentMax.D).toBeCloseTo((w.D * L * L) / 8, 9);
  // Each column takes the girder end over it; each footing what its column brings down.
  const cols: Record<string, number> = { C1: hand.G1.D[0], C2: hand.G1.D[1], C3: hand.G2.D[0], C4: hand.G2.D[1] };
  for (const [mark, d] of Object.entries(cols)) expect(json.columns[mark]!.cumulative.D).toBeCloseTo(d, 9);
  // Equilibrium: everything applied reaches the footings (w L per case).
  expect(json.balance.D!.applied).toBeCloseTo(w.D * L, 9);
  expect(json.balance.D!.supports).toBeCloseTo(w.D * L, 9);
}
