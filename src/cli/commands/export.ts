/**
 * `loadpath export <in.xlsx> -o <handoff.xlsx>`: the hand-off workbook. Every takedown sheet of
 * the workbook (recognised by its generated-sheet title, or named by the options) is rebuilt with
 * classic spreadsheet functions only, so the file recalculates without the add-in in Excel,
 * LibreOffice Calc and Gnumeric; add-in formulas elsewhere (the engineer's own sheets) become
 * their computed values, each with a cell note, listed on the notice sheet and on stdout; a
 * visible notice sheet says how the file was generated, its units, the code editions and the
 * caution. The input file is never changed.
 */
import { resolve } from "node:path";
import type ExcelJS from "exceljs";
import { noticeRows, NOTICE_SHEET, type ValueOnlyCell } from "../../engine/native/notice";
import { helperSheetName } from "../../engine/native/takedown-writer";
import { cellAddress } from "../../workbook/a1";
import { callsLoadpath } from "../../workbook/headless";
import { exportSheets, MemoryWorkbookPort } from "../../workbook/memory-port";
import { GENERATED_MARKER } from "../../workbook/port";
import { buildTakedown, DEFAULT_TAKEDOWN_SHEET } from "../../workbook/takedown-build";
import type { Problem, TakedownJson, TakedownOptions, UnitSystem } from "../../workbook/takedown-api";
import { cacheResults, engineSheets, readXlsx, writeXlsx, type XlsxWorkbook } from "../../workbook/xlsx";
import { EXIT, type CliIO, type Command } from "../main";
import { parseVerbArgs, usageOnThrow, writesOverInput } from "../shared";
import { tableOrSheet } from "../takedown-input";
import { describeTakedownProblem } from "./takedown";

const USAGE = `Usage: loadpath export <in.xlsx> -o <handoff.xlsx> [options]

Writes a hand-off copy of the workbook that recalculates without the Loadpath add-in (Excel,
LibreOffice Calc, Gnumeric): every takedown sheet is rebuilt with classic spreadsheet functions
only (reactions, exact maximum shear and moment, tributary areas, column accumulation, live load
reduction, governing combination, load balance), all live on the input tables. Add-in formulas
on other sheets are written as their computed values with a note on each cell; the command lists
them. A "${NOTICE_SHEET}" sheet says how the file was generated, its units, the code editions and
that results need a qualified engineer's review. The input is never changed.

Takedown sheets are found by their title line. A workbook without one gets a takedown built from
its tables named Zones, Members and (if present) Loads; or name the tables:
  --zones <table>     Zones table, sheet or Sheet!A1:G20
  --members <table>   Members table
  --loads <table>     Loads table (optional)
  --units US|SI       unit system (default: from the units in the table headers, else US)
  --sheet <name>      name of the takedown sheet (default ${DEFAULT_TAKEDOWN_SHEET})
  --json <file>       also write the takedown results (design.md JSON) and the value-only list

Exit status: 0 written, 1 problems stopped a takedown (nothing written), 2 usage or file errors.`;

/** A takedown to rebuild: its options (tables, units) and the sheet it goes on. */
export interface TakedownSpec {
  readonly sheet: string;
  readonly options: TakedownOptions;
}

/** What an export did. */
export interface ExportReport {
  readonly ok: boolean;
  readonly problems: readonly Problem[];
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
  /** Date written on the notice sheet (default: today, ISO). */
  readonly date?: string;
  /** Folder of the built functions bundle (tests). */
  readonly distDir?: string;
}

const TITLE = new RegExp(
  `^${GENERATED_MARKER.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}: load takedown \\((US|SI)\\) from Zones: (.+?), Members: (.+?)(?:, Loads: (.+?))?\\.(?: Hand-off version.*)?$`,
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
  const options: TakedownOptions = { units: m[1] as UnitSystem, zones: m[2]!, members: m[3]!, ...(m[4] ? { loads: m[4] } : {}), sheetName: sheet };
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

/** Header cells of a table or sheet (the table's header row, else the sheet's first row). */
function headersOf(wb: XlsxWorkbook, name: string): string[] {
  const table = wb.tables.find((t) => t.name.toLowerCase() === name.toLowerCase());
  if (table) return [...table.headers];
  const sheet = wb.sheets.find((s) => s.name.toLowerCase() === name.toLowerCase());
  return (sheet?.rows[0] ?? []).map((v) => (typeof v === "string" ? v.replace(/^'/, "") : String(v ?? "")));
}

/**
 * The unit system the member tables are written in, from the units in their headers
 * ("Span (m)", "wD (kN/m)" -> SI; otherwise US).
 */
export function unitsOfTables(wb: XlsxWorkbook, tables: readonly string[]): UnitSystem {
  const si = /\((m|mm|kN|kN\/m|kPa|kN\/m2|kN\/m²|m2|m²)\)\s*$/i;
  return tables.some((t) => headersOf(wb, t).some((h) => si.test(h))) ? "SI" : "US";
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
  const sheet = DEFAULT_TAKEDOWN_SHEET;
  return [{ sheet, options: { zones, members, ...(loads ? { loads } : {}), units: units ?? unitsOfTables(wb, [zones, members]), sheetName: sheet } }];
}

/** Why a LOADPATH formula outside a takedown sheet is written as its value in the hand-off file. */
export function valueOnlyReason(formula: string): string {
  const name = /(?:LOADPATH\.|_xldudf_LOADPATH_)([A-Za-z0-9_]+)\s*\(/i.exec(formula)?.[1]?.toUpperCase() ?? "an add-in function";
  if (/^(DEFLECTION_|REQUIRED_I)/.test(name)) return `${name}: a deflection needs the member's elastic curve (EI), solved by the add-in`;
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
 * into values, add the notice sheet and write the hand-off file.
 * @param input - the workbook (.xlsx)
 * @param output - the hand-off file to write (never the input unless the caller names it)
 * @param options - takedowns to build (default: found by title), notice date, bundle folder
 */
export async function exportHandoff(input: string, output: string, options: ExportOptions = {}): Promise<ExportReport> {
  const wb = await readXlsx(input);
  const port = await MemoryWorkbookPort.create({
    sheets: engineSheets(wb),
    tables: wb.tables.map(({ name, sheet, ref }) => ({ name, sheet, ref })),
    names: wb.names,
    ...(options.distDir ? { distDir: options.distDir } : {}),
  });
  const specs = options.takedowns ?? takedownsOf(wb, options.units);
  const problems: Problem[] = [];
  const takedowns: { sheet: string; helperSheet: string; members: number; json?: TakedownJson }[] = [];
  for (const spec of specs) {
    const result = await buildTakedown(port, { ...spec.options, sheetName: spec.sheet, native: true });
    problems.push(...result.problems);
    if (!result.ok) return { ok: false, problems, takedowns, valueOnly: [], noticeSheet: "" };
    const j = result.json;
    const marks = new Set([...Object.keys(j?.members ?? {}), ...Object.keys(j?.columns ?? {}), ...Object.keys(j?.foundations ?? {})]);
    takedowns.push({ sheet: spec.sheet, helperSheet: helperSheetName(spec.sheet), members: marks.size, ...(j ? { json: j } : {}) });
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
      valueOnly: valueOnly.map(({ value: _value, ...rest }) => rest),
    }),
  );
  await writeXlsx(wb, resolve(output));
  return { ok: true, problems, takedowns, valueOnly: valueOnly.map(({ value: _value, ...rest }) => rest), noticeSheet: name };
}

/** The lines printed for a report. */
export function reportLines(report: ExportReport, output: string): { out: string[]; err: string[] } {
  const err = report.problems.map(describeTakedownProblem);
  if (!report.ok) return { out: [], err: [...err, "loadpath export: problems stopped the takedown; nothing written."] };
  const out = [`Hand-off workbook written to ${output}.`];
  if (report.takedowns.length === 0) out.push("No takedown sheet or Zones and Members tables found (give --zones and --members to build one).");
  for (const t of report.takedowns) out.push(`  ${t.sheet}: ${t.members} members rebuilt with classic spreadsheet functions; exact shear and moment maxima on "${t.helperSheet}".`);
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
    const parsed = parseVerbArgs(
      "export",
      USAGE,
      args,
      {
        output: { type: "string", short: "o" },
        zones: { type: "string" },
        members: { type: "string" },
        loads: { type: "string" },
        units: { type: "string" },
        sheet: { type: "string" },
        json: { type: "string" },
      },
      io,
    );
    if (!parsed) return EXIT.usage;
    const [input, ...extra] = parsed.positionals;
    const v = parsed.values;
    if (input === undefined || extra.length > 0 || v.output === undefined) {
      io.err(`loadpath export: ${input === undefined ? "no input workbook given" : v.output === undefined ? "no output file given (-o)" : "one input workbook at a time"}.\n\n${USAGE}`);
      return EXIT.usage;
    }
    if (writesOverInput("export", input, [v.output, v.json], io)) return EXIT.usage;
    const units = v.units?.toUpperCase();
    if (units !== undefined && units !== "US" && units !== "SI") {
      io.err(`loadpath export: --units "${v.units}" is not US or SI.`);
      return EXIT.usage;
    }
    if ((v.zones === undefined) !== (v.members === undefined)) {
      io.err("loadpath export: give both --zones and --members (or neither, to rebuild the takedown sheets found in the file).");
      return EXIT.usage;
    }
    const sheet = v.sheet ?? DEFAULT_TAKEDOWN_SHEET;
    const takedowns =
      v.zones !== undefined && v.members !== undefined
        ? [{ sheet, options: { zones: v.zones, members: v.members, ...(v.loads ? { loads: v.loads } : {}), units: (units ?? "US") as UnitSystem, sheetName: sheet } }]
        : undefined;
    const { output, json: jsonPath } = v;
    return usageOnThrow("export", io, async () => {
      const report = await exportHandoff(input, output, { ...(takedowns ? { takedowns } : {}), ...(units ? { units: units as UnitSystem } : {}) });
      const lines = reportLines(report, output);
      lines.err.forEach((l) => io.err(l));
      lines.out.forEach((l) => io.out(l));
      if (jsonPath && report.ok) {
        const { writeFileSync } = await import("node:fs");
        const json = { takedowns: Object.fromEntries(report.takedowns.map((t) => [t.sheet, t.json ?? null])), valueOnly: report.valueOnly };
        writeFileSync(resolve(jsonPath), JSON.stringify(json, null, 2));
      }
      return report.ok ? EXIT.ok : EXIT.failed;
    });
  },
};

export default exportCommand;
