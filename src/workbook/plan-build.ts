/**
 * A takedown from a framing plan: read the plan tables (Grids, Levels, Framing, Decks), derive the
 * members, bearings and tributary pieces (src/engine/framing), write them as values on the
 * generated sheets `Plan members`, `Plan loads` and `Plan bearings` (marker and a note of what
 * they were derived from on top), then build the takedown from those sheets exactly as from typed
 * tables. Framing problems join the takedown's problems with their cells; the JSON gains `derived`.
 */
import { derivePlan, type Derivation, type PlanTables } from "../engine/framing";
import { derivedJson, PLAN_SHEETS, planTableRows, userLoadRows, type DerivedJson } from "../engine/framing/tables-out";
import type { CellValue, Problem, TableData } from "../engine/takedown/types";
import { LOADS_SPEC, matchTable } from "../engine/takedown/tables";
import { ForeignSheetError, GENERATED_MARKER, type WorkbookPort } from "./port";
import { buildTakedown } from "./takedown-build";
import type { TakedownBuildResult, TakedownOptions } from "./takedown-api";

/** Names of the plan tables (Excel table, sheet or `Sheet!A1:H20`); Grids, Levels and Decks optional. */
export interface PlanTableNames {
  readonly grids?: string;
  readonly levels?: string;
  readonly framing: string;
  readonly decks?: string;
  /** The user's Loads table: its rows join the derived ones on `Plan loads` (loads the plan cannot give). */
  readonly loads?: string;
}

/** What the derivation step gives the takedown. */
export interface PlanBuild {
  /** Null when a plan table could not be read or a generated sheet could not be written. */
  readonly derivation: Derivation | null;
  /** Framing problems (reading and derivation), and tables that could not be read. */
  readonly problems: readonly Problem[];
  /** The generated sheets written (members, loads, bearings), to build the takedown from. */
  readonly sheets: typeof PLAN_SHEETS;
}

/**
 * Derive the plan and write the generated plan sheets (values only).
 * @param port - the workbook
 * @param names - the plan tables
 * @param options - unit system, snapping tolerance, whether a user's sheet of a generated name may be replaced
 */
export async function writePlanSheets(port: WorkbookPort, names: PlanTableNames, options: { readonly units: "US" | "SI"; readonly tolerance?: number; readonly replaceForeign?: boolean }): Promise<PlanBuild> {
  const problems: Problem[] = [];
  const read = async (ref: string | undefined, role: string): Promise<TableData | undefined> => {
    if (ref === undefined) return undefined;
    try {
      return await port.readTable(ref, { dates: true });
    } catch (e) {
      problems.push({ code: "missingTable", message: `The ${role} table "${ref}" could not be read: ${e instanceof Error ? e.message : String(e)}`, sheet: ref, cell: "A1" });
      return undefined;
    }
  };
  const framing = await read(names.framing, "Framing");
  const grids = await read(names.grids, "Grids");
  const levels = await read(names.levels, "Levels");
  const decks = await read(names.decks, "Decks");
  const userLoads = await read(names.loads, "Loads");
  if (framing === undefined) return { derivation: null, problems, sheets: PLAN_SHEETS };
  const tables: PlanTables = { framing, ...(grids ? { grids } : {}), ...(levels ? { levels } : {}), ...(decks ? { decks } : {}) };
  const d = derivePlan(tables, options.units, options.tolerance);
  problems.push(...d.problems);
  let extra: CellValue[][] = [];
  if (userLoads) {
    const m = matchTable(LOADS_SPEC, userLoads, options.units);
    problems.push(...m.problems);
    extra = userLoadRows(m.table.data, m.table.columns, m.table.rows);
  }
  const rows = planTableRows(d, options.units, extra);
  const from = [`Framing: ${names.framing}`, ...(names.decks ? [`Decks: ${names.decks}`] : []), ...(names.grids ? [`Grids: ${names.grids}`] : []), ...(names.levels ? [`Levels: ${names.levels}`] : []), ...(names.loads ? [`Loads: ${names.loads} (its rows copied)`] : [])].join(", ");
  const note = `Values derived from the framing plan (${from}; snapping tolerance ${d.tolerance} ${options.units === "SI" ? "m" : "ft"}). Edit the plan tables, not this sheet: a rebuild replaces it. Results need a qualified engineer's review; local codes govern.`;
  const what: Record<keyof typeof PLAN_SHEETS, string> = { members: "members", loads: "tributary loads", bearings: "bearings of members continuous over what they cross" };
  try {
    for (const key of ["members", "loads", "bearings"] as const) {
      const sheet = PLAN_SHEETS[key];
      await port.prepareSheet(sheet, `${GENERATED_MARKER}: plan ${what[key]} derived from the framing plan.`, options.replaceForeign === true);
      await port.writeBlock(sheet, 1, 0, [[note], ...rows[key]]);
    }
  } catch (e) {
    if (!(e instanceof ForeignSheetError)) throw e;
    return { derivation: null, problems: [...problems, { code: "foreignSheet", message: e.message, sheet: e.message, cell: "A1" }], sheets: PLAN_SHEETS };
  }
  await port.flush();
  return { derivation: d, problems, sheets: PLAN_SHEETS };
}

/** A takedown built from a plan, with its derivation. */
export interface PlanTakedownResult {
  readonly result: TakedownBuildResult;
  readonly derivation: Derivation | null;
  readonly derived: Record<string, DerivedJson>;
}

/**
 * Derive the plan, write the plan sheets and build the takedown from them.
 * @param port - the workbook
 * @param names - the plan tables
 * @param options - the takedown options without members, loads and bearings (they are the plan sheets)
 * @param tolerance - snapping tolerance (ft or m); default 1/16 in or 1.5 mm
 */
export async function buildPlanTakedown(port: WorkbookPort, names: PlanTableNames, options: Omit<TakedownOptions, "members" | "loads" | "bearings">, tolerance?: number): Promise<PlanTakedownResult> {
  const plan = await writePlanSheets(port, names, { units: options.units, ...(tolerance !== undefined ? { tolerance } : {}), ...(options.replaceForeign ? { replaceForeign: true } : {}) });
  if (plan.derivation === null) return { result: { ok: false, problems: plan.problems }, derivation: null, derived: {} };
  const built = await buildTakedown(port, { ...options, members: plan.sheets.members, loads: plan.sheets.loads, bearings: plan.sheets.bearings });
  const derived = derivedJson(plan.derivation);
  const problems = [...plan.problems, ...built.problems];
  const json = built.json ? { ...built.json, problems, derived } : undefined;
  return { result: { ...built, problems, ...(json ? { json } : {}) }, derivation: plan.derivation, derived };
}
