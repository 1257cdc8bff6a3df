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

/** The load cases of the basic combinations. */
export type LoadCase = "D" | "L" | "Lr" | "S" | "R" | "W" | "E";

/** The load cases in argument order of COMBINE and COMBOS. */
export const LOAD_CASES: readonly LoadCase[] = ["D", "L", "Lr", "S", "R", "W", "E"];

/** One load effect per case (missing cases are 0 for the caller to fill). */
export type LoadEffects = Readonly<Record<LoadCase, number>>;

/** Strength design (Sec. 2.3) or allowable stress design (Sec. 2.4). */
export type DesignMethod = "LRFD" | "ASD";

/** Which end of the range of combined values governs. */
export type ExtremeKind = "max" | "min";

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

/** A combination list with each row's factors laid out in LOAD_CASES order, for fast evaluation. */
interface CompiledList {
  readonly rows: readonly Combination[];
  /** rows.length x 7 factors, row-major. */
  readonly factors: Float64Array;
}

function compile(rows: Combination[]): CompiledList {
  const factors = new Float64Array(rows.length * LOAD_CASES.length);
  rows.forEach((row, r) => {
    for (const t of row.terms) factors[r * LOAD_CASES.length + LOAD_CASES.indexOf(t.load)]! += t.factor;
  });
  return { rows: Object.freeze(rows), factors };
}

const STRENGTH = { plain: compile(strengthCombinations(false)), halfLive: compile(strengthCombinations(true)) };
const ALLOWABLE = compile(allowableStressCombinations());

function compiledOf(options: CombinationOptions): CompiledList {
  if (options.method === "ASD") return ALLOWABLE;
  return options.halfLive ? STRENGTH.halfLive : STRENGTH.plain;
}

/**
 * The expanded combination list of a method (same rows, in the standard's order, for any load
 * values: one row per "or" alternative and per sign of W and E).
 */
export function combinationsOf(options: CombinationOptions): readonly Combination[] {
  return compiledOf(options).rows;
}

/** The largest number of rows of any method: the fixed height of a spilled list of combinations. */
export const COMBINATION_ROWS_MAX = Math.max(STRENGTH.plain.rows.length, ALLOWABLE.rows.length);

function effectVector(effects: LoadEffects): number[] {
  return [effects.D, effects.L, effects.Lr, effects.S, effects.R, effects.W, effects.E];
}

/** Sum of factor x effect over the 7 cases, always in LOAD_CASES order (so every path rounds alike). */
function dot(factors: ArrayLike<number>, offset: number, x: readonly number[]): number {
  let v = 0;
  for (let j = 0; j < 7; j++) v += factors[offset + j]! * x[j]!;
  return v;
}

/** Value of one combination: sum of factor x load effect. */
export function combinationValue(combination: Combination, effects: LoadEffects): number {
  const factors = LOAD_CASES.map((load) => combination.terms.reduce((f, t) => (t.load === load ? f + t.factor : f), 0));
  return dot(factors, 0, effectVector(effects));
}

/**
 * Every combination of the method with its value, in the standard's order.
 * @param effects - load effect of each case, consistent units, sign as computed (W and E are applied with both signs)
 * @param options - method and the 0.5L option
 */
export function combinationValues(effects: LoadEffects, options: CombinationOptions): CombinationValue[] {
  const { rows, factors } = compiledOf(options);
  const x = effectVector(effects);
  return rows.map((c, r) => ({ ...c, value: dot(factors, r * 7, x) }));
}

/**
 * The governing combination: largest (`max`) or smallest (`min`, uplift / net tension) value.
 * Ties go to the first combination in the standard's order.
 */
export function governingCombination(effects: LoadEffects, options: CombinationOptions, extreme: ExtremeKind): CombinationValue {
  const { rows, factors } = compiledOf(options);
  const x = effectVector(effects);
  const sign = extreme === "max" ? 1 : -1;
  let best = 0;
  let bestValue = dot(factors, 0, x);
  for (let r = 1; r < rows.length; r++) {
    const v = dot(factors, r * 7, x);
    if (sign * v > sign * bestValue) {
      best = r;
      bestValue = v;
    }
  }
  return { ...rows[best]!, value: bestValue };
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
