/**
 * Real roots of a polynomial strictly inside an interval, found exactly: degrees 1 and 2 in
 * closed form (the cancellation-free quadratic formula, then Newton polishing); higher degrees
 * by isolating monotonic pieces between the roots of the derivative (found recursively) and
 * solving each piece with a sign change by safeguarded Newton–bisection to machine precision.
 * Coefficients are in ascending order: p(t) = c[0] + c[1] t + ... + c[deg] t^deg.
 */

/** Highest degree handled (the member's slope is a quartic). */
export const MAX_DEGREE = 6;

const derivatives: Float64Array[] = [];
const criticals: Float64Array[] = [];
for (let i = 0; i <= MAX_DEGREE; i++) {
  derivatives.push(new Float64Array(MAX_DEGREE + 1));
  criticals.push(new Float64Array(MAX_DEGREE + 2));
}

/** p(t) by Horner's rule. */
export function polyValue(c: ArrayLike<number>, deg: number, t: number): number {
  let v = c[deg];
  for (let i = deg - 1; i >= 0; i--) v = v * t + c[i];
  return v;
}

function polyDerivativeValue(c: ArrayLike<number>, deg: number, t: number): number {
  let v = deg * c[deg];
  for (let i = deg - 1; i >= 1; i--) v = v * t + i * c[i];
  return v;
}

function polish(c: ArrayLike<number>, deg: number, t: number): number {
  for (let i = 0; i < 3; i++) {
    const f = polyValue(c, deg, t);
    const d = polyDerivativeValue(c, deg, t);
    if (f === 0 || d === 0) break;
    const next = t - f / d;
    if (!(Math.abs(polyValue(c, deg, next)) < Math.abs(f))) break;
    t = next;
  }
  return t;
}

function push(out: Float64Array | number[], count: number, t: number, lo: number, hi: number): number {
  if (t > lo && t < hi && (count === 0 || t !== out[count - 1])) out[count++] = t;
  return count;
}

function linearRoots(c: ArrayLike<number>, lo: number, hi: number, out: Float64Array | number[], count: number): number {
  return push(out, count, -c[0] / c[1], lo, hi);
}

function quadraticRoots(c: ArrayLike<number>, lo: number, hi: number, out: Float64Array | number[], count: number): number {
  const a = c[2];
  const b = c[1];
  const k = c[0];
  let disc = b * b - 4 * a * k;
  if (disc < 0) {
    // a slightly negative discriminant from rounding is a double root
    if (disc < -1e-14 * (b * b + Math.abs(4 * a * k))) return count;
    disc = 0;
  }
  const qq = -(b + (b >= 0 ? Math.sqrt(disc) : -Math.sqrt(disc))) / 2;
  let r1 = qq / a;
  let r2 = qq !== 0 ? k / qq : r1;
  if (r1 > r2) {
    const s = r1;
    r1 = r2;
    r2 = s;
  }
  count = push(out, count, polish(c, 2, r1), lo, hi);
  return push(out, count, polish(c, 2, r2), lo, hi);
}

/** Root of p in (a, b) where p(a) and p(b) have strictly opposite signs. */
function bracketed(c: ArrayLike<number>, deg: number, a: number, b: number, fa: number): number {
  let lo = a;
  let hi = b;
  let flo = fa;
  let x = (a + b) / 2;
  for (let iter = 0; iter < 200; iter++) {
    const f = polyValue(c, deg, x);
    if (f === 0) return x;
    if (f > 0 === flo > 0) {
      lo = x;
      flo = f;
    } else hi = x;
    const d = polyDerivativeValue(c, deg, x);
    let next = x - f / d;
    if (!(next > lo && next < hi)) next = lo + (hi - lo) / 2;
    if (next === x || !(next > lo && next < hi)) return x;
    x = next;
  }
  return x;
}

/**
 * Writes the distinct real roots of p strictly inside (lo, hi), ascending, to `out` and returns
 * how many there are. Roots where p only touches zero are reported only when p is exactly 0
 * there (they are never extremes of p's integral). A polynomial that is identically zero has
 * no isolated roots and yields none.
 * @param c - coefficients, ascending
 * @param deg - degree (at most {@link MAX_DEGREE})
 */
export function rootsInInterval(c: ArrayLike<number>, deg: number, lo: number, hi: number, out: Float64Array | number[]): number {
  return rootsAt(c, deg, lo, hi, out, 0);
}

function rootsAt(c: ArrayLike<number>, deg: number, lo: number, hi: number, out: Float64Array | number[], depth: number): number {
  while (deg > 0 && c[deg] === 0) deg--;
  if (deg === 0) return 0;
  if (deg === 1) return linearRoots(c, lo, hi, out, 0);
  if (deg === 2) return quadraticRoots(c, lo, hi, out, 0);
  const dc = derivatives[depth];
  for (let i = 1; i <= deg; i++) dc[i - 1] = i * c[i];
  const cr = criticals[depth];
  const nc = rootsAt(dc, deg - 1, lo, hi, cr, depth + 1);
  let count = 0;
  let a = lo;
  let fa = polyValue(c, deg, lo);
  for (let i = 0; i <= nc; i++) {
    const b = i < nc ? cr[i] : hi;
    const fb = polyValue(c, deg, b);
    if ((fa < 0 && fb > 0) || (fa > 0 && fb < 0)) count = push(out, count, bracketed(c, deg, a, b, fa), lo, hi);
    if (fb === 0 && i < nc) count = push(out, count, b, lo, hi);
    a = b;
    fa = fb;
  }
  return count;
}
