/**
 * The exact piecewise solution. Between consecutive breakpoints (ends, supports, load starts and
 * ends, point loads, couples) the load intensity is linear, so in local coordinate t = x - x_k
 * every quantity is a polynomial fixed by six numbers stored per segment:
 *
 *   q(t)   = q0 + q1 t                                            (load, down +)
 *   V(t)   = V0 - q0 t - q1 t^2/2                                 (shear, V = dM/dx)
 *   M(t)   = M0 + V0 t - q0 t^2/2 - q1 t^3/6                      (moment, sagging +)
 *   EIθ(t) = T0 + M0 t + V0 t^2/2 - q0 t^3/6 - q1 t^4/24          (rotation, counter-clockwise +)
 *   EIy(t) = Y0 + T0 t + M0 t^2/2 + V0 t^3/6 - q0 t^4/24 - q1 t^5/120   (y upward)
 *
 * with EI y'' = M. Deflection (down +) is -y. Values at a segment's start are the values just to
 * the right of its breakpoint; a downward force P at x makes V jump by -P, an upward reaction R by
 * +R, and a counter-clockwise couple m (applied or reaction) makes M jump by -m.
 */
import * as packed from "./packed";
import type { PackedModel } from "./packed";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { doubles, KIND_LINE, KIND_MOMENT, KIND_POINT, LOAD_STRIDE, SHORT_LINE, SUPPORT_STRIDE } = packed;

/** Numbers stored per segment: q0, q1, V0, M0, T0 (EIθ), Y0 (EIy). */
export const SEG_STRIDE = 6;

/** Breakpoints and segment polynomials in one buffer. */
export interface Piecewise {
  /** Number of segments (breakpoints - 1), at least 1. */
  readonly n: number;
  /** buf[0..n] = sorted unique breakpoints; segment k's numbers start at segOffset + 6k. */
  readonly buf: number[];
  readonly segOffset: number;
}

let scratch = new Float64Array(64);
let jumpV = new Float64Array(64);
let jumpM = new Float64Array(64);

function ensureScratch(size: number): void {
  if (scratch.length < size) scratch = new Float64Array(size * 2);
}

/** Index of x among the breakpoints buf[0..count-1] (x must be one of them). */
export function breakpointIndex(buf: readonly number[], count: number, x: number): number {
  let lo = 0;
  let hi = count - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (buf[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function collectPositions(pm: PackedModel): number {
  const need = 2 + 2 * pm.loadCount + pm.supportCount;
  ensureScratch(need);
  let c = 0;
  scratch[c++] = 0;
  scratch[c++] = pm.span;
  const d = pm.loads;
  const short = SHORT_LINE * pm.span;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    scratch[c++] = d[o + 1];
    if (d[o] === KIND_LINE && d[o + 2] - d[o + 1] > short) scratch[c++] = d[o + 2];
  }
  for (let i = 0; i < pm.supportCount; i++) scratch[c++] = pm.supports[i * SUPPORT_STRIDE];
  return c;
}

function sortScratch(count: number): void {
  if (count > 32) {
    scratch.subarray(0, count).sort();
    return;
  }
  for (let i = 1; i < count; i++) {
    const v = scratch[i];
    let j = i - 1;
    while (j >= 0 && scratch[j] > v) {
      scratch[j + 1] = scratch[j];
      j--;
    }
    scratch[j + 1] = v;
  }
}

function allocate(count: number): Piecewise {
  let unique = 1;
  for (let i = 1; i < count; i++) if (scratch[i] !== scratch[unique - 1]) scratch[unique++] = scratch[i];
  const n = unique - 1;
  const buf = doubles(unique + SEG_STRIDE * n);
  for (let i = 0; i < unique; i++) buf[i] = scratch[i];
  return { n, buf, segOffset: unique };
}

function distributeLineLoads(pw: Piecewise, pm: PackedModel): void {
  const { buf, n, segOffset } = pw;
  const d = pm.loads;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    if (d[o] !== KIND_LINE) continue;
    const a = d[o + 1];
    const b = d[o + 2];
    const c = b - a;
    if (!(c > SHORT_LINE * pm.span)) continue; // carried as a point load, see loadJumps
    const w1 = d[o + 3];
    const dw = d[o + 4] - w1;
    const slope = dw / c;
    const ka = breakpointIndex(buf, n + 1, a);
    const kb = breakpointIndex(buf, n + 1, b);
    for (let k = ka; k < kb; k++) {
      const s = segOffset + SEG_STRIDE * k;
      buf[s] += w1 + dw * ((buf[k] - a) / c);
      buf[s + 1] += slope;
    }
  }
}

/**
 * Builds the breakpoints and each segment's load intensity (q0, q1). The shear, moment and
 * deflection numbers are filled by {@link march}.
 */
export function buildSegments(pm: PackedModel): Piecewise {
  const count = collectPositions(pm);
  sortScratch(count);
  const pw = allocate(count);
  distributeLineLoads(pw, pm);
  return pw;
}

/** Clears the jump arrays for a piecewise and adds the jumps of point loads, couples and very short line loads. */
export function loadJumps(pw: Piecewise, pm: PackedModel): void {
  const size = pw.n + 1;
  if (jumpV.length < size) {
    jumpV = new Float64Array(size * 2);
    jumpM = new Float64Array(size * 2);
  } else {
    for (let i = 0; i < size; i++) {
      jumpV[i] = 0;
      jumpM[i] = 0;
    }
  }
  const d = pm.loads;
  const short = SHORT_LINE * pm.span;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    const kind = d[o];
    const c = d[o + 2] - d[o + 1];
    if (kind === KIND_LINE && c > short) continue;
    const k = breakpointIndex(pw.buf, size, d[o + 1]);
    if (kind === KIND_POINT) jumpV[k] -= d[o + 3];
    else if (kind === KIND_MOMENT) jumpM[k] -= d[o + 3];
    else jumpV[k] -= ((d[o + 3] + d[o + 4]) * c) / 2; // a very short line load: its resultant
  }
}

/**
 * Adds the reactions' jumps (upward force, counter-clockwise couple) to the jump arrays.
 * @param reactions - vertical reaction per support
 * @param couples - reaction couple per support (0 at pins)
 */
export function reactionJumps(pw: Piecewise, pm: PackedModel, reactions: ArrayLike<number>, couples: ArrayLike<number>): void {
  for (let i = 0; i < pm.supportCount; i++) {
    const k = breakpointIndex(pw.buf, pw.n + 1, pm.supports[i * SUPPORT_STRIDE]);
    jumpV[k] += reactions[i];
    jumpM[k] -= couples[i];
  }
}

/** Values just right of x = span after the march: [V, M, EIθ, EIy] (V, M ~ 0 when in equilibrium). */
export const marchEnd = new Float64Array(4);

/**
 * Walks the segments from x = 0 with the current jumps, writing V0, M0, T0, Y0 of every segment.
 * @param t0 - EI times the rotation at x = 0
 * @param y0 - EI times the upward displacement at x = 0
 */
export function march(pw: Piecewise, t0: number, y0: number): void {
  const { buf, n, segOffset } = pw;
  let V = jumpV[0];
  let M = jumpM[0];
  let T = t0;
  let Y = y0;
  for (let k = 0; k < n; k++) {
    const s = segOffset + SEG_STRIDE * k;
    const h = buf[k + 1] - buf[k];
    const q0 = buf[s];
    const q1 = buf[s + 1];
    buf[s + 2] = V;
    buf[s + 3] = M;
    buf[s + 4] = T;
    buf[s + 5] = Y;
    Y += h * (T + h * (M / 2 + h * (V / 6 - h * (q0 / 24 + (h * q1) / 120))));
    T += h * (M + h * (V / 2 - h * (q0 / 6 + (h * q1) / 24)));
    M += h * (V - h * (q0 / 2 + (h * q1) / 6));
    V -= h * (q0 + (h * q1) / 2);
    V += jumpV[k + 1];
    M += jumpM[k + 1];
  }
  marchEnd[0] = V;
  marchEnd[1] = M;
  marchEnd[2] = T;
  marchEnd[3] = Y;
}

/** EIθ at breakpoint k after a march (continuous, so either side). */
export function slopeAtBreakpoint(pw: Piecewise, k: number): number {
  return k < pw.n ? pw.buf[pw.segOffset + SEG_STRIDE * k + 4] : marchEnd[2];
}

/** EIy (upward) at breakpoint k after a march. */
export function riseAtBreakpoint(pw: Piecewise, k: number): number {
  return k < pw.n ? pw.buf[pw.segOffset + SEG_STRIDE * k + 5] : marchEnd[3];
}

/**
 * Adds a rigid-body motion to the solution: EIθ += dT everywhere, EIy += dY + dT (x - xRef).
 */
export function addRigidMotion(pw: Piecewise, dT: number, dY: number, xRef: number): void {
  const { buf, n, segOffset } = pw;
  for (let k = 0; k < n; k++) {
    const s = segOffset + SEG_STRIDE * k;
    buf[s + 4] += dT;
    buf[s + 5] += dY + dT * (buf[k] - xRef);
  }
}
