/**
 * Values of the segment polynomials (see piecewise.ts) at local coordinate t, and the lookup of
 * the segment that holds a position, on either side of a breakpoint.
 */
import * as piecewise from "./piecewise";
import type { Piecewise } from "./piecewise";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { SEG_STRIDE } = piecewise;

/** Start index of segment k's numbers in pw.buf. */
export function segStart(pw: Piecewise, k: number): number {
  return pw.segOffset + SEG_STRIDE * k;
}

/** Load intensity (down +) at t in the segment starting at s. */
export function qAt(buf: readonly number[], s: number, t: number): number {
  return buf[s] + buf[s + 1] * t;
}

/** Shear at t in the segment starting at s. */
export function shearIn(buf: readonly number[], s: number, t: number): number {
  return buf[s + 2] - t * (buf[s] + (t * buf[s + 1]) / 2);
}

/** Bending moment (sagging +) at t in the segment starting at s. */
export function momentIn(buf: readonly number[], s: number, t: number): number {
  return buf[s + 3] + t * (buf[s + 2] - t * (buf[s] / 2 + (t * buf[s + 1]) / 6));
}

/** EI times the rotation (counter-clockwise +) at t in the segment starting at s. */
export function slopeIn(buf: readonly number[], s: number, t: number): number {
  return buf[s + 4] + t * (buf[s + 3] + t * (buf[s + 2] / 2 - t * (buf[s] / 6 + (t * buf[s + 1]) / 24)));
}

/** EI times the upward displacement at t in the segment starting at s. */
export function riseIn(buf: readonly number[], s: number, t: number): number {
  return buf[s + 5] + t * (buf[s + 4] + t * (buf[s + 3] / 2 + t * (buf[s + 2] / 6 - t * (buf[s] / 24 + (t * buf[s + 1]) / 120))));
}

/**
 * Segment holding x (0 <= x <= span). Side "right": the segment starting at x when x is a
 * breakpoint, except at the right end; side "left": the segment ending at x, except at x = 0.
 */
export function segmentOf(pw: Piecewise, x: number, right: boolean): number {
  const buf = pw.buf;
  let lo = 0;
  let hi = pw.n - 1;
  if (right) {
    // last k with buf[k] <= x
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (buf[mid] <= x) lo = mid;
      else hi = mid - 1;
    }
  } else {
    // first k with buf[k + 1] >= x
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (buf[mid + 1] >= x) hi = mid;
      else lo = mid + 1;
    }
  }
  return lo;
}
