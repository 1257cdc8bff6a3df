/**
 * The report's fixed wording: the caution, the code editions and the assumptions, stated as
 * what the takedown engine actually does (src/engine/takedown, src/engine/beam, src/engine/loads).
 */
import { LLR_THRESHOLD_AREA } from "../engine/loads/live-reduction";
import type { UnitSystem } from "../engine/takedown/types";
import { RESULT_UNITS } from "../engine/takedown/units";

/** The caution at the top and the bottom of every report (DEVELOPERS.md, Rules every change keeps). */
export const REPORT_CAUTION =
  "Caution: this report is a calculation aid. Every result needs review by a qualified (licensed) engineer, who remains responsible for the design. Code provisions apply only where the local jurisdiction adopts them; local codes and amendments govern.";

/** Code editions and methods used, as listed in the title block. */
export const CODE_EDITIONS: readonly string[] = [
  "ASCE/SEI 7-22: load combinations (Sec. 2.3.1, LRFD), partial (pattern) loading of live load (Sec. 4.3.3), live load reduction (Sec. 4.7, Eq. 4.7-1, Table 4.7-2)",
  "Beam formulas: exact Euler–Bernoulli analysis (piecewise closed-form solution of each member)",
];

/** Where each kind of result comes from, as printed in the Source column of the tables. */
export const SOURCES = {
  reaction: "Exact piecewise beam analysis (Euler–Bernoulli), pins at the supports",
  shear: "Exact piecewise beam analysis: largest |V| over the member",
  moment: "Exact piecewise beam analysis: at V = 0 (exact roots), not sampled",
  hogging: "Exact piecewise beam analysis (computed for this report from the same loads)",
  areaT: "Reaction of 1 per unit area on reducible zones, carried down the load path",
  kll: "ASCE/SEI 7-22 Table 4.7-2 (KLL column, or the default of the element)",
  llr: "ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1 with its limits",
  combination: "ASCE/SEI 7-22 Sec. 2.3.1 (LRFD), solved exactly with the factored loads",
  column: "Sum of the reactions delivered to the column and of the column above",
  reducedLive: "ASCE/SEI 7-22 Sec. 4.7: non-reducible live load + factor × reducible live load",
  governing: "ASCE/SEI 7-22 Sec. 2.3.1 (LRFD), largest of the gravity combinations",
  pattern: "ASCE/SEI 7-22 Sec. 4.3.3 (partial loading): L and Lr on or off span by span",
} as const;

/**
 * The assumptions and methods of the takedown, as a list of sentences.
 * @param units - the takedown's unit system (for the units and the reduction threshold)
 */
export function assumptions(units: UnitSystem): string[] {
  const u = RESULT_UNITS[units];
  const inputs = units === "US" ? "ft, psf, plf and lb (psf × ft = plf; /1000 = kip/ft)" : "m, kPa, kN/m and kN (kPa × m = kN/m)";
  const threshold = `${LLR_THRESHOLD_AREA[units]} ${u.area}`;
  return [
    "Gravity loads only: dead D, live L, roof live Lr, snow S and rain R as entered in the Zones, Members and Loads tables. No wind, seismic or other lateral loads. Unfactored results per case have each case on the whole member; the governing factored values of beams apply live load L and roof live load Lr span by span (pattern loading, ASCE/SEI 7-22 Sec. 4.3.3), while D, S and R act everywhere.",
    "Every beam, girder and joist is a single member on two pinned supports (no moment at its ends), at its ends or where the table gives overhangs; continuity over supports is not modelled. Columns carry axial load only; eccentricities are not considered.",
    "Area loads become line loads: zone area load × tributary width as entered in the Trib column, plus the extra full-length line loads wD, wL… of the member; rows of the Loads table add partial area loads, line loads and point loads where entered.",
    "Each end reaction of a member is applied to its support as a point load at the position entered (Start at / End at); a column receives the reactions delivered to it and passes its cumulative load to the column below or the foundation.",
    "Reactions, shears and moments of each member and load case come from the exact piecewise closed-form solution of the beam (Euler–Bernoulli); largest values are found where V = 0 by exact root finding, never by sampling.",
    "Tributary area A_T for live load reduction: the reactions of a load of 1 per unit area on reducible zones, carried down the same load path.",
    `Live load reduction per ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1, with K_LL from the KLL column or, where blank, Table 4.7-2 (interior beam 2, interior column 4); no reduction where K_LL·A_T < ${threshold}; at least 0.50 for members supporting one floor and 0.40 for two or more floors. Floors supported by a column: the levels of its stack where floor live load arrives. Only the area live load of zones marked reducible is reduced: zones marked not reducible, wL line loads and live loads of the Loads table are not, nor is roof live load.`,
    "Factored loads: the basic LRFD combinations of ASCE/SEI 7-22 Sec. 2.3.1 without wind or seismic terms, without the 0.5L option. Columns: the governing combination of the cumulative loads with the reduced live load. Beams: every combination (with 2.3.1 (5) as 0.9D, no wind load being present) and every on/off pattern of L and Lr over the member's spans and overhangs, of the member's own loads with its reducible live load reduced by its factor, each solved exactly; each factored quantity (M+, M−, |V|, each reaction's largest and smallest value) is reported with its own governing combination and pattern, a negative least reaction being uplift.",
    "Self weight is included only as entered (wD of the member).",
    `Units ${units}: inputs in ${inputs}; results in ${u.length}, ${u.line}, ${u.force}, ${u.moment}, ${u.area}. Gravity loads down +, reactions up +, sagging moment +; positions from each member's start end.`,
  ];
}
