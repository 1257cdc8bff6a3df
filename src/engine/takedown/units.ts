/**
 * Units of the input columns and the check of a header's unit against the chosen system.
 * US inputs are in feet and pounds (ft, psf, plf, lb) and results in kips (kip, kip/ft, kip-ft);
 * SI inputs and results are in metres and kilonewtons (m, kPa, kN/m, kN, kN·m).
 */
import type { UnitSystem } from "./types";

/** What a column holds, for its unit. */
export type Quantity = "none" | "length" | "areaLoad" | "lineLoad" | "force" | "lineOrForce" | "modulus" | "inertia";

/** Accepted unit spellings after {@link normaliseUnit}, per quantity and system. */
const ACCEPTED: Readonly<Record<Exclude<Quantity, "none" | "lineOrForce">, Readonly<Record<UnitSystem, readonly string[]>>>> = {
  length: { US: ["ft", "feet", "foot"], SI: ["m", "metre", "meter", "metres", "meters"] },
  areaLoad: { US: ["psf", "lb/ft2", "lbf/ft2", "lb/sf", "#/sf", "#/ft2"], SI: ["kpa", "kn/m2"] },
  lineLoad: { US: ["plf", "lb/ft", "lbf/ft", "#/ft"], SI: ["kn/m"] },
  force: { US: ["lb", "lbs", "lbf", "#"], SI: ["kn"] },
  modulus: { US: ["ksi"], SI: ["mpa", "n/mm2"] },
  inertia: { US: ["in4", "inch4"], SI: ["mm4"] },
};

/** Unit each quantity is read in, as shown to the user. */
export const UNIT_NAMES: Readonly<Record<Exclude<Quantity, "none">, Readonly<Record<UnitSystem, string>>>> = {
  length: { US: "ft", SI: "m" },
  areaLoad: { US: "psf", SI: "kPa" },
  lineLoad: { US: "plf", SI: "kN/m" },
  force: { US: "lb", SI: "kN" },
  lineOrForce: { US: "plf (line) or lb (point)", SI: "kN/m (line) or kN (point)" },
  modulus: { US: "ksi", SI: "MPa" },
  inertia: { US: "in⁴", SI: "mm⁴" },
};

/** Units of the results written to the generated sheet. */
export const RESULT_UNITS: Readonly<Record<UnitSystem, { length: string; area: string; line: string; force: string; moment: string }>> = {
  US: { length: "ft", area: "ft²", line: "kip/ft", force: "kip", moment: "kip-ft" },
  SI: { length: "m", area: "m²", line: "kN/m", force: "kN", moment: "kN·m" },
};

/** A unit as typed -> the form compared: lower case, no spaces, ² and ^2 as 2. */
export function normaliseUnit(unit: string): string {
  return unit
    .toLowerCase()
    .replace(/\s+/g, "")
    .replace(/²/g, "2")
    .replace(/⁴/g, "4")
    .replace(/\^([24])/g, "$1");
}

function accepts(quantity: Exclude<Quantity, "none" | "lineOrForce">, units: UnitSystem, unit: string): boolean {
  return ACCEPTED[quantity][units].includes(unit);
}

/**
 * Whether a header's unit suits a column in the chosen system.
 * @param quantity - what the column holds ("none": any unit or none is accepted)
 * @param units - the takedown's unit system
 * @param unit - the text in the header's parentheses
 * @returns true when the unit is one the column is read in
 */
export function unitFits(quantity: Quantity, units: UnitSystem, unit: string): boolean {
  if (quantity === "none") return true;
  if (quantity !== "lineOrForce") return accepts(quantity, units, normaliseUnit(unit));
  // "plf or lb", "plf, lb", "kN/m ; kN": every word must be a line load or force unit of the system.
  const words = unit.split(/,|;|\s+or\s+|\s+\/\s+/i).map(normaliseUnit).filter((w) => w !== "");
  return words.length > 0 && words.every((w) => accepts("lineLoad", units, w) || accepts("force", units, w));
}

/**
 * Units recognised in a header without being read by either system (kips, inches, millimetres,
 * stresses): a header "Load (kip)" is a load in kip, hence a unit mismatch, not a header named
 * "load (kip)".
 */
const OTHER_UNITS: readonly string[] = ["kip", "kips", "k", "klf", "kip/ft", "k/ft", "ksf", "kip/ft2", "kips/ft", "in", "inch", "inches", "mm", "cm", "km", "n", "n/m", "n/m2", "pa", "psi", "ksi", "mpa", "gpa", "kn/mm", "kg", "kg/m", "kg/m2", "lb/in", "pli"];

/**
 * Whether the text in a header's parentheses (or a units-row cell) is a unit the tool knows: any
 * spelling of a length, area load, line load or force of either system, a "line or point" pair
 * ("plf or lb"), or one of the other units it recognises (kip, in, mm, ...).
 * @param unit - the text as typed, without its brackets
 */
export function isKnownUnit(unit: string): boolean {
  const n = normaliseUnit(unit);
  if (n === "") return false;
  if (OTHER_UNITS.includes(n)) return true;
  const systems: readonly UnitSystem[] = ["US", "SI"];
  return systems.some((s) => (["length", "areaLoad", "lineLoad", "force", "lineOrForce", "modulus", "inertia"] as const).some((q) => unitFits(q, s, unit)));
}
