/**
 * Hand-worked cases of the derivation (statics by hand; formulas named beside each check).
 */
import { describe, expect, it } from "vitest";
import { cornerColumns, plan, total } from "./helpers";

// A bay 30 ft (x) by 24 ft (y): girders along x at y = 0 and y = 24 on columns, beams along y.
const bay = (beamsAt: number[]) => [
  ...cornerColumns(30, 24),
  ["G1", "girder", "1", 0, 0, 30, 0],
  ["G2", "girder", "1", 0, 24, 30, 24],
  ...beamsAt.map((x, i) => [`B${i + 1}`, "beam", "1", x, 0, x, 24]),
];

describe("one-way deck, strip rule (hand statics)", () => {
  it("interior beam carries q(a1 + a2)/2 per unit length; spandrels a/2 (tributary width, hand statics)", () => {
    const d = plan(bay([0, 10, 30]), [["D1", "1", "one-way", "Office", "x", 0, 0, 30, 24]]);
    expect(d.problems).toEqual([]);
    const b2 = d.members.find((m) => m.mark === "B2")!;
    // a1 = 10, a2 = 20: width (10 + 20)/2 = 15 ft over the full 24 ft
    expect(b2.tributary).toHaveLength(1);
    expect(b2.tributary[0]!.width).toBeCloseTo(15, 12);
    expect(b2.tributary[0]!.endWidth).toBeCloseTo(15, 12);
    expect(b2.tributary[0]!.from).toBeCloseTo(0, 12);
    expect(b2.tributary[0]!.to).toBeCloseTo(24, 12);
    expect(total(d, "B1")).toBeCloseTo(5 * 24, 10);
    expect(total(d, "B3")).toBeCloseTo(10 * 24, 10);
    // girders are parallel to the span: none
    expect(total(d, "G1")).toBe(0);
    // supports: beams land on the girders at their x
    expect(b2.startSupport).toBe("G1");
    expect(b2.startAt).toBeCloseTo(10, 12);
    expect(b2.endSupport).toBe("G2");
    expect(d.members.find((m) => m.mark === "G1")!.startSupport).toBe("C1");
  });

  it("spandrel with a slab overhang c carries q(a/2 + c) (hand statics)", () => {
    // beams at 0, 10, 20, 30; slab runs from x = -2.5 (overhang c = 2.5 past B1)
    const d = plan(bay([0, 10, 20, 30]), [["D1", "1", "one-way", "Office", "x", null, null, null, null, "-2.5,0; 30,0; 30,24; -2.5,24"]]);
    expect(d.problems).toEqual([]);
    const b1 = d.members.find((m) => m.mark === "B1")!;
    expect(b1.tributary[0]!.width).toBeCloseTo(10 / 2 + 2.5, 12);
    expect(total(d, "B1")).toBeCloseTo((5 + 2.5) * 24, 10);
  });

  it("a skewed beam gets a trapezoid: width varies linearly with the distance to its neighbours (hand statics)", () => {
    // B1 at x = 0, B3 at x = 30, B2 skewed from (10, 0) to (16, 24). Span x.
    const d = plan(
      [...bay([0]), ["B2", "beam", "1", 10, 0, 16, 24], ["B3", "beam", "1", 30, 0, 30, 24]],
      [["D1", "1", "one-way", "Office", "x", 0, 0, 30, 24]],
    );
    expect(d.problems).toEqual([]);
    const b2 = d.members.find((m) => m.mark === "B2")!;
    // at y: B2 at x = 10 + y/4. Strip width (in x) = (B3 - B1)/2 = 15 everywhere; along the member
    // the load per unit length is 15·sin(angle to the span) = 15·24/L, L = sqrt(6² + 24²).
    const L = Math.hypot(6, 24);
    expect(b2.tributary).toHaveLength(1);
    expect(b2.tributary[0]!.width).toBeCloseTo((15 * 24) / L, 10);
    expect(total(d, "B2")).toBeCloseTo(15 * 24, 10);
    // B1: strip from 0 to (0 + 10 + y/4)/2 = 5 + y/8: a trapezoid 5 -> 8
    const b1 = d.members.find((m) => m.mark === "B1")!;
    expect(b1.tributary[0]!.width).toBeCloseTo(5, 10);
    expect(b1.tributary[0]!.endWidth).toBeCloseTo(8, 10);
    expect(total(d, "B1") + total(d, "B2") + total(d, "B3")).toBeCloseTo(30 * 24, 9);
  });

  it("an opening removes its deck; the zone of each deck is kept", () => {
    const d = plan(bay([0, 10, 20, 30]), [
      ["D1", "1", "one-way", "Office", "x", 0, 0, 30, 24],
      ["O1", "1", "opening", null, null, 12, 4, 18, 10],
    ]);
    expect(d.problems).toEqual([]);
    const sum = ["B1", "B2", "B3", "B4"].reduce((s, m) => s + total(d, m), 0);
    expect(sum).toBeCloseTo(30 * 24 - 6 * 6, 9);
    // B2 (x = 10) loses x 12..15 over y 4..10: 3 x 6 = 18 (the part 15..18 was B3's)
    expect(total(d, "B2")).toBeCloseTo(10 * 24 - 18, 9);
    expect(d.members.find((m) => m.mark === "B2")!.tributary.every((p) => p.zone === "Office")).toBe(true);
  });
});

describe("deck direction change (hand statics)", () => {
  it("each deck area spans its own way and keeps its zone; a member parallel to one deck's span takes only the other's load", () => {
    // left 0..12 spans x between B1 (x = 0) and B2 (x = 12); right 12..30 spans y onto G1 (y = 0) and G2 (y = 24)
    const d = plan(bay([0, 12]), [
      ["D1", "1", "one-way", "Office", "x", 0, 0, 12, 24],
      ["D2", "1", "one-way", "Corridor", "y", 12, 0, 30, 24],
    ]);
    expect(d.problems).toEqual([]);
    expect(total(d, "B1")).toBeCloseTo(6 * 24, 10);
    expect(total(d, "B2")).toBeCloseTo(6 * 24, 10);
    const g1 = d.members.find((m) => m.mark === "G1")!;
    expect(g1.tributary.map((p) => [p.zone, p.from, p.to, p.width, p.endWidth])).toEqual([["Corridor", 12, 30, 12, 12]]);
    expect(d.members.find((m) => m.mark === "B2")!.tributary.every((p) => p.zone === "Office")).toBe(true);
  });
});

describe("two-way panel by 45-degree lines", () => {
  it("short sides carry qLx²/4, long sides q(LxLy/2 - Lx²/4) (yield-line / 45-degree rule, e.g. ACI 318 two-way slab load distribution, recalled from memory)", () => {
    const d = plan(
      [
        ...cornerColumns(30, 20),
        ["G1", "girder", "1", 0, 0, 30, 0],
        ["G2", "girder", "1", 0, 20, 30, 20],
        ["G3", "girder", "1", 0, 0, 0, 20],
        ["G4", "girder", "1", 30, 0, 30, 20],
      ],
      [["P1", "1", "two-way", "Office", null, 0, 0, 30, 20]],
    );
    expect(d.problems).toEqual([]);
    const lx = 20, ly = 30;
    expect(total(d, "G3")).toBeCloseTo((lx * lx) / 4, 10);
    expect(total(d, "G4")).toBeCloseTo((lx * lx) / 4, 10);
    expect(total(d, "G1")).toBeCloseTo((lx * ly) / 2 - (lx * lx) / 4, 10);
    expect(total(d, "G2")).toBeCloseTo((lx * ly) / 2 - (lx * lx) / 4, 10);
    const g1 = d.members.find((m) => m.mark === "G1")!;
    expect(g1.tributary.map((p) => [p.from, p.to, p.width, p.endWidth])).toEqual([
      [0, 10, 0, 10],
      [10, 20, 10, 10],
      [20, 30, 10, 0],
    ]);
  });

  it("a side carried by two girders end to end splits its trapezoid between them at the joint (same 45-degree rule)", () => {
    const d = plan(
      [
        ...cornerColumns(30, 20),
        ["C5", "column", "1", 15, 0],
        ["G1a", "girder", "1", 0, 0, 15, 0],
        ["G1b", "girder", "1", 15, 0, 30, 0],
        ["G2", "girder", "1", 0, 20, 30, 20],
        ["G3", "girder", "1", 0, 20, 0, 0],
        ["G4", "girder", "1", 30, 0, 30, 20],
      ],
      [["P1", "1", "two-way", "Office", null, 0, 0, 30, 20]],
    );
    expect(d.problems).toEqual([]);
    // trapezoid 0 -> 10 over 0..10, 10 over 10..20, 10 -> 0 over 20..30: each half carries 50 + 50
    expect(total(d, "G1a")).toBeCloseTo(100, 10);
    expect(total(d, "G1b")).toBeCloseTo(100, 10);
    expect(d.members.find((m) => m.mark === "G1b")!.tributary.map((p) => [p.from, p.to, p.width, p.endWidth])).toEqual([
      [0, 5, 10, 10],
      [5, 15, 10, 0],
    ]);
    // G3 runs from (0, 20) to (0, 0): its triangle measured from its own start
    expect(total(d, "G3")).toBeCloseTo((20 * 20) / 4, 10);
  });
});
