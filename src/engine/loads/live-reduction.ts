/**
 * Reduction of uniformly distributed floor live loads, ASCE/SEI 7-22 Sec. 4.7 (section numbers and
 * values recalled from memory; verify against the standard):
 *   Sec. 4.7.3, Eq. 4.7-1: L = Lo (0.25 + 15 / sqrt(KLL AT))      US: AT in ft^2
 *                          L = Lo (0.25 + 4.57 / sqrt(KLL AT))    SI: AT in m^2
 *   permitted only where KLL AT >= 400 ft^2 (37.16 m^2); L >= 0.50 Lo for members supporting one
 *   floor, L >= 0.40 Lo for members supporting two or more floors; L never above Lo.
 *   Sec. 4.7.4 / 4.7.5: heavy live loads (> 100 psf, 4.79 kN/m^2) and passenger vehicle garages
 *   are not reduced, except by at most 20 % for members supporting two or more floors (and not
 *   below the Eq. 4.7-1 value).
 * The result is linear in Lo, so Lo may be an area load (psf, kN/m^2) or any live load effect
 * (a column's accumulated live load in kip): the units argument only selects the Eq. 4.7-1
 * coefficient and area threshold, i.e. the unit of AT.
 */
import { ok, type Result } from "../errors";
import { count, nonNegative, positive } from "./checks";
import type { UnitSystem } from "./units";

/** Least K_LL A_T for which Eq. 4.7-1 applies (ft^2 in US, m^2 in SI; recalled from memory). */
export const LLR_THRESHOLD_AREA: Readonly<Record<UnitSystem, number>> = { US: 400, SI: 37.16 };

/** Coefficient of 1/sqrt(K_LL A_T) in Eq. 4.7-1 (US: ft, SI: m; recalled from memory). */
export const LLR_COEFFICIENT: Readonly<Record<UnitSystem, number>> = { US: 15, SI: 4.57 };

/** Least L/Lo for members supporting one floor (Sec. 4.7.3, recalled from memory). */
export const LLR_FLOOR_ONE_LEVEL = 0.5;

/** Least L/Lo for members supporting two or more floors (Sec. 4.7.3, recalled from memory). */
export const LLR_FLOOR_MULTI_LEVEL = 0.4;

/** Least L/Lo for heavy live loads and garages on members supporting two or more floors (Sec. 4.7.4/4.7.5, recalled). */
export const LLR_FLOOR_HEAVY = 0.8;

/**
 * L/Lo of Eq. 4.7-1 with its limits (pure arithmetic, inputs assumed checked).
 * @param kllAt - K_LL x A_T (ft^2 in US, m^2 in SI)
 * @param floors - number of floors supported by the member (1 or more)
 * @param units - unit system of kllAt
 * @returns a factor between 0.40 (or 0.50) and 1
 */
export function liveReductionFactor(kllAt: number, floors: number, units: UnitSystem): number {
  if (kllAt < LLR_THRESHOLD_AREA[units]) return 1;
  const raw = 0.25 + LLR_COEFFICIENT[units] / Math.sqrt(kllAt);
  const least = floors >= 2 ? LLR_FLOOR_MULTI_LEVEL : LLR_FLOOR_ONE_LEVEL;
  return Math.min(1, Math.max(least, raw));
}

/** Checked inputs of the live load reduction functions. */
export interface LiveReductionInput {
  /** Unreduced live load Lo (psf, kN/m^2, or any live load effect), >= 0. */
  readonly lo: number;
  /** Live load element factor K_LL (Table 4.7-2), > 0. */
  readonly kll: number;
  /** Tributary area A_T (ft^2 in US, m^2 in SI), >= 0. */
  readonly at: number;
  /** Floors supported by the member, whole number >= 1. */
  readonly floors: number;
  readonly units: UnitSystem;
}

function check(input: LiveReductionInput): Result<LiveReductionInput> {
  const checks = [
    nonNegative(input.lo, "Lo"),
    positive(input.kll, "KLL"),
    nonNegative(input.at, "AT"),
    count(input.floors, "floors"),
  ];
  const bad = checks.find((c) => !c.ok);
  return bad && !bad.ok ? bad : ok(input);
}

/**
 * Reduced floor live load L by ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1, with the 0.50/0.40 limits and
 * the K_LL A_T threshold. Not for heavy live loads, garages or assembly uses (see heavyLiveLoad).
 * @returns L in the units of Lo
 */
export function reducedLiveLoad(input: LiveReductionInput): Result<number> {
  const c = check(input);
  if (!c.ok) return c;
  return ok(input.lo * liveReductionFactor(input.kll * input.at, input.floors, input.units));
}

/**
 * Live load of a heavy live load (> 100 psf, 4.79 kN/m^2; Sec. 4.7.4) or a passenger vehicle
 * garage (Sec. 4.7.5): Lo for a member supporting one floor; for two or more floors a reduction
 * of at most 20 %, and not below the value of Eq. 4.7-1: Lo x max(0.80, Eq. 4.7-1 factor).
 * @returns L in the units of Lo
 */
export function heavyLiveLoad(input: LiveReductionInput): Result<number> {
  const c = check(input);
  if (!c.ok) return c;
  if (input.floors < 2) return ok(input.lo);
  const factor = Math.max(LLR_FLOOR_HEAVY, liveReductionFactor(input.kll * input.at, input.floors, input.units));
  return ok(input.lo * factor);
}
