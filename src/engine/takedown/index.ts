/**
 * The takedown engine: member tables -> model -> checks -> graph and order -> sheet plan, and
 * the results read back from the computed sheet. Pure: the workbook is reached only through the
 * tables given and the cells returned.
 */
import { a1 } from "./a1";
import { readModel, type TakedownModel } from "./model";
import { orderTakedown } from "./order";
import { planSheet, type SheetPlan } from "./plan";
import { LOADS_SPEC, matchTable, MEMBERS_SPEC, ZONES_SPEC } from "./tables";
import { checkPath } from "./validate";
import type { FormulaWriter } from "./formulas";
import type { Problem, TableData, UnitSystem } from "./types";

export * from "./types";
export { ADD_IN_WRITER, type FormulaWriter, type ChannelRefs, type MemberRefs } from "./formulas";
export { CAUTION, planSheet, type PlanCell, type SheetPlan, type MemberPlace } from "./plan";
export { readResults, summarize, gravityCombos, type TakedownResults, type Summary, type CellReader, type MemberResult, type ColumnResult } from "./results";
export { matchTable, splitHeader, ZONES_SPEC, MEMBERS_SPEC, LOADS_SPEC, type MatchedTable } from "./tables";
export { readModel, type TakedownModel, type Member, type MemberType, type Zone } from "./model";
export { checkPath, type Delivery } from "./validate";
export { sortGraph, type SortResult, type Edge } from "./graph";
export { orderTakedown, levelsTopDown, levelHeightHint } from "./order";
export { layoutOf, channelsOf, COL, type Layout, type Channel } from "./layout";

/**
 * Column mapping for tables whose headers differ from the defaults of docs/interface.md section 2:
 * canonical header (e.g. "Trib") -> the header the user's table has (e.g. "Trib width").
 */
export interface TableMapping {
  readonly zones?: Readonly<Record<string, string>>;
  readonly members?: Readonly<Record<string, string>>;
  readonly loads?: Readonly<Record<string, string>>;
}

/** Input of {@link planTakedown}. */
export interface TakedownInput {
  readonly zones: TableData;
  readonly members: TableData;
  readonly loads?: TableData;
  readonly units: UnitSystem;
  readonly mapping?: TableMapping;
  /** Name of the generated sheet. */
  readonly sheet: string;
  /** First line of the generated sheet (starts with the generated-sheet marker). */
  readonly title: string;
  readonly writer?: FormulaWriter;
}

/** Problems that stop a build: the tables cannot be read as meant. */
export const FATAL_CODES: ReadonlySet<Problem["code"]> = new Set(["missingTable", "missingColumn", "unitMismatch", "foreignSheet"]);

/** Outcome of {@link planTakedown}. */
export interface TakedownPlan {
  /** Every problem found, all at once, in table order. */
  readonly problems: readonly Problem[];
  /** The sheet to write; null when a problem stops the build (see {@link FATAL_CODES}). */
  readonly plan: SheetPlan | null;
  readonly model: TakedownModel | null;
  /** Levels from the top down. */
  readonly levels: readonly string[];
}

/**
 * Read the tables, check the load path, order it and plan the sheet. Members with a problem on
 * their own row or on a cycle are left out; everything else is planned.
 * @param input - the tables as read (header row first), unit system, mapping and sheet name
 */
export function planTakedown(input: TakedownInput): TakedownPlan {
  const zones = matchTable(ZONES_SPEC, input.zones, input.units, input.mapping?.zones);
  const members = matchTable(MEMBERS_SPEC, input.members, input.units, input.mapping?.members);
  const loads = input.loads ? matchTable(LOADS_SPEC, input.loads, input.units, input.mapping?.loads) : undefined;
  const headerProblems = [...zones.problems, ...members.problems, ...(loads?.problems ?? [])];
  if (members.table.columns.zone !== undefined && members.table.columns.trib === undefined && !members.problems.some((p) => p.code === "missingColumn")) {
    const d = input.members;
    headerProblems.push({ code: "missingColumn", message: "The Members table has a Zone column but no Trib column: zone loads need a trib width.", sheet: d.sheet, cell: a1(d.top, d.left) });
  }
  if (headerProblems.some((p) => FATAL_CODES.has(p.code))) return { problems: headerProblems, plan: null, model: null, levels: [] };
  const read = readModel({ zones: zones.table, members: members.table, ...(loads ? { loads: loads.table } : {}) }, input.units);
  const path = checkPath(read.model);
  const ordered = orderTakedown(read.model, path.deliveries);
  const plan = planSheet({
    model: read.model,
    order: ordered.order,
    deliveries: path.deliveries,
    placedLoads: path.placedLoads,
    sheet: input.sheet,
    title: input.title,
    ...(input.writer ? { writer: input.writer } : {}),
  });
  return { problems: [...headerProblems, ...read.problems, ...path.problems, ...ordered.problems], plan, model: read.model, levels: ordered.levels };
}

