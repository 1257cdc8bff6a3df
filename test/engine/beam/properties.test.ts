/**
 * Properties every exact beam solution must have, checked with fast-check over random members:
 * 1 to 5 spans of random lengths, random pin/fixed supports, random overhangs at either end,
 * single fixed supports anywhere, and random line (uniform, trapezoidal, triangular, partial),
 * point and couple loads, some placed exactly on supports and ends.
 *
 * Sources of the properties (standard structural mechanics, common practice): global
 * equilibrium; linearity (superposition); Maxwell–Betti reciprocity; symmetry under mirroring;
 * the support conditions themselves; extremes bounding every sampled value (sampling is used
 * here only to check, never to compute).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { solveBeam, type BeamLoad, type BeamModel, type BeamSolution, type Support } from "../../../src/engine/beam";
import { SHORT_LINE } from "../../../src/engine/beam/packed";

const TOL = 1e-9;

function solved(model: BeamModel): BeamSolution {
  const r = solveBeam(model);
  if (!r.ok) throw new Error(`${r.error.message} in ${JSON.stringify(model)}`);
  return r.value;
}

// ---------- random members ----------

interface Layout {
  readonly span: number;
  readonly supports: Support[];
}

const length = fc.double({ min: 0.5, max: 20, noNaN: true });
const overhang = fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 8, noNaN: true }));
const magnitude = fc.double({ min: -10, max: 10, noNaN: true });

/** Continuous members: 1-5 spans, every support pin or fixed, optional overhangs. */
const spansLayout: fc.Arbitrary<Layout> = fc
  .record({
    spans: fc.array(length, { minLength: 1, maxLength: 5 }),
    fixedFlags: fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }),
    left: overhang,
    right: overhang,
  })
  .map(({ spans, fixedFlags, left, right }) => {
    const supports: Support[] = [];
    let x = left;
    supports.push({ x, type: fixedFlags[0] ? "fixed" : "pin" });
    spans.forEach((s, i) => {
      x += s;
      supports.push({ x, type: fixedFlags[i + 1] ? "fixed" : "pin" });
    });
    return { span: x + right, supports };
  });

/** One fixed support anywhere, including either end. */
const cantileverLayout: fc.Arbitrary<Layout> = fc
  .record({ a: fc.oneof(fc.constant(0), length), b: fc.oneof(fc.constant(0), length) })
  .filter(({ a, b }) => a + b >= 0.5)
  .map(({ a, b }) => ({ span: a + b, supports: [{ x: a, type: "fixed" as const }] }));

const layoutArb: fc.Arbitrary<Layout> = fc.oneof({ weight: 4, arbitrary: spansLayout }, { weight: 1, arbitrary: cantileverLayout });

/** A position on the member: anywhere, or exactly at an end or a support. */
function positionArb(layout: Layout): fc.Arbitrary<number> {
  const snaps = [0, layout.span, ...layout.supports.map((s) => s.x)];
  return fc.oneof(
    { weight: 3, arbitrary: fc.double({ min: 0, max: 1, noNaN: true }).map((f) => f * layout.span) },
    { weight: 1, arbitrary: fc.constantFrom(...snaps) },
  );
}

function loadArb(layout: Layout): fc.Arbitrary<BeamLoad> {
  const pos = positionArb(layout);
  return fc.oneof(
    fc.record({ a: pos, b: pos, w1: magnitude, w2: magnitude }).map(({ a, b, w1, w2 }): BeamLoad => ({ kind: "line", start: Math.min(a, b), end: Math.max(a, b), w1, w2 })),
    fc.record({ x: pos, p: magnitude }).map(({ x, p }): BeamLoad => ({ kind: "point", x, p })),
    fc.record({ x: pos, m: magnitude }).map(({ x, m }): BeamLoad => ({ kind: "moment", x, m })),
  );
}

const loadsFor = (layout: Layout, max = 8): fc.Arbitrary<BeamLoad[]> => fc.array(loadArb(layout), { minLength: 0, maxLength: max });

const modelArb: fc.Arbitrary<BeamModel> = layoutArb.chain((layout) => loadsFor(layout).map((loads) => ({ ...layout, loads })));

/** Two load sets on one member, for superposition. */
const pairArb = layoutArb.chain((layout) => fc.tuple(fc.constant(layout), loadsFor(layout, 5), loadsFor(layout, 5)));

/** Positions x in 0..span to check at. */
const fractions = fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 10 });

// ---------- independent statics of the loads ----------

/** Total downward load and its clockwise moment about x = 0 (couples counter-clockwise +). */
function loadStatics(loads: readonly BeamLoad[]): { force: number; clockwiseAbout0: number; size: number } {
  let force = 0;
  let moment = 0;
  let size = 0;
  for (const l of loads) {
    if (l.kind === "point") {
      force += l.p;
      moment += l.p * l.x;
      size += Math.abs(l.p);
    } else if (l.kind === "moment") {
      moment -= l.m;
      size += Math.abs(l.m);
    } else {
      // split into a rectangle w1 and a triangle (w2 - w1) peaking at the end
      const c = l.end - l.start;
      force += l.w1 * c + ((l.w2 - l.w1) * c) / 2;
      moment += l.w1 * c * (l.start + c / 2) + ((l.w2 - l.w1) * c * (l.start + (2 * c) / 3)) / 2;
      size += ((Math.abs(l.w1) + Math.abs(l.w2)) * c) / 2;
    }
  }
  return { force, clockwiseAbout0: moment, size };
}

/**
 * Force scale of a solution: the largest of the loads, the reactions and the couples / span. The
 * natural scales of moment, EI x slope and EI x deflection are this times span, span^2, span^3.
 */
function forceScale(model: BeamModel, s: BeamSolution): number {
  let f = loadStatics(model.loads).size + 1e-12;
  for (const r of s.reactions) f = Math.max(f, Math.abs(r));
  for (const c of s.reactionMoments) f = Math.max(f, Math.abs(c) / model.span);
  for (const l of model.loads) if (l.kind === "moment") f = Math.max(f, Math.abs(l.m) / model.span);
  return f;
}

// ---------- properties ----------

describe("global equilibrium (statics, common practice)", () => {
  it("sum of reactions = sum of loads; moments about x = 0 balance with couples", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const s = solved(model);
        const { force, clockwiseAbout0 } = loadStatics(model.loads);
        const F = forceScale(model, s);
        const sumR = s.reactions.reduce((a, b) => a + b, 0);
        expect(Math.abs(sumR - force)).toBeLessThanOrEqual(TOL * F * model.supports.length);
        let ccw = -clockwiseAbout0;
        model.supports.forEach((sup, i) => (ccw += s.reactions[i] * sup.x + s.reactionMoments[i]));
        expect(Math.abs(ccw)).toBeLessThanOrEqual(TOL * F * model.span * model.supports.length);
        model.supports.forEach((sup, i) => {
          if (sup.type === "pin") expect(s.reactionMoments[i]).toBe(0);
        });
      }),
      { numRuns: 400 },
    );
  });

  it("V and M vanish beyond the ends: V(0 right) and M(0 right) are the jumps at x = 0", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const s = solved(model);
        const F = forceScale(model, s);
        let v0 = 0;
        let m0 = 0;
        model.supports.forEach((sup, i) => {
          if (sup.x === 0) {
            v0 += s.reactions[i];
            m0 -= s.reactionMoments[i];
          }
        });
        for (const l of model.loads) {
          if (l.kind === "point" && l.x === 0) v0 -= l.p;
          if (l.kind === "moment" && l.x === 0) m0 -= l.m;
          // documented rule (SHORT_LINE): a line load shorter than 1e-12 x span acts as its resultant at its start
          if (l.kind === "line" && l.start === 0 && l.end - l.start <= SHORT_LINE * model.span) v0 -= ((l.w1 + l.w2) * (l.end - l.start)) / 2;
        }
        expect(Math.abs(s.shearAt(0) - v0)).toBeLessThanOrEqual(TOL * F);
        expect(Math.abs(s.momentAt(0) - m0)).toBeLessThanOrEqual(TOL * F * model.span);
      }),
      { numRuns: 200 },
    );
  });
});

describe("support conditions (the equations solved for, checked on the result)", () => {
  it("deflection is zero at every support and the slope is zero at every fixed support", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const s = solved(model);
        const F = forceScale(model, s);
        const L = model.span;
        for (const sup of model.supports) {
          expect(Math.abs(s.deflectionEIAt(sup.x))).toBeLessThanOrEqual(TOL * F * L ** 3);
          if (sup.type === "fixed") expect(Math.abs(s.slopeEIAt(sup.x))).toBeLessThanOrEqual(TOL * F * L ** 2);
        }
      }),
      { numRuns: 400 },
    );
  });
});

describe("superposition (linear elasticity)", () => {
  it("the solution of loads A + B is the sum of the solutions of A and of B", () => {
    fc.assert(
      fc.property(pairArb, fractions, ([layout, a, b], fs) => {
        const sa = solved({ ...layout, loads: a });
        const sb = solved({ ...layout, loads: b });
        const model = { ...layout, loads: [...a, ...b] };
        const sab = solved(model);
        const F = Math.max(forceScale(model, sab), forceScale({ ...layout, loads: a }, sa), forceScale({ ...layout, loads: b }, sb));
        const L = layout.span;
        sab.reactions.forEach((r, i) => expect(Math.abs(r - sa.reactions[i] - sb.reactions[i])).toBeLessThanOrEqual(TOL * F));
        sab.reactionMoments.forEach((c, i) => expect(Math.abs(c - sa.reactionMoments[i] - sb.reactionMoments[i])).toBeLessThanOrEqual(TOL * F * L));
        for (const f of fs) {
          const x = f * L;
          expect(Math.abs(sab.momentAt(x) - sa.momentAt(x) - sb.momentAt(x))).toBeLessThanOrEqual(TOL * F * L);
          expect(Math.abs(sab.shearAt(x, "left") - sa.shearAt(x, "left") - sb.shearAt(x, "left"))).toBeLessThanOrEqual(TOL * F);
          expect(Math.abs(sab.deflectionEIAt(x) - sa.deflectionEIAt(x) - sb.deflectionEIAt(x))).toBeLessThanOrEqual(TOL * F * L ** 3);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe("Maxwell–Betti reciprocity", () => {
  it("deflection at b under a unit load at a = deflection at a under a unit load at b", () => {
    fc.assert(
      fc.property(layoutArb, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (layout, fa, fb) => {
        const a = fa * layout.span;
        const b = fb * layout.span;
        const sa = solved({ ...layout, loads: [{ kind: "point", x: a, p: 1 }] });
        const sb = solved({ ...layout, loads: [{ kind: "point", x: b, p: 1 }] });
        const F = Math.max(forceScale({ ...layout, loads: [] }, sa), forceScale({ ...layout, loads: [] }, sb), 1);
        expect(Math.abs(sa.deflectionEIAt(b) - sb.deflectionEIAt(a))).toBeLessThanOrEqual(TOL * F * layout.span ** 3);
      }),
      { numRuns: 300 },
    );
  });

  it("EI slope at a under a unit load at b = EI deflection at b under a unit couple at a", () => {
    // Betti with a couple: work of couple m=1 (ccw) through rotation θ_a(P) equals work of P=1
    // (down) through the downward deflection Δ_b(m): θ_a(P) = Δ_b(m).
    fc.assert(
      fc.property(layoutArb, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (layout, fa, fb) => {
        const a = fa * layout.span;
        const b = fb * layout.span;
        const sp = solved({ ...layout, loads: [{ kind: "point", x: b, p: 1 }] });
        const sm = solved({ ...layout, loads: [{ kind: "moment", x: a, m: 1 }] });
        const F = Math.max(forceScale({ ...layout, loads: [] }, sp), forceScale({ ...layout, loads: [] }, sm), 1);
        expect(Math.abs(sp.slopeEIAt(a) - sm.deflectionEIAt(b))).toBeLessThanOrEqual(TOL * F * layout.span ** 3);
      }),
      { numRuns: 200 },
    );
  });
});

function mirror(model: BeamModel): BeamModel {
  const L = model.span;
  return {
    span: L,
    supports: model.supports.map((s) => ({ x: L - s.x, type: s.type })),
    loads: model.loads.map((l): BeamLoad => {
      if (l.kind === "line") return { kind: "line", start: L - l.end, end: L - l.start, w1: l.w2, w2: l.w1 };
      if (l.kind === "point") return { kind: "point", x: L - l.x, p: l.p };
      return { kind: "moment", x: L - l.x, m: -l.m }; // a mirror turns counter-clockwise into clockwise
    }),
  };
}

/** Positions on a dyadic grid (multiples of 2^-20), so that L - x is exact and mirroring loses nothing. */
const grid = (v: number): number => Math.round(v * 2 ** 20) / 2 ** 20;

function onGrid(model: BeamModel): BeamModel {
  return {
    span: grid(model.span),
    supports: model.supports.map((s) => ({ ...s, x: grid(s.x) })),
    loads: model.loads.map((l): BeamLoad => (l.kind === "line" ? { ...l, start: grid(l.start), end: grid(l.end) } : { ...l, x: grid(l.x) })),
  };
}

describe("mirror symmetry", () => {
  it("the mirrored member has the same reactions, opposite couples, M(x) = M'(L - x), V(x) = -V'(L - x)", () => {
    fc.assert(
      fc.property(modelArb.map(onGrid), fractions, (model, fs) => {
        const s = solved(model);
        const m = solved(mirror(model));
        const F = Math.max(forceScale(model, s), forceScale(mirror(model), m));
        const L = model.span;
        s.reactions.forEach((r, i) => expect(Math.abs(r - m.reactions[i])).toBeLessThanOrEqual(TOL * F));
        s.reactionMoments.forEach((c, i) => expect(Math.abs(c + m.reactionMoments[i])).toBeLessThanOrEqual(TOL * F * L));
        for (const f of fs) {
          const x = grid(f * L);
          expect(Math.abs(s.momentAt(x, "right") - m.momentAt(L - x, "left"))).toBeLessThanOrEqual(TOL * F * L);
          expect(Math.abs(s.shearAt(x, "right") + m.shearAt(L - x, "left"))).toBeLessThanOrEqual(TOL * F);
          expect(Math.abs(s.deflectionEIAt(x) - m.deflectionEIAt(L - x))).toBeLessThanOrEqual(TOL * F * L ** 3);
          expect(Math.abs(s.slopeEIAt(x) + m.slopeEIAt(L - x))).toBeLessThanOrEqual(TOL * F * L ** 2);
        }
        expect(Math.abs(s.maxSagging().value - m.maxSagging().value)).toBeLessThanOrEqual(TOL * F * L);
        expect(Math.abs(s.maxHogging().value - m.maxHogging().value)).toBeLessThanOrEqual(TOL * F * L);
        expect(Math.abs(Math.abs(s.maxShear().value) - Math.abs(m.maxShear().value))).toBeLessThanOrEqual(TOL * F);
        expect(Math.abs(s.maxDeflectionEI().value - m.maxDeflectionEI().value)).toBeLessThanOrEqual(TOL * F * L ** 3);
      }),
      { numRuns: 300 },
    );
  });
});

describe("exact extremes bound every sampled value and are attained", () => {
  it("200 random positions (both sides) never exceed the extremes", () => {
    fc.assert(
      fc.property(modelArb, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 200, maxLength: 200 }), (model, fs) => {
        const s = solved(model);
        const F = forceScale(model, s);
        const L = model.span;
        const sag = s.maxSagging();
        const hog = s.maxHogging();
        const shear = s.maxShear();
        const down = s.maxDeflectionEI();
        const up = s.minDeflectionEI();
        expect(sag.value).toBeGreaterThanOrEqual(0);
        expect(hog.value).toBeLessThanOrEqual(0);
        expect(down.value).toBeGreaterThanOrEqual(0);
        expect(up.value).toBeLessThanOrEqual(0);
        const tm = TOL * F * L;
        const td = TOL * F * L ** 3;
        for (const f of fs) {
          const x = f * L;
          for (const side of ["left", "right"] as const) {
            const mx = s.momentAt(x, side);
            expect(mx).toBeLessThanOrEqual(sag.value + tm);
            expect(mx).toBeGreaterThanOrEqual(hog.value - tm);
            expect(Math.abs(s.shearAt(x, side))).toBeLessThanOrEqual(Math.abs(shear.value) + TOL * F);
          }
          const d = s.deflectionEIAt(x);
          expect(d).toBeLessThanOrEqual(down.value + td);
          expect(d).toBeGreaterThanOrEqual(up.value - td);
        }
        // attained where reported (on one side of a jump)
        const atSides = (fn: (side: "left" | "right") => number, v: number, tol: number): void => {
          expect(Math.min(Math.abs(fn("left") - v), Math.abs(fn("right") - v))).toBeLessThanOrEqual(tol);
        };
        if (sag.value > 0) atSides((side) => s.momentAt(sag.x, side), sag.value, tm);
        if (hog.value < 0) atSides((side) => s.momentAt(hog.x, side), hog.value, tm);
        atSides((side) => s.shearAt(shear.x, side), shear.value, TOL * F);
        if (down.value > 0) expect(Math.abs(s.deflectionEIAt(down.x) - down.value)).toBeLessThanOrEqual(td);
        if (up.value < 0) expect(Math.abs(s.deflectionEIAt(up.x) - up.value)).toBeLessThanOrEqual(td);
      }),
      { numRuns: 300 },
    );
  });

  it("critical points are sorted, unique, within the member, and hold the ends, supports and extremes", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const s = solved(model);
        const cp = s.criticalPoints();
        const L = model.span;
        expect(cp[0]).toBe(0);
        expect(cp[cp.length - 1]).toBe(L);
        for (let i = 1; i < cp.length; i++) expect(cp[i]).toBeGreaterThan(cp[i - 1]);
        for (const sup of model.supports) expect(cp).toContain(sup.x);
        for (const e of [s.maxSagging(), s.maxHogging(), s.maxShear(), s.maxDeflectionEI(), s.minDeflectionEI()]) {
          if (e.value !== 0) expect(cp.some((x) => Math.abs(x - e.x) <= 1e-9 * L)).toBe(true);
        }
        cp.push(-1); // a fresh array: changing it does not change the solution
        expect(s.criticalPoints()).not.toContain(-1);
      }),
      { numRuns: 200 },
    );
  });

  it("supportMoments is M at each support (the larger-magnitude side at a jump)", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const s = solved(model);
        model.supports.forEach((sup, i) => {
          const l = s.momentAt(sup.x, "left");
          const r = s.momentAt(sup.x, "right");
          expect(s.supportMoments[i]).toBe(Math.abs(l) > Math.abs(r) ? l : r);
        });
      }),
      { numRuns: 100 },
    );
  });
});

function deepFreeze<T>(o: T): T {
  if (typeof o === "object" && o !== null) {
    for (const v of Object.values(o)) deepFreeze(v);
    Object.freeze(o);
  }
  return o;
}

describe("inputs are never mutated nor retained", () => {
  it("a deep-frozen model solves, and equals its clone afterwards", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const clone = structuredClone(model);
        const frozen = deepFreeze(model);
        const s = solved(frozen);
        s.maxSagging();
        s.maxHogging();
        s.maxShear();
        s.maxDeflectionEI();
        s.minDeflectionEI();
        s.criticalPoints();
        void s.supportMoments;
        expect(frozen).toEqual(clone);
        expect(s.model).toEqual(clone);
        expect(s.model).not.toBe(frozen);
        expect(s.model.loads).not.toBe(frozen.loads);
        expect(s.model.supports).not.toBe(frozen.supports);
      }),
      { numRuns: 100 },
    );
  });

  it("changing the input after solving changes nothing in the solution", () => {
    fc.assert(
      fc.property(modelArb, (model) => {
        const clone = structuredClone(model);
        const s = solved(model);
        const reactions = [...s.reactions];
        const mutable = model as { span: number; supports: Support[]; loads: BeamLoad[] };
        mutable.supports.push({ x: 0, type: "fixed" });
        mutable.loads.push({ kind: "point", x: 0, p: 1e6 });
        if (mutable.loads[0]?.kind === "point") (mutable.loads[0] as { p: number }).p += 100;
        mutable.span *= 2;
        const fresh = solved(clone);
        expect([...s.reactions]).toEqual(reactions);
        expect(s.model).toEqual(clone);
        expect(s.maxSagging()).toEqual(fresh.maxSagging());
        expect(s.maxDeflectionEI()).toEqual(fresh.maxDeflectionEI());
      }),
      { numRuns: 100 },
    );
  });
});
