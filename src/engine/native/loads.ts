/**
 * Classic-function formulas for the load side of a takedown: live load reduction with its
 * limits (ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1), the basic gravity combinations (Sec. 2.3.1 /
 * 2.4.1) and their governing value, sums for column accumulation and the load balance. The
 * coefficients come from the load engine (src/engine/loads), so the hand-off formulas and the
 * add-in functions cannot drift apart.
 */
import {
  combinationsOf,
  LLR_COEFFICIENT,
  LLR_FLOOR_MULTI_LEVEL,
  LLR_FLOOR_ONE_LEVEL,
  LLR_THRESHOLD_AREA,
  type CombinationOptions,
  type ExtremeKind,
  type LoadCase,
} from "../loads";
import type { UnitSystem } from "../loads/units";
import { num } from "./refs";

/**
 * Formula text of L/Lo by ASCE/SEI 7-22 Eq. 4.7-1 with its limits: 1 below the K_LL A_T
 * threshold (400 ft^2, 37.16 m^2), otherwise 0.25 + 15/sqrt(K_LL A_T) (SI: 4.57), not above 1 and
 * not below 0.50 (one floor) or 0.40 (two or more floors).
 * @param kllAt - reference to (or parenthesised expression of) K_LL x A_T, ft^2 (US) or m^2 (SI)
 * @param floors - reference to the number of floors supported (a whole number >= 1)
 * @param units - unit system of the area
 */
export function liveReductionFactorFormula(kllAt: string, floors: string, units: UnitSystem): string {
  const least = `IF(${floors}>=2,${num(LLR_FLOOR_MULTI_LEVEL)},${num(LLR_FLOOR_ONE_LEVEL)})`;
  const raw = `0.25+${num(LLR_COEFFICIENT[units])}/SQRT(${kllAt})`;
  return `IF(${kllAt}<${num(LLR_THRESHOLD_AREA[units])},1,MIN(1,MAX(${least},${raw})))`;
}

/** One combination as a formula: its label (as the load engine writes it) and the formula text. */
export interface CombinationFormula {
  readonly label: string;
  readonly formula: string;
}

/**
 * Every basic combination of the method as a formula over the load effects given. Cases not
 * given (wind and seismic in a gravity takedown) count as zero and their terms are left out, so
 * rows that differ only by the sign of W or E give the same value, as in the add-in's list.
 * @param effects - reference (or expression) of each load case's effect present, e.g. { D: "C5", L: "D5" }
 * @param options - design method (LRFD Sec. 2.3, ASD Sec. 2.4) and the 0.5L option
 */
export function combinationFormulas(effects: Readonly<Partial<Record<LoadCase, string>>>, options: CombinationOptions): CombinationFormula[] {
  return combinationsOf(options).map((c) => {
    const terms = c.terms.filter((t) => effects[t.load] !== undefined && t.factor !== 0);
    const text = terms
      .map((t, i) => {
        const sign = t.factor < 0 ? "-" : i === 0 ? "" : "+";
        const factor = Math.abs(t.factor);
        return `${sign}${factor === 1 ? "" : `${num(factor)}*`}${effects[t.load]}`;
      })
      .join("");
    return { label: c.label, formula: text === "" ? "0" : text };
  });
}

/**
 * The governing combination value: the largest (max) or smallest (min) of the cells holding the
 * combination formulas.
 * @param cells - references (cells or ranges) of the combination values
 */
export function governingFormula(cells: readonly string[], extreme: ExtremeKind = "max"): string {
  return `${extreme === "max" ? "MAX" : "MIN"}(${cells.join(",")})`;
}

/**
 * The sum of some cells or ranges, e.g. a column's load at one level plus the column above it, or
 * every foundation reaction of a case in the load balance. An empty list sums to 0.
 * Spreadsheets limit a function to 255 arguments: longer lists are split into nested sums.
 */
export function sumFormula(refs: readonly string[]): string {
  if (refs.length === 0) return "0";
  if (refs.length <= 255) return `SUM(${refs.join(",")})`;
  const parts: string[] = [];
  for (let i = 0; i < refs.length; i += 255) parts.push(sumFormula(refs.slice(i, i + 255)));
  return sumFormula(parts);
}

/**
 * Tributary area or load of an area element: `area load x width x length` written visibly, e.g.
 * a zone's psf times a tributary width (ft) gives plf; `divisor` converts (1000 for plf -> kip/ft).
 */
export function productFormula(factors: readonly string[], divisor = 1): string {
  const body = factors.length === 0 ? "0" : factors.join("*");
  return divisor === 1 ? body : `${body}/${num(divisor)}`;
}
