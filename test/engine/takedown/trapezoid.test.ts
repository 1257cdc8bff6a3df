/**
 * Loads that vary linearly along a member: a Loads row's `End width` (area load: the tributary
 * width runs from Width at From to End width at To) and `End magnitude` (line load), in the
 * add-in version of the takedown, built and computed in the headless engine. Every expected
 * value is hand statics written out here: a trapezoid split into a uniform part w1 over (a, b)
 * with its resultant at mid-length, and a triangle rising from 0 at a to (w2 - w1) at b with its
 * resultant (w2 - w1)(b - a)/2 at a + 2(b - a)/3 (the centroid of a triangle, common practice in
 * any statics text); the right reaction from moments about the left pin, the left one from
 * vertical equilibrium. The A_T of a trapezoidal tributary is its area (Width + End width)/2 x
 * (To - From).
 */
import type { RawCellContent } from "hyperformula";
import { describe, expect, it } from "vitest";
import { buildOn, resultOf } from "../../workbook/takedown-helpers";

/** Reactions of a pin-pin member of span L under a linearly varying load w1 at a to w2 at b (hand statics). */
function trapezoidReactions(span: number, w1: number, w2: number, a: number, b: number): { left: number; right: number } {
  const len = b - a;
  const uniform = w1 * len;
  const triangle = ((w2 - w1) * len) / 2;
  const moment = uniform * (a + len / 2) + triangle * (a + (2 * len) / 3);
  const right = moment / span;
  return { left: uniform + triangle - right, right };
}

function sheets(loads: RawCellContent[][]): Record<string, RawCellContent[][]> {
  return {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "S (psf)", "Reducible"],
      ["OFFICE", 60, 40, null, "yes"],
    ],
    Members: [
      ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"],
      ["B-1", "beam", "L2", 20, null, null, "W-1", null, "W-1", null],
      ["B-2", "beam", "L2", 20, null, null, "W-1", null, "W-1", null],
      ["B-3", "beam", "L2", 24, "OFFICE", 5, "W-1", null, "W-1", null],
      ["W-1", "wall", null, null, null, null, null, null, null, null],
    ],
    Loads: [["Mark", "Kind", "Zone or case", "Magnitude", "Width (ft)", "From (ft)", "To (ft)", "End width (ft)", "End magnitude (plf)"], ...loads],
  };
}

const LOADS: RawCellContent[][] = [
  // B-1: a trapezoidal tributary (4 ft at 2 ft, 10 ft at 14 ft) of zone OFFICE
  ["B-1", "area", "OFFICE", null, 4, 2, 14, 10, null],
  // B-2: a line load of D rising from 300 plf at 0 to 900 plf at 20 ft (given From and To)
  ["B-2", "line", "D", 300, null, 0, 20, null, 900],
  // B-2: a snow drift falling from 450 plf to 0 over the first 8 ft
  ["B-2", "line", "S", 450, null, 0, 8, null, 0],
  // B-3: a full-length uniform zone load (Trib) and a point load: no end magnitude, unchanged
  ["B-3", "point", "D", 1200, null, 9, null, null, null],
];

describe("Loads End width and End magnitude (add-in version)", () => {
  it("a trapezoidal tributary width: D and L reactions and A_T by hand statics", async () => {
    const { port, result } = await buildOn(sheets(LOADS));
    expect(result.problems).toEqual([]);
    // D: 60 psf x 4 ft = 240 plf at 2 ft, 60 x 10 = 600 plf at 14 ft (kip/ft: /1000)
    const d = trapezoidReactions(20, 0.24, 0.6, 2, 14);
    expect(resultOf(port, "B-1", "D R1 (kip)")).toBeCloseTo(d.left, 9);
    expect(resultOf(port, "B-1", "D R2 (kip)")).toBeCloseTo(d.right, 9);
    // L: 40 psf over the same widths
    const l = trapezoidReactions(20, 0.16, 0.4, 2, 14);
    expect(resultOf(port, "B-1", "L R1 (kip)")).toBeCloseTo(l.left, 9);
    expect(resultOf(port, "B-1", "L R2 (kip)")).toBeCloseTo(l.right, 9);
    // A_T: the trapezoid's area (4 + 10)/2 x 12 = 84 ft²
    expect(resultOf(port, "B-1", "A_T (ft²)")).toBeCloseTo(84, 9);
  });

  it("line loads with End magnitude (a rising D load, a snow drift triangle): reactions and total by hand statics", async () => {
    const { port } = await buildOn(sheets(LOADS));
    const d = trapezoidReactions(20, 0.3, 0.9, 0, 20);
    expect(resultOf(port, "B-2", "D R1 (kip)")).toBeCloseTo(d.left, 9);
    expect(resultOf(port, "B-2", "D R2 (kip)")).toBeCloseTo(d.right, 9);
    // drift: resultant 0.45 x 8 / 2 = 1.8 kip at 8/3 ft from the left end
    expect(resultOf(port, "B-2", "S R2 (kip)")).toBeCloseTo((1.8 * (8 / 3)) / 20, 9);
    expect(resultOf(port, "B-2", "S R1 (kip)")).toBeCloseTo(1.8 - (1.8 * (8 / 3)) / 20, 9);
    // largest sagging moment of the drift alone: shear zero where R1 = w(x) area from 0;
    // w(x) = 0.45 (1 - x/8), so 0.45 (x - x²/16) = R1; M = R1 x - 0.45 (x²/2 - x³/48)
    const r1 = 1.8 - (1.8 * (8 / 3)) / 20;
    const x = (16 - Math.sqrt(256 - (4 * 16 * r1) / 0.45)) / 2;
    const m = r1 * x - 0.45 * (x * x / 2 - (x * x * x) / 48);
    expect(resultOf(port, "B-2", "S M max (kip-ft)")).toBeCloseTo(m, 9);
  });

  it("a member without a varying load is unchanged: uniform zone load and point load by hand statics", async () => {
    const { port } = await buildOn(sheets(LOADS));
    // 60 psf x 5 ft = 0.3 kip/ft over 24 ft, plus 1.2 kip at 9 ft
    const right = (0.3 * 24 * 12 + 1.2 * 9) / 24;
    expect(resultOf(port, "B-3", "D R2 (kip)")).toBeCloseTo(right, 9);
    expect(resultOf(port, "B-3", "D R1 (kip)")).toBeCloseTo(0.3 * 24 + 1.2 - right, 9);
  });

  it("the end magnitude column is written for every line load (no blank a host could read as 0)", async () => {
    const { port } = await buildOn(sheets(LOADS));
    const id = port.hf.getSheetId("Takedown")!;
    const values = port.hf.getSheetValues(id);
    const h = values.findIndex((r) => r[0] === "Mark");
    const col = values[h]!.indexOf("w at end (kip/ft)");
    expect(col).toBeGreaterThan(0);
    const row = values.findIndex((r, i) => i > h && r[0] === "B-3");
    // B-3's uniform zone row: end magnitude equals its magnitude (0.3 kip/ft)
    expect(values[row]![col]).toBeCloseTo(0.3, 12);
  });

  it("without End width or End magnitude the loads blocks keep their four columns", async () => {
    const { port } = await buildOn(sheets(LOADS.slice(3)));
    const values = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
    const h = values.findIndex((r) => r[0] === "Mark");
    expect(values[h]!.some((v) => typeof v === "string" && v.startsWith("w at end"))).toBe(false);
  });

  it("End width on a line load and End magnitude on an area load are problems naming the cell", async () => {
    const { result } = await buildOn(
      sheets([
        ["B-1", "line", "D", 300, null, 0, 10, 6, null],
        ["B-2", "area", "OFFICE", null, 4, 0, 10, null, 500],
        ["B-3", "area", "OFFICE", null, 4, 0, 10, -2, null],
      ]),
    );
    const messages = result.problems.map((p) => `${p.cell} ${p.message}`);
    expect(messages).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^H2 Loads row 2 \(B-1\): End width applies to an area load only/),
        expect.stringMatching(/^I3 Loads row 3 \(B-2\): End magnitude applies to a line load only/),
        expect.stringMatching(/^H4 Loads row 4 \(B-3\): End width -2 is negative/),
      ]),
    );
  });
});
