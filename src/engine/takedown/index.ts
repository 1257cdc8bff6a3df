/**
 * The takedown engine: member tables -> model -> checks -> graph and order -> sheet plan, and
 * the results read back from the computed sheet. Pure: the workbook is reached only through the
 * tables given and the cells returned.
 */
import { a1 } from "./a1";
import { isFlexural, readModel, type TakedownModel } from "./model";
import { orderTakedown } from "./order";
import { planSheet, type SheetPlan } from "./plan";
import { BEARINGS_SPEC, LOADS_SPEC, matchTable, MEMBERS_SPEC, ZONES_SPEC } from "./tables";
import { checkPath, type CheckedPath } from "./validate";
import type { FormulaWriter } from "./formulas";
import type { Problem, TableData, UnitSystem } from "./types";

export * from "./types";
export { ADD_IN_WRITER, type FormulaWriter, type ChannelRefs, type MemberRefs } from "./formulas";
export { CAUTION, planSheet, type PlanCell, type SheetPlan, type MemberPlace } from "./plan";
export { readResults, byMark, summarize, gravityCombos, type TakedownResults, type Summary, type CellReader, type MemberResult, type ColumnResult } from "./results";
export { scanResults, scanJson } from "./scan";
export { isErrorValue } from "./cells";
export { matchTable, splitHeader, foldHeader, HEADER_SEARCH_ROWS, ZONES_SPEC, MEMBERS_SPEC, LOADS_SPEC, BEARINGS_SPEC, type MatchedTable } from "./tables";
export { readModel, type TakedownModel, type Member, type MemberType, type Zone, type Bearing } from "./model";
export { checkPath, deliveryLabel, type Delivery, type InteriorSupport } from "./validate";
export { sortGraph, type SortResult, type Edge } from "./graph";
export { orderTakedown, levelsTopDown, levelHeightHint } from "./order";
export { layoutOf, channelsOf, COL, type Layout, type Channel } from "./layout";

/**
 * Column mapping for tables whose headers differ from the defaults of docs/interface.md section 2:
 * canonical header (e.g. "Trib") -> the user's reference: a header ("Trib width"), a group and
 * header under a group row ("End/Location") or a column letter of the sheet ("J").
 */
export interface TableMapping {
  readonly zones?: Readonly<Record<string, string>>;
  readonly members?: Readonly<Record<string, string>>;
  readonly loads?: Readonly<Record<string, string>>;
  readonly bearings?: Readonly<Record<string, string>>;
}

/** The header row of each table, as a 1-based sheet row, where the user gives it (else it is found). */
export interface HeaderRows {
  readonly zones?: number;
  readonly members?: number;
  readonly loads?: number;
  readonly bearings?: number;
}

/** Input of {@link planTakedown}. */
export interface TakedownInput {
  readonly zones: TableData;
  readonly members: TableData;
  readonly loads?: TableData;
  /** Interior supports of continuous members (docs/interface.md section 2). */
  readonly bearings?: TableData;
  readonly units: UnitSystem;
  readonly mapping?: TableMapping;
  /** Header rows given by the user (1-based sheet rows); a table left out has its header row found. */
  readonly headerRows?: HeaderRows;
  /** Name of the generated sheet. */
  readonly sheet: string;
  /** First line of the generated sheet (starts with the generated-sheet marker). */
  readonly title: string;
  readonly writer?: FormulaWriter;
}

/** Problems that stop a build: the tables cannot be read as meant. */
export const FATAL_CODES: ReadonlySet<Problem["code"]> = new Set(["missingTable", "missingColumn", "ambiguousColumn", "unitMismatch", "foreignSheet", "emptyTable"]);

/**
 * Most load rows a member's loads argument may have: the LOADPATH beam functions accept at most
 * 1000 (src/functions/spill.ts, MAX_LOAD_ROWS; a test keeps the two equal).
 */
export const MAX_MEMBER_LOAD_ROWS = 1000;

/**
 * Beams, girders and joists that would carry more load rows than the worksheet functions accept
 * are left out of the takedown with a problem at their mark (never a sheet of #VALUE!); so are
 * the loads they would receive. The same rule holds in the hand-off version, so both versions
 * build the same members.
 */
function withoutOverloaded(model: TakedownModel, path: CheckedPath): { model: TakedownModel; path: CheckedPath; problems: Problem[] } {
  const rows = new Map<number, number>();
  const add = (i: number): void => void rows.set(i, (rows.get(i) ?? 0) + 1);
  for (const m of model.members) if (m.valid && isFlexural(m.type) && (m.zone !== null || Object.keys(m.extra).length > 0)) add(m.index);
  for (const p of path.placedLoads) add(p.member);
  for (const d of path.deliveries) add(d.to);
  const over = new Set<number>();
  const problems: Problem[] = [];
  for (const [i, n] of rows) {
    const m = model.members[i]!;
    if (!isFlexural(m.type) || n <= MAX_MEMBER_LOAD_ROWS) continue;
    over.add(i);
    problems.push({
      code: "tooManyLoads",
      message: `${m.mark}: carries ${n} loads (its zone load, Loads rows and the members it carries); the worksheet functions take at most ${MAX_MEMBER_LOAD_ROWS} load rows per member, so ${m.mark} is left out of the takedown. Split it into shorter members, or combine loads.`,
      sheet: m.markCell.sheet,
      cell: a1(m.markCell.row, m.markCell.col),
      mark: m.mark,
    });
  }
  if (over.size === 0) return { model, path, problems };
  return {
    model: { ...model, members: model.members.map((m) => (over.has(m.index) ? { ...m, valid: false } : m)) },
    path: { ...path, deliveries: path.deliveries.filter((d) => !over.has(d.to) && !over.has(d.from)), placedLoads: path.placedLoads.filter((p) => !over.has(p.member)) },
    problems,
  };
}

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
  const zones = matchTable(ZONES_SPEC, input.zones, input.units, input.mapping?.zones, input.headerRows?.zones);
  const members = matchTable(MEMBERS_SPEC, input.members, input.units, input.mapping?.members, input.headerRows?.members);
  const loads = input.loads ? matchTable(LOADS_SPEC, input.loads, input.units, input.mapping?.loads, input.headerRows?.loads) : undefined;
  const bearings = input.bearings ? matchTable(BEARINGS_SPEC, input.bearings, input.units, input.mapping?.bearings, input.headerRows?.bearings) : undefined;
  const headerProblems = [...zones.problems, ...members.problems, ...(loads?.problems ?? []), ...(bearings?.problems ?? [])];
  if (members.table.columns.zone !== undefined && members.table.columns.trib === undefined && !members.problems.some((p) => p.code === "missingColumn")) {
    const d = input.members;
    headerProblems.push({ code: "missingColumn", message: "The Members table has a Zone column but no Trib column: zone loads need a trib width.", sheet: d.sheet, cell: a1(d.top + members.table.headerRow, d.left) });
  }
  if (!headerProblems.some((p) => FATAL_CODES.has(p.code)) && members.table.rows.length === 0) {
    const d = input.members;
    headerProblems.push({ code: "emptyTable", message: `The Members table ("${d.sheet}") has no members: no row below its header holds a value.`, sheet: d.sheet, cell: a1(d.top + members.table.headerRow, d.left) });
  }
  if (headerProblems.some((p) => FATAL_CODES.has(p.code))) return { problems: headerProblems, plan: null, model: null, levels: [] };
  const read = readModel({ zones: zones.table, members: members.table, ...(loads ? { loads: loads.table } : {}), ...(bearings ? { bearings: bearings.table } : {}) }, input.units);
  const checkedPath = checkPath(read.model);
  // Members left out for a Bearings row that cannot be used are out of the takedown like members with a problem on their own row.
  const withBearings = checkedPath.excluded.size === 0 ? read.model : { ...read.model, members: read.model.members.map((m) => (checkedPath.excluded.has(m.index) ? { ...m, valid: false } : m)) };
  const checked = withoutOverloaded(withBearings, checkedPath);
  const path = checked.path;
  const model = checked.model;
  const ordered = orderTakedown(model, path.deliveries);
  const plan = planSheet({
    model,
    order: ordered.order,
    deliveries: path.deliveries,
    placedLoads: path.placedLoads,
    interiors: path.interiors,
    sheet: input.sheet,
    title: input.title,
    ...(input.writer ? { writer: input.writer } : {}),
  });
  return { problems: [...headerProblems, ...read.problems, ...path.problems, ...checked.problems, ...ordered.problems], plan, model, levels: ordered.levels };
}

