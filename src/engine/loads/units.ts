/**
 * Unit systems of the load functions. Only code formulas that are not dimensionless depend on
 * them (the live load reduction area threshold and coefficient, the roof live load area breaks,
 * bounds and slope measure); everything else works in any consistent units.
 */
import { fail, ok, type Result } from "../errors";

/** `US`: areas in ft^2, area loads in psf. `SI`: areas in m^2, area loads in kN/m^2 (kPa). */
export type UnitSystem = "US" | "SI";

/** The unit system keys a user may type, in the order listed in messages. */
export const UNIT_SYSTEMS: readonly UnitSystem[] = ["US", "SI"];

/** Square metres in one square foot (exact: 0.3048^2). */
export const M2_PER_FT2 = 0.09290304;

/** Kilopascals (kN/m^2) in one pound per square foot (1 lbf = 4.4482216152605 N). */
export const KPA_PER_PSF = 4.4482216152605 / M2_PER_FT2 / 1000;

/** Pounds per foot in one kip per foot, and pounds in one kip. */
export const LB_PER_KIP = 1000;

/** Area in m^2 of an area given in ft^2. */
export function ft2ToM2(areaFt2: number): number {
  return areaFt2 * M2_PER_FT2;
}

/** Area in ft^2 of an area given in m^2. */
export function m2ToFt2(areaM2: number): number {
  return areaM2 / M2_PER_FT2;
}

/** Area load in kN/m^2 of an area load given in psf. */
export function psfToKpa(loadPsf: number): number {
  return loadPsf * KPA_PER_PSF;
}

/** Area load in psf of an area load given in kN/m^2. */
export function kpaToPsf(loadKpa: number): number {
  return loadKpa / KPA_PER_PSF;
}

/**
 * Read a `units` argument: `US` (default when blank) or `SI`, case-insensitive, surrounding
 * spaces ignored.
 * @param text - the argument as typed, or null when omitted
 * @param argument - argument name for the error message
 */
export function parseUnitSystem(text: string | null | undefined, argument = "units"): Result<UnitSystem> {
  if (text === null || text === undefined || text.trim() === "") return ok("US");
  const key = text.trim().toUpperCase();
  const found = UNIT_SYSTEMS.find((u) => u === key);
  return found
    ? ok(found)
    : fail("unknownUnits", `"${text}" is not a unit system; use one of ${UNIT_SYSTEMS.join(", ")}.`, argument);
}
