/**
 * Curves of V, M and deflection for drawing: the exact values at every critical point the
 * engine reports (both sides of a jump) plus evenly spread intermediate points for a smooth
 * line. Only the drawn line is sampled; labelled extremes come from the engine's exact
 * extremes, and zero crossings are refined on the exact functions.
 */

/** A drawn point of a curve: position (length units) and value. */
export interface CurvePoint {
  readonly x: number;
  readonly v: number;
}

/** A function of position that may jump; side picks the value just left or right of x. */
export type SidedFunction = (x: number, side: "left" | "right") => number;

/** Intermediate points across the whole span (more where intervals are long). */
const SAMPLES_PER_SPAN = 96;

/**
 * Points of a curve through all the critical points, both sides of each (so jumps are drawn
 * vertical), with intermediate points between them.
 * @param critical - sorted critical positions including both ends (length units)
 * @param span - member length
 * @param f - the exact function
 */
export function sampleCurve(critical: readonly number[], span: number, f: SidedFunction): CurvePoint[] {
  const out: CurvePoint[] = [];
  for (let i = 0; i + 1 < critical.length; i++) {
    const a = critical[i] as number;
    const b = critical[i + 1] as number;
    if (!(b > a)) continue;
    const n = Math.max(2, Math.ceil(((b - a) / span) * SAMPLES_PER_SPAN));
    out.push({ x: a, v: f(a, "right") });
    for (let k = 1; k < n; k++) {
      const x = a + ((b - a) * k) / n;
      out.push({ x, v: f(x, "right") });
    }
    out.push({ x: b, v: f(b, "left") });
  }
  return out;
}

function bisect(f: SidedFunction, lo: number, hi: number, fLo: number): number {
  let a = lo;
  let b = hi;
  let fa = fLo;
  for (let k = 0; k < 80 && b - a > 1e-13 * Math.max(1, Math.abs(b)); k++) {
    const m = (a + b) / 2;
    const fm = f(m, "right");
    if (fm === 0) return m;
    if (Math.sign(fm) === Math.sign(fa)) {
      a = m;
      fa = fm;
    } else b = m;
  }
  return (a + b) / 2;
}

/**
 * Interior positions where the curve changes sign: across a jump (taken at the jump) or
 * inside an interval (refined by bisection on the exact function). Values within `tolerance`
 * of zero count as zero; touching zero without changing sign is not a crossing.
 * @param curve - sampled curve from {@link sampleCurve}
 * @param f - the exact function
 * @param tolerance - magnitude treated as zero
 * @param span - member length; crossings at the ends are left out
 */
export function zeroCrossings(curve: readonly CurvePoint[], f: SidedFunction, tolerance: number, span: number): number[] {
  const out: number[] = [];
  let last: CurvePoint | undefined;
  let zeroRun: CurvePoint[] = [];
  for (const p of curve) {
    if (Math.abs(p.v) <= tolerance) {
      zeroRun.push(p);
      continue;
    }
    if (last !== undefined && Math.sign(last.v) !== Math.sign(p.v)) {
      let x: number;
      if (zeroRun.length > 0) x = ((zeroRun[0] as CurvePoint).x + (zeroRun[zeroRun.length - 1] as CurvePoint).x) / 2;
      else if (p.x === last.x) x = p.x;
      else x = bisect(f, last.x, p.x, last.v);
      const edge = 1e-9 * span;
      if (x > edge && x < span - edge && (out.length === 0 || x - (out[out.length - 1] as number) > edge)) out.push(x);
    }
    last = p;
    zeroRun = [];
  }
  return out;
}
