/**
 * Gravity load worksheet functions (namespace LOADPATH): tributary width, line load, ASCE/SEI 7-22
 * basic load combinations, live and roof live load reduction. Thin wrappers: arguments are
 * declared as data and checked by the shared runner (args.ts); the arithmetic is in
 * src/engine/loads. The JSDoc of each @customfunction is the help text Excel shows.
 *
 * Parameters are typed `any` so that a text or error cell reaches the runner, which names the
 * argument in its message. Return types name what the cell shows; on bad input the runner's
 * `CustomFunctions.Error` is returned in its place (Excel shows #VALUE! with the message).
 */
/* eslint-disable @typescript-eslint/no-explicit-any -- parameter types are what the metadata generator maps */
import {
  builtInSet,
  COMBINATION_TABLE_MAX_ROWS,
  evaluateCombinations,
  heavyLiveLoad,
  kllOf,
  lineLoad,
  reducedLiveLoad,
  reducedRoofLiveLoad,
  parseCombinationTable,
  setOfMethod,
  tributaryWidth,
  type CombinationMethod,
  type CombinationResult,
  type CombinationSet,
  type ExtremeKind,
  type LoadEffects,
  type UnitSystem,
} from "../engine/loads";
import { ok, type Result } from "../engine/errors";
import { arg, asHostMatrix, asHostNumber, defineArgs, runFunction, type ArgValues } from "./args";
import { padToSize, shapeOfValue, spillSize } from "./spill";

/** The unit systems; the beam functions' spellings are accepted too (kip-ft is US, kN-m is SI). */
const UNITS = { US: "US", "kip-ft": "US", SI: "SI", "kN-m": "SI" } as const;
const METHODS = { LRFD: "LRFD", ASD: "ASD", service: "service" } as const;
const EXTREMES = { max: "max", min: "min" } as const;
const YES_NO = { TRUE: "TRUE", FALSE: "FALSE", "1": "TRUE", "0": "FALSE", YES: "TRUE", NO: "FALSE" } as const;

const TRIB_ARGS = defineArgs(
  arg.optionalNumber("spacing_a", 0, { atLeast: 0 }),
  arg.optionalNumber("spacing_b", 0, { atLeast: 0 }),
  arg.optionalNumber("overhang_a", 0, { atLeast: 0 }),
  arg.optionalNumber("overhang_b", 0, { atLeast: 0 }),
);

/**
 * Tributary width of a beam or joist: half the spacing to the neighbouring member on each side.
 * At a slab edge or an opening leave that side's spacing blank (or 0): the side then contributes
 * only its overhang (slab cantilevered beyond the member, default 0). Any consistent length unit.
 * Example: interior joist at 6 ft and 7 ft: =LOADPATH.TRIB_WIDTH(6, 7) gives 6.5.
 * Edge beam with a 1.5 ft slab overhang: =LOADPATH.TRIB_WIDTH(8, "", , 1.5) gives 5.5.
 * @customfunction TRIB_WIDTH
 * @param spacing_a Spacing to the next member on side a (ft or m); blank or 0 at an edge or opening.
 * @param spacing_b Spacing to the next member on side b (ft or m); blank or 0 at an edge or opening.
 * @param [overhang_a] Slab beyond the member on side a, used only where spacing_a is blank or 0 (ft or m). Default 0.
 * @param [overhang_b] Slab beyond the member on side b, used only where spacing_b is blank or 0 (ft or m). Default 0.
 * @returns Tributary width (same length unit).
 */
export function tribWidth(spacing_a: any, spacing_b: any, overhang_a?: any, overhang_b?: any): number {
  return asHostNumber(
    runFunction(TRIB_ARGS, [spacing_a, spacing_b, overhang_a, overhang_b], (a) => tributaryWidth(a.spacing_a, a.spacing_b, a.overhang_a, a.overhang_b)),
  );
}

const LINE_ARGS = defineArgs(arg.number("area_load"), arg.number("trib_width", { atLeast: 0 }), arg.optionalNumber("extra", 0));

/**
 * Line load on a member: area load x tributary width + extra line load, in consistent units.
 * Convert in the cell: psf x ft = lb/ft (plf), divide by 1000 for kip/ft. Example: 80 psf on a 7.5 ft
 * width: =LOADPATH.LINE_LOAD(80/1000, 7.5) gives 0.6 kip/ft; with 0.05 kip/ft self weight:
 * =LOADPATH.LINE_LOAD(80/1000, 7.5, 0.05) gives 0.65. SI: kPa x m = kN/m.
 * @customfunction LINE_LOAD
 * @param area_load Load per unit area, positive downward (e.g. ksf = psf/1000, or kN/m²).
 * @param trib_width Tributary width (ft or m), not negative.
 * @param [extra] Extra line load added as is (kip/ft or kN/m), e.g. self weight or cladding. Default 0.
 * @returns Line load (kip/ft with ksf and ft; kN/m with kN/m² and m).
 */
export function lineLoadFn(area_load: any, trib_width: any, extra?: any): number {
  return asHostNumber(runFunction(LINE_ARGS, [area_load, trib_width, extra], (a) => lineLoad(a.area_load, a.trib_width, a.extra)));
}

const COMBINE_ARGS = defineArgs(
  arg.number("D"),
  arg.optionalNumber("L", 0),
  arg.optionalNumber("Lr", 0),
  arg.optionalNumber("S", 0),
  arg.optionalNumber("R", 0),
  arg.optionalNumber("W", 0),
  arg.optionalNumber("E", 0),
  arg.optionalText("method", "LRFD", METHODS),
  arg.optionalText("extreme", "max", EXTREMES),
  arg.optionalText("half_live", "FALSE", YES_NO),
  // header row + at most COMBINATION_TABLE_MAX_ROWS combinations (trailing blank rows are not counted)
  arg.optionalRange("combinations", { maxRows: COMBINATION_TABLE_MAX_ROWS + 1 }),
);

type CombineArgs = ArgValues<typeof COMBINE_ARGS>;

function effectsOf(a: CombineArgs): LoadEffects {
  return { D: a.D, L: a.L, Lr: a.Lr, S: a.S, R: a.R, W: a.W, E: a.E };
}

/**
 * The combinations of the chosen method: from the combinations range when given (a firm's own
 * table, header row first; half_live does not apply), else the built-in set.
 */
function setOf(a: CombineArgs): Result<CombinationSet> {
  const method = a.method as CombinationMethod;
  if (a.combinations === undefined) return ok(builtInSet(method, a.half_live === "TRUE"));
  const sets = parseCombinationTable(a.combinations);
  return sets.ok ? setOfMethod(sets.value, method) : sets;
}

/** Every combination of the set with its value and the governing one (the engine's one evaluator). */
function evaluated(a: CombineArgs): Result<CombinationResult> {
  const set = setOf(a);
  return set.ok ? evaluateCombinations(set.value, effectsOf(a), a.extreme as ExtremeKind) : set;
}

// Reading of W and E: the standard's wind and seismic load effects act in either direction, so every
// combination holding them is evaluated with +W and -W (+E and -E). E is the user's seismic load
// effect with Eh and Ev combined; Ev is not computed or separated (README, load functions).
/**
 * Governing value of the ASCE/SEI 7-22 basic load combinations, LRFD Sec. 2.3.1/2.3.6 (default),
 * ASD Sec. 2.4.1/2.4.5 or service (D + L level, common practice), from the load effect of each case
 * (one consistent unit, gravity positive), or of your own combinations given as a range.
 * W and E are taken with both signs, so extreme "min" gives uplift; each of Lr, S, R is tried.
 * Factors recalled from memory: verify. Example: =LOADPATH.COMBINE(12, 9, 3) gives 30.3.
 * @customfunction COMBINE
 * @param D Dead load effect (any consistent unit, e.g. kip or kip-ft).
 * @param [L] Live load effect (reduced where allowed). Default 0.
 * @param [Lr] Roof live load effect. Default 0.
 * @param [S] Snow load effect, strength level as ASCE/SEI 7-22 gives it. Default 0.
 * @param [R] Rain load effect. Default 0.
 * @param [W] Wind load effect, taken with both signs. Default 0.
 * @param [E] Seismic load effect with Eh and Ev combined (Ev is not computed here; enter |Eh| + |Ev| to cover 1.2D + Ev + Eh and 0.9D - Ev - Eh), taken with both signs. Default 0.
 * @param [method] "LRFD" (strength, Sec. 2.3, default), "ASD" (allowable stress, Sec. 2.4) or "service" (deflection and bearing, common practice).
 * @param [extreme] "max" (default) for the largest value, "min" for the smallest (uplift).
 * @param [half_live] TRUE applies 0.5L in LRFD combinations 3, 4 and 6, permitted where Lo <= 100 psf (4.79 kN/m²) except garages and public assembly. Default FALSE; ignored for ASD, service and your own combinations.
 * @param [combinations] Your own combinations instead of the built-in ones: a range with the header row Combination | Method | D | L | Lr | S | R | W | E and one combination per row (name, method LRFD, ASD or service, factors; blank = 0). The rows of the chosen method are used.
 * @returns The governing combined load effect, same unit as the inputs.
 */
export function combine(D: any, L?: any, Lr?: any, S?: any, R?: any, W?: any, E?: any, method?: any, extreme?: any, half_live?: any, combinations?: any[][]): number {
  return asHostNumber(
    runFunction(COMBINE_ARGS, [D, L, Lr, S, R, W, E, method, extreme, half_live, combinations], (a) => {
      const r = evaluated(a);
      return r.ok ? ok(r.value.governing.value) : r;
    }),
  );
}

/**
 * Every load combination with its value, for the record: spills label | value, one row per
 * combination (each "or" alternative and each sign of W and E its own row), in order. Built-in
 * ASCE/SEI 7-22 labels read "section (number) combination", e.g. "2.3.1 (2) 1.2D + 1.6L + 0.5Lr";
 * your own combinations keep your names ("(-W)" marks a row evaluated with W reversed). Spills 25
 * rows, or twice the rows of the combinations range below its header when that is more; unused rows
 * are blank. Same arguments as COMBINE (extreme is accepted and ignored). Factors recalled from memory: verify.
 * @customfunction COMBOS
 * @param D Dead load effect (any consistent unit).
 * @param [L] Live load effect. Default 0.
 * @param [Lr] Roof live load effect. Default 0.
 * @param [S] Snow load effect, strength level as ASCE/SEI 7-22 gives it. Default 0.
 * @param [R] Rain load effect. Default 0.
 * @param [W] Wind load effect, taken with both signs. Default 0.
 * @param [E] Seismic load effect (Eh with Ev), taken with both signs. Default 0.
 * @param [method] "LRFD" (default), "ASD" or "service".
 * @param [extreme] Accepted for symmetry with COMBINE; every combination is listed.
 * @param [half_live] TRUE applies 0.5L in LRFD combinations 3, 4 and 6. Default FALSE.
 * @param [combinations] Your own combinations: a range with the header row Combination | Method | D | L | Lr | S | R | W | E (see COMBINE).
 * @returns Two columns: combination label and value.
 */
export function combos(D: any, L?: any, Lr?: any, S?: any, R?: any, W?: any, E?: any, method?: any, extreme?: any, half_live?: any, combinations?: any[][]): any[][] {
  const raw = [D, L, Lr, S, R, W, E, method, extreme, half_live, combinations];
  const size = spillSize("COMBOS", raw.map(shapeOfValue))!;
  return asHostMatrix(
    runFunction(COMBINE_ARGS, raw, (a) => {
      const r = evaluated(a);
      if (!r.ok) return r;
      const rows = r.value.values.map((c): (number | string)[] => [c.label, c.value]);
      return ok(padToSize(rows, size) ?? rows);
    }),
  );
}

const LLR_ARGS = defineArgs(
  arg.number("Lo", { atLeast: 0 }),
  arg.number("KLL", { greaterThan: 0 }),
  arg.number("AT", { atLeast: 0 }),
  arg.optionalNumber("floors", 1, { atLeast: 1, integer: true }),
  arg.optionalText("units", "US", UNITS, "unknownUnits"),
);

type LlrArgs = ArgValues<typeof LLR_ARGS>;

function llrInput(a: LlrArgs): { lo: number; kll: number; at: number; floors: number; units: UnitSystem } {
  return { lo: a.Lo, kll: a.KLL, at: a.AT, floors: a.floors, units: a.units as UnitSystem };
}

/**
 * Reduced floor live load, ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1: L = Lo (0.25 + 15/sqrt(KLL AT)) in US
 * units (AT in ft²), L = Lo (0.25 + 4.57/sqrt(KLL AT)) in SI (AT in m²). No reduction while KLL AT <
 * 400 ft² (37.16 m²); L not below 0.50 Lo for a member supporting one floor, 0.40 Lo for two or
 * more; never above Lo. Not for live loads over 100 psf (4.79 kN/m²) or passenger vehicle garages
 * (use LL_HEAVY) nor assembly uses (no reduction: use Lo). The result is Lo times a factor, so Lo may
 * also be a live load in kip. Values recalled from memory: verify against the standard.
 * Example: 50 psf, interior column, 900 ft² over 3 floors: =LOADPATH.LL_REDUCE(50, 4, 900, 3) gives 25.
 * @customfunction LL_REDUCE
 * @param Lo Unreduced live load: psf (US) or kN/m² (SI), or any live load quantity (kip, kN).
 * @param KLL Live load element factor, Table 4.7-2 (see LOADPATH.KLL), e.g. 4 for an interior column.
 * @param AT Tributary area: ft² (US) or m² (SI).
 * @param [floors] Number of floors the member supports (1 or more). Default 1.
 * @param [units] "US" (ft², default; or "kip-ft") or "SI" (m²; or "kN-m"): selects the equation's coefficient and threshold.
 * @returns Reduced live load L, same unit as Lo.
 */
export function llReduce(Lo: any, KLL: any, AT: any, floors?: any, units?: any): number {
  return asHostNumber(runFunction(LLR_ARGS, [Lo, KLL, AT, floors, units], (a) => reducedLiveLoad(llrInput(a))));
}

/**
 * Live load that may not be reduced by Eq. 4.7-1: heavy live loads over 100 psf (4.79 kN/m²),
 * ASCE/SEI 7-22 Sec. 4.7.4, and passenger vehicle garages, Sec. 4.7.5. A member supporting one
 * floor takes Lo; a member supporting two or more floors may be reduced by at most 20 %, and not
 * below the value of Eq. 4.7-1: L = Lo x max(0.80, Eq. 4.7-1 factor). Same arguments as LL_REDUCE.
 * Values recalled from memory: verify against the standard.
 * Example: 150 psf storage, 3 floors, interior column, 900 ft²: =LOADPATH.LL_HEAVY(150, 4, 900, 3) gives 120.
 * @customfunction LL_HEAVY
 * @param Lo Unreduced live load: psf (US) or kN/m² (SI), or any live load quantity (kip, kN).
 * @param KLL Live load element factor, Table 4.7-2 (see LOADPATH.KLL).
 * @param AT Tributary area: ft² (US) or m² (SI).
 * @param [floors] Number of floors the member supports (1 or more). Default 1.
 * @param [units] "US" (ft², default; or "kip-ft") or "SI" (m²; or "kN-m").
 * @returns Live load L, same unit as Lo.
 */
export function llHeavy(Lo: any, KLL: any, AT: any, floors?: any, units?: any): number {
  return asHostNumber(runFunction(LLR_ARGS, [Lo, KLL, AT, floors, units], (a) => heavyLiveLoad(llrInput(a))));
}

const KLL_ARGS = defineArgs(arg.text("element"));

/**
 * Live load element factor KLL, ASCE/SEI 7-22 Table 4.7-2, by element: "interior column" 4,
 * "exterior column without cantilever slabs" 4, "edge column with cantilever slabs" 3, "corner
 * column with cantilever slabs" 2, "edge beam without cantilever slabs" 2, "interior beam" 2, "all
 * other members" 1, and in that group "edge beam with cantilever slabs", "cantilever beam",
 * "one-way slab", "two-way slab", "member without provisions for continuous shear transfer normal
 * to its span". Case, extra spaces, hyphens and plurals do not matter. Values recalled from memory:
 * verify against the standard. Example: =LOADPATH.KLL("interior column") gives 4.
 * @customfunction KLL
 * @param element Element description, e.g. "interior column" or "edge beam without cantilever slabs".
 * @returns KLL (dimensionless).
 */
export function kll(element: any): number {
  return asHostNumber(runFunction(KLL_ARGS, [element], (a): Result<number> => kllOf(a.element)));
}

const ROOF_ARGS = defineArgs(
  arg.number("Lo", { atLeast: 0 }),
  arg.number("AT", { atLeast: 0 }),
  arg.optionalNumber("rise", 0, { atLeast: 0 }),
  arg.optionalText("units", "US", UNITS, "unknownUnits"),
);

/**
 * Reduced roof live load of ordinary flat, pitched and curved roofs, ASCE/SEI 7-22 Sec. 4.8.2,
 * Eq. 4.8-1: Lr = Lo R1 R2, kept within 12 to 20 psf (0.58 to 0.96 kN/m²) and never above Lo.
 * R1 = 1 up to AT = 200 ft² (18.58 m²), 1.2 - 0.001 AT (SI 1.2 - 0.011 AT) between, 0.6 from 600 ft²
 * (55.74 m²). R2 = 1 for F <= 4, 1.2 - 0.05 F between, 0.6 for F >= 12, where F = rise in inches per
 * foot (US) or 0.12 x slope in percent (SI). Lo above 20 psf (special purpose roofs) is an error:
 * reduce those with LL_REDUCE. Values recalled from memory: verify against the standard.
 * Example: =LOADPATH.ROOF_LL_REDUCE(20, 400) gives 16.
 * @customfunction ROOF_LL_REDUCE
 * @param Lo Unreduced roof live load: psf (US, usually 20) or kN/m² (SI, usually 0.96).
 * @param AT Tributary area: ft² (US) or m² (SI).
 * @param [rise] Roof slope: inches of rise per foot (US) or slope in percent (SI). Default 0 (flat).
 * @param [units] "US" (default; or "kip-ft") or "SI" (or "kN-m").
 * @returns Reduced roof live load Lr, same unit as Lo.
 */
export function roofLlReduce(Lo: any, AT: any, rise?: any, units?: any): number {
  return asHostNumber(
    runFunction(ROOF_ARGS, [Lo, AT, rise, units], (a) => reducedRoofLiveLoad({ lo: a.Lo, at: a.AT, rise: a.rise, units: a.units as UnitSystem })),
  );
}
