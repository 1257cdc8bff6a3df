/**
 * A fine-grid sampling oracle, written here and independent of the engine's slabs: each small
 * cell of deck goes to the nearer supporting member along its strip (the line through the cell in
 * the span direction), searching both ways only through deck; integrating the cells gives each
 * member's total load per unit area load and its first moment along the member (hence its simple
 * span reactions). The engine's exact values must agree within the grid's error.
 */
import { describe, expect, it } from "vitest";
import { plan } from "./helpers";
import type { CellValue } from "../../../src/engine/takedown/types";

type P = { x: number; y: number };
interface M { mark: string; a: P; b: P }

function inside(p: P, poly: readonly P[]): boolean {
  let c = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const a = poly[j]!, b = poly[i]!;
    if (a.y > p.y !== b.y > p.y && p.x < a.x + ((p.y - a.y) * (b.x - a.x)) / (b.y - a.y)) c = !c;
  }
  return c;
}

/** Oracle: total area and first moment (about each member's start) per member. */
function oracle(deck: P[], openings: P[][], spanDeg: number, members: M[], h: number): Map<string, { area: number; moment: number }> {
  const d = { x: Math.cos((spanDeg * Math.PI) / 180), y: Math.sin((spanDeg * Math.PI) / 180) };
  const isDeck = (p: P): boolean => inside(p, deck) && !openings.some((o) => inside(p, o));
  const xs = deck.map((p) => p.x), ys = deck.map((p) => p.y);
  const out = new Map<string, { area: number; moment: number }>();
  const carriers = members.filter((m) => Math.abs((m.b.x - m.a.x) * d.y - (m.b.y - m.a.y) * d.x) > 1e-9);
  for (let x = Math.min(...xs) + h / 2; x < Math.max(...xs); x += h)
    for (let y = Math.min(...ys) + h / 2; y < Math.max(...ys); y += h) {
      const p = { x, y };
      if (!isDeck(p)) continue;
      // crossing of the strip line p + t d with each member: t and position along the member
      let best: { m: M; t: number; s: number } | null = null;
      for (const m of carriers) {
        const ex = m.b.x - m.a.x, ey = m.b.y - m.a.y;
        const den = d.x * ey - d.y * ex;
        const qx = m.a.x - p.x, qy = m.a.y - p.y;
        const t = (qx * ey - qy * ex) / den;
        const u = (qx * d.y - qy * d.x) / den;
        if (u < -1e-9 || u > 1 + 1e-9) continue;
        // deck all the way from p to the member (checked every h/2)
        const n = Math.ceil(Math.abs(t) / (h / 2));
        let through = true;
        for (let k = 1; k < n; k++) if (!isDeck({ x: p.x + (d.x * t * k) / n, y: p.y + (d.y * t * k) / n })) through = false;
        if (!through) continue;
        if (!best || Math.abs(t) < Math.abs(best.t)) best = { m, t, s: u * Math.hypot(ex, ey) };
      }
      if (!best) continue;
      const r = out.get(best.m.mark) ?? { area: 0, moment: 0 };
      r.area += h * h;
      r.moment += h * h * best.s;
      out.set(best.m.mark, r);
    }
  return out;
}

const pts = (poly: P[]): string => poly.map((p) => `${p.x},${p.y}`).join("; ");

function check(members: M[], columns: [string, number, number][], deck: P[], openings: P[][], spanDeg: number, h: number, tolArea: number): void {
  const rows: CellValue[][] = [
    ...columns.map(([mark, x, y]) => [mark, "column", "1", x, y]),
    ...members.map((m) => [m.mark, m.mark.startsWith("G") ? "girder" : "beam", "1", m.a.x, m.a.y, m.b.x, m.b.y]),
  ];
  const decks: CellValue[][] = [["D1", "1", "one-way", "Office", spanDeg, null, null, null, null, pts(deck)], ...openings.map((o, i) => [`O${i + 1}`, "1", "opening", null, null, null, null, null, null, pts(o)])];
  const d = plan(rows, decks);
  expect(d.problems.filter((p) => p.code !== "endOnNothing")).toEqual([]);
  const o = oracle(deck, openings, spanDeg, members, h);
  let sum = 0;
  for (const m of members) {
    const got = d.members.find((x) => x.mark === m.mark)!;
    const area = got.tributaryArea;
    const moment = got.tributary.reduce((s, p) => {
      const L = p.to - p.from;
      // ∫ s·w(s) ds of a linear w over [from, to] (exact)
      return s + L * (p.width * (2 * p.from + p.to) + p.endWidth * (p.from + 2 * p.to)) / 6;
    }, 0);
    const want = o.get(m.mark) ?? { area: 0, moment: 0 };
    const len = Math.hypot(m.b.x - m.a.x, m.b.y - m.a.y);
    expect(Math.abs(area - want.area), `${m.mark} area ${area} vs oracle ${want.area}`).toBeLessThan(tolArea);
    expect(Math.abs(moment - want.moment), `${m.mark} moment ${moment} vs oracle ${want.moment}`).toBeLessThan((tolArea * len) / 3);
    sum += area;
  }
  expect(sum).toBeGreaterThan(0);
}

describe("strip rule against a fine-grid sampling oracle", () => {
  const G = (mark: string, a: P, b: P): M => ({ mark, a, b });
  const bayGirders = [G("G1", { x: 0, y: 0 }, { x: 30, y: 0 }), G("G2", { x: 0, y: 24 }, { x: 30, y: 24 })];
  const cols: [string, number, number][] = [["C1", 0, 0], ["C2", 30, 0], ["C3", 0, 24], ["C4", 30, 24]];

  it("skewed beam, overhang polygon and an opening, span x", () => {
    const beams = [G("B1", { x: 0, y: 0 }, { x: 0, y: 24 }), G("B2", { x: 10, y: 0 }, { x: 16, y: 24 }), G("B3", { x: 22, y: 0 }, { x: 20, y: 24 }), G("B4", { x: 30, y: 0 }, { x: 30, y: 24 })];
    const deck = [{ x: -3, y: 0 }, { x: 30, y: 0 }, { x: 30, y: 24 }, { x: -3, y: 24 }];
    check([...bayGirders, ...beams], cols, deck, [[{ x: 13, y: 5 }, { x: 19, y: 5 }, { x: 19, y: 11 }, { x: 13, y: 11 }]], 0, 0.2, 2);
  });

  it("deck spanning at 25 degrees onto skewed framing, L-shaped deck", () => {
    const beams = [G("B1", { x: 0, y: 0 }, { x: 0, y: 24 }), G("B2", { x: 9, y: 0 }, { x: 14, y: 24 }), G("B3", { x: 21, y: 0 }, { x: 21, y: 24 }), G("B4", { x: 30, y: 0 }, { x: 30, y: 24 })];
    const deck = [{ x: 0, y: 0 }, { x: 30, y: 0 }, { x: 30, y: 14 }, { x: 18, y: 14 }, { x: 18, y: 24 }, { x: 0, y: 24 }];
    check([...bayGirders, ...beams], cols, deck, [], 25, 0.2, 2);
  });
});
