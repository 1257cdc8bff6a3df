/**
 * What the verbs that build a takedown from an .xlsx file share (`loadpath takedown`,
 * `loadpath report`, `loadpath export`): the table options (`--zones`, `--members`, `--loads`,
 * `--map`, `--units`, `--sheet`, `--replace`, the same meaning in every verb), their checks, the
 * unit system read from the headers, the default tables' lookup and the headless build of a file
 * in memory.
 */
import type { ParseArgsConfig } from "node:util";
import { MemoryWorkbookPort } from "../workbook/memory-port";
import { tableRowCount, takedownMemoryProblem } from "../workbook/size-limits";
import { buildTakedown } from "../workbook/takedown-build";
import type { ColumnMapping, HeaderRows, TakedownBuildResult, TakedownOptions, UnitSystem } from "../workbook/takedown-api";
import { dateCells, engineSheets, type XlsxWorkbook } from "../workbook/xlsx";
import { readInputWorkbook } from "./shared";
import { buildPlanTakedown, type PlanTableNames } from "../workbook/plan-build";
import { PLAN_SHEETS } from "../engine/framing/tables-out";
import type { Derivation } from "../engine/framing";
import { unitFits } from "../engine/takedown/units";
import { HEADER_SEARCH_ROWS } from "../engine/takedown/tables";
import { MATCHING_TABLES, overMatching, readSavedMatching, SETTINGS_SHEET, writeSavedMatching, type SavedMatching } from "../workbook/saved-matching";

/** What a takedown run needs besides the files. */
export interface TakedownRun {
  /** Unit system; left out: the one the headers' units show, else US. */
  readonly units?: UnitSystem;
  readonly zones?: string;
  readonly members?: string;
  readonly loads?: string;
  /** Bearings table (interior supports of continuous members). */
  readonly bearings?: string;
  /** Plan tables: a takedown from the framing plan (used when given, or when the workbook has Framing and Decks and no Members). */
  readonly framing?: string;
  readonly decks?: string;
  readonly grids?: string;
  readonly levels?: string;
  /** Snapping tolerance of the framing plan (ft or m), `--tolerance`; default 1/16 in or 1.5 mm. */
  readonly tolerance?: number;
  readonly mapping?: ColumnMapping;
  /** Header rows given with `--header-row` (1-based sheet rows). */
  readonly headerRows?: HeaderRows;
  readonly sheet?: string;
  readonly replace?: boolean;
  /** Hand-off version: classic spreadsheet functions only. */
  readonly native?: boolean;
  /** Write the matching used (tables, columns, header rows, units) on the settings sheet of the output. */
  readonly saveMapping?: boolean;
}

/** The result of a run, with the workbook, the port it was built in and the options it was built with. */
export interface TakedownFileResult {
  readonly result: TakedownBuildResult;
  readonly workbook: XlsxWorkbook;
  readonly port: MemoryWorkbookPort;
  readonly options: TakedownOptions;
  /** The unit system the table headers show, when they show one. */
  readonly headerUnits?: UnitSystem;
  /** The workbook's saved matching (settings sheet), when it has one. */
  readonly saved?: SavedMatching;
  /** A takedown built from the framing plan: the plan tables read and the derivation. */
  readonly plan?: { readonly names: PlanTableNames; readonly derivation: Derivation | null };
}

/**
 * Parse `--map` entries: `members.Trib=Trib width` -> { members: { Trib: "Trib width" } }. The
 * value names the user's column by its header (`Supported by (end)`), by group and header under
 * a group row (`End/Location`) or by the sheet's column letter (`J`).
 * @param entries - the option's values
 * @returns the mapping, or an error message naming the bad entry
 */
export function parseMappings(entries: readonly string[]): { mapping: ColumnMapping } | { error: string } {
  const out: Record<"zones" | "members" | "loads" | "bearings", Record<string, string>> = { zones: {}, members: {}, loads: {}, bearings: {} };
  for (const e of entries) {
    const m = /^\s*(zones|members|loads|bearings)\.([^=]+?)\s*=\s*(.*?)\s*$/i.exec(e);
    if (!m) return { error: `--map "${e}": write it as <table>.<Column>=<your header, Group/Header or column letter>, table zones, members, loads or bearings (e.g. members.Trib="Trib width", members.End at=J).` };
    out[m[1]!.toLowerCase() as "zones" | "members" | "loads" | "bearings"][m[2]!] = m[3]!.replace(/^"(.*)"$/, "$1");
  }
  return { mapping: out };
}

/**
 * Parse `--header-row` entries: `5` (every table's header row is sheet row 5) or `members=5`
 * (that table only; repeatable, a table's own entry wins over a bare number).
 * @param entries - the option's values
 * @returns the header rows, or an error message naming the bad entry
 */
export function parseHeaderRows(entries: readonly string[]): { headerRows: HeaderRows } | { error: string } {
  let all: number | undefined;
  const own: { zones?: number; members?: number; loads?: number; bearings?: number } = {};
  for (const e of entries) {
    const m = /^\s*(?:(zones|members|loads|bearings)\s*=\s*)?(\d+)\s*$/i.exec(e);
    const n = m ? Number(m[2]) : NaN;
    if (!m || !Number.isSafeInteger(n) || n < 1) return { error: `--header-row "${e}": write the header row's sheet row number, 1 or more, for every table (--header-row 5) or one (--header-row members=5).` };
    if (m[1] === undefined) all = n;
    else own[m[1].toLowerCase() as "zones" | "members" | "loads" | "bearings"] = n;
  }
  if (all === undefined) return { headerRows: own };
  return { headerRows: { zones: own.zones ?? all, members: own.members ?? all, loads: own.loads ?? all, bearings: own.bearings ?? all } };
}

/**
 * The `parseArgs` options every verb that reads the member tables takes, with the same meaning
 * everywhere: `--zones`, `--members`, `--loads` name a table (Excel table, sheet or
 * `Sheet!A1:H20`), `--map` renames a column, `--units` is the unit system, `--sheet` names the
 * generated sheet and `--replace` lets it replace a same-named sheet the add-in did not make.
 */
export function tableOptions(): NonNullable<ParseArgsConfig["options"]> {
  return {
    units: { type: "string" },
    zones: { type: "string" },
    members: { type: "string" },
    loads: { type: "string" },
    bearings: { type: "string" },
    framing: { type: "string" },
    decks: { type: "string" },
    grids: { type: "string" },
    levels: { type: "string" },
    tolerance: { type: "string" },
    map: { type: "string", multiple: true },
    "header-row": { type: "string", multiple: true },
    sheet: { type: "string" },
    replace: { type: "boolean" },
  };
}

/** The usage lines of {@link tableOptions}, shared by the verbs' help texts. */
export const TABLE_OPTIONS_USAGE = `  --zones, --members, --loads, --bearings <name>
                 Excel table, sheet (its used range) or Sheet!A1:H20 of each table;
                 default: the table or sheet named Zones, Members and (if present) Loads
                 and Bearings
  --framing, --decks, --grids, --levels <name>
                 the framing plan's tables: the takedown is built from the plan (members,
                 supports and tributary loads derived onto the generated sheets "Plan
                 members", "Plan loads" and "Plan bearings") when --framing is given, or
                 when the workbook has Framing and Decks and no Members; default: the
                 tables or sheets so named
  --tolerance <length>
                 the framing plan's snapping tolerance (ft or m, the plan's units):
                 member ends and corners closer than this are one point; default 1/16 in
                 (0.0052083 ft) or 1.5 mm (0.0015 m)
  --map <table>.<Column>=<your header | Group/Header | column letter>
                 a column whose header differs, e.g. --map members.Trib="Trib width",
                 --map "members.End at=End/Location" (header under the group row's
                 "End"), --map "members.End at=J" (sheet column J); repeatable; table
                 zones, members, loads or bearings
  --header-row [<table>=]<row>
                 the header row's sheet row (1-based), for every table or one
                 (--header-row members=5); default: found among the first 20 rows
  --units US|SI  US (ft, psf, plf, lb; results in kip) or SI (m, kPa, kN/m, kN); default:
                 the system the table headers' units show ("Span (m)"), else US
  --sheet <name> name of the generated sheet (default "Takedown")
  --replace      replace a same-named sheet the add-in did not create`;

/** Option values as `parseArgs` gives them. */
export type OptionValues = Readonly<Record<string, string | boolean | (string | boolean)[] | undefined>>;

function stringOf(v: OptionValues[string]): string | undefined {
  return typeof v === "string" ? v : undefined;
}

/**
 * Why a name cannot be a worksheet's name in Excel (undefined when it can): 1 to 31 characters,
 * none of : \ / ? * [ ], not beginning or ending with an apostrophe, not "History" (reserved).
 * @param name - the name asked for
 */
export function sheetNameProblem(name: string): string | undefined {
  if (name.length === 0) return "--sheet: a sheet name cannot be empty.";
  if (name.length > 31) return `--sheet "${name}": ${name.length} characters; Excel allows at most 31.`;
  const bad = /[:\\/?*[\]]/.exec(name);
  if (bad) return `--sheet "${name}": Excel does not allow "${bad[0]}" in a sheet name (nor any of : \\ / ? * [ ]).`;
  if (/[\u0000-\u001F\u007F]/.test(name)) return `--sheet: the name holds a control character.`;
  if (name.startsWith("'") || name.endsWith("'")) return `--sheet "${name}": a sheet name cannot begin or end with an apostrophe.`;
  if (name.trim().toLowerCase() === "history") return `--sheet "${name}": "History" is reserved by Excel.`;
  return undefined;
}

/**
 * Check the table options and turn them into a run: `--units` is US or SI (left out: read from
 * the headers when the file is read), every `--map` entry is `<table>.<Column>=<header>`,
 * `--sheet` a name Excel accepts.
 * @param values - the parsed option values
 * @returns the run, or a message for the user
 */
export function runOfOptions(values: OptionValues): { run: TakedownRun } | { error: string } {
  const given = stringOf(values.units);
  const unitsText = given?.trim().toUpperCase();
  if (unitsText !== undefined && unitsText !== "US" && unitsText !== "SI") return { error: `--units is US or SI (got "${given}").` };
  const mapValues = Array.isArray(values.map) ? values.map.filter((v): v is string => typeof v === "string") : [];
  const maps = parseMappings(mapValues);
  if ("error" in maps) return { error: maps.error };
  const rowValues = Array.isArray(values["header-row"]) ? values["header-row"].filter((v): v is string => typeof v === "string") : [];
  const rows = parseHeaderRows(rowValues);
  if ("error" in rows) return { error: rows.error };
  const sheet = stringOf(values.sheet);
  const sheetProblem = sheet === undefined ? undefined : sheetNameProblem(sheet);
  if (sheetProblem !== undefined) return { error: sheetProblem };
  const zones = stringOf(values.zones);
  const members = stringOf(values.members);
  const loads = stringOf(values.loads);
  const bearings = stringOf(values.bearings);
  const toleranceText = stringOf(values.tolerance);
  const tolerance = toleranceText === undefined ? undefined : Number(toleranceText.trim());
  if (toleranceText !== undefined && (toleranceText.trim() === "" || !Number.isFinite(tolerance) || tolerance! <= 0)) {
    return { error: `--tolerance is a positive length in the plan's units, ft or m (got "${toleranceText}").` };
  }
  const plan = Object.fromEntries((["framing", "decks", "grids", "levels"] as const).flatMap((k) => (stringOf(values[k]) !== undefined ? [[k, stringOf(values[k])!]] : [])));
  return {
    run: {
      ...(unitsText !== undefined ? { units: unitsText } : {}),
      mapping: maps.mapping,
      ...(Object.keys(rows.headerRows).length > 0 ? { headerRows: rows.headerRows } : {}),
      ...(zones !== undefined ? { zones } : {}),
      ...(members !== undefined ? { members } : {}),
      ...(loads !== undefined ? { loads } : {}),
      ...(bearings !== undefined ? { bearings } : {}),
      ...plan,
      ...(tolerance !== undefined ? { tolerance } : {}),
      ...(sheet !== undefined ? { sheet } : {}),
      replace: values.replace === true,
    },
  };
}

/** Whether the run names a table or a column mapping (rather than leaving everything to the defaults). */
export function namesTables(run: TakedownRun): boolean {
  const mapped = run.mapping !== undefined && Object.values(run.mapping).some((m) => m !== undefined && Object.keys(m).length > 0);
  return run.zones !== undefined || run.members !== undefined || run.loads !== undefined || run.bearings !== undefined || mapped || run.headerRows !== undefined;
}

/**
 * Cells that may carry a table's units: an Excel table's header row, else the first
 * {@link HEADER_SEARCH_ROWS} rows of the sheet or range (the header row may sit below a title
 * block, with a units row under it).
 */
export function headersOf(wb: XlsxWorkbook, name: string): string[] {
  const table = wb.tables.find((t) => t.name.toLowerCase() === name.toLowerCase());
  if (table) return [...table.headers];
  const sheetName = /^'?(.+?)'?!/.exec(name)?.[1]?.replace(/''/g, "'") ?? name;
  const sheet = wb.sheets.find((s) => s.name.toLowerCase() === sheetName.toLowerCase());
  return (sheet?.rows.slice(0, HEADER_SEARCH_ROWS) ?? []).flat().map((v) => (typeof v === "string" ? v.replace(/^'/, "") : ""));
}

const QUANTITIES = ["length", "areaLoad", "lineLoad", "force"] as const;

/**
 * The unit system the units in the tables' headers show (`Span (m)`, `D (psf)`, a units row's
 * `(m)` or `[kPa]`): SI or US when every recognised unit belongs to one system; undefined when
 * they show none or both. Bare words ("m") are not read as units here: a level may be called M.
 * @param wb - the workbook read
 * @param tables - names of the tables (or sheets) to look at
 */
export function unitsShownByHeaders(wb: XlsxWorkbook, tables: readonly string[]): UnitSystem | undefined {
  const shown = new Set<UnitSystem>();
  for (const t of tables) {
    for (const h of headersOf(wb, t)) {
      const unit = /\(([^()]*)\)\s*$/.exec(h)?.[1] ?? /^\s*\[([^[\]]*)\]\s*$/.exec(h)?.[1];
      if (unit === undefined) continue;
      for (const system of ["US", "SI"] as const) if (QUANTITIES.some((q) => unitFits(q, system, unit))) shown.add(system);
    }
  }
  return shown.size === 1 ? [...shown][0] : undefined;
}

/**
 * The table called `name` (any case), else the sheet so called, by the workbook's own spelling.
 * @param wb - the workbook read
 * @param name - the name looked for ("Zones", say)
 * @returns the table's or sheet's name, or undefined when the workbook has neither
 */
export function tableOrSheet(wb: XlsxWorkbook, name: string): string | undefined {
  const key = name.toLowerCase();
  return wb.tables.find((t) => t.name.toLowerCase() === key)?.name ?? wb.sheets.find((s) => s.name.toLowerCase() === key)?.name;
}

/** A name given, or the table/sheet named `fallback` when the workbook has one. */
function tableName(wb: XlsxWorkbook, given: string | undefined, fallback: string): string | undefined {
  return given ?? tableOrSheet(wb, fallback);
}

/**
 * Build the takedown of an .xlsx file in memory (nothing written).
 * @param input - path of the workbook
 * @param run - unit system, table names, mapping
 * @throws Error when the file cannot be read, or a table name is missing and no default exists
 */
export async function takedownOfFile(input: string, run: TakedownRun): Promise<TakedownFileResult> {
  const workbook = await readInputWorkbook(input);
  const port = await MemoryWorkbookPort.create({ sheets: engineSheets(workbook), tables: workbook.tables.map((t) => ({ name: t.name, sheet: t.sheet, ref: t.ref })), names: workbook.names, dates: dateCells(workbook) });
  const read = await readSavedMatching(port);
  if (read !== null && "error" in read) throw new Error(`${input}: ${read.error}`);
  const saved = read?.matching;
  const used = overMatching(saved ?? {}, givenMatching(run));
  const zones = tableName(workbook, used.tables?.zones, "Zones");
  const members = tableName(workbook, used.tables?.members, "Members");
  const framing = tableName(workbook, run.framing, "Framing");
  const decks = tableName(workbook, run.decks, "Decks");
  if (run.framing !== undefined || (members === undefined && framing !== undefined && decks !== undefined)) {
    if (zones === undefined) throw new Error(`${input}: no Zones table or sheet; name it with --zones.`);
    if (framing === undefined) throw new Error(`${input}: no Framing table or sheet; name it with --framing.`);
    if (run.saveMapping) throw new Error(`--save-mapping saves the member tables' matching; a takedown from the framing plan has none to save.`);
    const grids = tableName(workbook, run.grids, "Grids");
    const levels = tableName(workbook, run.levels, "Levels");
    const headerUnits = unitsShownByHeaders(workbook, [zones, framing]);
    const units = used.units ?? headerUnits ?? "US";
    const zonesMap = used.mapping?.zones;
    const options: TakedownOptions = {
      zones,
      members: PLAN_SHEETS.members,
      loads: PLAN_SHEETS.loads,
      bearings: PLAN_SHEETS.bearings,
      units,
      ...(zonesMap ? { mapping: { zones: zonesMap } } : {}),
      ...(used.headerRows?.zones !== undefined ? { headerRows: { zones: used.headerRows.zones } } : {}),
      ...(run.sheet ? { sheetName: run.sheet } : {}),
      replaceForeign: run.replace === true,
      ...(run.native ? { native: true } : {}),
    };
    const { members: _m, loads: _l, bearings: _b, ...rest } = options;
    const userLoads = tableName(workbook, used.tables?.loads, "Loads");
    const names = { framing, ...(decks !== undefined ? { decks } : {}), ...(grids !== undefined ? { grids } : {}), ...(levels !== undefined ? { levels } : {}), ...(userLoads !== undefined ? { loads: userLoads } : {}) };
    const planned = await buildPlanTakedown(port, names, rest, run.tolerance);
    return { result: planned.result, workbook, port, options, ...(headerUnits !== undefined ? { headerUnits } : {}), ...(saved !== undefined ? { saved } : {}), plan: { names, derivation: planned.derivation } };
  }
  if (zones === undefined || members === undefined) {
    throw new Error(`${input}: no ${zones === undefined ? "Zones" : "Members"} table or sheet; name it with --${zones === undefined ? "zones" : "members"}.`);
  }
  const tooLarge = takedownMemoryProblem(await tableRowCount(port, members));
  if (tooLarge !== undefined) throw new Error(`${input}: ${tooLarge}`);
  const loads = tableName(workbook, used.tables?.loads, "Loads");
  const bearings = tableName(workbook, used.tables?.bearings, "Bearings");
  const headerUnits = unitsShownByHeaders(workbook, [zones, members, ...(loads !== undefined ? [loads] : [])]);
  const units = used.units ?? headerUnits ?? "US";
  const options: TakedownOptions = {
    zones,
    members,
    ...(loads !== undefined ? { loads } : {}),
    ...(bearings !== undefined ? { bearings } : {}),
    units,
    ...(used.mapping ? { mapping: used.mapping } : {}),
    ...(used.headerRows ? { headerRows: used.headerRows } : {}),
    ...(run.sheet ? { sheetName: run.sheet } : {}),
    replaceForeign: run.replace === true,
    ...(run.native ? { native: true } : {}),
  };
  if (run.saveMapping) {
    if ((run.sheet ?? "").toLowerCase() === SETTINGS_SHEET.toLowerCase()) throw new Error(`--sheet "${run.sheet}" is the settings sheet's name; choose another.`);
    // Queued on the port and written by the build's own flush (one engine rebuild, not two).
    await writeSavedMatching(port, { ...used, units, tables: { zones, members, ...(loads !== undefined ? { loads } : {}), ...(bearings !== undefined ? { bearings } : {}) } }, false);
  }
  const result = await buildTakedown(port, options);
  return { result, workbook, port, options, ...(headerUnits !== undefined ? { headerUnits } : {}), ...(saved !== undefined ? { saved } : {}) };
}

/** What the command line gives of a matching: tables named, `--map` entries, `--header-row`, `--units`. */
function givenMatching(run: TakedownRun): SavedMatching {
  const tables: Partial<Record<(typeof MATCHING_TABLES)[number], string>> = {};
  for (const t of MATCHING_TABLES) if (run[t] !== undefined) tables[t] = run[t]!;
  const mapping = Object.fromEntries(MATCHING_TABLES.filter((t) => Object.keys(run.mapping?.[t] ?? {}).length > 0).map((t) => [t, run.mapping![t]!]));
  return {
    ...(run.units !== undefined ? { units: run.units } : {}),
    tables,
    ...(run.headerRows !== undefined ? { headerRows: run.headerRows } : {}),
    mapping,
  };
}

/**
 * The option that would fit when the unit system used is not the one the headers show (a unit
 * mismatch is then among the problems), e.g. `the table headers show SI units (m, kPa, kN/m, kN);
 * run with --units SI.`; undefined when they agree or show none.
 * @param file - the build of a file
 */
export function unitsHint(file: Pick<TakedownFileResult, "options" | "headerUnits">): string | undefined {
  const shown = file.headerUnits;
  if (shown === undefined || shown === file.options.units) return undefined;
  const names = shown === "SI" ? "m, kPa, kN/m, kN" : "ft, psf, plf, lb";
  return `the table headers show ${shown} units (${names}); run with --units ${shown}.`;
}
