/**
 * The formula-writing part of the sheet plan, separate from the layout: the plan decides where
 * every load, reaction and column total sits and hands the references to a writer, which spells
 * the member-level computations. The add-in writer uses the LOADPATH worksheet functions; a
 * hand-off writer (classic spreadsheet functions only) can implement the same interface from the
 * same references.
 */
import type { UnitSystem } from "./types";

/** References to one flexural member's geometry, for its formulas. */
export interface MemberRefs {
  /** Cell holding the member's length (ft or m), e.g. "$D12". */
  readonly span: string;
  /** One-column range of the two support positions, or null for pins at 0 and the length. */
  readonly supports: string | null;
}

/**
 * One load case's loads on one member. Every range covers the member's load rows; rows without a
 * load of this case are blank in `magnitude`.
 */
export interface ChannelRefs {
  /**
   * The loads argument of the LOADPATH beam functions: a 4-column range `kind | magnitude | from |
   * to` (from and to blank = full length; a fifth column `end magnitude` when some load of the
   * takedown varies linearly), or a single magnitude cell when the member carries one
   * uniform load over its whole length.
   */
  readonly loads: string;
  /** Range of magnitudes (kip/ft or kip; kN/m or kN). */
  readonly magnitude: string;
  /** Range of load kinds: "line" (applied), "point" (applied) or "reaction" (a point load from a carried member). */
  readonly kind: string;
  /** Range of start positions (blank = 0). */
  readonly from: string;
  /** Range of loaded lengths of line loads (end = from + loaded length). */
  readonly loaded: string;
}

/** Spells the member-level computations of the takedown sheet (formula text without "="). */
export interface FormulaWriter {
  /** Name shown in the generated sheet's header. */
  readonly name: string;
  /** Whether the plan writes each case's `kind | magnitude | from | to` columns beside the magnitudes. */
  readonly writesLoadRanges: boolean;
  /**
   * Whether it spells members on more than two supports (continuous members); when not, the plan
   * writes those members' results with the add-in writer and lists the cells in
   * `SheetPlan.valueOnly` so that the build replaces them with their values.
   */
  readonly continuous?: boolean;
  /**
   * Whether it spells the governing values over combinations and live load patterns and the
   * deflection check; when not, the plan writes them with the add-in's functions and lists them in
   * `SheetPlan.valueOnly` (replaced by their values).
   */
  readonly governing?: boolean;
  /**
   * Whether it spells loads varying linearly along a member (a loads range with an end magnitude
   * column); when not, the plan writes those members' results with the add-in writer and lists
   * the cells in `SheetPlan.valueOnly`, as for continuous members.
   */
  readonly trapezoids?: boolean;
  /** Vertical reaction (up +) at the member's support number `index` (1 = first, in order along the member). */
  reaction(member: MemberRefs, loads: ChannelRefs, index: number): string;
  /** Largest absolute shear. */
  shearMax(member: MemberRefs, loads: ChannelRefs): string;
  /** Largest sagging moment. */
  momentMax(member: MemberRefs, loads: ChannelRefs): string;
  /** K_LL of an element of ASCE/SEI 7-22 Table 4.7-2 by its key ("interior column"). */
  kllDefault(element: string): string;
  /** Live load reduction factor L/Lo (ASCE/SEI 7-22 Sec. 4.7) from K_LL, A_T and floors supported. */
  llrFactor(kll: string, areaT: string, floors: string, units: UnitSystem): string;
  /** Governing LRFD factored value of the load effects (ASCE/SEI 7-22 Sec. 2.3.1). */
  combine(dead: string, live: string, roofLive: string, snow: string, rain: string): string;
}

function withSupports(member: MemberRefs): string {
  return member.supports === null ? "" : `,${member.supports}`;
}

/** The add-in writer: the LOADPATH worksheet functions over the loads ranges. */
export const ADD_IN_WRITER: FormulaWriter = {
  name: "LOADPATH worksheet functions",
  writesLoadRanges: true,
  continuous: true,
  governing: true,
  trapezoids: true,
  reaction: (m, c, index) => `LOADPATH.REACTION(${m.span},${c.loads},${index}${withSupports(m)})`,
  shearMax: (m, c) => `LOADPATH.SHEAR_MAX(${m.span},${c.loads}${withSupports(m)})`,
  momentMax: (m, c) => `LOADPATH.MOMENT_MAX(${m.span},${c.loads}${withSupports(m)})`,
  kllDefault: (element) => `LOADPATH.KLL("${element}")`,
  llrFactor: (kll, at, floors, units) => `LOADPATH.LL_REDUCE(1,${kll},${at},${floors},"${units}")`,
  combine: (d, l, lr, s, r) => `LOADPATH.COMBINE(${d},${l},${lr},${s},${r})`,
};

/** The loads of the five cases a governing or deflection formula takes (a loads reference, or "0" for none). */
export interface CaseLoads {
  readonly D: string;
  readonly L: string;
  readonly Lr: string;
  readonly S: string;
  readonly R: string;
}

function caseArgs(c: CaseLoads): string {
  return `${c.D},${c.L},${c.Lr},${c.S},${c.R}`;
}

/**
 * A LOADPATH.GOVERNING formula: the governing LRFD value of a quantity over the combinations and the
 * live load patterns, or (what "case") its combination and pattern as text.
 * @param member - length and supports
 * @param cases - the loads of each case
 * @param quantity - "moment max", "moment min", "shear max", "reaction max N", "reaction min N"
 * @param liveFactor - cell or number multiplying L (the member's live load reduction factor, or 1)
 * @param what - "value" or "case"
 */
export function governingFormula(member: MemberRefs, cases: CaseLoads, quantity: string, liveFactor: string, what: "value" | "case"): string {
  const tail = what === "value" ? "" : `,"${what}"`;
  return `LOADPATH.GOVERNING(${member.span},"${quantity}",${caseArgs(cases)},${member.supports ?? ""},"LRFD",${liveFactor}${tail})`;
}

/**
 * A LOADPATH.DEFLECTION_CHECK formula.
 * @param member - length and supports
 * @param E - cell of E (ksi or MPa)
 * @param I - cell of I (in⁴ or mm⁴), or "" when blank
 * @param units - the takedown's unit system (US: kip-ft, SI: kN-m)
 * @param cases - the loads of each case (unfactored)
 * @param live - live limit ratio (cell formula or number)
 * @param total - total limit ratio
 * @param what - "live", "total", "live limit", "total limit", "ratio" or "required I"
 */
export function deflectionFormula(member: MemberRefs, E: string, I: string, units: UnitSystem, cases: CaseLoads, live: string, total: string, what: string): string {
  return `LOADPATH.DEFLECTION_CHECK(${member.span},${E},${I},"${units === "US" ? "kip-ft" : "kN-m"}",${caseArgs(cases)},${member.supports ?? ""},${live},${total},"${what}")`;
}
