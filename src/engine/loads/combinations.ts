/**
 * Basic load combinations of ASCE/SEI 7-22: strength design (LRFD) Sec. 2.3.1 and 2.3.6, allowable
 * stress design (ASD) Sec. 2.4.1 and 2.4.5.
 *
 * The combination texts below were recalled from memory (the standard could not be consulted
 * while writing this); every one is marked so and must be verified against the standard.
 *
 * Reading of the inputs: every argument is a load effect (an axial force, a reaction, a
 * moment...) of one load case, in any consistent units, with its own sign. Wind W and seismic E
 * act in either direction: every combination that contains them is evaluated with +W and -W
 * (+E and -E), so `min` finds the uplift / net tension case. "(Lr or S or R)" is expanded into
 * one row per alternative, so the record shows each. E is the seismic load effect as the user
 * computed it (horizontal and vertical effects together); Ev is not computed or separated here.
 * Snow S is the strength-level snow load effect of ASCE/SEI 7-22 (Chapter 7), hence the factors
 * 1.0, 0.3 and 0.15 in strength design and 0.7 in allowable stress design (recalled from memory).
 */
import { fail, ok, type Result } from "../errors";
import { finite, normaliseKey } from "./checks";
import {
  combinationSetValues,
  expandedRows,
  freezeSet,
  governingIndex,
  LOAD_CASES,
  SERVICE_SET,
  type CombinationMethod,
  type CombinationRow,
  type CombinationSet,
  type ExtremeKind,
  type LoadCase,
  type LoadEffects,
} from "./combination-sets";

export { LOAD_CASES, type ExtremeKind, type LoadCase, type LoadEffects } from "./combination-sets";

/** Strength design (Sec. 2.3) or allowable stress design (Sec. 2.4). */
export type DesignMethod = "LRFD" | "ASD";

export const DESIGN_METHODS: readonly DesignMethod[] = ["LRFD", "ASD"];
export const EXTREME_KINDS: readonly ExtremeKind[] = ["max", "min"];

/** One factored load case inside a combination; `text` is how the standard writes it, unsigned. */
export interface CombinationTerm {
  readonly load: LoadCase;
  readonly factor: number;
  readonly text: string;
}

/** One expanded combination (one choice of each "or" and of each sign of W and E). */
export interface Combination {
  /** Section of ASCE/SEI 7-22, e.g. "2.3.1". */
  readonly section: string;
  /** Combination number within the standard's list. */
  readonly number: number;
  /** e.g. "2.3.1 (3) 1.2D + 1.6S - 0.5W". */
  readonly label: string;
  readonly terms: readonly CombinationTerm[];
}

/** A combination and its value for a set of load effects. */
export interface CombinationValue extends Combination {
  readonly value: number;
}

/** Options of the combination set. */
export interface CombinationOptions {
  readonly method: DesignMethod;
  /**
   * Apply the 0.5 factor on L permitted in LRFD combinations 3, 4 and 6 where Lo <= 100 psf
   * (4.79 kN/m^2), except garages and places of public assembly. Ignored for ASD.
   */
  readonly halfLive: boolean;
}

type Alternatives = readonly (readonly CombinationTerm[])[];

function term(load: LoadCase, factor: number, text?: string): CombinationTerm {
  return { load, factor, text: text ?? (factor === 1 ? load : `${factor}${load}`) };
}

/** A term that stands alone (one alternative). */
function only(...terms: CombinationTerm[]): Alternatives {
  return [terms];
}

/**
 * "(factor Lr or snowFactor S or factor R)": one alternative per roof load case. ASCE/SEI 7-22
 * gives snow at strength level, so S carries its own factor (1.0, 0.3, 0.15 in strength design;
 * 0.7 in allowable stress design) where Lr and R keep the factors of earlier editions.
 */
function roofOr(factor: number, snowFactor: number, snowText?: string): Alternatives {
  return (["Lr", "S", "R"] as const).map((load) => [load === "S" ? term("S", snowFactor, snowText) : term(load, factor)]);
}

/** A load effect that acts in either direction: +t and -t. */
function eitherSign(t: CombinationTerm): Alternatives {
  return [[t], [{ ...t, factor: -t.factor }]];
}

function labelOf(section: string, number: number, terms: readonly CombinationTerm[]): string {
  const body = terms
    .map((t, i) => (i === 0 ? (t.factor < 0 ? "-" : "") + t.text : `${t.factor < 0 ? " - " : " + "}${t.text}`))
    .join("");
  return `${section} (${number}) ${body}`;
}

/** Every choice of one alternative from each group, in order (first group varies slowest). */
function expand(section: string, number: number, groups: readonly Alternatives[]): Combination[] {
  let partial: CombinationTerm[][] = [[]];
  for (const group of groups) partial = partial.flatMap((terms) => group.map((alt) => [...terms, ...alt]));
  return partial.map((terms) => ({ section, number, label: labelOf(section, number, terms), terms }));
}

/** Strength design combinations (LRFD). */
function strengthCombinations(halfLive: boolean): Combination[] {
  const fL = halfLive ? 0.5 : 1;
  return [
    // ASCE/SEI 7-22 Sec. 2.3.1, combination 1 (recalled from memory; verify against the standard): 1.4D
    ...expand("2.3.1", 1, [only(term("D", 1.4))]),
    // ASCE/SEI 7-22 Sec. 2.3.1, combination 2 (recalled from memory; verify against the standard):
    // 1.2D + 1.6L + (0.5Lr or 0.3S or 0.5R)
    ...expand("2.3.1", 2, [only(term("D", 1.2)), only(term("L", 1.6)), roofOr(0.5, 0.3)]),
    // ASCE/SEI 7-22 Sec. 2.3.1, combination 3 (recalled from memory; verify against the standard):
    // 1.2D + (1.6Lr or 1.0S or 1.6R) + (L or 0.5W); 0.5L permitted (Sec. 2.3.1 exception, recalled)
    ...expand("2.3.1", 3, [only(term("D", 1.2)), roofOr(1.6, 1, "1.0S"), [[term("L", fL)], ...eitherSign(term("W", 0.5))]]),
    // ASCE/SEI 7-22 Sec. 2.3.1, combination 4 (recalled from memory; verify against the standard):
    // 1.2D + 1.0W + L + (0.5Lr or 0.3S or 0.5R)
    ...expand("2.3.1", 4, [only(term("D", 1.2)), eitherSign(term("W", 1, "1.0W")), only(term("L", fL)), roofOr(0.5, 0.3)]),
    // ASCE/SEI 7-22 Sec. 2.3.1, combination 5 (recalled from memory; verify against the standard): 0.9D + 1.0W
    ...expand("2.3.1", 5, [only(term("D", 0.9)), eitherSign(term("W", 1, "1.0W"))]),
    // ASCE/SEI 7-22 Sec. 2.3.6, combination 6 (recalled from memory; verify against the standard):
    // 1.2D + Ev + Eh + L + 0.15S, with E = the seismic load effect as entered, both signs
    ...expand("2.3.6", 6, [only(term("D", 1.2)), eitherSign(term("E", 1)), only(term("L", fL)), only(term("S", 0.15))]),
    // ASCE/SEI 7-22 Sec. 2.3.6, combination 7 (recalled from memory; verify against the standard):
    // 0.9D - Ev + Eh, with E = the seismic load effect as entered, both signs
    ...expand("2.3.6", 7, [only(term("D", 0.9)), eitherSign(term("E", 1))]),
  ];
}

/** Allowable stress design combinations (ASD). */
function allowableStressCombinations(): Combination[] {
  return [
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 1 (recalled from memory; verify against the standard): D
    ...expand("2.4.1", 1, [only(term("D", 1))]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 2 (recalled from memory; verify against the standard): D + L
    ...expand("2.4.1", 2, [only(term("D", 1)), only(term("L", 1))]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 3 (recalled from memory; verify against the standard): D + (Lr or 0.7S or R)
    ...expand("2.4.1", 3, [only(term("D", 1)), roofOr(1, 0.7)]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 4 (recalled from memory; verify against the standard):
    // D + 0.75L + 0.75(Lr or 0.7S or R)
    ...expand("2.4.1", 4, [only(term("D", 1)), only(term("L", 0.75)), roofOr(0.75, 0.75 * 0.7, "0.75(0.7S)")]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 5 (recalled from memory; verify against the standard): D + 0.6W
    ...expand("2.4.1", 5, [only(term("D", 1)), eitherSign(term("W", 0.6))]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 6 (recalled from memory; verify against the standard):
    // D + 0.75L + 0.75(0.6W) + 0.75(Lr or 0.7S or R)
    ...expand("2.4.1", 6, [
      only(term("D", 1)),
      only(term("L", 0.75)),
      eitherSign(term("W", 0.75 * 0.6, "0.75(0.6W)")),
      roofOr(0.75, 0.75 * 0.7, "0.75(0.7S)"),
    ]),
    // ASCE/SEI 7-22 Sec. 2.4.1, combination 7 (recalled from memory; verify against the standard): 0.6D + 0.6W
    ...expand("2.4.1", 7, [only(term("D", 0.6)), eitherSign(term("W", 0.6))]),
    // ASCE/SEI 7-22 Sec. 2.4.5, combination 8 (recalled from memory; verify against the standard):
    // 1.0D + 0.7Ev + 0.7Eh, with E = the seismic load effect as entered, both signs
    ...expand("2.4.5", 8, [only(term("D", 1, "1.0D")), eitherSign(term("E", 0.7))]),
    // ASCE/SEI 7-22 Sec. 2.4.5, combination 9 (recalled from memory; verify against the standard):
    // 1.0D + 0.525Ev + 0.525Eh + 0.75L + 0.75(0.7S)
    ...expand("2.4.5", 9, [
      only(term("D", 1, "1.0D")),
      eitherSign(term("E", 0.525)),
      only(term("L", 0.75)),
      only(term("S", 0.75 * 0.7, "0.75(0.7S)")),
    ]),
    // ASCE/SEI 7-22 Sec. 2.4.5, combination 10 (recalled from memory; verify against the standard):
    // 0.6D - 0.7Ev + 0.7Eh, with E = the seismic load effect as entered, both signs
    ...expand("2.4.5", 10, [only(term("D", 0.6)), eitherSign(term("E", 0.7))]),
  ];
}

/** A combination of the standard as a row of a combination set: its label, section and factors. */
function rowOf(c: Combination): CombinationRow {
  const factors: Partial<Record<LoadCase, number>> = {};
  for (const t of c.terms) factors[t.load] = (factors[t.load] ?? 0) + t.factor;
  return { label: c.label, source: `ASCE/SEI 7-22 Sec. ${c.section}, combination ${c.number} (recalled from memory; verify against the standard)`, factors };
}

/** The standard's combinations of a method and the same as a combination set (rows in the same order). */
interface BuiltIn {
  readonly combinations: readonly Combination[];
  readonly set: CombinationSet;
}

function builtIn(name: string, method: DesignMethod, combinations: Combination[]): BuiltIn {
  return { combinations: Object.freeze(combinations), set: freezeSet({ name, method, rows: combinations.map(rowOf) }) };
}

const STRENGTH = {
  plain: builtIn("ASCE/SEI 7-22 LRFD", "LRFD", strengthCombinations(false)),
  halfLive: builtIn("ASCE/SEI 7-22 LRFD, 0.5L", "LRFD", strengthCombinations(true)),
};
const ALLOWABLE = builtIn("ASCE/SEI 7-22 ASD", "ASD", allowableStressCombinations());

function builtInOf(options: CombinationOptions): BuiltIn {
  if (options.method === "ASD") return ALLOWABLE;
  return options.halfLive ? STRENGTH.halfLive : STRENGTH.plain;
}

/**
 * A built-in combination set as data (label, source and one factor per case each): ASCE/SEI 7-22
 * LRFD (Sec. 2.3.1, 2.3.6) or ASD (Sec. 2.4.1, 2.4.5), recalled from memory, one row per "or"
 * alternative and per sign of W and E, in the standard's order; or the service set (common
 * practice, see SERVICE_ROWS in combination-sets.ts).
 * @param method - LRFD, ASD or service
 * @param halfLive - LRFD only: the 0.5L permitted in combinations 3, 4 and 6 (ignored otherwise)
 */
export function builtInSet(method: CombinationMethod, halfLive = false): CombinationSet {
  return method === "service" ? SERVICE_SET : builtInOf({ method, halfLive }).set;
}

/**
 * The expanded combination list of a method (same rows, in the standard's order, for any load
 * values: one row per "or" alternative and per sign of W and E).
 */
export function combinationsOf(options: CombinationOptions): readonly Combination[] {
  return builtInOf(options).combinations;
}

/** The largest number of rows of any built-in set: the spill height of COMBOS without a combinations range. */
export const COMBINATION_ROWS_MAX = Math.max(
  expandedRows(STRENGTH.plain.set).length,
  expandedRows(STRENGTH.halfLive.set).length,
  expandedRows(ALLOWABLE.set).length,
  expandedRows(SERVICE_SET).length,
);

/** Value of one combination: sum of factor x load effect, in LOAD_CASES order as the evaluator sums. */
export function combinationValue(combination: Combination, effects: LoadEffects): number {
  const row = rowOf(combination);
  return LOAD_CASES.reduce((v, c) => v + (row.factors[c] ?? 0) * effects[c], 0);
}

/**
 * Every combination of the method with its value, in the standard's order (the evaluator of
 * combination-sets.ts on the built-in set; the built-in sets list both signs of W and E, so the
 * rows are those of {@link combinationsOf}).
 * @param effects - load effect of each case, consistent units, sign as computed (W and E are applied with both signs)
 * @param options - method and the 0.5L option
 */
export function combinationValues(effects: LoadEffects, options: CombinationOptions): CombinationValue[] {
  const { combinations, set } = builtInOf(options);
  const values = combinationSetValues(set, effects);
  return combinations.map((c, r) => ({ ...c, value: values[r]!.value }));
}

/**
 * The governing combination: largest (`max`) or smallest (`min`, uplift / net tension) value.
 * Ties go to the first combination in the standard's order.
 */
export function governingCombination(effects: LoadEffects, options: CombinationOptions, extreme: ExtremeKind): CombinationValue {
  const { combinations, set } = builtInOf(options);
  const g = governingIndex(set, effects, extreme);
  return { ...combinations[g.index]!, value: g.value };
}

/** Check that every load effect is a finite number (error names the case's argument). */
export function checkLoadEffects(effects: LoadEffects): Result<LoadEffects> {
  for (const load of LOAD_CASES) {
    const f = finite(effects[load], load);
    if (!f.ok) return f;
  }
  return ok(effects);
}

/** Read a `method` argument: `LRFD` (default when blank) or `ASD`, case-insensitive. */
export function parseMethod(text: string | null | undefined): Result<DesignMethod> {
  if (text === null || text === undefined || text.trim() === "") return ok("LRFD");
  const key = normaliseKey(text).toUpperCase();
  const found = DESIGN_METHODS.find((m) => m === key);
  return found ? ok(found) : fail("unknownKey", `"${text}" is not a design method; use one of ${DESIGN_METHODS.join(", ")}.`, "method");
}

/** Read an `extreme` argument: `max` (default when blank) or `min`, case-insensitive. */
export function parseExtreme(text: string | null | undefined): Result<ExtremeKind> {
  if (text === null || text === undefined || text.trim() === "") return ok("max");
  const key = normaliseKey(text);
  const found = EXTREME_KINDS.find((m) => m === key);
  return found ? ok(found) : fail("unknownKey", `"${text}" is not an extreme; use one of ${EXTREME_KINDS.join(", ")}.`, "extreme");
}
