/**
 * Bearing walls that carry load down (issue 11, item 3): a wall's Start support is what it bears
 * on; on a beam it stands from Start at to End at and the beam takes its load as a line load over
 * that length; stacked walls accumulate level by level; walls and foundations report per unit
 * length. Checked against hand statics written out here; the sheet is evaluated by HyperFormula
 * with the add-in's functions. Needs `npm run build`.
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { buildOn, handMaxMoment, handReactions } from "./takedown-helpers";

function close(actual: unknown, expected: number, rel = 1e-12): void {
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

const MEMBER_HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"];
const LOAD_HEADERS = ["Mark", "Kind", "Zone or case", "Magnitude", "Width", "From", "To"];
const ZONES = [
  ["Zone", "D (psf)", "L (psf)", "Reducible"],
  ["FLR", 50, 40, "no"],
];

/** Joist J3 (12 ft, trib 10 ft) from wall W2 to wall W0: each wall gets wL/2 (D 3.0 kip, L 2.4 kip). */
const J3_D = ((50 * 10) / 1000) * 12 / 2;
const J3_L = ((40 * 10) / 1000) * 12 / 2;

describe("a wall standing on a beam", () => {
  /**
   * W2 (level 2) stands on beam B1 from 4 to 14 ft, carries J3's end and a 2 kip D point load
   * (its own weight); B1 spans 20 ft between footings F1 and F2.
   */
  function building(start: RawCellContent = 4, end: RawCellContent = 14, base: RawCellContent = "B1"): Record<string, RawCellContent[][]> {
    return {
      Zones: ZONES,
      Members: [
        MEMBER_HEADERS,
        ["J3", "joist", "3", 12, "FLR", 10, "W2", null, "W0", null],
        ["W2", "wall", "2", null, null, null, base, start, null, end],
        ["B1", "beam", "1", 20, null, null, "F1", null, "F2", null],
        ["C1", "column", "1", 10, null, null, "F1", null, null, null],
        ["W0", "wall", null, null, null, null, null, null, null, null],
        ["F1", "foundation", null, null, null, null, null, null, null, null],
        ["F2", "foundation", null, null, null, null, null, null, null, null],
      ],
      Loads: [LOAD_HEADERS, ["W2", "point", "D", 2000, null, null, null]],
    };
  }

  it("the beam takes the wall's total per unit length over Start at..End at; its reactions follow by statics", async () => {
    const { result } = await buildOn(building());
    expect(result.problems).toEqual([]);
    const wallD = J3_D + 2; // kip
    const w = wallD / 10; // kip/ft over 10 ft
    const json = result.json!;
    close(json.foundations.W2!.D!, wallD);
    close(json.perLength.W2!.length, 10);
    close(json.perLength.W2!.loads.D!, w);
    close(json.perLength.W2!.loads.L!, J3_L / 10);
    const hand = handReactions(20, [], [{ w, a: 4, b: 14 }]);
    close(json.members.B1!.reactions.D![0]!, hand.left);
    close(json.members.B1!.reactions.D![1]!, hand.right);
    close(json.members.B1!.momentMax.D!, handMaxMoment(20, [], [{ w, a: 4, b: 14 }]));
    close(json.foundations.F2!.D!, hand.right);
  });

  it("the balance counts the wall once: applied load = W0 + F1 + F2", async () => {
    const { result } = await buildOn(building());
    const b = result.json!.balance.D!;
    close(b.applied, ((50 * 10) / 1000) * 12 + 2);
    close(b.supports, b.applied);
  });

  it("a wall on a column, or outside its beam: a problem naming the cell, the rest builds", async () => {
    const onColumn = await buildOn(building(4, 14, "C1"));
    expect(onColumn.result.problems.map((p) => [p.code, p.sheet, p.cell])).toEqual([["badValue", "Members", "G3"]]);
    expect(onColumn.result.json!.members.B1).toBeDefined();
    const outside = await buildOn(building(4, 24));
    expect(outside.result.problems.map((p) => [p.code, p.cell])).toEqual([["supportOutside", "J3"]]);
    const reversed = await buildOn(building(14, 4));
    expect(reversed.result.problems.map((p) => [p.code, p.cell])).toEqual([["badValue", "J3"]]);
    const blank = await buildOn(building(null, 14));
    expect(blank.result.problems.map((p) => [p.code, p.cell])).toEqual([["missingPosition", "H3"]]);
  });

  it("hand-off version: the beam under the wall is written as values and listed", async () => {
    const { result } = await buildOn(building(), { native: true });
    expect(result.problems).toEqual([]);
    // B1's mechanics for the wall's partial line load; the governing values of J3 and B1 (add-in only) are counted apart.
    expect(result.valueOnly?.map((v) => v.mark)).toEqual(["B1"]);
    expect(result.valueOnly![0]!.reason).toMatch(/carries a wall's load/);
    expect(result.governingValuesOnly).toBe(2);
    const hand = handReactions(20, [], [{ w: (J3_D + 2) / 10, a: 4, b: 14 }]);
    close(result.json!.members.B1!.reactions.D![0]!, hand.left);
  });
});

describe("two stacked walls onto a footing", () => {
  /** W3 (level 3, 10 ft long) bears on W2 (level 2, 10 ft long), which bears on footing F9 (no length given). */
  const sheets: Record<string, RawCellContent[][]> = {
    Zones: ZONES,
    Members: [
      MEMBER_HEADERS,
      ["J3", "joist", "3", 12, "FLR", 10, "W3", null, "W0", null],
      ["W3", "wall", "3", 10, null, null, "W2", null, null, null],
      ["W2", "wall", "2", 10, null, null, "F9", null, null, null],
      ["W0", "wall", null, null, null, null, null, null, null, null],
      ["F9", "foundation", null, null, null, null, null, null, null, null],
    ],
    Loads: [LOAD_HEADERS, ["W3", "point", "D", 1500, null, null, null], ["W2", "point", "D", 1500, null, null, null]],
  };

  it("totals accumulate level by level and each reports per unit length (hand sums)", async () => {
    const { result } = await buildOn(sheets);
    expect(result.problems).toEqual([]);
    const j = result.json!;
    // W3: J3's end + 1.5 kip; W2: W3 + 1.5 kip; F9: W2. Per length: over 10 ft each (F9: W2's length).
    close(j.foundations.W3!.D!, J3_D + 1.5);
    close(j.foundations.W2!.D!, J3_D + 3);
    close(j.foundations.F9!.D!, J3_D + 3);
    close(j.foundations.F9!.L!, J3_L);
    close(j.perLength.W3!.loads.D!, (J3_D + 1.5) / 10);
    close(j.perLength.W2!.loads.D!, (J3_D + 3) / 10);
    close(j.perLength.F9!.length, 10);
    close(j.perLength.F9!.loads.D!, (J3_D + 3) / 10);
    close(j.perLength.F9!.loads.L!, J3_L / 10);
    expect(j.perLength.W0).toBeUndefined();
    const b = j.balance.D!;
    close(b.applied, ((50 * 10) / 1000) * 12 + 3);
    close(b.supports, b.applied);
  });
});
