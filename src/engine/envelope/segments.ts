/**
 * The segments of one member for pattern (skip) loading: the parts between consecutive supports
 * ("spans") and the parts beyond the first and last support ("overhangs"). Live load is switched
 * on and off segment by segment, and deflection limits are checked segment by segment.
 *
 * Conventions and units are those of the beam engine (src/engine/beam/types.ts): x from the left
 * end, any consistent units.
 */
import { fail, ok, type Result } from "../errors";
import type { BeamLoad, Support } from "../beam/types";

/** One part of a member between two consecutive supports, or beyond the end support. */
export interface MemberSegment {
  /** 0-based position of the segment along the member, left to right. */
  readonly index: number;
  /** Left end of the segment (length, from the member's left end). */
  readonly start: number;
  /** Right end of the segment (length). */
  readonly end: number;
  /** "span" between two supports, "overhang" between a support and a free end. */
  readonly kind: "span" | "overhang";
  /** How a report names it: "span 1", "span 2", "overhang left", "overhang right". */
  readonly label: string;
}

/**
 * The segments of a member, left to right. Spans are numbered from 1 along the member; a part
 * shorter than 1e-9 x span (a support at an end) is no segment.
 *
 * Fails with `missing` when there is no support, `notPositive` for a span <= 0 and
 * `outOfMember` for a support outside 0..span; the beam engine reports everything else.
 * @param span - member length (length, > 0)
 * @param supports - supports in any order (positions in length from the left end)
 * @returns the segments in order along the member
 */
export function memberSegments(span: number, supports: readonly Support[]): Result<MemberSegment[]> {
  if (!(Number.isFinite(span) && span > 0)) return fail("notPositive", `must be a finite number greater than 0; got ${span}.`, "span");
  if (supports.length === 0) return fail("missing", "a member needs at least one support.", "supports");
  const tol = 1e-9 * span;
  const xs: number[] = [];
  for (let i = 0; i < supports.length; i++) {
    const x = supports[i]!.x;
    if (!(Number.isFinite(x) && x >= -tol && x <= span + tol)) return fail("outOfMember", `position ${x} is outside the member (0 to ${span}).`, "supports", i + 1);
    xs.push(Math.min(span, Math.max(0, x)));
  }
  xs.sort((a, b) => a - b);
  const cuts: number[] = [];
  for (const x of xs) if (cuts.length === 0 || x - cuts[cuts.length - 1]! > tol) cuts.push(x);
  const out: MemberSegment[] = [];
  const first = cuts[0]!;
  const last = cuts[cuts.length - 1]!;
  if (first > tol) out.push({ index: 0, start: 0, end: first, kind: "overhang", label: "overhang left" });
  for (let k = 0; k + 1 < cuts.length; k++) {
    out.push({ index: out.length, start: cuts[k]!, end: cuts[k + 1]!, kind: "span", label: `span ${k + 1}` });
  }
  if (span - last > tol) out.push({ index: out.length, start: last, end: span, kind: "overhang", label: "overhang right" });
  return ok(out);
}

/**
 * Index of the segment that holds position x: a position on a support between two segments
 * belongs to the segment on its right, the right end of the member to the last segment.
 */
export function segmentAt(segments: readonly MemberSegment[], x: number): number {
  for (let k = 0; k < segments.length; k++) if (x < segments[k]!.end) return k;
  return segments.length - 1;
}

/** Intensity of a linearly varying line load at x (force/length). */
function intensityAt(start: number, end: number, w1: number, w2: number, x: number): number {
  return end > start ? w1 + ((w2 - w1) * (x - start)) / (end - start) : w1;
}

/**
 * The loads of one case cut at the segment ends: entry k holds the part of every load that lies
 * in segment k. A line load over several segments becomes one piece per segment with the
 * intensities interpolated at the cuts (so the pieces add up to the load exactly); point loads
 * and couples go to the segment that holds them ({@link segmentAt}). A line load of zero length
 * carries nothing and is dropped.
 * @param loads - loads of one case (beam engine conventions: line loads force/length, point loads force, couples force x length)
 * @param segments - from {@link memberSegments}
 * @returns one list of loads per segment, in segment order
 */
export function splitBySegment(loads: readonly BeamLoad[], segments: readonly MemberSegment[]): BeamLoad[][] {
  const out: BeamLoad[][] = segments.map(() => []);
  for (const load of loads) {
    if (load.kind !== "line") {
      out[segmentAt(segments, load.x)]!.push(load);
      continue;
    }
    for (const s of segments) {
      const a = Math.max(load.start, s.start);
      const b = Math.min(load.end, s.end);
      if (!(b > a)) continue;
      const w1 = a === load.start ? load.w1 : intensityAt(load.start, load.end, load.w1, load.w2, a);
      const w2 = b === load.end ? load.w2 : intensityAt(load.start, load.end, load.w1, load.w2, b);
      out[s.index]!.push({ kind: "line", start: a, end: b, w1, w2 });
    }
  }
  return out;
}

/** A load multiplied by a factor (a load factor of a combination). */
export function scaleLoad(load: BeamLoad, factor: number): BeamLoad {
  if (load.kind === "line") return { kind: "line", start: load.start, end: load.end, w1: load.w1 * factor, w2: load.w2 * factor };
  if (load.kind === "point") return { kind: "point", x: load.x, p: load.p * factor };
  return { kind: "moment", x: load.x, m: load.m * factor };
}

/**
 * Direction of a list of loads: +1 when every load acts downward or is zero, -1 when every load
 * acts upward or is zero, 0 when mixed or when it holds a couple (whose effect has no one sign).
 */
export function loadDirection(loads: readonly BeamLoad[]): -1 | 0 | 1 {
  let down = false;
  let up = false;
  for (const l of loads) {
    if (l.kind === "moment") {
      if (l.m !== 0) return 0;
      continue;
    }
    const values = l.kind === "line" ? [l.w1, l.w2] : [l.p];
    for (const v of values) {
      if (v > 0) down = true;
      else if (v < 0) up = true;
    }
  }
  if (down && up) return 0;
  return up ? -1 : 1;
}
