/**
 * Deflection of one member against span ratios, checked segment by segment with the live load
 * patterns of patterns.ts.
 *
 * - The length a limit divides is the distance between the two supports of a span, and twice the
 *   length of an overhang (a cantilever tip is held to the limit of a span twice as long) —
 *   common practice.
 * - Defaults: live load deflection span/360, total load deflection span/240 (common practice for
 *   floor members; a firm or a building code may ask for others, so both are arguments).
 * - Live deflection: every service combination of live load alone (default: the live part of
 *   ASCE/SEI 7-22 Sec. 2.4.1 combinations 2 to 4, recalled from memory: L, Lr, 0.7S, R,
 *   0.75L + 0.75(Lr or 0.7S or R)) under every live load pattern; total deflection: the same with
 *   D (combinations 2 to 4 themselves). Snow enters as 0.7S because ASCE/SEI 7-22 gives S at
 *   strength level.
 * - In each segment the largest deflection magnitude, downward or upward (a back span lifts when
 *   only its overhang is loaded), is compared with that segment's limit; the segment with the
 *   largest deflection / allowable ratio governs. Extremes come from the roots of the slope of the
 *   exact solution, never from sampling.
 *
 * Units: deflections come out multiplied by EI (force x length^3, as the beam engine's
 * deflectionEIAt) and, when the flexural rigidity EI is given in the same consistent units
 * (force x length^2), as lengths. Required EI (force x length^2) holds both limits in every
 * segment; required I = required EI / E is left to the caller's unit conversion.
 */
import { fail, ok, type Result } from "../errors";
import type { LoadCase } from "../loads/combinations";
import { builtInCombinations, checkCombinations, factorOf, type FactoredCombination } from "./combination-sets";
import { activeUnits, DEFAULT_PATTERNED, patternModel, prepareMember, solveChecked, type MemberCases, type PreparedMember } from "./member-cases";
import { candidatePatterns, describePattern, ENUMERATION_LIMIT, type PatternRecord } from "./patterns";
import type { MemberSegment } from "./segments";

/** Span ratios of the limits: deflection <= length / ratio. */
export interface DeflectionLimits {
  /** Live load limit ratio (default 360: span/360, common practice). */
  readonly live: number;
  /** Total load limit ratio (default 240: span/240, common practice). */
  readonly total: number;
}

/** span/360 live, span/240 total (common practice). */
export const DEFAULT_DEFLECTION_LIMITS: DeflectionLimits = Object.freeze({ live: 360, total: 240 });

const GRAVITY: readonly LoadCase[] = ["L", "Lr", "S", "R"];

function serviceCombinations(): { live: FactoredCombination[]; total: FactoredCombination[] } {
  const rows = builtInCombinations({ method: "ASD", halfLive: false }).filter(
    (c) => factorOf(c, "W") === 0 && factorOf(c, "E") === 0 && GRAVITY.some((g) => factorOf(c, g) !== 0),
  );
  const live = rows.map((c) => {
    const factors: Partial<Record<LoadCase, number>> = { ...c.factors };
    delete factors.D;
    return { label: `${c.label}, live part`, factors };
  });
  return { live, total: rows };
}

/** The default service combinations for deflection (ASCE/SEI 7-22 Sec. 2.4.1, 2 to 4, recalled from memory). */
export const DEFAULT_DEFLECTION_COMBINATIONS: Readonly<{ live: readonly FactoredCombination[]; total: readonly FactoredCombination[] }> = Object.freeze(serviceCombinations());

/** Options of the deflection check. */
export interface DeflectionOptions {
  /** Limit ratios (default {@link DEFAULT_DEFLECTION_LIMITS}). */
  readonly limits?: DeflectionLimits;
  /** Flexural rigidity E x I (force x length^2, consistent with the loads); blank = not known. */
  readonly flexuralRigidity?: number;
  /** Service combinations (default {@link DEFAULT_DEFLECTION_COMBINATIONS}). */
  readonly combinations?: { readonly live: readonly FactoredCombination[]; readonly total: readonly FactoredCombination[] };
  /** Cases applied segment by segment (default L and Lr). */
  readonly patterned?: readonly LoadCase[];
  /** Most pattern units enumerated exhaustively (default ENUMERATION_LIMIT). */
  readonly enumerationLimit?: number;
}

/** The governing deflection of one check (live or total) in one segment or over the member. */
export interface DeflectionResult {
  /** The segment, e.g. "span 2", "overhang right". */
  readonly region: string;
  /** Index of that segment. */
  readonly segment: number;
  /** Length the limit divides: the span between supports, or twice the overhang (length). */
  readonly limitLength: number;
  /** Allowable deflection, limitLength / ratio (length). */
  readonly allowable: number;
  /** EI x the governing deflection, downward + (force x length^3). */
  readonly deflectionEI: number;
  /** The deflection (length, downward +), or null when EI is not known. */
  readonly deflection: number | null;
  /** |deflection| / allowable (<= 1 passes), or null when EI is not known. */
  readonly ratio: number | null;
  /** EI that makes |deflection| equal the allowable (force x length^2). */
  readonly requiredEI: number;
  /** Where the deflection occurs (length from the left end). */
  readonly x: number;
  readonly combination: string;
  readonly pattern: string;
  readonly on: PatternRecord["on"];
}

/** The deflection check of one member. */
export interface DeflectionCheck {
  /** Governing live load deflection (largest ratio over the segments); null when the member carries no live load. */
  readonly live: DeflectionResult | null;
  /** Governing total load deflection; null when no total combination carries load. */
  readonly total: DeflectionResult | null;
  /** Per segment, in order: its governing live and total deflection. */
  readonly segments: readonly { readonly segment: MemberSegment; readonly live: DeflectionResult | null; readonly total: DeflectionResult | null }[];
  /** Least EI for which both limits hold in every segment (force x length^2); 0 when nothing deflects. */
  readonly requiredEI: number;
  /** True when every on/off live load pattern was checked (see patterns.ts). */
  readonly exhaustive: boolean;
}

interface RegionBest {
  abs: number;
  value: number;
  x: number;
  combination: number;
  active: readonly number[];
  on: readonly boolean[];
}

/** Largest |EI deflection| of every segment for each combination and pattern. */
function scan(
  prepared: PreparedMember,
  combinations: readonly FactoredCombination[],
  limit: number,
): { best: (RegionBest | null)[]; exhaustive: boolean } {
  const segments = prepared.segments;
  const best: (RegionBest | null)[] = segments.map(() => null);
  let exhaustive = true;
  combinations.forEach((combination, c) => {
    if (!prepared.present.some((p) => factorOf(combination, p) !== 0)) return;
    const active = activeUnits(prepared, combination);
    const factors = active.map((k) => factorOf(combination, prepared.units[k]!.load));
    const set = candidatePatterns(active.map((k) => prepared.units[k]!), factors, segments.length, limit);
    exhaustive &&= set.exhaustive;
    for (const on of set.patterns) {
      const s = solveChecked(patternModel(prepared, combination, active, on));
      // Slope roots, supports, load ends and member ends: every place a deflection extreme can be.
      const points = s.criticalPoints();
      for (const seg of segments) {
        for (const x of points) {
          if (x < seg.start || x > seg.end) continue;
          const v = s.deflectionEIAt(x);
          const b = best[seg.index];
          if (b === null || Math.abs(v) - b.abs > 1e-12 * Math.abs(v)) {
            best[seg.index] = { abs: Math.abs(v), value: v, x, combination: c, active, on };
          }
        }
      }
    }
  });
  return { best, exhaustive };
}

function resultOf(
  b: RegionBest | null,
  seg: MemberSegment,
  ratio: number,
  prepared: PreparedMember,
  combinations: readonly FactoredCombination[],
  ei: number | undefined,
): DeflectionResult | null {
  if (b === null) return null;
  const length = seg.end - seg.start;
  const limitLength = seg.kind === "overhang" ? 2 * length : length;
  const allowable = limitLength / ratio;
  const record = describePattern(
    b.active.map((k) => prepared.units[k]!),
    b.on,
    prepared.segments,
  );
  const deflection = ei === undefined ? null : b.value / ei;
  return {
    region: seg.label,
    segment: seg.index,
    limitLength,
    allowable,
    deflectionEI: b.value,
    deflection,
    ratio: deflection === null ? null : Math.abs(deflection) / allowable,
    requiredEI: b.abs / allowable,
    x: b.x,
    combination: combinations[b.combination]!.label,
    pattern: record.text,
    on: record.on,
  };
}

function governing(results: readonly (DeflectionResult | null)[]): DeflectionResult | null {
  let out: DeflectionResult | null = null;
  for (const r of results) if (r !== null && (out === null || r.requiredEI > out.requiredEI * (1 + 1e-12))) out = r;
  return out;
}

function positiveRatio(v: number, name: string): Result<number> {
  return Number.isFinite(v) && v > 0 ? ok(v) : fail("notPositive", `must be a finite number greater than 0; got ${v}.`, name);
}

/**
 * Live and total load deflection of one member, segment by segment, against span ratios.
 *
 * Fails (never throws) for a bad member or load (beam engine codes, message naming the case), a
 * limit ratio or EI that is not a positive number, or a bad combination list.
 * @param member - span (length), supports, unfactored loads by case (consistent units)
 * @param options - limits, EI, service combinations, patterned cases
 * @returns the governing live and total deflections (EI x deflection, and the deflection when EI
 *   is given), their allowables, the segment and pattern, and the EI both limits need
 * @example
 * // 6 m simple span, L = 3 kN/m, EI = 20,000 kN·m^2: 5wL^4/(384EI) = 2.53 mm <= 6000/360 = 16.7 mm
 * deflectionCheck({ span: 6, supports: [{ x: 0, type: "pin" }, { x: 6, type: "pin" }],
 *   loads: { L: [{ kind: "line", start: 0, end: 6, w1: 3, w2: 3 }] } }, { flexuralRigidity: 20000 });
 */
export function deflectionCheck(member: MemberCases, options: DeflectionOptions = {}): Result<DeflectionCheck> {
  const limits = options.limits ?? DEFAULT_DEFLECTION_LIMITS;
  const live = positiveRatio(limits.live, "live limit");
  if (!live.ok) return live;
  const total = positiveRatio(limits.total, "total limit");
  if (!total.ok) return total;
  const ei = options.flexuralRigidity;
  if (ei !== undefined) {
    const e = positiveRatio(ei, "EI");
    if (!e.ok) return e;
  }
  const combinations = options.combinations ?? DEFAULT_DEFLECTION_COMBINATIONS;
  for (const list of [combinations.live, combinations.total]) {
    const c = checkCombinations(list);
    if (!c.ok) return c;
  }
  const limit = options.enumerationLimit ?? ENUMERATION_LIMIT;
  if (!(Number.isInteger(limit) && limit >= 0 && limit <= 20)) return fail("invalid", `must be a whole number from 0 to 20; got ${limit}.`, "enumerationLimit");
  const preparedResult = prepareMember(member, options.patterned ?? DEFAULT_PATTERNED);
  if (!preparedResult.ok) return preparedResult;
  const prepared = preparedResult.value;
  const liveScan = scan(prepared, combinations.live, limit);
  const totalScan = scan(prepared, combinations.total, limit);
  const segments = prepared.segments.map((segment) => ({
    segment,
    live: resultOf(liveScan.best[segment.index] ?? null, segment, live.value, prepared, combinations.live, ei),
    total: resultOf(totalScan.best[segment.index] ?? null, segment, total.value, prepared, combinations.total, ei),
  }));
  const governingLive = governing(segments.map((s) => s.live));
  const governingTotal = governing(segments.map((s) => s.total));
  return ok({
    live: governingLive,
    total: governingTotal,
    segments,
    requiredEI: Math.max(governingLive?.requiredEI ?? 0, governingTotal?.requiredEI ?? 0),
    exhaustive: liveScan.exhaustive && totalScan.exhaustive,
  });
}
