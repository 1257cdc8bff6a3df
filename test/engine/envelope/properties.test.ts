/**
 * Properties of the pattern envelope over random members (fast-check), each against patterns
 * built and solved directly here with solveBeam (the test puts every live load inside one
 * segment, so the patterns need no cutting of loads):
 * - the envelope bounds every (combination, pattern) and equals the brute-force extreme (n <= 6 units);
 * - every governing reaction's model is in equilibrium and reproduces the value;
 * - the alternating-segment rule (used beyond the enumeration limit) finds the same extremes as
 *   the full enumeration for downward loads.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { solveBeam } from "../../../src/engine/beam";
import type { BeamLoad, Support } from "../../../src/engine/beam/types";
import { envelope, governingModel, type FactoredCombination } from "../../../src/engine/envelope";

interface Layout {
  readonly span: number;
  readonly supports: Support[];
  /** Segment ends along the member. */
  readonly cuts: number[];
}

const length = fc.double({ min: 1, max: 10, noNaN: true });

const layoutArb: fc.Arbitrary<Layout> = fc
  .record({
    spans: fc.array(length, { minLength: 1, maxLength: 3 }),
    left: fc.oneof(fc.constant(0), fc.double({ min: 0.5, max: 4, noNaN: true })),
    right: fc.oneof(fc.constant(0), fc.double({ min: 0.5, max: 4, noNaN: true })),
    fixedEnds: fc.array(fc.boolean(), { minLength: 2, maxLength: 2 }),
  })
  .map(({ spans, left, right, fixedEnds }) => {
    const xs = [left];
    for (const s of spans) xs.push(xs[xs.length - 1]! + s);
    const span = xs[xs.length - 1]! + right;
    const supports: Support[] = xs.map((x, i) => ({ x, type: (i === 0 && left === 0 && fixedEnds[0]) || (i === xs.length - 1 && right === 0 && fixedEnds[1]) ? "fixed" : "pin" }));
    const cuts = [0, ...xs.filter((x) => x > 0 && x < span), span];
    return { span, supports, cuts };
  });

/** One random load inside [a, b]; magnitudes in [min, max]. */
function loadIn(a: number, b: number, min: number, max: number): fc.Arbitrary<BeamLoad> {
  const at = fc.double({ min: 0, max: 1, noNaN: true }).map((f) => a + f * (b - a));
  const mag = fc.double({ min, max, noNaN: true });
  return fc.oneof(
    fc.record({ p: at, q: at, w1: mag, w2: mag }).map(({ p, q, w1, w2 }): BeamLoad => ({ kind: "line", start: Math.min(p, q), end: Math.max(p, q), w1, w2 })),
    fc.record({ x: at, p: mag }).map(({ x, p }): BeamLoad => ({ kind: "point", x, p })),
  );
}

interface Case {
  readonly layout: Layout;
  readonly dead: BeamLoad[];
  /** Live loads of each segment (in segment order). */
  readonly live: BeamLoad[][];
}

function caseArb(min: number, max: number): fc.Arbitrary<Case> {
  return layoutArb.chain((layout) => {
    const segs = layout.cuts.slice(1).map((b, i) => [layout.cuts[i]!, b] as const);
    return fc.record({
      layout: fc.constant(layout),
      dead: fc.array(loadIn(0, layout.span, 0, max), { minLength: 0, maxLength: 2 }),
      live: fc.tuple(...segs.map(([a, b]) => fc.array(loadIn(a, b, min, max), { minLength: 1, maxLength: 2 }))),
    });
  });
}

const COMBOS: FactoredCombination[] = [
  { label: "1.4D", factors: { D: 1.4 } },
  { label: "1.2D + 1.6L", factors: { D: 1.2, L: 1.6 } },
  { label: "0.9D", factors: { D: 0.9 } },
];

const scale = (l: BeamLoad, f: number): BeamLoad =>
  l.kind === "line" ? { ...l, w1: l.w1 * f, w2: l.w2 * f } : l.kind === "point" ? { ...l, p: l.p * f } : { ...l, m: l.m * f };

/** Every combination x every on/off pattern of the segments' live loads, solved directly. */
function bruteForce(c: Case) {
  const out: { sag: number; hog: number; shear: number; reactions: readonly number[] }[] = [];
  const n = c.live.length;
  for (const combo of COMBOS) {
    const fD = combo.factors.D ?? 0;
    const fL = combo.factors.L ?? 0;
    for (let mask = 0; mask < 1 << n; mask++) {
      const loads = [...c.dead.map((l) => scale(l, fD))];
      if (fL !== 0) c.live.forEach((ls, j) => (mask & (1 << j) ? loads.push(...ls.map((l) => scale(l, fL))) : undefined));
      const s = solveBeam({ span: c.layout.span, supports: c.layout.supports, loads });
      if (!s.ok) throw new Error(s.error.message);
      out.push({ sag: s.value.maxSagging().value, hog: s.value.maxHogging().value, shear: Math.abs(s.value.maxShear().value), reactions: s.value.reactions });
    }
  }
  return out;
}

function memberOf(c: Case) {
  return { span: c.layout.span, supports: c.layout.supports, loads: { D: c.dead, L: c.live.flat() } };
}

const near = (a: number, b: number, scaleOf: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, scaleOf);

describe("envelope properties (fast-check)", () => {
  it("bounds every combination and pattern solved directly, and equals the brute-force extreme", () => {
    fc.assert(
      fc.property(caseArb(-5, 10), (c) => {
        const r = envelope(memberOf(c), COMBOS);
        if (!r.ok) throw new Error(r.error.message);
        const env = r.value;
        const all = bruteForce(c);
        const big = Math.max(...all.map((a) => Math.max(a.sag, -a.hog, a.shear, ...a.reactions.map(Math.abs))));
        const maxSag = Math.max(...all.map((a) => a.sag));
        const minHog = Math.min(...all.map((a) => a.hog));
        const maxShear = Math.max(...all.map((a) => a.shear));
        expect(near(env.momentMax.value, maxSag, big)).toBe(true);
        expect(near(env.momentMin.value, minHog, big)).toBe(true);
        expect(near(env.shearMax.value, maxShear, big)).toBe(true);
        c.layout.supports.forEach((_, i) => {
          const rs = all.map((a) => a.reactions[i]!);
          expect(near(env.reactionMax[i]!.value, Math.max(...rs), big)).toBe(true);
          expect(near(env.reactionMin[i]!.value, Math.min(...rs), big)).toBe(true);
        });
      }),
      { numRuns: 60 },
    );
  });

  it("every governing reaction's model is in equilibrium and gives the governing value", () => {
    fc.assert(
      fc.property(caseArb(-5, 10), (c) => {
        const member = memberOf(c);
        const r = envelope(member, COMBOS);
        if (!r.ok) throw new Error(r.error.message);
        for (const [i, g] of [...r.value.reactionMax.entries(), ...r.value.reactionMin.entries()]) {
          const m = governingModel(member, COMBOS, g);
          if (!m.ok) throw new Error(m.error.message);
          const s = solveBeam(m.value);
          if (!s.ok) throw new Error(s.error.message);
          const applied = m.value.loads.reduce((sum, l) => sum + (l.kind === "line" ? ((l.w1 + l.w2) * (l.end - l.start)) / 2 : l.kind === "point" ? l.p : 0), 0);
          const scaleOf = Math.max(1, ...m.value.loads.map((l) => (l.kind === "line" ? Math.abs(l.w1) + Math.abs(l.w2) : l.kind === "point" ? Math.abs(l.p) : 0))) * c.layout.span;
          expect(Math.abs(s.value.reactions.reduce((a, b) => a + b, 0) - applied)).toBeLessThanOrEqual(1e-9 * scaleOf);
          expect(Math.abs(s.value.reactions[i]! - g.value)).toBeLessThanOrEqual(1e-9 * scaleOf);
        }
      }),
      { numRuns: 40 },
    );
  });

  it("the alternating-segment rule finds the same M+, M- and |V| as every pattern (downward loads)", () => {
    fc.assert(
      fc.property(caseArb(0.1, 10), (c) => {
        const member = memberOf(c);
        const full = envelope(member, COMBOS);
        const rule = envelope(member, COMBOS, { enumerationLimit: 0 });
        if (!full.ok || !rule.ok) throw new Error("solve failed");
        expect(rule.value.exhaustive).toBe(c.live.length === 0);
        expect(rule.value.proven).toBe(true);
        const big = Math.max(full.value.momentMax.value, -full.value.momentMin.value, full.value.shearMax.value);
        expect(near(rule.value.momentMax.value, full.value.momentMax.value, big)).toBe(true);
        expect(near(rule.value.momentMin.value, full.value.momentMin.value, big)).toBe(true);
        expect(near(rule.value.shearMax.value, full.value.shearMax.value, big)).toBe(true);
      }),
      { numRuns: 80 },
    );
  });
});
