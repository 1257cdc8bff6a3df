/**
 * The results of a takedown read back from the computed sheet: the JSON of docs/interface.md section 4
 * and the summary the pane shows. Values come from the sheet's cells (computed by the workbook's
 * engine); the list of load combinations of each column is evaluated with the engine's ASCE/SEI
 * 7-22 combinations from the column's computed totals, the same code LOADPATH.COMBINE runs.
 */
import type { DerivedJson } from "../framing/tables-out";
import { combinationValues } from "../loads/combinations";
import { isFlexural, isTerminal, type TakedownModel } from "./model";
import type { SheetPlan } from "./plan";
import type { CellValue, LoadCase, Problem, UnitSystem } from "./types";

/** One flexural member (or a column, with its base reaction) in the JSON. */
export interface MemberResult {
  readonly type: string;
  readonly level: string;
  /** Per case: one value per support in order along the member for beams ([start, end] on two supports); [base] for columns. */
  readonly reactions: Readonly<Record<string, readonly number[]>>;
  readonly shearMax: Readonly<Record<string, number>>;
  readonly momentMax: Readonly<Record<string, number>>;
  readonly tributaryArea: number;
  readonly llrFactor: number;
  /** Beams, girders, joists: governing values by combination set (LRFD: ASCE/SEI 7-22 Sec. 2.3.1) over the live load patterns. */
  readonly governing?: { readonly LRFD: GoverningSet };
  /** Beams, girders, joists with E given: the deflection check (in or mm; required I in⁴ or mm⁴); null where not computed (I blank). */
  readonly deflection?: DeflectionResults;
}

/** A governing value with the combination and the live load pattern that produce it. */
export interface GoverningValue {
  /** kip, kip-ft (US) or kN, kN·m (SI); NaN (null in JSON) when the cell is an error. */
  readonly value: number;
  readonly combination: string | null;
  readonly pattern: string | null;
}

/** The governing values of one member under one combination set. */
export interface GoverningSet {
  readonly momentMax: GoverningValue;
  readonly momentMin: GoverningValue;
  readonly shearMax: GoverningValue;
  /** One per support, in order along the member. */
  readonly reactionMax: readonly GoverningValue[];
  /** One per support, in order along the member; negative is uplift. */
  readonly reactionMin: readonly GoverningValue[];
}

/** The deflection check of one member. */
export interface DeflectionResults {
  readonly live: number | null;
  readonly total: number | null;
  readonly liveLimit: number | null;
  readonly totalLimit: number | null;
  readonly ratio: number | null;
  readonly requiredI: number | null;
}

/** One column (one level of a stack) in the JSON. */
export interface ColumnResult {
  readonly level: string;
  readonly cumulative: Readonly<Record<string, number>>;
  readonly tributaryArea: number;
  readonly floors: number;
  readonly kllAt: number;
  readonly llrFactor: number;
  readonly reducedLive: number;
  readonly combos: Readonly<Record<string, number>>;
}

/** The JSON of docs/interface.md section 4. */
export interface TakedownResults {
  readonly units: UnitSystem;
  readonly members: Readonly<Record<string, MemberResult>>;
  readonly columns: Readonly<Record<string, ColumnResult>>;
  readonly foundations: Readonly<Record<string, Readonly<Record<string, number>>>>;
  /**
   * Walls and foundations whose length is known (a wall on a beam: End at - Start at; else the
   * Span cell; a footing under one wall: that wall's length): the length and, per case, the total
   * per unit length (kip/ft or kN/m).
   */
  readonly perLength: Readonly<Record<string, { readonly length: number; readonly loads: Readonly<Record<string, number>> }>>;
  readonly balance: Readonly<Record<string, { readonly applied: number; readonly supports: number }>>;
  readonly problems: readonly Problem[];
  /** A takedown built from a framing plan: per member, what the derivation found (docs/interface.md). */
  readonly derived?: Readonly<Record<string, DerivedJson>>;
}

/** What the pane shows after a build. */
export interface Summary {
  readonly membersByType: Readonly<Record<string, number>>;
  readonly levels: readonly string[];
  /** Total applied load per case (kip or kN). */
  readonly appliedByCase: Readonly<Record<string, number>>;
  /** Total foundation/wall reactions per case. */
  readonly supportsByCase: Readonly<Record<string, number>>;
}

/** Reads a computed cell of the generated sheet (0-based row and column). */
export type CellReader = (row: number, col: number) => CellValue | undefined;

/** A computed cell as a number: blank is 0 (nothing delivered), text or an error is NaN (null in JSON). */
function numberAt(read: CellReader, row: number, col: number | undefined): number {
  if (col === undefined) return 0;
  const v = read(row, col);
  if (v === null || v === undefined || v === "") return 0;
  return typeof v === "number" ? v : Number.NaN;
}

/**
 * An empty object keyed by marks: no prototype, so no mark collides with an object's inherited
 * names ("__proto__", "constructor", "toString", "hasOwnProperty").
 */
export function byMark<T>(): Record<string, T> {
  return Object.create(null) as Record<string, T>;
}

/** The gravity combinations (no wind or seismic term) of ASCE/SEI 7-22 Sec. 2.3.1, LRFD, by label. */
export function gravityCombos(effects: Readonly<Partial<Record<LoadCase, number>>>): Record<string, number> {
  const values = combinationValues({ D: effects.D ?? 0, L: effects.L ?? 0, Lr: effects.Lr ?? 0, S: effects.S ?? 0, R: effects.R ?? 0, W: 0, E: 0 }, { method: "LRFD", halfLive: false });
  const out: Record<string, number> = {};
  for (const v of values) if (v.terms.every((t) => t.load !== "W" && t.load !== "E")) out[v.label] = v.value;
  return out;
}

/** A governing value and its "combination; pattern" text cell (the column after the value). */
function governingAt(read: CellReader, row: number, col: number): GoverningValue {
  const text = read(row, col + 1);
  let combination: string | null = null;
  let pattern: string | null = null;
  if (typeof text === "string" && !text.startsWith("#")) {
    // Combination labels hold no "; " (built-in ASCE/SEI 7-22 labels); the pattern may ("L on span 1; Lr off").
    const cut = text.indexOf("; ");
    combination = cut < 0 ? text : text.slice(0, cut);
    pattern = cut < 0 ? null : text.slice(cut + 2);
  }
  return { value: numberAt(read, row, col), combination, pattern };
}

/** The governing LRFD values of a flexural member read from its rows. */
function governingOf(plan: SheetPlan, read: CellReader, row: number, interiors: number): GoverningSet {
  const g = plan.layout.governing;
  const along = (first: number, last: number): GoverningValue[] => [
    governingAt(read, row, first),
    ...Array.from({ length: interiors }, (_, k) => governingAt(read, row + 1 + k, first)),
    governingAt(read, row, last),
  ];
  return {
    momentMax: governingAt(read, row, g.momentMax),
    momentMin: governingAt(read, row, g.momentMin),
    shearMax: governingAt(read, row, g.shearMax),
    reactionMax: along(g.reactionMaxFirst, g.reactionMaxLast),
    reactionMin: along(g.reactionMinFirst, g.reactionMinLast),
  };
}

/** The deflection check of a member with E given (null where the cell was not written). */
function deflectionOf(plan: SheetPlan, read: CellReader, row: number, withI: boolean): DeflectionResults {
  const d = plan.layout.deflection!;
  const at = (col: number): number => numberAt(read, row, col);
  return {
    live: withI ? at(d.live) : null,
    total: withI ? at(d.total) : null,
    liveLimit: at(d.liveLimit),
    totalLimit: at(d.totalLimit),
    ratio: withI ? at(d.ratio) : null,
    requiredI: at(d.requiredI),
  };
}

/**
 * Read the takedown's results from the computed sheet.
 * @param plan - the sheet plan that was written
 * @param model - the model it was planned from
 * @param read - computed cell values of the generated sheet
 * @param problems - problems to carry in the JSON
 */
export function readResults(plan: SheetPlan, model: TakedownModel, read: CellReader, problems: readonly Problem[]): TakedownResults {
  const { layout } = plan;
  // Keyed by the user's marks: objects without a prototype, so a mark such as "__proto__",
  // "constructor" or "toString" is an ordinary key (kept in the JSON, never found where absent).
  const members = byMark<MemberResult>();
  const columns = byMark<ColumnResult>();
  const foundations = byMark<Record<string, number>>();
  const perLength = byMark<{ length: number; loads: Record<string, number> }>();
  const caseIndex = layout.cases.map((c) => ({ key: c.key, i: layout.channels.indexOf(c) }));
  const hasAt = layout.channels.some((c) => c.key === "AT");
  for (const place of plan.places) {
    const m = model.members[place.member]!;
    const row = place.row;
    const at = (col: number): number => numberAt(read, row, col);
    if (isTerminal(m.type)) {
      foundations[m.mark] = Object.fromEntries(caseIndex.map(({ key, i }) => [key, at(layout.total[i]!)]));
      const length = read(row, layout.wallLength);
      if (length !== null && length !== undefined && length !== "") {
        perLength[m.mark] = { length: at(layout.wallLength), loads: Object.fromEntries(caseIndex.map(({ key, i }) => [key, at(layout.perLength[i]!)])) };
      }
      continue;
    }
    const tributaryArea = hasAt ? at(layout.areaT) : 0;
    const llrFactor = hasAt ? at(layout.llr) : 1;
    if (isFlexural(m.type)) {
      members[m.mark] = {
        type: m.type,
        level: m.level,
        // One value per support in order along the member: first, the interior ones (R1 below), last.
        reactions: Object.fromEntries(
          caseIndex.map(({ key, i }) => [key, [at(layout.r1[i]!), ...Array.from({ length: place.interiors ?? 0 }, (_, k) => numberAt(read, row + 1 + k, layout.r1[i]!)), at(layout.r2[i]!)]]),
        ),
        shearMax: Object.fromEntries(layout.cases.map((c, k) => [c.key, at(layout.vMax[k]!)])),
        momentMax: Object.fromEntries(layout.cases.map((c, k) => [c.key, at(layout.mMax[k]!)])),
        tributaryArea,
        llrFactor,
        governing: { LRFD: governingOf(plan, read, row, place.interiors ?? 0) },
        ...(plan.layout.deflection !== null && m.deflection?.E != null ? { deflection: deflectionOf(plan, read, row, m.deflection.I !== null) } : {}),
      };
      continue;
    }
    const cumulative: Record<string, number> = Object.fromEntries(caseIndex.map(({ key, i }) => [key, at(layout.total[i]!)]));
    const reducedLive = hasAt ? at(layout.reducedLive) : (cumulative.L ?? 0);
    members[m.mark] = {
      type: m.type,
      level: m.level,
      reactions: Object.fromEntries(Object.entries(cumulative).map(([k, v]) => [k, [v]])),
      shearMax: {},
      momentMax: {},
      tributaryArea,
      llrFactor,
    };
    columns[m.mark] = {
      level: m.level,
      cumulative,
      tributaryArea,
      floors: hasAt ? at(layout.floors) : 0,
      kllAt: hasAt ? at(layout.kllAt) : 0,
      llrFactor,
      reducedLive,
      combos: gravityCombos({ ...cumulative, L: reducedLive }),
    };
  }
  const balance = Object.fromEntries(
    layout.cases.map((c, k) => [c.key, { applied: numberAt(read, plan.balance.appliedRow, plan.balance.caseCols[k]), supports: numberAt(read, plan.balance.supportsRow, plan.balance.caseCols[k]) }]),
  );
  return { units: model.units, members, columns, foundations, perLength, balance, problems };
}

/**
 * The summary of a build: members by type, levels top-down, applied and supported load per case.
 * @param results - from {@link readResults}
 * @param plan - the sheet plan
 * @param model - the model
 * @param levels - levels from the top down
 */
export function summarize(results: TakedownResults, plan: SheetPlan, model: TakedownModel, levels: readonly string[]): Summary {
  const membersByType: Record<string, number> = {};
  for (const p of plan.places) {
    const t = model.members[p.member]!.type;
    membersByType[t] = (membersByType[t] ?? 0) + 1;
  }
  const appliedByCase: Record<string, number> = {};
  const supportsByCase: Record<string, number> = {};
  for (const [k, v] of Object.entries(results.balance)) {
    appliedByCase[k] = v.applied;
    supportsByCase[k] = v.supports;
  }
  return { membersByType, levels, appliedByCase, supportsByCase };
}
