/**
 * The takedown orchestrator: reads the engineer's tables through a workbook port, runs the
 * takedown engine (model, checks, order, sheet plan), writes the generated sheet in whole blocks,
 * and reads the computed results back for the summary and the JSON. It only talks to the port,
 * so the task pane (Office adapter) and the CLI (HyperFormula adapter) run the same build.
 */
import { cellAddress, sheetRef } from "./a1";
import { createNativeWriter, type NativeFormulaWriter } from "../engine/native/takedown-writer";
import { byMark, FATAL_CODES, planTakedown, readResults, scanJson, scanResults, summarize, type CellReader, type PlanCell, type SheetPlan, type TableData } from "../engine/takedown";
import { ForeignSheetError, GENERATED_MARKER, type CellInput, type CellValue, type RangeData, type WorkbookPort } from "./port";
import type { BuildTakedown, BuiltTakedown, MemberRows, Problem, Progress, TakedownJson, TakedownOptions } from "./takedown-api";

/** Default name of the generated sheet (docs/interface.md section 3). */
export const DEFAULT_TAKEDOWN_SHEET = "Takedown";

/** Rows per block written through the port (keeps each Office request well under its size limit). */
export const WRITE_BLOCK_ROWS = 2000;

/** Rows per block read back. */
const READ_BLOCK_ROWS = 5000;

/** First line of the generated sheet: the marker the add-in recognises, and what the sheet is. */
export function sheetTitle(options: TakedownOptions): string {
  const tables = [`Zones: ${options.zones}`, `Members: ${options.members}`, ...(options.loads ? [`Loads: ${options.loads}`] : []), ...(options.bearings ? [`Bearings: ${options.bearings}`] : [])].join(", ");
  const handOff = options.native ? " Hand-off version: classic spreadsheet functions only, no add-in needed." : "";
  return `${GENERATED_MARKER}: load takedown (${options.units}) from ${tables}.${handOff}`;
}

/** First line of the hand-off version's helper sheet (src/engine/native). */
export function helperTitle(sheet: string): string {
  return `${GENERATED_MARKER}: helper cells of the hand-off takedown on sheet "${sheet}" (exact largest shear and moment).`;
}

/** Write the hand-off writer's helper sheet in blocks of rows (its sheet is prepared by the caller). */
async function writeHelper(port: WorkbookPort, writer: NativeFormulaWriter, sheet: string): Promise<void> {
  const rows = writer.helperCells(helperTitle(sheet));
  for (let from = 0; from < rows.length; from += WRITE_BLOCK_ROWS) {
    await port.writeBlock(writer.helperSheet, from, 0, rows.slice(from, from + WRITE_BLOCK_ROWS));
  }
}

async function report(progress: Progress | undefined, fraction: number, message: string): Promise<void> {
  if (progress) await progress(fraction, message);
}

function missingTable(ref: string, role: string, error: unknown): Problem {
  const detail = error instanceof Error ? error.message : String(error);
  return { code: "missingTable", message: `The ${role} table "${ref}" could not be read: ${detail}`, sheet: ref, cell: "A1" };
}

/** Read the input tables; a table that cannot be read is a problem. */
async function readInputs(port: WorkbookPort, options: TakedownOptions): Promise<{ zones?: TableData; members?: TableData; loads?: TableData; bearings?: TableData; problems: Problem[] }> {
  const problems: Problem[] = [];
  const read = async (ref: string, role: string): Promise<RangeData | undefined> => {
    try {
      return await port.readTable(ref, { dates: true });
    } catch (e) {
      problems.push(missingTable(ref, role, e));
      return undefined;
    }
  };
  const zones = await read(options.zones, "Zones");
  const members = await read(options.members, "Members");
  const loads = options.loads ? await read(options.loads, "Loads") : undefined;
  const bearings = options.bearings ? await read(options.bearings, "Bearings") : undefined;
  return { ...(zones ? { zones } : {}), ...(members ? { members } : {}), ...(loads ? { loads } : {}), ...(bearings ? { bearings } : {}), problems };
}

/**
 * A generated sheet (the takedown's, or the hand-off version's helper sheet) that would be written
 * over a sheet holding one of the tables being read: refused before anything is written, even
 * when replacing is allowed.
 */
function tableSheetClash(inputs: { zones?: TableData; members?: TableData; loads?: TableData; bearings?: TableData }, generated: readonly string[], options: TakedownOptions): Problem | null {
  const tables: [TableData | undefined, string, string][] = [
    [inputs.zones, "Zones", options.zones],
    [inputs.members, "Members", options.members],
    [inputs.loads, "Loads", options.loads ?? ""],
    [inputs.bearings, "Bearings", options.bearings ?? ""],
  ];
  for (const name of generated) {
    for (const [data, role, ref] of tables) {
      if (data === undefined || data.sheet.toLowerCase() !== name.toLowerCase()) continue;
      return {
        code: "foreignSheet",
        message: `The generated sheet "${name}" would be written over the sheet "${data.sheet}", which holds the ${role} table ("${ref}") being read; choose another name for the generated sheet.`,
        sheet: data.sheet,
        cell: "A1",
      };
    }
  }
  return null;
}

/** Rows from..to (exclusive) of the plan as a dense block. */
function blockOf(cells: SheetPlan["cells"], from: number, to: number): CellInput[][] {
  let width = 0;
  for (let r = from; r < to; r++) width = Math.max(width, cells[r]?.length ?? 0);
  const out: CellInput[][] = [];
  for (let r = from; r < to; r++) {
    const src = cells[r] ?? [];
    const row: CellInput[] = new Array<CellInput>(width).fill(null);
    for (let c = 0; c < src.length; c++) {
      const v: PlanCell | undefined = src[c];
      if (v !== undefined) row[c] = v;
    }
    out.push(row);
  }
  return out;
}

/** Write the plan in blocks of rows, reporting progress between blocks. */
async function writePlan(port: WorkbookPort, plan: SheetPlan, progress: Progress | undefined): Promise<void> {
  const total = plan.cells.length;
  for (let from = 0; from < total; from += WRITE_BLOCK_ROWS) {
    const to = Math.min(total, from + WRITE_BLOCK_ROWS);
    await port.writeBlock(plan.sheet, from, 0, blockOf(plan.cells, from, to));
    await report(progress, 0.4 + (0.4 * to) / Math.max(1, total), `Writing rows ${from + 1} to ${to} of ${total}`);
  }
}

/**
 * Read back the computed cells the results need: the balance and the result columns of every
 * member row, in blocks of rows.
 */
async function readBack(port: WorkbookPort, plan: SheetPlan, progress: Progress | undefined): Promise<CellReader> {
  // A host that calculates add-in functions asynchronously (Excel) shows #BUSY! until they finish.
  for (let attempt = 0; ; attempt++) {
    const chunks = await readChunks(port, plan, progress);
    const busy = chunks.some((c) => c.values.some((r) => r.some((v) => v === BUSY)));
    if (!busy || attempt >= BUSY_RETRIES) return readerOf(chunks);
    await new Promise((resolve) => setTimeout(resolve, BUSY_WAIT_MS));
  }
}

/** The value a host shows while an add-in function is still calculating. */
const BUSY = "#BUSY!";
const BUSY_RETRIES = 40;
const BUSY_WAIT_MS = 250;

async function readChunks(port: WorkbookPort, plan: SheetPlan, progress: Progress | undefined): Promise<RangeData[]> {
  const sheet = sheetRef(plan.sheet);
  const chunks: RangeData[] = [];
  const balanceCols = Math.max(1, plan.balance.caseCols.length);
  chunks.push(await port.readTable(`${sheet}!${cellAddress(plan.balance.appliedRow, 0)}:${cellAddress(plan.balance.supportsRow, balanceCols)}`));
  const first = plan.headerRow + 1;
  const last = plan.cells.length - 1;
  const left = Math.min(...plan.layout.r1, plan.layout.areaT);
  for (let from = first; from <= last; from += READ_BLOCK_ROWS) {
    const to = Math.min(last, from + READ_BLOCK_ROWS - 1);
    chunks.push(await port.readTable(`${sheet}!${cellAddress(from, left)}:${cellAddress(to, plan.layout.width - 1)}`));
    await report(progress, 0.85 + (0.1 * (to - first + 1)) / Math.max(1, last - first + 1), "Reading the results");
  }
  return chunks;
}

/** A cell reader over blocks read back. */
function readerOf(chunks: readonly RangeData[]): CellReader {
  return (row, col): CellValue | undefined => {
    for (const c of chunks) {
      const r = row - c.top;
      const k = col - c.left;
      if (r >= 0 && r < c.values.length && k >= 0 && k < (c.values[r]?.length ?? 0)) return c.values[r]![k];
    }
    return undefined;
  };
}

/**
 * Each member's block of rows on the generated sheet, by mark.
 * @param plan - the plan written
 * @param model - the model it was planned from
 */
export function rowsByMemberOf(plan: SheetPlan, model: BuiltTakedown["model"]): Record<string, MemberRows> {
  const out = byMark<MemberRows>();
  for (const p of plan.places) out[model.members[p.member]!.mark] = { row: p.row, rows: p.rows };
  return out;
}

/**
 * Build the takedown: read the tables, check and order the load path, write the generated sheet
 * (rebuilt in place when it is the add-in's own; a user's sheet of that name is never replaced
 * unless `replaceForeign`), and read the results back.
 * Problems with individual members are reported and the rest is still written; problems with
 * the tables themselves (missing, missing columns, wrong units) stop the build before anything
 * is written.
 */
export const buildTakedown: BuildTakedown = async (port, options, progress) => {
  await report(progress, 0, "Reading the tables");
  const inputs = await readInputs(port, options);
  if (!inputs.zones || !inputs.members) return { ok: false, problems: inputs.problems };
  await report(progress, 0.1, "Checking the load path");
  const sheet = options.sheetName ?? DEFAULT_TAKEDOWN_SHEET;
  const title = sheetTitle(options);
  const writer = options.native ? createNativeWriter({ sheet }) : undefined;
  const planned = planTakedown({
    zones: inputs.zones,
    members: inputs.members,
    ...(inputs.loads ? { loads: inputs.loads } : {}),
    ...(inputs.bearings ? { bearings: inputs.bearings } : {}),
    units: options.units,
    ...(options.mapping ? { mapping: options.mapping } : {}),
    ...(options.headerRows ? { headerRows: options.headerRows } : {}),
    sheet,
    title,
    ...(writer ? { writer } : {}),
  });
  const problems: Problem[] = [...inputs.problems, ...planned.problems];
  if (!planned.plan || !planned.model || problems.some((p) => FATAL_CODES.has(p.code))) return { ok: false, problems };
  const overTable = tableSheetClash(inputs, [sheet, ...(writer ? [writer.helperSheet] : [])], options);
  if (overTable) return { ok: false, problems: [...problems, overTable] };
  await report(progress, 0.3, "Preparing the sheet");
  try {
    await port.prepareSheet(sheet, title, options.replaceForeign === true);
    if (writer) await port.prepareSheet(writer.helperSheet, helperTitle(sheet), options.replaceForeign === true);
  } catch (e) {
    if (!(e instanceof ForeignSheetError)) throw e;
    return { ok: false, problems: [...problems, { code: "foreignSheet", message: e.message, sheet, cell: "A1" }] };
  }
  await writePlan(port, planned.plan, progress);
  if (writer) await writeHelper(port, writer, sheet);
  await report(progress, 0.8, "Calculating");
  await port.flush();
  const read = await readBack(port, planned.plan, progress);
  // Cells the writer could not spell (continuous members in the hand-off version) become their values.
  for (const v of planned.plan.valueOnly) {
    const value = read(v.row, v.col);
    await port.writeBlock(sheet, v.row, v.col, [[value === undefined ? null : value]]);
  }
  if (planned.plan.valueOnly.length > 0) await port.flush();
  // Any error value or non-finite number among the results is a listed problem, never silent.
  problems.push(...scanResults(planned.plan, planned.model, read));
  const read0 = readResults(planned.plan, planned.model, read, problems);
  problems.push(...scanJson(read0, planned.plan, planned.model, problems));
  const json: TakedownJson = { ...read0, problems };
  const summary = summarize(json, planned.plan, planned.model, planned.levels);
  await report(progress, 1, "Done");
  // The hand-off writer spells every member on two supports; continuous members are written as values, listed.
  const built: BuiltTakedown = { model: planned.model, plan: planned.plan, rowsByMember: rowsByMemberOf(planned.plan, planned.model) };
  // One entry per member whose mechanics are values, with the first reason given for it; the
  // governing values (add-in only, read by nothing downstream) are counted apart.
  const byMark = new Map<string, { mark: string; reason: string }>();
  const governingMarks = new Set<string>();
  for (const v of planned.plan.valueOnly) {
    if (v.governing) governingMarks.add(v.mark);
    else if (!byMark.has(v.mark)) byMark.set(v.mark, { mark: v.mark, reason: v.reason });
  }
  const valueOnly = [...byMark.values()];
  return { ok: true, problems, summary, json, sheet, built, ...(writer ? { valueOnly, governingValuesOnly: governingMarks.size } : {}) };
};
