/**
 * The numeric kernels under the beam solver, checked against polynomials and systems built from
 * known roots and known solutions (mathematics; common practice), and with fast-check.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { solveInPlace } from "../../../src/engine/beam/linear-solve";
import { polyValue, rootsInInterval } from "../../../src/engine/beam/roots";

/** Ascending coefficients of a * prod (t - r_i). */
function fromRoots(roots: number[], a = 1): number[] {
  let c = [a];
  for (const r of roots) {
    const next = new Array<number>(c.length + 1).fill(0);
    c.forEach((v, i) => {
      next[i + 1] += v;
      next[i] -= r * v;
    });
    c = next;
  }
  return c;
}

function roots(c: number[], lo: number, hi: number): number[] {
  const out: number[] = [];
  const n = rootsInInterval(c, c.length - 1, lo, hi, out);
  return out.slice(0, n);
}

describe("rootsInInterval", () => {
  it("finds every simple root of a quartic inside the interval, ascending, to machine precision", () => {
    const r = roots(fromRoots([0.1, 0.35, 0.8, 1.7], -2.5), 0, 2);
    expect(r).toHaveLength(4);
    [0.1, 0.35, 0.8, 1.7].forEach((x, i) => expect(Math.abs(r[i] - x)).toBeLessThanOrEqual(4e-16 * 2));
  });
  it("keeps only roots strictly inside (lo, hi)", () => {
    expect(roots(fromRoots([0, 1, 2, 3]), 0, 3)).toHaveLength(2);
    expect(roots(fromRoots([-1, 5, 7]), 0, 4)).toEqual([]);
  });
  it("degrees 1 and 2, leading zeros, constants", () => {
    expect(roots([-3, 2], 0, 10)).toEqual([1.5]);
    expect(roots(fromRoots([2, 6]), 0, 10)).toEqual([2, 6]);
    expect(roots([-3, 2, 0, 0, 0], 0, 10)).toEqual([1.5]);
    expect(roots([5], 0, 10)).toEqual([]);
    expect(roots([0, 0, 0], 0, 10)).toEqual([]);
    expect(roots([1, 0, 1], -5, 5)).toEqual([]); // t^2 + 1
  });
  it("a quadratic with a tiny leading coefficient keeps its accurate small root", () => {
    const r = roots([-1, 1, 1e-12], 0, 10); // roots ~1 and ~-1e12
    expect(r).toHaveLength(1);
    expect(Math.abs(polyValue([-1, 1, 1e-12], 2, r[0]))).toBeLessThan(1e-15);
  });
  it("separates two close roots and finds the simple root beside a double one", () => {
    const c = fromRoots([1, 1 + 1e-6, 4]);
    const close = roots(c, 0, 5);
    expect(close).toHaveLength(3);
    // roots 1e-6 apart are only defined to ~eps / p'(r) ~ 1e-10 by the rounded coefficients:
    // check the separation to that, and that each is a root to rounding (backward error)
    expect(Math.abs(close[1] - close[0] - 1e-6)).toBeLessThan(1e-9);
    const size = c.reduce((sum, v, i) => sum + Math.abs(v) * 5 ** i, 0);
    for (const r of close) expect(Math.abs(polyValue(c, 3, r))).toBeLessThan(1e-15 * size);
    const dbl = roots(fromRoots([1, 1, 3]), 0, 5);
    expect(dbl).toContain(3);
    for (const r of dbl) expect(Math.abs(polyValue(fromRoots([1, 1, 3]), 3, r))).toBeLessThan(1e-12);
  });
  it("random quartics and quintics with well separated roots (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 1, max: 999 }), { minLength: 1, maxLength: 5 }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        (ks, a) => {
          const rs = ks.map((k) => k / 1000).sort((p, q) => p - q);
          const c = fromRoots(rs, a);
          const found = roots(c, 0, 1);
          expect(found).toHaveLength(rs.length);
          // Roots 0.001 apart are only defined to about eps * sum|c_i| r^i / |p'(r)| by the rounded
          // coefficients (the root's condition number): allow a small multiple of that bound.
          rs.forEach((r, i) => {
            const slope = Math.abs(a * rs.reduce((prod, q, j) => (j === i ? prod : prod * (r - q)), 1));
            const size = c.reduce((sum, v, k) => sum + Math.abs(v) * r ** k, 0);
            const bound = 1e-10 + (64 * Number.EPSILON * size) / slope;
            expect(Math.abs(found[i] - r)).toBeLessThan(bound);
          });
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("solveInPlace (Gaussian elimination, partial pivoting)", () => {
  it("solves a system that needs pivoting", () => {
    const a = new Float64Array([0, 2, 1, 1, 1, 1, 2, 1, 3]);
    const x = [1.5, -2, 0.25];
    const b = new Float64Array([0 * 1.5 + 2 * -2 + 0.25, 1.5 - 2 + 0.25, 3 - 2 + 0.75]);
    expect(solveInPlace(a, b, 3, 1e-13)).toBe(true);
    x.forEach((v, i) => expect(b[i]).toBeCloseTo(v, 14));
  });
  it("reports a singular system instead of dividing by zero", () => {
    const a = new Float64Array([1, 2, 2, 4]);
    const b = new Float64Array([1, 2]);
    expect(solveInPlace(a, b, 2, 1e-13)).toBe(false);
  });
  it("random well-conditioned systems (diagonally dominant) reproduce their solution", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }).chain((n) => fc.tuple(fc.constant(n), fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n * n + n, maxLength: n * n + n }))), ([n, v]) => {
        const a = new Float64Array(n * n);
        for (let i = 0; i < n * n; i++) a[i] = v[i];
        for (let i = 0; i < n; i++) a[i * n + i] += n + 1;
        const x = v.slice(n * n);
        const b = new Float64Array(n);
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) b[i] += a[i * n + j] * x[j];
        expect(solveInPlace(a, b, n, 1e-13)).toBe(true);
        x.forEach((xi, i) => expect(Math.abs(b[i] - xi)).toBeLessThan(1e-12));
      }),
      { numRuns: 200 },
    );
  });
});
