/**
 * Exact extremes of the piecewise solution. Candidates are the segment ends on both sides of every
 * breakpoint and the interior stationary points: roots of V for the moment, roots of q for the
 * shear, roots of the slope for the deflection, each found on the exact segment polynomial.
 */
import * as evaluate from "./evaluate";
import type { Piecewise } from "./piecewise";
import * as roots from "./roots";
import type { Extreme } from "./types";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { momentIn, riseIn, segStart, shearIn } = evaluate;
const { rootsInInterval } = roots;

/**
 * Two candidates whose values differ by less than this fraction count as equal; the leftmost is
 * kept. A result smaller than this fraction of the largest magnitude of its kind is rounding
 * noise and is reported as 0 (for example the moment at a free end).
 */
export const RELATIVE_NOISE = 1e-12;

const rootsOut = new Float64Array(8);
const coeffs = new Float64Array(5);

/** Running maximum and minimum of a scan from left to right. */
class Tracker {
  maxValue = -Infinity;
  maxX = 0;
  minValue = Infinity;
  minX = 0;

  see(v: number, x: number): void {
    if (v - this.maxValue > RELATIVE_NOISE * Math.abs(v)) {
      this.maxValue = v;
      this.maxX = x;
    }
    if (this.minValue - v > RELATIVE_NOISE * Math.abs(v)) {
      this.minValue = v;
      this.minX = x;
    }
  }

  scale(): number {
    return Math.max(Math.abs(this.maxValue), Math.abs(this.minValue));
  }

  /** Largest value, 0 (at x = 0) when none is above the noise. */
  positive(): Extreme {
    return this.maxValue > RELATIVE_NOISE * this.scale() ? { value: this.maxValue, x: this.maxX } : { value: 0, x: 0 };
  }

  /** Smallest value, 0 (at x = 0) when none is below the noise. */
  negative(): Extreme {
    return this.minValue < -RELATIVE_NOISE * this.scale() ? { value: this.minValue, x: this.minX } : { value: 0, x: 0 };
  }
}

function ascending(p: number, q: number): number {
  return p - q;
}

/** Interior roots are kept only this far (relative to the span) from a segment's ends. */
function endGap(pw: Piecewise): number {
  return RELATIVE_NOISE * pw.buf[pw.n];
}

/**
 * Roots of V inside segment k (local t, ascending) written to `out`.
 * @returns how many
 */
export function shearRoots(pw: Piecewise, k: number, out: Float64Array | number[]): number {
  const buf = pw.buf;
  const s = segStart(pw, k);
  const h = buf[k + 1] - buf[k];
  const gap = endGap(pw);
  coeffs[0] = buf[s + 2];
  coeffs[1] = -buf[s];
  coeffs[2] = -buf[s + 1] / 2;
  return rootsInInterval(coeffs, 2, gap, h - gap, out);
}

/** Root of q inside segment k (local t), or -1. */
export function loadRoot(pw: Piecewise, k: number): number {
  const buf = pw.buf;
  const s = segStart(pw, k);
  const h = buf[k + 1] - buf[k];
  const gap = endGap(pw);
  if (buf[s + 1] === 0) return -1;
  const t = -buf[s] / buf[s + 1];
  return t > gap && t < h - gap ? t : -1;
}

/**
 * Roots of the slope inside segment k (local t, ascending) written to `out`.
 * @returns how many
 */
export function slopeRoots(pw: Piecewise, k: number, out: Float64Array | number[]): number {
  const buf = pw.buf;
  const s = segStart(pw, k);
  const h = buf[k + 1] - buf[k];
  const gap = endGap(pw);
  coeffs[0] = buf[s + 4];
  coeffs[1] = buf[s + 3];
  coeffs[2] = buf[s + 2] / 2;
  coeffs[3] = -buf[s] / 6;
  coeffs[4] = -buf[s + 1] / 24;
  return rootsInInterval(coeffs, 4, gap, h - gap, out);
}

/** Largest sagging and most hogging moments. */
export function momentExtremes(pw: Piecewise): { sagging: Extreme; hogging: Extreme } {
  const buf = pw.buf;
  const tr = new Tracker();
  for (let k = 0; k < pw.n; k++) {
    const s = segStart(pw, k);
    const x0 = buf[k];
    const h = buf[k + 1] - x0;
    tr.see(buf[s + 3], x0);
    const nr = shearRoots(pw, k, rootsOut);
    for (let i = 0; i < nr; i++) tr.see(momentIn(buf, s, rootsOut[i]), x0 + rootsOut[i]);
    tr.see(momentIn(buf, s, h), buf[k + 1]);
  }
  return { sagging: tr.positive(), hogging: tr.negative() };
}

/** Shear of largest magnitude (signed). */
export function shearExtreme(pw: Piecewise): Extreme {
  const buf = pw.buf;
  let best = 0;
  let bestX = 0;
  let largest = 0;
  for (let k = 0; k < pw.n; k++) {
    const s = segStart(pw, k);
    const x0 = buf[k];
    const h = buf[k + 1] - x0;
    const t = loadRoot(pw, k);
    for (let c = 0; c < 3; c++) {
      // candidates left to right: start (right of x0), root of q, end (left of the next breakpoint)
      if (c === 1 && t < 0) continue;
      const tc = c === 0 ? 0 : c === 1 ? t : h;
      const v = c === 0 ? buf[s + 2] : shearIn(buf, s, tc);
      const a = Math.abs(v);
      if (a - largest > RELATIVE_NOISE * a) {
        largest = a;
        best = v;
        bestX = c === 2 ? buf[k + 1] : x0 + tc;
      }
    }
  }
  return { value: best, x: bestX };
}

/** Largest downward and largest upward EI * deflection (deflection = -EIy). */
export function deflectionExtremes(pw: Piecewise): { down: Extreme; up: Extreme } {
  const buf = pw.buf;
  const tr = new Tracker();
  for (let k = 0; k < pw.n; k++) {
    const s = segStart(pw, k);
    const x0 = buf[k];
    const h = buf[k + 1] - x0;
    tr.see(-buf[s + 5], x0);
    const nr = slopeRoots(pw, k, rootsOut);
    for (let i = 0; i < nr; i++) tr.see(-riseIn(buf, s, rootsOut[i]), x0 + rootsOut[i]);
    if (k === pw.n - 1) tr.see(-riseIn(buf, s, h), buf[k + 1]);
  }
  return { down: tr.positive(), up: tr.negative() };
}

/**
 * Sorted unique positions where something changes: every breakpoint plus the interior roots of
 * V, q and the slope. Interior roots closer together than the noise gap are merged.
 */
export function criticalPositions(pw: Piecewise): number[] {
  const buf = pw.buf;
  const gap = endGap(pw);
  const out: number[] = [buf[0]];
  const local: number[] = [];
  for (let k = 0; k < pw.n; k++) {
    local.length = 0;
    const tmp = rootsOut;
    let nr = shearRoots(pw, k, tmp);
    for (let i = 0; i < nr; i++) local.push(tmp[i]);
    const t = loadRoot(pw, k);
    if (t >= 0) local.push(t);
    nr = slopeRoots(pw, k, tmp);
    for (let i = 0; i < nr; i++) local.push(tmp[i]);
    local.sort(ascending);
    let last = -Infinity;
    for (const r of local) {
      if (r - last > gap) out.push(buf[k] + r);
      last = r;
    }
    out.push(buf[k + 1]);
  }
  return out;
}
