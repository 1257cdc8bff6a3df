/**
 * What the verbs that build a takedown from an .xlsx file share (`loadpath takedown`,
 * `loadpath report`): the table options (`--units`, `--zones`, `--members`, `--loads`, `--map`),
 * their checks, the default tables' lookup (also used by `loadpath export`) and the headless
 * build of a file in memory.
 */
import type { ParseArgsConfig } from "node:util";
import { MemoryWorkbookPort } from "../workbook/memory-port";
import { tableRowCount, takedownMemoryProblem } from "../workbook/size-limits";
import { buildTakedown } from "../workbook/takedown-build";
import type { ColumnMapping, TakedownBuildResult, TakedownOptions, UnitSystem } from "../workbook/takedown-api";
import { engineSheets, readXlsx, type XlsxWorkbook } from "../workbook/xlsx";

/** What a takedown run needs besides the files. */
export interface TakedownRun {
  readonly units: UnitSystem;
  readonly zones?: string;
  readonly members?: string;
  readonly loads?: string;
  readonly mapping?: ColumnMapping;
  readonly sheet?: string;
  readonly replace?: boolean;
  /** Hand-off version: classic spreadsheet functions only. */
  readonly native?: boolean;
}

/** The result of a run, with the workbook, the port it was built in and the options it was built with. */
export interface TakedownFileResult {
  readonly result: TakedownBuildResult;
  readonly workbook: XlsxWorkbook;
  readonly port: MemoryWorkbookPort;
  readonly options: TakedownOptions;
}

/**
 * Parse `--map` entries: `members.Trib=Trib width` -> { members: { Trib: "Trib width" } }.
 * @param entries - the option's values
 * @returns the mapping, or an error message naming the bad entry
 */
export function parseMappings(entries: readonly string[]): { mapping: ColumnMapping } | { error: string } {
  const out: Record<"zones" | "members" | "loads", Record<string, string>> = { zones: {}, members: {}, loads: {} };
  for (const e of entries) {
    const m = /^\s*(zones|members|loads)\.([^=]+?)\s*=\s*(.*?)\s*$/i.exec(e);
    if (!m) return { error: `--map "${e}": write it as <table>.<Column>=<your header>, table zones, members or loads (e.g. members.Trib="Trib width").` };
    out[m[1]!.toLowerCase() as "zones" | "members" | "loads"][m[2]!] = m[3]!.replace(/^"(.*)"$/, "$1");
  }
  return { mapping: out };
}

/**
 * The `parseArgs` options of the table choices. The Members table's option is `--members` in
 * `loadpath takedown`; a verb that uses `--members` for something else names it differently.
 * @param membersOption - name of the Members table's option (without the dashes)
 */
export function tableOptions(membersOption = "members"): NonNullable<ParseArgsConfig["options"]> {
  return {
    units: { type: "string" },
    zones: { type: "string" },
    [membersOption]: { type: "string" },
    loads: { type: "string" },
    map: { type: "string", multiple: true },
  };
}

/** Option values as `parseArgs` gives them. */
export type OptionValues = Readonly<Record<string, string | boolean | (string | boolean)[] | undefined>>;

function stringOf(v: OptionValues[string]): string | undefined {
  return typeof v === "string" ? v : undefined;
}

/**
 * Check the table options and turn them into a run: `--units` is US or SI (default US), every
 * `--map` entry is `<table>.<Column>=<header>`.
 * @param values - the parsed option values
 * @param membersOption - name of the Members table's option (see {@link tableOptions})
 * @returns the run, or a message for the user
 */
export function runOfOptions(values: OptionValues, membersOption = "members"): { run: TakedownRun } | { error: string } {
  const given = stringOf(values.units);
  const unitsText = (given ?? "US").toUpperCase();
  if (unitsText !== "US" && unitsText !== "SI") return { error: `--units is US or SI (got "${given}").` };
  const mapValues = Array.isArray(values.map) ? values.map.filter((v): v is string => typeof v === "string") : [];
  const maps = parseMappings(mapValues);
  if ("error" in maps) return { error: maps.error };
  const zones = stringOf(values.zones);
  const members = stringOf(values[membersOption]);
  const loads = stringOf(values.loads);
  return {
    run: {
      units: unitsText,
      mapping: maps.mapping,
      ...(zones !== undefined ? { zones } : {}),
      ...(members !== undefined ? { members } : {}),
      ...(loads !== undefined ? { loads } : {}),
    },
  };
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
 * @param membersOption - name of the Members table's option, for the message when it is missing
 * @throws Error when the file cannot be read, or a table name is missing and no default exists
 */
export async function takedownOfFile(input: string, run: TakedownRun, membersOption = "members"): Promise<TakedownFileResult> {
  const workbook = await readXlsx(input);
  const port = await MemoryWorkbookPort.create({ sheets: engineSheets(workbook), tables: workbook.tables.map((t) => ({ name: t.name, sheet: t.sheet, ref: t.ref })), names: workbook.names });
  const zones = tableName(workbook, run.zones, "Zones");
  const members = tableName(workbook, run.members, "Members");
  if (zones === undefined || members === undefined) {
    throw new Error(`${input}: no ${zones === undefined ? "Zones" : "Members"} table or sheet; name it with --${zones === undefined ? "zones" : membersOption}.`);
  }
  const tooLarge = takedownMemoryProblem(await tableRowCount(port, members));
  if (tooLarge !== undefined) throw new Error(`${input}: ${tooLarge}`);
  const loads = tableName(workbook, run.loads, "Loads");
  const options: TakedownOptions = {
    zones,
    members,
    ...(loads !== undefined ? { loads } : {}),
    units: run.units,
    ...(run.mapping ? { mapping: run.mapping } : {}),
    ...(run.sheet ? { sheetName: run.sheet } : {}),
    replaceForeign: run.replace === true,
    ...(run.native ? { native: true } : {}),
  };
  const result = await buildTakedown(port, options);
  return { result, workbook, port, options };
}
