/**
 * Reduced roof live load of ordinary flat, pitched and curved roofs, ASCE/SEI 7-22 Sec. 4.8.2,
 * Eq. 4.8-1 (recalled from memory; verify against the standard):
 *   Lr = Lo R1 R2, 12 <= Lr <= 20 psf (0.58 <= Lr <= 0.96 kN/m^2)
 *   R1 = 1 for AT <= 200 ft^2 (18.58 m^2); 1.2 - 0.001 AT (SI: 1.2 - 0.011 AT) between;
 *        0.6 for AT >= 600 ft^2 (55.74 m^2)
 *   R2 = 1 for F <= 4; 1.2 - 0.05 F for 4 < F < 12; 0.6 for F >= 12
 *   F = rise in inches per foot (US); F = 0.12 x slope in percent (SI).
 * The reduction applies to ordinary roofs (Lo up to 20 psf); special purpose roofs (Sec. 4.8.3)
 * are reduced as floors (Sec. 4.7).
 */
import { fail, ok, type Result } from "../errors";
import { nonNegative } from "./checks";
import type { UnitSystem } from "./units";

/** Constants of Eq. 4.8-1 per unit system (recalled from memory). */
export const ROOF_LLR = {
  US: { areaFull: 200, areaLeast: 600, r1Slope: 0.001, lrMin: 12, lrMax: 20, fPerRise: 1 },
  SI: { areaFull: 18.58, areaLeast: 55.74, r1Slope: 0.011, lrMin: 0.58, lrMax: 0.96, fPerRise: 0.12 },
} as const;

/**
 * Tributary area factor R1.
 * @param atArea - tributary area A_T (ft^2 in US, m^2 in SI)
 */
export function roofR1(atArea: number, units: UnitSystem): number {
  const c = ROOF_LLR[units];
  if (atArea <= c.areaFull) return 1;
  if (atArea >= c.areaLeast) return 0.6;
  return 1.2 - c.r1Slope * atArea;
}

/**
 * Roof slope factor R2.
 * @param f - F: rise in inches per foot (US), or 0.12 x slope in percent (SI)
 */
export function roofR2(f: number): number {
  if (f <= 4) return 1;
  if (f >= 12) return 0.6;
  return 1.2 - 0.05 * f;
}

/** Inputs of the roof live load reduction. */
export interface RoofReductionInput {
  /** Unreduced roof live load Lo (psf in US, kN/m^2 in SI), 0 to 20 psf (0.96 kN/m^2). */
  readonly lo: number;
  /** Tributary area A_T (ft^2 in US, m^2 in SI), >= 0. */
  readonly at: number;
  /** Rise: inches per foot (US) or slope in percent (SI), >= 0; 0 for a flat roof. */
  readonly rise: number;
  readonly units: UnitSystem;
}

/**
 * Reduced roof live load Lr = Lo R1 R2, kept within 12..20 psf (0.58..0.96 kN/m^2) and never
 * above Lo (ASCE/SEI 7-22 Sec. 4.8.2, Eq. 4.8-1, recalled from memory).
 * @returns Lr in the units of Lo
 */
export function reducedRoofLiveLoad(input: RoofReductionInput): Result<number> {
  const c = ROOF_LLR[input.units];
  const checks = [nonNegative(input.lo, "Lo"), nonNegative(input.at, "AT"), nonNegative(input.rise, "rise")];
  const bad = checks.find((r) => !r.ok);
  if (bad && !bad.ok) return bad;
  if (input.lo > c.lrMax) {
    const unit = input.units === "US" ? "psf" : "kN/m^2";
    return fail(
      "invalid",
      `${input.lo} ${unit} is above the ${c.lrMax} ${unit} of ordinary roofs; Eq. 4.8-1 does not apply (special purpose roofs, Sec. 4.8.3, are reduced as floors with LL_REDUCE).`,
      "Lo",
    );
  }
  const f = input.rise * c.fPerRise;
  const lr = input.lo * roofR1(input.at, input.units) * roofR2(f);
  return ok(Math.min(input.lo, Math.max(lr, c.lrMin)));
}
