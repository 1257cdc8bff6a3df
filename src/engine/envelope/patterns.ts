/**
 * Pattern (skip) live loading, ASCE/SEI 7-22 Sec. 4.3.3 (partial loading; recalled from memory:
 * "the full intensity of the appropriately reduced live load applied only to a portion of a
 * structure or member shall be accounted for if it produces a more unfavorable load effect than
 * the same intensity applied over the full structure or member").
 *
 * A "unit" is the load of one patterned case (L or Lr) on one segment of the member. A pattern
 * says which units are on; dead load and the unpatterned cases stay on everywhere.
 *
 * Which patterns are checked:
 * - up to {@link ENUMERATION_LIMIT} units: every on/off pattern (2^units), exact for any member;
 * - beyond: the alternating-segment rule below, which is exact for a prismatic member on
 *   unyielding supports when each unit's load acts in one direction (all down or all up).
 *
 * The alternating-segment rule. For x in segment i, an unloaded segment j != i affects the member
 * at x only through the support moments at the ends of segment i (or, in an overhang, through
 * the rotation of its support). With the loaded segments all on one side of segment i, the two
 * end moments of segment i keep a fixed ratio (the "focal point" of the unloaded side), and the
 * moment they carry into segment i alternates in sign from one loaded segment to the next
 * (three-moment equation: in a chain of unloaded spans the support moments alternate in sign
 * and decay; the same holds for a fixed end, and an overhang acts like one more span). So for each
 * x, the sign of every unit's contribution to M(x), V(x) and the deflection at x is: alternating
 * over the segments right of i, starting with + at i+1 or at i+2; alternating over the segments
 * left of i, starting at i-1 or at i-2; and unknown for the units in segment i itself. The
 * patterns that load exactly the units of positive contribution are, per segment i, these
 * 2 x 2 choices times every on/off choice of segment i's own units; their union over i holds the
 * governing pattern of every quantity at every x. (A unit whose load acts upward, or a negative
 * load factor, flips its sign; a unit of mixed direction has no one sign, and the result then
 * says the rule is not proven for it.)
 */
import type { BeamLoad } from "../beam/types";
import { LOAD_CASES, type LoadCase } from "../loads/combinations";
import type { MemberSegment } from "./segments";

/** Most units whose every on/off pattern is checked (2^10 = 1024 patterns per combination). */
export const ENUMERATION_LIMIT = 10;

/** The load of one patterned case on one segment. */
export interface PatternUnit {
  readonly load: LoadCase;
  /** Index of the segment (see memberSegments). */
  readonly segment: number;
  /** Loads of that case inside the segment (beam engine conventions, unfactored). */
  readonly loads: readonly BeamLoad[];
  /** +1 all down, -1 all up, 0 mixed (see loadDirection). */
  readonly direction: -1 | 0 | 1;
}

/** The patterns to check for one combination. */
export interface PatternSet {
  /** Each pattern: which units are on (same order as the units). */
  readonly patterns: readonly (readonly boolean[])[];
  /** True when every on/off pattern is in the set. */
  readonly exhaustive: boolean;
  /**
   * True when the set is exhaustive or the alternating-segment rule applies to every unit (all
   * units of one direction); false when the rule was used with a unit of mixed direction.
   */
  readonly proven: boolean;
}

/** A pattern in a form a report prints and a program reads. */
export interface PatternRecord {
  /** e.g. "L on spans 1, 3 and overhang right; Lr off"; "no pattern" when no case is patterned. */
  readonly text: string;
  /** For each patterned case that carries load: the indices of the segments where it is on. */
  readonly on: Readonly<Partial<Record<LoadCase, readonly number[]>>>;
}

function keyOf(on: readonly boolean[]): string {
  return on.map((b) => (b ? "1" : "0")).join("");
}

/**
 * The alternating-segment rule (module comment): for every segment i, every choice of the first
 * loaded segment on each side (i+1 or i+2, i-1 or i-2) and every on/off choice of the units in
 * segment i. A unit outside segment i is on when its signed direction agrees with the wanted sign.
 */
function alternatingRule(units: readonly PatternUnit[], signs: readonly number[], segmentCount: number): boolean[][] {
  const seen = new Set<string>();
  const out: boolean[][] = [];
  const add = (on: boolean[]): void => {
    const k = keyOf(on);
    if (!seen.has(k)) {
      seen.add(k);
      out.push(on);
    }
  };
  add(units.map(() => true));
  add(units.map(() => false));
  for (let i = 0; i < segmentCount; i++) {
    const own = units.map((u, k) => (u.segment === i ? k : -1)).filter((k) => k >= 0);
    for (const right of [1, 2]) {
      for (const left of [1, 2]) {
        for (let mask = 0; mask < 1 << own.length; mask++) {
          const on = units.map((u, k) => {
            const j = u.segment;
            if (j === i) return (mask & (1 << own.indexOf(k))) !== 0;
            const d = j > i ? j - i - right : i - j - left;
            const wanted = d >= 0 && d % 2 === 0 ? 1 : -1;
            return wanted * (signs[k] ?? 1) > 0;
          });
          add(on);
        }
      }
    }
  }
  return out;
}

/**
 * The patterns to check for one combination.
 * @param units - the patterned units that carry load under this combination (factor != 0)
 * @param factors - the combination's load factor of each unit's case (same order; sign matters)
 * @param segmentCount - number of segments of the member
 * @param limit - most units enumerated exhaustively (default {@link ENUMERATION_LIMIT})
 */
export function candidatePatterns(units: readonly PatternUnit[], factors: readonly number[], segmentCount: number, limit: number = ENUMERATION_LIMIT): PatternSet {
  const m = units.length;
  if (m <= limit) {
    const patterns: boolean[][] = [];
    for (let mask = 0; mask < 2 ** m; mask++) patterns.push(units.map((_, k) => Math.floor(mask / 2 ** k) % 2 === 1));
    return { patterns, exhaustive: true, proven: true };
  }
  const signs = units.map((u, k) => u.direction * Math.sign(factors[k] ?? 0));
  return { patterns: alternatingRule(units, signs, segmentCount), exhaustive: false, proven: signs.every((s) => s !== 0) };
}

/** "spans 1, 3 and overhang right" from segment indices. */
function listSegments(indices: readonly number[], segments: readonly MemberSegment[]): string {
  const spans = indices.filter((i) => segments[i]!.kind === "span").map((i) => segments[i]!.label.replace("span ", ""));
  const overhangs = indices.filter((i) => segments[i]!.kind === "overhang").map((i) => segments[i]!.label.replace("overhang ", ""));
  const parts: string[] = [];
  if (spans.length > 0) parts.push((spans.length === 1 ? "span " : "spans ") + spans.join(", "));
  if (overhangs.length > 0) parts.push((overhangs.length === 1 ? "overhang " : "overhangs ") + overhangs.join(" and "));
  return parts.join(" and ");
}

/**
 * The printable and structured form of a pattern. A case on every segment where it carries load,
 * over the whole member, reads "L on all segments"; a case on nowhere reads "L off".
 * @param units - the units of the combination
 * @param on - which units are on
 * @param segments - the member's segments
 */
export function describePattern(units: readonly PatternUnit[], on: readonly boolean[], segments: readonly MemberSegment[]): PatternRecord {
  const parts: string[] = [];
  const record: Partial<Record<LoadCase, readonly number[]>> = {};
  for (const load of LOAD_CASES) {
    const mine = units.map((u, k) => ({ u, k })).filter(({ u }) => u.load === load);
    if (mine.length === 0) continue;
    const onSegments = mine.filter(({ k }) => on[k]).map(({ u }) => u.segment);
    record[load] = onSegments;
    if (onSegments.length === 0) parts.push(`${load} off`);
    else if (onSegments.length === mine.length && mine.length === segments.length) parts.push(`${load} on all segments`);
    else parts.push(`${load} on ${listSegments(onSegments, segments)}`);
  }
  return { text: parts.length === 0 ? "no pattern" : parts.join("; "), on: record };
}
