/**
 * The governing value of every factored quantity of one member over a set of load combinations
 * and the live load patterns of ASCE/SEI 7-22 Sec. 4.3.3 (see patterns.ts): largest sagging
 * moment, most hogging moment, largest |shear|, and the largest and smallest (uplift) reaction at
 * each support, each with the combination and the pattern that produce it.
 *
 * Reactions are linear in the loads, so the extreme reaction over all patterns is exact without
 * enumeration: the fixed cases plus every unit whose factored contribution has the wanted sign.
 * Moments and shears are maxima over x of a sum, which is not linear: every candidate pattern
 * (patterns.ts) is solved as one factored member by the exact engine, and its extremes come from
 * the roots of V and q of that solution.
 *
 * Units: those of the loads (any consistent set): moments force x length, shears and reactions force.
 */
import type { BeamModel } from "../beam/types";
import { fail, ok, type Result } from "../errors";
import type { LoadCase } from "../loads/combinations";
import { checkCombinations, distinctOn, factorOf, type FactoredCombination } from "./combination-sets";
import { activeUnits, DEFAULT_PATTERNED, patternModel, prepareMember, solveChecked, type MemberCases, type PreparedMember } from "./member-cases";
import { candidatePatterns, describePattern, ENUMERATION_LIMIT, type PatternRecord } from "./patterns";
import type { MemberSegment } from "./segments";

/** Options of the envelope. */
export interface EnvelopeOptions {
  /**
   * Cases applied segment by segment (default L and Lr). Snow S and rain R are applied
   * everywhere: ASCE/SEI 7-22 treats snow on part of a roof through its own partial and
   * unbalanced loading rules (Sec. 7.5 and 7.6, recalled from memory: selected spans at the full
   * balanced load, the others at half, not on/off), and rain (Chapter 8) through the ponding
   * water depth, so an on/off pattern of S or R is not what the standard asks.
   */
  readonly patterned?: readonly LoadCase[];
  /** Most pattern units enumerated exhaustively (default {@link ENUMERATION_LIMIT}); beyond, the alternating-segment rule. */
  readonly enumerationLimit?: number;
}

/** A governing value and what produces it. */
export interface Governing {
  /** The value (force x length for moments, force for shear and reactions). */
  readonly value: number;
  /** Where it occurs along the member (length), the support position for reactions. */
  readonly x: number;
  /** Label of the governing combination. */
  readonly combination: string;
  /** Index of that combination in the list given (to rebuild the model with {@link governingModel}). */
  readonly combinationIndex: number;
  /** The pattern as a report prints it, e.g. "L on span 1". */
  readonly pattern: string;
  /** The pattern as data: the segments where each patterned case is on. */
  readonly on: PatternRecord["on"];
}

/** The governing values of one member under one combination set. */
export interface Envelope {
  /** The member's segments (spans and overhangs), as the patterns name them. */
  readonly segments: readonly MemberSegment[];
  /** Largest sagging moment (>= 0). */
  readonly momentMax: Governing;
  /** Most hogging moment (<= 0). */
  readonly momentMin: Governing;
  /** Largest shear magnitude (>= 0). */
  readonly shearMax: Governing;
  /** Largest reaction at each support (up +), in the order the supports were given. */
  readonly reactionMax: readonly Governing[];
  /** Smallest reaction at each support; negative is uplift (the support must hold the member down). */
  readonly reactionMin: readonly Governing[];
  /** Number of factored members solved for moments and shears (all combinations). */
  readonly patternsSolved: number;
  /** True when every on/off pattern was solved for every combination. */
  readonly exhaustive: boolean;
  /**
   * True when the result is the governing value over every pattern: exhaustive, or the
   * alternating-segment rule with loads of one direction per unit (patterns.ts).
   */
  readonly proven: boolean;
}

/** Running extreme that keeps the first of equal values (combination order, then pattern order). */
class Best {
  value: number;
  x = 0;
  combination = -1;
  on: readonly boolean[] = [];
  active: readonly number[] = [];
  constructor(private readonly sign: 1 | -1) {
    this.value = sign * -Infinity;
  }
  see(value: number, x: number, combination: number, active: readonly number[], on: readonly boolean[]): void {
    if (this.sign * (value - this.value) > 1e-12 * Math.abs(value)) {
      this.value = value;
      this.x = x;
      this.combination = combination;
      this.active = active;
      this.on = on;
    }
  }
}

function governingOf(best: Best, prepared: PreparedMember, combinations: readonly FactoredCombination[]): Governing {
  const units = best.active.map((k) => prepared.units[k]!);
  const record = describePattern(units, best.on, prepared.segments);
  return {
    value: best.value,
    x: best.x,
    combination: combinations[best.combination]!.label,
    combinationIndex: best.combination,
    pattern: record.text,
    on: record.on,
  };
}

/**
 * Governing factored values of one member over a combination set and the live load patterns.
 *
 * Fails (never throws) with the beam engine's codes for a bad member or load (the message names
 * the case), and for a bad combination list (argument `combinations`, with its row).
 * @param member - span (length), supports, unfactored loads by case (consistent units)
 * @param combinations - the combination set: a label and one factor per case each (see builtInCombinations)
 * @param options - patterned cases and the enumeration limit
 * @returns governing M+, M-, |V| and reactions, each with its combination and pattern
 * @example
 * // two equal 6 m spans, D = 2 and L = 3 kN/m everywhere, LRFD:
 * envelope({ span: 12, supports: [0, 6, 12].map((x) => ({ x, type: "pin" })),
 *   loads: { D: [{ kind: "line", start: 0, end: 12, w1: 2, w2: 2 }], L: [{ kind: "line", start: 0, end: 12, w1: 3, w2: 3 }] } },
 *   builtInCombinations({ method: "LRFD", halfLive: false }));
 * // reactionMax[1].value = 1.25 x (1.2 x 2 + 1.6 x 3) x 6 = 54 kN, "L on all segments"
 */
export function envelope(member: MemberCases, combinations: readonly FactoredCombination[], options: EnvelopeOptions = {}): Result<Envelope> {
  const checked = checkCombinations(combinations);
  if (!checked.ok) return checked;
  const limit = options.enumerationLimit ?? ENUMERATION_LIMIT;
  if (!(Number.isInteger(limit) && limit >= 0 && limit <= 20)) return fail("invalid", `must be a whole number from 0 to 20; got ${limit}.`, "enumerationLimit");
  const preparedResult = prepareMember(member, options.patterned ?? DEFAULT_PATTERNED);
  if (!preparedResult.ok) return preparedResult;
  const prepared = preparedResult.value;
  const supportCount = member.supports.length;
  const sagging = new Best(1);
  const hogging = new Best(-1);
  const shear = new Best(1);
  const rMax = member.supports.map(() => new Best(1));
  const rMin = member.supports.map(() => new Best(-1));
  let solved = 0;
  let exhaustive = true;
  let proven = true;
  // A combination that differs from an earlier one only in cases the member does not carry gives the same values.
  // With no load under any combination, the first one stands for all (every value is 0).
  const kept = distinctOn(combinations, prepared.present);
  const distinct = new Set(kept.length > 0 ? kept : [combinations[0]!]);
  combinations.forEach((combination, c) => {
    if (!distinct.has(combination)) return;
    const active = activeUnits(prepared, combination);
    const factors = active.map((k) => factorOf(combination, prepared.units[k]!.load));
    // Reactions: linear, so the extreme over patterns takes each unit whose contribution has the wanted sign.
    for (let i = 0; i < supportCount; i++) {
      let base = 0;
      prepared.fixed.forEach((load, f) => {
        base += factorOf(combination, load) * prepared.fixedReactions[f]![i]!;
      });
      const parts = active.map((k, a) => factors[a]! * prepared.unitReactions[k]![i]!);
      const noise = 1e-12 * Math.max(Math.abs(base), ...parts.map(Math.abs));
      const up = parts.map((p) => p > noise);
      const down = parts.map((p) => p < -noise);
      const x = member.supports[i]!.x;
      rMax[i]!.see(parts.reduce((s, p, a) => (up[a] ? s + p : s), base), x, c, active, up);
      rMin[i]!.see(parts.reduce((s, p, a) => (down[a] ? s + p : s), base), x, c, active, down);
    }
    const set = candidatePatterns(active.map((k) => prepared.units[k]!), factors, prepared.segments.length, limit);
    exhaustive &&= set.exhaustive;
    proven &&= set.proven;
    for (const on of set.patterns) {
      const s = solveChecked(patternModel(prepared, combination, active, on));
      solved++;
      const m1 = s.maxSagging();
      const m2 = s.maxHogging();
      const v = s.maxShear();
      sagging.see(m1.value, m1.x, c, active, on);
      hogging.see(m2.value, m2.x, c, active, on);
      shear.see(Math.abs(v.value), v.x, c, active, on);
    }
  });
  const g = (b: Best): Governing => governingOf(b, prepared, combinations);
  return ok({
    segments: prepared.segments,
    momentMax: g(sagging),
    momentMin: g(hogging),
    shearMax: g(shear),
    reactionMax: rMax.map(g),
    reactionMin: rMin.map(g),
    patternsSolved: solved,
    exhaustive,
    proven,
  });
}

/**
 * The factored member of a governing value (its combination and pattern), for a diagram or a
 * report that draws the governing case of the quantity picked.
 * @param member - the member as given to {@link envelope}
 * @param combinations - the same combination list
 * @param governing - one value of the envelope
 * @param options - the same options
 */
export function governingModel(member: MemberCases, combinations: readonly FactoredCombination[], governing: Governing, options: EnvelopeOptions = {}): Result<BeamModel> {
  const prepared = prepareMember(member, options.patterned ?? DEFAULT_PATTERNED);
  if (!prepared.ok) return prepared;
  const combination = combinations[governing.combinationIndex];
  if (combination === undefined) return fail("invalid", `combination ${governing.combinationIndex + 1} is not in the list.`, "combinations");
  const active = activeUnits(prepared.value, combination);
  const on = active.map((k) => {
    const u = prepared.value.units[k]!;
    return (governing.on[u.load] ?? []).includes(u.segment);
  });
  return ok(patternModel(prepared.value, combination, active, on));
}
