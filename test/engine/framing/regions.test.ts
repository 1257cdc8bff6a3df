/**
 * The deck region each member receives (Derivation.regions), for the plan drawings: each region's
 * area (shoelace, computed here) equals the integral of the member's derived width along it, the
 * regions of a deck tile it (their areas add up to the deck's area less its openings, and no two
 * overlap), and every region lies in its deck. Cases: a skewed beam (trapezoids), an opening, a
 * slab overhang, a two-way panel and a deck at an angle.
 */
import { describe, expect, it } from "vitest";
import type { Derivation } from "../../../src/engine/framing";
import { cornerColumns, plan } from "./helpers";

type P = { x: number; y: number };
const shoelace = (poly: readonly P[]): number => Math.abs(poly.reduce((s, a, i) => s + a.x * poly[(i + 1) % poly.length]!.y - poly[(i + 1) % poly.length]!.x * a.y, 0)) / 2;

/** Whether p lies in the rectangle [x0, x1] x [y0, y1] (within 1e-9). */
const inRect = (p: P, x0: number, y0: number, x1: number, y1: number) => p.x >= x0 - 1e-9 && p.x <= x1 + 1e-9 && p.y >= y0 - 1e-9 && p.y <= y1 + 1e-9;

function checkMembers(d: Derivation): void {
  for (const m of d.members) {
    const mine = d.regions.filter((r) => r.mark === m.mark);
    const area = mine.reduce((s, r) => s + shoelace(r.polygon), 0);
    const integral = m.tributary.reduce((s, p) => s + ((p.to - p.from) * (p.width + p.endWidth)) / 2, 0);
    expect(area, m.mark).toBeCloseTo(integral, 9);
    expect(area, m.mark).toBeCloseTo(m.tributaryArea, 9);
  }
}

describe("tributary regions", () => {
  it("a skewed beam, an opening and a slab overhang: regions add up per member and tile the deck", () => {
    const d = plan(
      [...cornerColumns(30, 24), ["G1", "girder", "1", -2.5, 0, 30, 0], ["G2", "girder", "1", -2.5, 24, 30, 24], ["B1", "beam", "1", 0, 0, 0, 24], ["B2", "beam", "1", 10, 0, 16, 24], ["B3", "beam", "1", 30, 0, 30, 24]],
      [["D1", "1", "one-way", "Office", "x", null, null, null, null, "-2.5,0; 30,0; 30,24; -2.5,24"], ["O1", "1", "opening", null, null, 20, 6, 26, 12]],
    );
    expect(d.problems.filter((p) => p.code !== "endOnNothing")).toEqual([]);
    checkMembers(d);
    const total = d.regions.reduce((s, r) => s + shoelace(r.polygon), 0);
    // deck 32.5 x 24 less the 6 x 6 opening (hand arithmetic)
    expect(total).toBeCloseTo(32.5 * 24 - 36, 9);
    for (const r of d.regions) for (const p of r.polygon) expect(inRect(p, -2.5, 0, 30, 24), r.mark).toBe(true);
    // B2 skewed (x = 10 + y/4) between B1 (x = 0) and B3 (x = 30): strip width (30 − 0)/2 = 15 at
    // every y, less the opening's part on B2's side of mid-distance x = 20 + y/8 for y in 6..12:
    // ∫ (20 + y/8 − 20) dy = (12² − 6²)/16 = 6.75 ft² (hand statics)
    const b2 = d.regions.filter((r) => r.mark === "B2").reduce((s, r) => s + shoelace(r.polygon), 0);
    expect(b2).toBeCloseTo(15 * 24 - 6.75, 9);
  });

  it("a two-way panel: four regions, triangles of Lx²/4 on the short sides and trapezoids on the long ones", () => {
    const d = plan(
      [...cornerColumns(20, 30), ["G1", "girder", "1", 0, 0, 20, 0], ["G2", "girder", "1", 0, 30, 20, 30], ["B1", "beam", "1", 0, 0, 0, 30], ["B2", "beam", "1", 20, 0, 20, 30]],
      [["P1", "1", "two-way", "Office", null, 0, 0, 20, 30]],
    );
    expect(d.problems).toEqual([]);
    checkMembers(d);
    const area = (mark: string) => d.regions.filter((r) => r.mark === mark).reduce((s, r) => s + shoelace(r.polygon), 0);
    // Lx = 20, Ly = 30: short sides 20²/4 = 100 ft², long sides 20·30/2 − 20²/4 = 200 ft² (two-way slab by 45-degree lines)
    expect(area("G1")).toBeCloseTo(100, 9);
    expect(area("G2")).toBeCloseTo(100, 9);
    expect(area("B1")).toBeCloseTo(200, 9);
    expect(area("B2")).toBeCloseTo(200, 9);
  });

  it("a deck spanning at 30 degrees: regions add up per member and to the deck's area", () => {
    const d = plan(
      [...cornerColumns(30, 24), ["G1", "girder", "1", 0, 0, 30, 0], ["G2", "girder", "1", 0, 24, 30, 24], ["B1", "beam", "1", 0, 0, 0, 24], ["B2", "beam", "1", 15, 0, 15, 24], ["B3", "beam", "1", 30, 0, 30, 24]],
      [["D1", "1", "one-way", "Office", 30, 0, 0, 30, 24]],
    );
    checkMembers(d);
    const total = d.regions.reduce((s, r) => s + shoelace(r.polygon), 0);
    expect(total).toBeCloseTo(30 * 24, 9);
  });
});
