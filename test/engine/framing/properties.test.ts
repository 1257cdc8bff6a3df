/**
 * Properties of the derivation with fast-check: it does not depend on the order of the rows, on a
 * rigid rotation of the whole plan (multiples of 90 degrees and arbitrary angles), on feet vs
 * metres (areas scale by the square of the factor, positions by the factor), and coordinate
 * noise below the snapping tolerance moves nothing but by the noise.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Derivation } from "../../../src/engine/framing";
import type { CellValue } from "../../../src/engine/takedown/types";
import { plan } from "./helpers";

type P = { x: number; y: number };
interface Abstract {
  members: { mark: string; type: string; a: P; b?: P }[];
  decks: { area: string; kind: string; span: number; corners: P[] }[];
}

/** A bay W x H with girders on columns, beams across (the first maybe skewed), a deck with an overhang in its span direction, maybe an opening. */
const bayArb = fc
  .record({
    w: fc.integer({ min: 20, max: 40 }),
    h: fc.integer({ min: 15, max: 30 }),
    cuts: fc.uniqueArray(fc.integer({ min: 2, max: 18 }), { minLength: 1, maxLength: 4 }),
    skew: fc.integer({ min: -3, max: 3 }),
    overhang: fc.integer({ min: 0, max: 4 }),
    opening: fc.boolean(),
    span: fc.constantFrom(0, 10, 90, 135),
  })
  .map(({ w, h, cuts, skew, overhang: ov, opening, span }): Abstract => {
    // an overhang is carried along the span: only for spans along x or y (an angled strip would leave the overhang's corner unsupported)
    const overhang = span === 0 || span === 90 ? ov : 0;
    const xs = [...new Set(cuts.map((c) => (c * w) / 20))].sort((a, b) => a - b).filter((x) => x > 0 && x < w);
    const members: Abstract["members"] = [
      { mark: "C1", type: "column", a: { x: 0, y: 0 } },
      { mark: "C2", type: "column", a: { x: w, y: 0 } },
      { mark: "C3", type: "column", a: { x: 0, y: h } },
      { mark: "C4", type: "column", a: { x: w, y: h } },
      { mark: "G1", type: "girder", a: { x: 0, y: 0 }, b: { x: w, y: 0 } },
      { mark: "G2", type: "girder", a: { x: 0, y: h }, b: { x: w, y: h } },
      { mark: "G3", type: "girder", a: { x: 0, y: 0 }, b: { x: 0, y: h } },
      { mark: "G4", type: "girder", a: { x: w, y: 0 }, b: { x: w, y: h } },
      ...xs.map((x, i) => ({ mark: `B${i + 1}`, type: "beam", a: { x, y: 0 }, b: { x: i === 0 ? Math.min((xs[1] ?? w) - 0.5, Math.max(0.5, x + skew)) : x, y: h } })),
    ];
    const decks: Abstract["decks"] = [{ area: "D1", kind: "one-way", span, corners: span === 90 ? [{ x: 0, y: -overhang }, { x: w, y: -overhang }, { x: w, y: h }, { x: 0, y: h }] : [{ x: -overhang, y: 0 }, { x: w, y: 0 }, { x: w, y: h }, { x: -overhang, y: h }] }];
    if (opening) decks.push({ area: "O1", kind: "opening", span: 0, corners: [{ x: w / 4, y: h / 4 }, { x: w / 2, y: h / 4 }, { x: w / 2, y: h / 2 }, { x: w / 4, y: h / 2 }] });
    return { members, decks };
  });

function rows(p: Abstract, t: (q: P) => P, dSpan = 0): { framing: CellValue[][]; decks: CellValue[][] } {
  return {
    framing: p.members.map((m) => {
      const a = t(m.a);
      const b = m.b ? t(m.b) : null;
      return b ? [m.mark, m.type, "1", a.x, a.y, b.x, b.y] : [m.mark, m.type, "1", a.x, a.y];
    }),
    decks: p.decks.map((d) => [d.area, "1", d.kind, "Office", d.span + dSpan, null, null, null, null, d.corners.map(t).map((q) => `${q.x},${q.y}`).join("; ")]),
  };
}

function derived(r: { framing: CellValue[][]; decks: CellValue[][] }, tol?: number): Derivation {
  return plan(r.framing, r.decks, [], [["1", 12]], tol);
}

/** What must not change: per member its supports, positions along supports and tributary area. */
function summary(d: Derivation, scale = 1): Record<string, [string | null, number | null, string | null, number | null, number, number | null]> {
  const out: Record<string, [string | null, number | null, string | null, number | null, number, number | null]> = {};
  for (const m of d.members) out[m.mark] = [m.startSupport, m.startAt === null ? null : m.startAt / scale, m.endSupport, m.endAt === null ? null : m.endAt / scale, m.tributaryArea / scale ** 2, m.span === null ? null : m.span / scale];
  return out;
}

function expectClose(a: ReturnType<typeof summary>, b: ReturnType<typeof summary>, tol: number): void {
  expect(Object.keys(a).sort()).toEqual(Object.keys(b).sort());
  for (const k of Object.keys(a)) {
    const x = a[k]!, y = b[k]!;
    expect([x[0], x[2]], k).toEqual([y[0], y[2]]);
    for (const i of [1, 3, 4, 5] as const) {
      if (x[i] === null || y[i] === null) expect(x[i], k).toBe(y[i]);
      else expect(Math.abs((x[i] as number) - (y[i] as number)), `${k}[${i}] ${x[i]} vs ${y[i]}`).toBeLessThan(tol);
    }
  }
}

const id = (q: P): P => q;

describe("framing derivation properties", () => {
  it("the bay plans are sound: no problems, and deck load is conserved (sum of tributary areas = deck area minus opening)", () => {
    fc.assert(
      fc.property(bayArb, (p) => {
        const d = derived(rows(p, id));
        expect(d.problems).toEqual([]);
        const deck = p.decks.find((x) => x.kind === "one-way")!;
        const area = (c: P[]) => Math.abs((c[1]!.x - c[0]!.x) * (c[2]!.y - c[1]!.y));
        const opening = p.decks.find((x) => x.kind === "opening");
        const sum = d.members.reduce((s, m) => s + m.tributaryArea, 0);
        expect(sum).toBeCloseTo(area(deck.corners) - (opening ? area(opening.corners) : 0), 8);
      }),
      { numRuns: 40 },
    );
  });

  it("row order does not change anything", () => {
    fc.assert(
      fc.property(bayArb, fc.infiniteStream(fc.double({ min: 0, max: 1, noNaN: true })), (p, rnd) => {
        const r = rows(p, id);
        const shuffle = <T,>(xs: T[]): T[] => xs.map((x) => [rnd.next().value as number, x] as const).sort((a, b) => a[0] - b[0]).map((x) => x[1]);
        const a = derived(r);
        const b = derived({ framing: shuffle(r.framing), decks: shuffle(r.decks) });
        const strip = (d: Derivation) => d.members.map(({ source: _s, ...m }) => m).sort((x, y) => (x.mark < y.mark ? -1 : 1));
        expect(strip(b)).toEqual(strip(a));
        expect(b.bearings).toEqual(a.bearings);
      }),
      { numRuns: 30 },
    );
  });

  it("a rotation of the whole plan by a multiple of 90 degrees (coordinates swapped, exact) changes nothing", () => {
    fc.assert(
      fc.property(bayArb, fc.integer({ min: 1, max: 3 }), (p, k) => {
        const rot = (q: P): P => (k === 1 ? { x: -q.y, y: q.x } : k === 2 ? { x: -q.x, y: -q.y } : { x: q.y, y: -q.x });
        expectClose(summary(derived(rows(p, rot, 90 * k))), summary(derived(rows(p, id))), 1e-9);
      }),
      { numRuns: 30 },
    );
  });

  it("a rotation by an arbitrary angle about an arbitrary point changes nothing (to round-off)", () => {
    fc.assert(
      fc.property(bayArb, fc.double({ min: -180, max: 180, noNaN: true }), fc.integer({ min: -500, max: 500 }), (p, deg, shift) => {
        const c = Math.cos((deg * Math.PI) / 180), s = Math.sin((deg * Math.PI) / 180);
        const rot = (q: P): P => ({ x: shift + q.x * c - q.y * s, y: -shift + q.x * s + q.y * c });
        expectClose(summary(derived(rows(p, rot, deg))), summary(derived(rows(p, id))), 1e-7);
      }),
      { numRuns: 40 },
    );
  });

  it("feet to metres: positions scale by 0.3048 and areas by its square", () => {
    fc.assert(
      fc.property(bayArb, (p) => {
        const f = 0.3048;
        const m = derived(rows(p, (q) => ({ x: q.x * f, y: q.y * f })), (1 / 192) * f);
        expectClose(summary(m, f), summary(derived(rows(p, id))), 1e-9);
      }),
      { numRuns: 30 },
    );
  });

  it("coordinate noise below the tolerance keeps every support and moves areas only by the noise", () => {
    const tol = 1 / 192;
    fc.assert(
      fc.property(bayArb, fc.infiniteStream(fc.double({ min: -0.2 * tol, max: 0.2 * tol, noNaN: true })), (p, noise) => {
        const jitter = (q: P): P => ({ x: q.x + (noise.next().value as number), y: q.y + (noise.next().value as number) });
        const d = derived(rows(p, jitter));
        expect(d.problems).toEqual([]);
        // each area moves by at most about noise x (perimeter of its tributary) / sin(angle between a
        // member and the span): a member at 10 degrees to the strips moves its crossings by the
        // noise / tan(10 degrees). Bound: 0.2 tol x 200 ft / sin(10 degrees).
        expectClose(summary(d), summary(derived(rows(p, id))), (0.2 * tol * 200) / Math.sin((10 * Math.PI) / 180));
      }),
      { numRuns: 30 },
    );
  });
});
