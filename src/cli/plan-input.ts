/**
 * What `loadpath plan` draws from a workbook: the framing plan (Grids, Levels, Framing, Decks
 * read and derived by src/engine/framing) when the workbook has a Framing table, else the
 * schematic key plan of the typed member tables (Zones, Members, Bearings read and checked by
 * the takedown's own reading, src/engine/takedown). Nothing is written to the workbook.
 */
import { a1 } from "../engine/a1";
import { derive, readPlan, type FramingProblem } from "../engine/framing";
import { planTakedown } from "../engine/takedown";
import type { TableReading } from "../engine/takedown/tables";
import type { TableData, UnitSystem } from "../engine/takedown/types";
import type { FramingPlanModel } from "../drawings/plan";
import { keyPlanOfModel, type KeyPlanInput } from "../drawings/key-plan";
import { MemoryWorkbookPort } from "../workbook/memory-port";
import type { WorkbookPort } from "../workbook/port";
import { sheetRef } from "../workbook/a1";
import { dateCells, engineSheets, type XlsxWorkbook } from "../workbook/xlsx";
import { tableOrSheet, unitsShownByHeaders } from "./takedown-input";

/** Tables a plan run may name (each an Excel table, a sheet or `Sheet!A1:H20`). */
export const PLAN_TABLES = ["grids", "levels", "framing", "decks", "zones", "members", "bearings"] as const;
/** One of {@link PLAN_TABLES}. */
export type PlanTableKey = (typeof PLAN_TABLES)[number];

/** The options of a plan run: table names, column mappings per table, unit system. */
export interface PlanRun {
  readonly tables: Partial<Record<PlanTableKey, string>>;
  readonly mapping: Partial<Record<PlanTableKey, Readonly<Record<string, string>>>>;
  readonly units?: UnitSystem;
}

/** What was read: a framing plan or a key plan, the unit system and every problem as `Sheet!A1: message`. */
export type PlanInput =
  | { readonly kind: "framing"; readonly model: FramingPlanModel; readonly units: UnitSystem; readonly problems: readonly string[] }
  | { readonly kind: "key"; readonly input: KeyPlanInput; readonly units: UnitSystem; readonly problems: readonly string[] };

/**
 * Parse `--map` entries for the plan verb: `<table>.<Column>=<header>`, table one of
 * {@link PLAN_TABLES}.
 * @param entries - the option's values
 */
export function parsePlanMappings(entries: readonly string[]): { mapping: PlanRun["mapping"] } | { error: string } {
  const out: Partial<Record<PlanTableKey, Record<string, string>>> = {};
  for (const e of entries) {
    const m = /^\s*([a-z]+)\.([^=]+?)\s*=\s*(.*?)\s*$/i.exec(e);
    const table = m?.[1]?.toLowerCase() as PlanTableKey | undefined;
    if (!m || table === undefined || !PLAN_TABLES.includes(table)) return { error: `--map "${e}": write it as <table>.<Column>=<your header, Group/Header or column letter>, table ${PLAN_TABLES.join(", ")} (e.g. framing.X1="Start x").` };
    out[table] = { ...(out[table] ?? {}), [m[2]!]: m[3]!.replace(/^"(.*)"$/, "$1") };
  }
  return { mapping: out };
}

function framingProblem(p: FramingProblem): string {
  return `${sheetRef(p.sheet)}!${p.cell}: ${p.message}`;
}

/**
 * Read what to draw from a workbook.
 * @param workbook - the workbook read
 * @param run - table names, mappings, unit system
 * @param given - a port over the same workbook already built (else one is made)
 * @throws Error naming the file's missing table when it has neither a Framing nor a Members table
 */
export async function planInputOf(workbook: XlsxWorkbook, run: PlanRun, given?: WorkbookPort): Promise<PlanInput> {
  const port = given ?? (await MemoryWorkbookPort.create({ sheets: engineSheets(workbook), tables: workbook.tables.map((t) => ({ name: t.name, sheet: t.sheet, ref: t.ref })), names: workbook.names, dates: dateCells(workbook) }));
  const name = (key: PlanTableKey, fallback: string): string | undefined => run.tables[key] ?? tableOrSheet(workbook, fallback);
  const read = async (ref: string | undefined): Promise<TableData | undefined> => (ref === undefined ? undefined : await port.readTable(ref));
  const reading = (key: PlanTableKey): TableReading => (run.mapping[key] ? { mapping: run.mapping[key] } : {});
  const framingName = name("framing", "Framing");
  if (framingName !== undefined) {
    const names = { grids: name("grids", "Grids"), levels: name("levels", "Levels"), decks: name("decks", "Decks") };
    const units = run.units ?? unitsShownByHeaders(workbook, [framingName, ...(names.decks !== undefined ? [names.decks] : []), ...(names.levels !== undefined ? [names.levels] : [])]) ?? "US";
    const framing = (await read(framingName))!;
    const [grids, levels, decks] = [await read(names.grids), await read(names.levels), await read(names.decks)];
    const r = readPlan({ framing, ...(grids ? { grids } : {}), ...(levels ? { levels } : {}), ...(decks ? { decks } : {}) }, units, { framing: reading("framing"), grids: reading("grids"), levels: reading("levels"), decks: reading("decks") });
    const derivation = derive(r.plan, { units });
    const problems = [...r.problems, ...derivation.problems].map(framingProblem);
    return { kind: "framing", model: { plan: r.plan, grids: r.grids, derivation, units }, units, problems };
  }
  const membersName = name("members", "Members");
  if (membersName === undefined) throw new Error("no Framing table or sheet (a framing plan) and no Members table or sheet (typed tables); name one with --framing or --members.");
  const zonesName = name("zones", "Zones");
  const bearingsName = name("bearings", "Bearings");
  const units = run.units ?? unitsShownByHeaders(workbook, [membersName]) ?? "US";
  const members = (await read(membersName))!;
  const zones = (await read(zonesName)) ?? { sheet: members.sheet, top: 0, left: 0, values: [["Zone"]] };
  const bearings = await read(bearingsName);
  const mapping = { ...(run.mapping.members ? { members: run.mapping.members } : {}), ...(run.mapping.zones ? { zones: run.mapping.zones } : {}), ...(run.mapping.bearings ? { bearings: run.mapping.bearings } : {}) };
  const p = planTakedown({ zones, members, ...(bearings ? { bearings } : {}), units, mapping, sheet: "Takedown", title: "" });
  const problems = p.problems.map((q) => `${sheetRef(q.sheet)}!${q.cell}: ${q.message}`);
  if (zonesName === undefined) problems.unshift(`${sheetRef(members.sheet)}!${a1(members.top, members.left)}: no Zones table; the key plan is drawn from the Members table alone.`);
  const model = p.model;
  if (!model) return { kind: "key", input: { levels: [], members: [] }, units, problems };
  return { kind: "key", input: keyPlanOfModel(model, p.levels), units, problems };
}
