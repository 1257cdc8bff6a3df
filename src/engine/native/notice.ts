/**
 * The notice sheet of a hand-off workbook: how it was generated, its units, the code editions
 * its formulas follow, the caution, and the results that are values rather than live formulas.
 */
import { LLR_COEFFICIENT, LLR_THRESHOLD_AREA } from "../loads";
import type { UnitSystem } from "../loads/units";

/** Default name of the notice sheet. */
export const NOTICE_SHEET = "Read me";

/** A result written as a value in the hand-off version, and why. */
export interface ValueOnlyCell {
  /** Sheet and A1 address of the cell. */
  readonly sheet: string;
  readonly address: string;
  /** Member mark or row label when known. */
  readonly mark?: string;
  /** The add-in formula the value came from. */
  readonly formula: string;
  readonly reason: string;
}

/** What the notice says. */
export interface NoticeInput {
  /** First line (the generated-sheet marker and a title). */
  readonly title: string;
  /** Program and version that generated the file, e.g. "loadpath 0.1.0 (loadpath export)". */
  readonly generator: string;
  /** When, as text (ISO date), given by the caller so the engine stays pure. */
  readonly date: string;
  /** Source workbook name. */
  readonly source: string;
  /** Takedown sheets rebuilt with classic functions and their helper sheets. */
  readonly takedowns: readonly { readonly sheet: string; readonly helperSheet: string; readonly units: UnitSystem; readonly members: number }[];
  readonly valueOnly: readonly ValueOnlyCell[];
}

/** The classic functions the hand-off formulas use. */
export const HANDOFF_FUNCTIONS = ["SUM", "SUMPRODUCT", "SUMIF", "SMALL", "IF", "MIN", "MAX", "ABS", "SQRT"] as const;

/** Units line of a takedown. */
export function unitsText(units: UnitSystem): string {
  return units === "US"
    ? "US: lengths ft, area loads psf, line loads kip/ft, forces kip, moments kip-ft, tributary areas ft^2. Inputs in psf and plf are converted in the formulas (psf x ft = plf; /1000 = kip/ft)."
    : "SI: lengths m, area loads kPa (kN/m^2), line loads kN/m, forces kN, moments kN-m, tributary areas m^2.";
}

/** The code editions behind the formulas. */
export function editionsText(): string {
  return (
    "Code editions: ASCE/SEI 7-22. Load combinations: Sec. 2.3.1 strength design (LRFD), gravity cases D, L, Lr, S, R. " +
    `Live load reduction: Sec. 4.7.3, Eq. 4.7-1, L = Lo (0.25 + ${LLR_COEFFICIENT.US}/sqrt(K_LL A_T)) in US units ` +
    `(${LLR_COEFFICIENT.SI}/sqrt(K_LL A_T) in SI), not below 0.50 Lo for members supporting one floor and 0.40 Lo for two or more, ` +
    `only where K_LL A_T >= ${LLR_THRESHOLD_AREA.US} ft^2 (${LLR_THRESHOLD_AREA.SI} m^2); K_LL from Table 4.7-2. ` +
    "Beam reactions, shears and moments by statics (AISC Steel Construction Manual beam diagrams give the same for the standard cases). " +
    "Code provisions apply only where the local jurisdiction adopts them; local codes and amendments govern."
  );
}

/** Caution carried by every hand-off workbook. */
export const HANDOFF_CAUTION =
  "Caution: a calculation aid. Every result needs review by a qualified engineer, who remains responsible for the design.";

/**
 * The notice sheet as rows of text (column A, with a second column for the value-only list).
 * @param input - what was generated, from what, and what is not live
 */
export function noticeRows(input: NoticeInput): (string | null)[][] {
  const rows: (string | null)[][] = [[input.title], []];
  rows.push([`How it was generated: by ${input.generator} on ${input.date} from ${input.source}.`]);
  rows.push([
    `Hand-off version: the formulas use classic spreadsheet functions only (arithmetic, ${HANDOFF_FUNCTIONS.join(", ")}), so the workbook recalculates without the Loadpath add-in in Excel, LibreOffice Calc and Gnumeric. Editing a zone load, a span, a trib width or a support position in the input tables updates every result.`,
  ]);
  for (const t of input.takedowns) {
    rows.push([
      `Sheet "${t.sheet}": the load takedown (${t.members} members) in takedown order. Sheet "${t.helperSheet}": helper cells for the exact largest shear and moment of each member and load case (breakpoints sorted, shear polynomial per segment, roots of the shear); the takedown reads them. Both are rebuilt by the next takedown; do not edit them.`,
    ]);
    rows.push([`Units of "${t.sheet}": ${unitsText(t.units)}`]);
  }
  rows.push(["Sign conventions: gravity loads down +, reactions up +, sagging moment +. Positions are measured from each member's start end."]);
  rows.push([editionsText()]);
  rows.push([HANDOFF_CAUTION]);
  rows.push([]);
  if (input.valueOnly.length === 0) {
    rows.push(["Results written as values (not live): none. Every result of this workbook is a live formula."]);
  } else {
    rows.push([
      `Results written as values (not live; they do NOT update when inputs change): ${input.valueOnly.length} cell(s). Their analysis has no practical form in classic functions; recompute them with the add-in (or by hand) after any change.`,
    ]);
    rows.push(["Cell", "Member or row", "Add-in formula", "Why"]);
    for (const v of input.valueOnly) rows.push([`${v.sheet}!${v.address}`, v.mark ?? "", v.formula, v.reason]);
  }
  rows.push([]);
  rows.push([
    "Which version to use: keep working in the add-in version (LOADPATH functions, any supports, deflections, diagrams) while you design; send this hand-off version to a checker or another office that may not have the add-in. Results of the two versions agree.",
  ]);
  return rows;
}
