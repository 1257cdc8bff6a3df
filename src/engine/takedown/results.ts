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
