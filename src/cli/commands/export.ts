/**
 * `loadpath export <in.xlsx> -o <handoff.xlsx>`: the hand-off workbook. Every takedown sheet of
 * the workbook (recognised by its generated-sheet title, or named by the options) is rebuilt with
 * classic spreadsheet functions only, so the file recalculates without the add-in in Excel,
 * LibreOffice Calc and Gnumeric; add-in formulas elsewhere (the engineer's own sheets) become
 * their computed values, each with a cell note, listed on the notice sheet and on stdout; a
 * visible notice sheet says how the file was generated, its units, the code editions and the
 * caution. The input file is never changed; the hand-off file is written whole or not at all.
 * Problems with single members leave those members out, are listed on the notice sheet and give
 * exit status 1 with the file still written.
 */
import { resolve } from "node:path";
import type ExcelJS from "exceljs";
import { noticeRows, NOTICE_SHEET, type ValueOnlyCell } from "../../engine/native/notice";
import { helperSheetName } from "../../engine/native/takedown-writer";
import { cellAddress } from "../../workbook/a1";
import { callsLoadpath } from "../../workbook/headless";
import { exportSheets, MemoryWorkbookPort } from "../../workbook/memory-port";
import { GENERATED_MARKER } from "../../workbook/port";
import { overMatching, readSavedMatching, type SavedMatching } from "../../workbook/saved-matching";
import { buildTakedown, DEFAULT_TAKEDOWN_SHEET } from "../../workbook/takedown-build";
import type { Problem, TakedownJson, TakedownOptions, UnitSystem } from "../../workbook/takedown-api";
import { writeTextAtomically } from "../../workbook/files";
import { cacheResults, dateCells, engineSheets, writeXlsx, type XlsxWorkbook } from "../../workbook/xlsx";
import { EXIT, outputsRefused, parseVerbArgs, readInputWorkbook, singleInput, usageOnThrow, type CliIO, type Command } from "../shared";
import { namesTables, runOfOptions, TABLE_OPTIONS_USAGE, tableOptions, tableOrSheet, unitsHint, unitsShownByHeaders, type TakedownRun } from "../takedown-input";
import { describeTakedownProblem } from "./takedown";

const USAGE = `Usage: loadpath export <in.xlsx> [-o <handoff.xlsx>] [--json <file>]
                     [--zones <name>] [--members <name>] [--loads <name>]
                     [--map <table>.<Column>=<your header> ...] [--header-row [<table>=]<row>]
                     [--units US|SI] [--sheet <name>] [--replace]

Writes a hand-off copy of the workbook that recalculates without the Loadpath add-in (Excel,
LibreOffice Calc, Gnumeric): every takedown sheet is rebuilt with classic spreadsheet functions
only (reactions, exact maximum shear and moment, tributary areas, column accumulation, live load
reduction, governing combination, load balance), all live on the input tables. Add-in formulas
on other sheets are written as their computed values with a note on each cell; the command lists
them. A "${NOTICE_SHEET}" sheet says how the file was generated, its units, the code editions,
the members left out by problems, and that results need a qualified engineer's review. The input
is never changed.

Takedown sheets are found by their title line. A workbook without one, or a command naming a
table (--zones, --members, --loads, --map) or --sheet, gets one takedown built from its tables
(default: the tables or sheets named Zones, Members and, if present, Loads).

  -o, --output   hand-off workbook to write (never the input file); without -o the takedowns
                 are rebuilt and checked, and nothing is written
  --json         also write the takedown results (fields in docs/interface.md) and the
                 value-only list
${TABLE_OPTIONS_USAGE}

Problems are listed on stderr as Sheet!A1: message. Exit status: 0 written without problems,
1 problems found (what could be built is still written; members left out are listed on the
notice sheet), 2 usage or file errors (nothing written). Interface: docs/interface.md.`;

/** A takedown to rebuild: its options (tables, units) and the sheet it goes on. */
export interface TakedownSpec {
  readonly sheet: string;
  readonly options: TakedownOptions;
}

/** What an export did. */
export interface ExportReport {
  /** False when problems stopped a takedown (nothing written). */
  readonly ok: boolean;
  readonly problems: readonly Problem[];
  /** Which `--units` would fit when the headers show another system than a takedown used. */
  readonly hints: readonly string[];
  /** Whether the hand-off file was written (an output was named and every takedown was built). */
  readonly written: boolean;
  readonly takedowns: readonly { readonly sheet: string; readonly helperSheet: string; readonly members: number; readonly json?: TakedownJson }[];
  readonly valueOnly: readonly ValueOnlyCell[];
  readonly noticeSheet: string;
}

/** Options of {@link exportHandoff}. */
export interface ExportOptions {
  /** Takedowns to build; default: {@link takedownsOf} (the takedown sheets found, else the default tables). */
  readonly takedowns?: readonly TakedownSpec[];
  /** Unit system of a takedown built from the default tables (default: read from their headers). */
  readonly units?: UnitSystem;
  /**
   * Table options of the command line: when they name a table, a mapping or a sheet, one
   * takedown is built from the tables (see {@link takedownsOfRun}).
   */
  readonly run?: TakedownRun;
  /** Date written on the notice sheet (default: today, ISO). */
  readonly date?: string;
  /** Folder of the built functions bundle (tests). */
  readonly distDir?: string;
}

const TITLE = new RegExp(
  `^${GENERATED_MARKER.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}: load takedown \\((US|SI)\\) from Zones: (.+?), Members: (.+?)(?:, Loads: (.+?))?(?:, Bearings: (.+?))?\\.(?: Hand-off version.*)?$`,
);

/**
 * The takedown options written in a generated takedown sheet's title line (see sheetTitle in
 * src/workbook/takedown-build.ts), or null when the text is not such a title.
 * @param title - the sheet's A1 text
 * @param sheet - the sheet's name
 */
export function takedownFromTitle(title: string, sheet: string): TakedownSpec | null {
  const m = TITLE.exec(title.trim());
  if (!m) return null;
  const options: TakedownOptions = { units: m[1] as UnitSystem, zones: m[2]!, members: m[3]!, ...(m[4] ? { loads: m[4] } : {}), ...(m[5] ? { bearings: m[5] } : {}), sheetName: sheet };
  return { sheet, options };
}

/** Every takedown sheet of a workbook, found by its title line. */
export function findTakedowns(wb: XlsxWorkbook): TakedownSpec[] {
  const out: TakedownSpec[] = [];
  for (const s of wb.sheets) {
    const a1 = s.rows[0]?.[0];
    const text = typeof a1 === "string" ? a1.replace(/^'/, "") : "";
    const spec = takedownFromTitle(text, s.name);
    if (spec) out.push(spec);
  }
  return out;
}

/**
 * The unit system the member tables are written in, from the units in their headers
 * ("Span (m)", "wD (kN/m)" -> SI; "Span (ft)" -> US; none or both -> US).
 */
export function unitsOfTables(wb: XlsxWorkbook, tables: readonly string[]): UnitSystem {
  return unitsShownByHeaders(wb, tables) ?? "US";
}

/**
 * The takedowns to rebuild: the takedown sheets found by their title; when there are none, one
 * built from the tables named Zones, Members and (if present) Loads, on sheet "Takedown", in the
 * unit system given or read from the tables' headers.
 * @param wb - the workbook
 * @param units - unit system for a takedown built from the default tables (default: from the headers)
 */
export function takedownsOf(wb: XlsxWorkbook, units?: UnitSystem): TakedownSpec[] {
  const found = findTakedowns(wb);
  if (found.length > 0) return found;
  const zones = tableOrSheet(wb, "Zones");
  const members = tableOrSheet(wb, "Members");
  if (zones === undefined || members === undefined) return [];
  const loads = tableOrSheet(wb, "Loads");
  const bearings = tableOrSheet(wb, "Bearings");
  const sheet = DEFAULT_TAKEDOWN_SHEET;
  return [{ sheet, options: { zones, members, ...(loads ? { loads } : {}), ...(bearings ? { bearings } : {}), units: units ?? unitsOfTables(wb, [zones, members, ...(loads ? [loads] : [])]), sheetName: sheet } }];
}

/**
 * Takedowns with the workbook's saved matching (its settings sheet) under their own options: the
 * columns and header rows saved are used where the command line gives none.
 * @param specs - the takedowns to build
 * @param saved - the saved matching, when the workbook has one
 */
function withSavedMatching(specs: readonly TakedownSpec[], saved: SavedMatching | undefined): TakedownSpec[] {
  if (saved === undefined) return [...specs];
  return specs.map((spec) => {
    const m = overMatching(saved, { ...(spec.options.mapping ? { mapping: spec.options.mapping } : {}), ...(spec.options.headerRows ? { headerRows: spec.options.headerRows } : {}) });
    return { ...spec, options: { ...spec.options, ...(m.mapping ? { mapping: m.mapping } : {}), ...(m.headerRows ? { headerRows: m.headerRows } : {}) } };
  });
}

/**
 * A command line that builds from the tables (it names a table, a mapping or a header row) takes
 * the tables and the unit system it does not give from the saved matching; one that names none is left as it is (it
 * rebuilds the takedown sheets found by their titles).
 */
function withSavedTables(run: TakedownRun, saved: SavedMatching): TakedownRun {
  if (!namesTables(run)) return run;
  const t = saved.tables ?? {};
  const zones = run.zones ?? t.zones;
  const members = run.members ?? t.members;
  const loads = run.loads ?? t.loads;
  const bearings = run.bearings ?? t.bearings;
  const units = run.units ?? saved.units;
  return { ...run, ...(units !== undefined ? { units } : {}), ...(zones !== undefined ? { zones } : {}), ...(members !== undefined ? { members } : {}), ...(loads !== undefined ? { loads } : {}), ...(bearings !== undefined ? { bearings } : {}) };
}

/**
 * The takedowns of a command line: when it names a table, a mapping or a sheet, one takedown
 * from the tables (each not named: the table or sheet so called), in the units given or shown by
 * the headers, on the sheet given (default "Takedown"); otherwise {@link takedownsOf}.
 * @param wb - the workbook
 * @param run - the table options
 * @throws Error when a table is neither named nor found by its default name
 */
export function takedownsOfRun(wb: XlsxWorkbook, run: TakedownRun): TakedownSpec[] {
  if (!namesTables(run) && run.sheet === undefined) {
    return takedownsOf(wb, run.units).map((t) => ({ ...t, options: { ...t.options, ...(run.replace ? { replaceForeign: true } : {}) } }));
  }
  const zones = run.zones ?? tableOrSheet(wb, "Zones");
  const members = run.members ?? tableOrSheet(wb, "Members");
  if (zones === undefined || members === undefined) throw new Error(`no ${zones === undefined ? "Zones" : "Members"} table or sheet; name it with --${zones === undefined ? "zones" : "members"}.`);
  const loads = run.loads ?? tableOrSheet(wb, "Loads");
  const bearings = run.bearings ?? tableOrSheet(wb, "Bearings");
  const sheet = run.sheet ?? DEFAULT_TAKEDOWN_SHEET;
  const units = run.units ?? unitsOfTables(wb, [zones, members, ...(loads ? [loads] : [])]);
  return [{ sheet, options: { zones, members, ...(loads ? { loads } : {}), ...(bearings ? { bearings } : {}), units, ...(run.mapping ? { mapping: run.mapping } : {}), ...(run.headerRows ? { headerRows: run.headerRows } : {}), sheetName: sheet, ...(run.replace ? { replaceForeign: true } : {}) } }];
}

/** Why a LOADPATH formula outside a takedown sheet is written as its value in the hand-off file. */
export function valueOnlyReason(formula: string): string {
  const name = /(?:LOADPATH\.|_xldudf_LOADPATH_)([A-Za-z0-9_]+)\s*\(/i.exec(formula)?.[1]?.toUpperCase() ?? "an add-in function";
  if (/^(DEFLECTION_|REQUIRED_I)/.test(name)) return `${name}: a deflection needs the member's elastic curve (EI), solved by the add-in`;
  if (name === "GOVERNING") return `${name}: governing values over the load combinations and live load patterns, computed by the add-in`;
  if (/^(DIAGRAM|REACTIONS|COMBOS)$/.test(name)) return `${name}: a spilled list computed by the add-in`;
  return `${name} on your own sheet: the hand-off version rebuilds takedown sheets in classic functions, other add-in formulas keep their values`;
}

/** Text in column A of a cell's row (the mark of a schedule row), if any. */
function markOf(wb: XlsxWorkbook, sheet: string, row: number): string | undefined {
  const v = wb.sheets.find((s) => s.name === sheet)?.rows[row]?.[0];
  if (typeof v !== "string" || v.startsWith("=")) return undefined;
  return v.replace(/^'/, "");
}

/** A free sheet name for the notice: "Read me", or "Read me (hand-off)" when the user has a "Read me". */
function noticeName(wb: XlsxWorkbook): string {
  const existing = wb.excel.getWorksheet(NOTICE_SHEET);
  if (!existing) return NOTICE_SHEET;
  const a1 = existing.getCell(1, 1).value;
  return typeof a1 === "string" && a1.startsWith(GENERATED_MARKER) ? NOTICE_SHEET : `${NOTICE_SHEET} (hand-off)`;
}

/** Replace the workbook's notice sheet and put it first, visible and active. */
function writeNotice(excel: ExcelJS.Workbook, name: string, rows: readonly (readonly (string | null)[])[]): void {
  const old = excel.getWorksheet(name);
  if (old) excel.removeWorksheet(old.id);
  const ws = excel.addWorksheet(name, { state: "visible" });
  ws.getColumn(1).width = 110;
  rows.forEach((row, r) =>
    row.forEach((text, c) => {
      if (text === null) return;
      const cell = ws.getCell(r + 1, c + 1);
      cell.value = text;
      if (c === 0 && row.length === 1) cell.alignment = { wrapText: true, vertical: "top" };
    }),
  );
  ws.getCell(1, 1).font = { bold: true };
  // ExcelJS writes sheets in `orderNo` order (a runtime field its typings leave out)
  const ordered = (w: ExcelJS.Worksheet): { orderNo: number } => w as unknown as { orderNo: number };
  ordered(ws).orderNo = Math.min(...excel.worksheets.map((w) => ordered(w).orderNo)) - 1;
  const index = excel.worksheets.findIndex((w) => w.name === name);
  excel.views = [{ x: 0, y: 0, width: 20000, height: 12000, firstSheet: 0, activeTab: Math.max(0, index), visibility: "visible" }];
}

/** Turn the remaining add-in formulas into their computed values, each with a note. */
function writeValueOnly(wb: XlsxWorkbook, cells: readonly (ValueOnlyCell & { value: unknown })[]): void {
  for (const c of cells) {
    const ws = wb.excel.getWorksheet(c.sheet);
    if (!ws) continue;
    const cell = ws.getCell(c.address);
    const v = c.value;
    const isError = typeof v === "string" && /^#[A-Z/0!?]+[!?]?$/.test(v);
    cell.value = ((isError ? { error: v } : v) ?? null) as ExcelJS.CellValue;
    cell.note = `Hand-off version: a value, not a live formula (it does not update). Was =${c.formula} — ${c.reason}. Recompute with the Loadpath add-in after any change.`;
  }
}

/**
 * Read a workbook, rebuild its takedowns with classic functions, turn the other add-in formulas
 * into values, add the notice sheet (listing the members problems left out) and write the
 * hand-off file (whole or not at all). Nothing is written when problems stop a takedown.
 * @param input - the workbook (.xlsx)
 * @param output - the hand-off file to write (never the input unless the caller names it);
 *   undefined: build and check only
 * @param options - takedowns to build (default: found by title), notice date, bundle folder
 */
export async function exportHandoff(input: string, output: string | undefined, options: ExportOptions = {}): Promise<ExportReport> {
  const wb = await readInputWorkbook(input);
  const port = await MemoryWorkbookPort.create({
    sheets: engineSheets(wb),
    tables: wb.tables.map(({ name, sheet, ref }) => ({ name, sheet, ref })),
    names: wb.names,
    dates: dateCells(wb),
    ...(options.distDir ? { distDir: options.distDir } : {}),
  });
  const saved = await readSavedMatching(port);
  if (saved !== null && "error" in saved) throw new Error(`${input}: ${saved.error}`);
  const run = options.run && saved !== null && "matching" in saved ? withSavedTables(options.run, saved.matching) : options.run;
  const specs = withSavedMatching(options.takedowns ?? (run ? takedownsOfRun(wb, run) : takedownsOf(wb, options.units)), saved?.matching);
  const problems: Problem[] = [];
  const hints: string[] = [];
  const takedowns: { sheet: string; helperSheet: string; members: number; json?: TakedownJson }[] = [];
  // Takedown cells the classic functions cannot spell (continuous members), already values on the sheet.
  const takedownValues: ValueOnlyCell[] = [];
  for (const spec of specs) {
    const result = await buildTakedown(port, { ...spec.options, sheetName: spec.sheet, native: true });
    problems.push(...result.problems);
    const { zones, members, loads } = spec.options;
    const headerUnits = unitsShownByHeaders(wb, [zones, members, ...(loads ? [loads] : [])]);
    const hint = result.problems.length > 0 ? unitsHint({ options: spec.options, ...(headerUnits ? { headerUnits } : {}) }) : undefined;
    if (hint !== undefined) hints.push(hint);
    if (!result.ok) return { ok: false, problems, hints, written: false, takedowns, valueOnly: [], noticeSheet: "" };
    const j = result.json;
    const marks = new Set([...Object.keys(j?.members ?? {}), ...Object.keys(j?.columns ?? {}), ...Object.keys(j?.foundations ?? {})]);
    takedowns.push({ sheet: spec.sheet, helperSheet: helperSheetName(spec.sheet), members: marks.size, ...(j ? { json: j } : {}) });
    const plan = result.built?.plan;
    for (const v of plan?.valueOnly ?? []) {
      const cell = plan!.cells[v.row]?.[v.col];
      const formula = cell !== null && typeof cell === "object" ? cell.formula : "";
      takedownValues.push({ sheet: spec.sheet, address: cellAddress(v.row, v.col), mark: v.mark, formula, reason: v.reason });
    }
  }
  const generated = new Set(port.generatedSheets());
  const valueOnly = wb.formulas
    .filter((f) => !generated.has(f.sheet) && callsLoadpath(f.formula))
    .map((f) => {
      const address = cellAddress(f.row, f.col);
      const mark = markOf(wb, f.sheet, f.row);
      return { sheet: f.sheet, address, ...(mark ? { mark } : {}), formula: f.formula, reason: valueOnlyReason(f.formula), value: port.value(f.sheet, address) };
    });
  cacheResults({ ...wb, formulas: wb.formulas.filter((f) => !generated.has(f.sheet)) }, port.headless);
  exportSheets(port, wb.excel);
  writeValueOnly(wb, valueOnly);
  const name = noticeName(wb);
  const units = new Map(specs.map((s) => [s.sheet, s.options.units]));
  writeNotice(
    wb.excel,
    name,
    noticeRows({
      title: `${GENERATED_MARKER}: hand-off workbook (classic spreadsheet functions only).`,
      generator: "Loadpath (loadpath export)",
      date: options.date ?? new Date().toISOString().slice(0, 10),
      source: input.replace(/^.*[\\/]/, ""),
      takedowns: takedowns.map((t) => ({ sheet: t.sheet, helperSheet: t.helperSheet, units: units.get(t.sheet) ?? "US", members: t.members })),
      valueOnly: [...takedownValues, ...valueOnly.map(({ value: _value, ...rest }) => rest)],
    }).concat(leftOutRows(problems)),
  );
  if (output !== undefined) await writeXlsx(wb, resolve(output));
  return { ok: true, problems, hints, written: output !== undefined, takedowns, valueOnly: [...takedownValues, ...valueOnly.map(({ value: _value, ...rest }) => rest)], noticeSheet: name };
}

/**
 * Rows of the notice sheet about problems: the members they left out, one row per problem with
 * its cell (none when there were no problems).
 * @param problems - the problems of every takedown built
 */
export function leftOutRows(problems: readonly Problem[]): (string | null)[][] {
  if (problems.length === 0) return [];
  return [
    [],
    [`Problems found (${problems.length}): the members they concern are left out of the takedown, or carry less load than they should, until the input tables are corrected and the file is exported again.`],
    ...problems.map((p) => [describeTakedownProblem(p)]),
  ];
}

/**
 * The lines printed for a report.
 * @param report - what the export did
 * @param output - the file named with -o (undefined: check only)
 */
export function reportLines(report: ExportReport, output: string | undefined): { out: string[]; err: string[] } {
  const err = [...report.problems.map(describeTakedownProblem), ...report.hints.map((h) => `loadpath export: ${h}`)];
  if (!report.ok) return { out: [], err: [...err, "loadpath export: problems stopped the takedown; nothing written."] };
  const out = [output !== undefined ? `Hand-off workbook written to ${output}.` : "Hand-off workbook built and checked; check only, nothing written (give -o <handoff.xlsx> to write it)."];
  if (report.takedowns.length === 0) out.push("No takedown sheet or Zones and Members tables found (give --zones and --members to build one).");
  for (const t of report.takedowns) out.push(`  ${t.sheet}: ${t.members} members rebuilt with classic spreadsheet functions; exact shear and moment maxima on "${t.helperSheet}".`);
  if (report.problems.length > 0) out.push(`  Problems: ${report.problems.length}, listed on stderr${output !== undefined ? ` and on "${report.noticeSheet}"` : ""}; the members they concern are left out or incomplete.`);
  if (report.valueOnly.length === 0) out.push("  Written as values (not live): none; every result is a live formula.");
  else {
    out.push(`  Written as values (not live; recompute with the add-in after a change): ${report.valueOnly.length} cell(s):`);
    for (const v of report.valueOnly) out.push(`    ${v.sheet}!${v.address}${v.mark ? ` (${v.mark})` : ""}: ${v.reason}`);
  }
  out.push(`  Notice sheet: "${report.noticeSheet}" (how it was generated, units, code editions, caution).`);
  out.push("Results are for review by a qualified engineer; local codes govern.");
  return { out, err };
}

const exportCommand: Command = {
  summary: "write a hand-off copy that recalculates without the add-in (Excel, LibreOffice Calc, Gnumeric)",
  usage: USAGE,
  async run(args, io: CliIO) {
    const parsed = parseVerbArgs("export", USAGE, args, { output: { type: "string", short: "o" }, json: { type: "string" }, ...tableOptions() }, io);
    if (!parsed) return EXIT.usage;
    const input = singleInput("export", USAGE, parsed.positionals, io);
    if (input === undefined) return EXIT.usage;
    const v = parsed.values;
    const output = typeof v.output === "string" ? v.output : undefined;
    const jsonPath = typeof v.json === "string" ? v.json : undefined;
    const outputs = [output !== undefined ? { option: "-o", path: output } : undefined, jsonPath !== undefined ? { option: "--json", path: jsonPath } : undefined];
    if (outputsRefused("export", [input], outputs, io)) return EXIT.usage;
    const checked = runOfOptions(v);
    if ("error" in checked) {
      io.err(`loadpath export: ${checked.error}`);
      return EXIT.usage;
    }
    const planOption = (["framing", "decks", "grids", "levels", "tolerance"] as const).find((k) => checked.run[k] !== undefined);
    if (planOption !== undefined) {
      io.err(`loadpath export: --${planOption}: export hands off the takedown sheets of a workbook; build the takedown from the plan first (loadpath takedown <in.xlsx> --framing ... -o built.xlsx), then export built.xlsx.`);
      return EXIT.usage;
    }
    return usageOnThrow("export", io, async () => {
      const report = await exportHandoff(input, output, { run: checked.run });
      const lines = reportLines(report, output);
      lines.err.forEach((l) => io.err(l));
      lines.out.forEach((l) => io.out(l));
      if (jsonPath !== undefined && report.ok) {
        const json = { takedowns: Object.fromEntries(report.takedowns.map((t) => [t.sheet, t.json ?? null])), valueOnly: report.valueOnly };
        await writeTextAtomically(resolve(jsonPath), JSON.stringify(json, null, 2) + "\n");
        io.out(`Results written to ${jsonPath}.`);
      }
      return report.ok && report.problems.length === 0 ? EXIT.ok : EXIT.failed;
    });
  },
};

export default exportCommand;
