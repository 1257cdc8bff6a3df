/**
 * .xlsx files <-> the headless engine, through ExcelJS. Reading gives each sheet's values and
 * formulas (in the engine's spelling), every formula cell as written in the file, and the
 * workbook's Excel tables (name, sheet, extent from `tableRef`, headers). Writing back keeps the
 * ExcelJS model of the file (styles, tables, names, widths) and only sets each formula cell to
 * `{ formula, result }` with the computed value cached, so the file reads correctly in any
 * program, with or without the add-in.
 *
 * Spelling in files: LOADPATH calls are written as `_xldudf_LOADPATH_NAME(` (what Excel itself
 * stores for add-in functions, with the namespace's dot as an underscore); other formula text is
 * written as it was read (`_xlfn.` prefixes kept). Spilled results are written as array formulas
 * over the spilled area (`t="array"`) with the values in the other cells: ExcelJS cannot write
 * Excel's dynamic-array marker, and an array formula computes the same cells.
 */
import { existsSync, statSync } from "node:fs";
import { readFile } from "node:fs/promises";
import { resolve } from "node:path";
import ExcelJS from "exceljs";
import { DetailedCellError, ErrorType, HyperFormula, type CellValue as HfCellValue, type RawCellContent } from "hyperformula";
import { cellAddress, parseCell, sheetRef } from "./a1";
import { writeAtomically } from "./files";
import { callsLoadpath, createHeadless, excelErrorText, NAMESPACE, toEngineFormula, toFileFormula, type DefinedName, type Headless, type HeadlessOptions } from "./headless";
import { exportSheets, type MemoryWorkbookPort } from "./memory-port";
import { writeWithGeneratedSheets, type GeneratedCell, type GeneratedSheet } from "./xlsx-stream";

/** A formula cell as found in the file. Rows and columns are 0-based. */
export interface XlsxFormulaCell {
  readonly sheet: string;
  readonly row: number;
  readonly col: number;
  /** Formula text as in the file, without "=" (shared formulas already expanded for this cell). */
  readonly formula: string;
  /** For an array formula (Excel's spilled results are stored this way), its area, e.g. "F2:H2". */
  readonly arrayRef?: string;
  /** The value the file holds for it (its last result), if any. */
  readonly cached?: Cached;
}

/** An Excel table (ListObject) of the workbook. */
export interface XlsxTable {
  readonly name: string;
  readonly sheet: string;
  /** Full extent including the header row (and totals row), e.g. "A1:H20". */
  readonly ref: string;
  readonly headers: readonly string[];
}

/** One sheet as the engine reads it: values and "=formula" strings (engine spelling), row-major. */
export interface XlsxSheet {
  readonly name: string;
  readonly rows: RawCellContent[][];
  /** Cells holding a date (read as serial day numbers), as "row,col" 0-based. */
  readonly dates: ReadonlySet<string>;
}

/** A workbook read from a file, ready to evaluate and to write back. */
export interface XlsxWorkbook {
  /** Absolute path it was read from (undefined when built in memory). */
  readonly path?: string;
  /** The bytes of the file it was read from (the generated-sheet writer copies the user's parts from them). */
  readonly bytes?: Buffer;
  /** The ExcelJS model: written back with its styles, tables and everything else untouched. */
  readonly excel: ExcelJS.Workbook;
  readonly sheets: readonly XlsxSheet[];
  readonly formulas: readonly XlsxFormulaCell[];
  readonly tables: readonly XlsxTable[];
  /** The workbook's defined names that refer to one range (print areas and the like left out). */
  readonly names: readonly DefinedName[];
}

/** A value cached in a file for a formula cell. */
type Cached = number | string | boolean | { error: string } | undefined;

/** Excel's day 0 (1899-12-30) in ms since the Unix epoch: dates become serial day numbers. */
const EXCEL_EPOCH_MS = Date.UTC(1899, 11, 30);
const MS_PER_DAY = 86_400_000;

interface CellModelish {
  type: ExcelJS.ValueType;
  value: unknown;
  formula?: string;
  text?: string;
}

/** A plain (non-formula) cell value for the engine; text is marked so it is never parsed. */
function plainContent(cell: CellModelish): RawCellContent {
  const v = cell.value;
  switch (cell.type) {
    case ExcelJS.ValueType.Number:
    case ExcelJS.ValueType.Boolean:
      return v as number | boolean;
    case ExcelJS.ValueType.Date:
      return ((v as Date).getTime() - EXCEL_EPOCH_MS) / MS_PER_DAY;
    case ExcelJS.ValueType.Error:
      return (v as { error: string }).error;
    case ExcelJS.ValueType.String:
    case ExcelJS.ValueType.SharedString:
    case ExcelJS.ValueType.RichText:
    case ExcelJS.ValueType.Hyperlink: {
      const text = typeof v === "string" ? v : (cell.text ?? "");
      // A leading apostrophe keeps text as text ("12", "=x", "TRUE" stay strings).
      return text === "" ? null : `'${text}`;
    }
    default:
      return null;
  }
}

/**
 * Cells of an "A1:C3" area, 0-based, within the rows and columns that can hold anything (`last`:
 * the sheet's last row and column with content): an area a file declares over a whole sheet
 * ("A1:XFD1048576") visits only the sheet's real extent, never a billion cells.
 * @param ref - the area
 * @param last - 0-based last row and column of the sheet's content (default: no bound)
 */
export function areaCells(ref: string, last: { row: number; col: number } = { row: Number.POSITIVE_INFINITY, col: Number.POSITIVE_INFINITY }): { row: number; col: number }[] {
  const [a, b = a] = ref.replace(/\$/g, "").split(":");
  const p = parseCell(a!);
  const q = parseCell(b!);
  const out: { row: number; col: number }[] = [];
  const bottom = Math.min(Math.max(p.row, q.row), last.row);
  const right = Math.min(Math.max(p.col, q.col), last.col);
  for (let r = Math.min(p.row, q.row); r <= bottom; r++) for (let c = Math.min(p.col, q.col); c <= right; c++) out.push({ row: r, col: c });
  return out;
}

const lastCells = new WeakMap<ExcelJS.Worksheet, { row: number; col: number }>();

/** 0-based last row and column of a worksheet's content as read (ExcelJS's extent, worked out once per sheet). */
function lastCell(ws: ExcelJS.Worksheet): { row: number; col: number } {
  let last = lastCells.get(ws);
  if (!last) {
    last = { row: ws.rowCount - 1, col: ws.columnCount - 1 };
    lastCells.set(ws, last);
  }
  return last;
}

function setAt(rows: RawCellContent[][], row: number, col: number, content: RawCellContent): void {
  while (rows.length <= row) rows.push([]);
  const r = rows[row]!;
  while (r.length < col) r.push(null);
  r[col] = content;
}

function readSheet(ws: ExcelJS.Worksheet): { sheet: XlsxSheet; formulas: XlsxFormulaCell[] } {
  const rows: RawCellContent[][] = [];
  const formulas: XlsxFormulaCell[] = [];
  const dates = new Set<string>();
  ws.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    row.eachCell({ includeEmpty: false }, (cell, colNumber) => {
      const r = rowNumber - 1;
      const c = colNumber - 1;
      const model = cell as unknown as CellModelish;
      if (cell.type === ExcelJS.ValueType.Formula) {
        const formula = String(cell.formula ?? "");
        const value = cell.value as { shareType?: string; ref?: string; result?: unknown };
        const arrayRef = value.shareType === "array" && value.ref ? value.ref : undefined;
        const cached = cachedInFile(value.result);
        formulas.push({ sheet: ws.name, row: r, col: c, formula, ...(arrayRef ? { arrayRef } : {}), ...(cached !== undefined ? { cached } : {}) });
        setAt(rows, r, c, "=" + toEngineFormula(formula));
      } else if (cell.type !== ExcelJS.ValueType.Merge) {
        setAt(rows, r, c, plainContent(model));
        if (cell.type === ExcelJS.ValueType.Date) dates.add(`${r},${c}`);
      }
    });
  });
  // The other cells of an array formula hold its last results: clear them, the engine recomputes.
  for (const f of formulas) {
    if (!f.arrayRef) continue;
    for (const { row, col } of areaCells(f.arrayRef, lastCell(ws))) if ((row !== f.row || col !== f.col) && rows[row]?.[col] !== undefined && !isFormula(rows[row]![col])) rows[row]![col] = null;
  }
  return { sheet: { name: ws.name, rows, dates }, formulas };
}

/** A formula's last result as the file holds it (dates as serial numbers). */
function cachedInFile(result: unknown): Cached {
  if (typeof result === "number" || typeof result === "string" || typeof result === "boolean") return result;
  if (result instanceof Date) return (result.getTime() - EXCEL_EPOCH_MS) / MS_PER_DAY;
  if (typeof result === "object" && result !== null && typeof (result as { error?: unknown }).error === "string") return { error: (result as { error: string }).error };
  return undefined;
}

/** The defined names of a workbook that refer to a single range (not print areas, filters or unions). */
function definedNamesOf(excel: ExcelJS.Workbook): DefinedName[] {
  const model = (excel.definedNames as unknown as { model?: { name?: string; ranges?: string[] }[] }).model ?? [];
  const seen = new Set<string>();
  const out: DefinedName[] = [];
  for (const n of model) {
    const name = String(n.name ?? "");
    const key = name.toUpperCase();
    if (name === "" || key.startsWith("_XLNM.") || seen.has(key) || n.ranges?.length !== 1) continue;
    seen.add(key);
    out.push({ name, refersTo: n.ranges[0]! });
  }
  return out;
}

function isFormula(content: RawCellContent | undefined): boolean {
  return typeof content === "string" && content.startsWith("=");
}

function readTables(ws: ExcelJS.Worksheet): XlsxTable[] {
  const tables = (ws as unknown as { tables?: Record<string, { table?: Record<string, unknown>; model?: Record<string, unknown> }> }).tables ?? {};
  return Object.values(tables).map((t) => {
    const model = (t.table ?? t.model ?? {}) as { name?: string; tableRef?: string; ref?: string; columns?: { name?: string }[] };
    return { name: String(model.name ?? ""), sheet: ws.name, ref: String(model.tableRef ?? model.ref ?? ""), headers: (model.columns ?? []).map((c) => String(c.name ?? "")) };
  });
}

/**
 * Read an ExcelJS workbook model into engine sheets, formula cells and tables.
 * @param excel - a loaded (or built) ExcelJS workbook.
 * @param path - where it came from, if a file.
 */
export function fromExcelJs(excel: ExcelJS.Workbook, path?: string, bytes?: Buffer): XlsxWorkbook {
  const sheets: XlsxSheet[] = [];
  const formulas: XlsxFormulaCell[] = [];
  const tables: XlsxTable[] = [];
  excel.eachSheet((ws) => {
    const read = readSheet(ws);
    sheets.push(read.sheet);
    formulas.push(...read.formulas);
    tables.push(...readTables(ws));
  });
  return { ...(path ? { path } : {}), ...(bytes ? { bytes } : {}), excel, sheets, formulas, tables, names: definedNamesOf(excel) };
}

/** The start of a zip file (a local file header), and of an empty zip (its end record). */
const ZIP_MAGIC = [Buffer.from("PK\x03\x04", "latin1"), Buffer.from("PK\x05\x06", "latin1")];
/** The start of an OLE compound file: an encrypted (password-protected) workbook, or an old .xls. */
const OLE_MAGIC = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);

/** A stream name of a compound file as stored in its directory (UTF-16LE). */
function utf16(text: string): Buffer {
  return Buffer.from(text, "utf16le");
}

/**
 * Why the bytes of a file are not an .xlsx workbook ExcelJS can read, or undefined when they look
 * like one (a zip holding `xl/workbook.xml`). Only the bytes are looked at, nothing is unpacked:
 * the names of a zip's parts are stored uncompressed in its central directory.
 */
export function notAWorkbook(bytes: Buffer): string | undefined {
  if (bytes.length === 0) return "not an .xlsx workbook (the file is empty)";
  if (bytes.subarray(0, OLE_MAGIC.length).equals(OLE_MAGIC)) {
    if (bytes.includes(utf16("EncryptionInfo")) || bytes.includes(utf16("EncryptedPackage"))) {
      return "encrypted workbook (it has a password to open: remove the password in Excel, File > Info > Protect Workbook, and save it again)";
    }
    return "not an .xlsx workbook (an older binary file, such as an .xls workbook: open it in Excel and save it as .xlsx)";
  }
  if (!ZIP_MAGIC.some((m) => bytes.subarray(0, m.length).equals(m))) return "not an .xlsx workbook (not a zip file)";
  if (!bytes.includes(Buffer.from("xl/workbook.xml", "latin1"))) {
    const what = bytes.includes(Buffer.from("word/document.xml", "latin1")) ? "a Word document" : bytes.includes(Buffer.from("ppt/presentation.xml", "latin1")) ? "a PowerPoint file" : "a zip file without a workbook in it";
    return `not an .xlsx workbook (${what})`;
  }
  return undefined;
}

/**
 * Read an .xlsx file.
 * @param path - the file.
 * @throws Error with a plain message when the file is missing, not an .xlsx workbook (`<file>: not
 * an .xlsx workbook (...)`) or an encrypted one (`<file>: encrypted workbook (...)`).
 */
export async function readXlsx(path: string): Promise<XlsxWorkbook> {
  const full = resolve(path);
  if (!existsSync(full)) throw new Error(`${path}: no such file.`);
  let bytes: Buffer;
  try {
    if (statSync(full).isDirectory()) throw new Error("it is a folder");
    bytes = await readFile(full);
  } catch (e) {
    throw new Error(`${path}: cannot be read (${e instanceof Error ? e.message : String(e)}).`);
  }
  const why = notAWorkbook(bytes);
  if (why !== undefined) throw new Error(`${path}: ${why}.`);
  const excel = new ExcelJS.Workbook();
  try {
    await excel.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (e) {
    throw new Error(`${path}: not an .xlsx workbook that can be read (a damaged file? ${e instanceof Error ? e.message : String(e)}).`);
  }
  return fromExcelJs(excel, full, bytes);
}

/** The sheets as `createHeadless` takes them. */
export function engineSheets(wb: XlsxWorkbook): Record<string, RawCellContent[][]> {
  return Object.fromEntries(wb.sheets.map((s) => [s.name, s.rows]));
}

/**
 * The date cells of each sheet ("row,col", 0-based) for the memory port, so a table read from
 * the file knows which numbers were dates.
 * @param wb - the workbook.
 */
export function dateCells(wb: XlsxWorkbook): Record<string, ReadonlySet<string>> {
  return Object.fromEntries(wb.sheets.filter((s) => s.dates.size > 0).map((s) => [s.name, s.dates]));
}

/**
 * A headless engine loaded with the workbook's sheets.
 * @param wb - the workbook.
 * @param options - headless options (bundle folder, configuration).
 */
export async function evaluateWorkbook(wb: XlsxWorkbook, options: Omit<HeadlessOptions, "sheets"> = {}): Promise<Headless> {
  return createHeadless({ ...options, sheets: engineSheets(wb), names: wb.names });
}

/** What went wrong in one formula cell. */
export interface CellProblem {
  readonly sheet: string;
  /** A1 address on the sheet. */
  readonly address: string;
  /**
   * unknownFunction = #NAME?; cycle = circular reference; error = any other error value;
   * notEvaluated = the formula cannot be evaluated headless (it does not parse here, or calls a
   * function or name the engine lacks): the file keeps the cell as it was, cached value included,
   * and formulas that use it read that cached value.
   */
  readonly kind: "unknownFunction" | "cycle" | "error" | "notEvaluated";
  /** Excel error text, e.g. "#VALUE!". */
  readonly code: string;
  readonly message: string;
  /** The cell's formula calls a LOADPATH function. */
  readonly loadpath: boolean;
  /** Where the error came from when it was passed on from another cell ("Sheet!A1"), else undefined. */
  readonly from?: string;
}

/** The result of evaluating a workbook's formulas. */
export interface RecalcSummary {
  readonly formulaCount: number;
  /** Formula cells that call a LOADPATH function. */
  readonly loadpathCount: number;
  readonly problems: readonly CellProblem[];
}

function problemOf(f: XlsxFormulaCell, e: DetailedCellError): CellProblem {
  const address = cellAddress(f.row, f.col);
  const here = `${f.sheet}!${address}`;
  const kind = e.type === "NAME" ? "unknownFunction" : e.type === "CYCLE" ? "cycle" : "error";
  const message = kind === "cycle" ? "circular reference (the formula depends on itself)." : e.message || e.value;
  const origin = e.address && e.address.replace(/'/g, "") !== here ? { from: e.address } : {};
  return { sheet: f.sheet, address, kind, code: e.value, message, loadpath: callsLoadpath(f.formula), ...origin };
}

/** Size of the array whose anchor is at `addr` (its cells are typed ARRAY to the right and below). */
function arrayExtent(hf: HyperFormula, sheet: number, row: number, col: number): { rows: number; cols: number } {
  let cols = 1;
  while (hf.getCellType({ sheet, row, col: col + cols }) === "ARRAY") cols++;
  let rows = 1;
  while (hf.getCellType({ sheet, row: row + rows, col }) === "ARRAY") rows++;
  return { rows, cols };
}


/** A computed value as cached in a file. */
function cachedOf(v: HfCellValue): Cached {
  if (v instanceof DetailedCellError) return { error: excelErrorText(v.type) };
  if (v === null) return undefined;
  return v as number | string | boolean;
}

/** A spilled value written as a plain cell ("" padding is left blank). */
function plainOf(v: HfCellValue): ExcelJS.CellValue {
  const c = cachedOf(v);
  return c === undefined || c === "" ? null : (c as ExcelJS.CellValue);
}

/**
 * Why a formula cell cannot be evaluated headless, or undefined when it can: it does not parse
 * here, or it calls a function or uses a name the engine does not have (errors passed on from
 * another cell are that cell's).
 */
function unevaluable(hf: HyperFormula, f: XlsxFormulaCell, value: HfCellValue): string | undefined {
  if (!(value instanceof DetailedCellError)) return undefined;
  const here = `${f.sheet}!${cellAddress(f.row, f.col)}`;
  if (value.address && value.address.replace(/'/g, "") !== here.replace(/'/g, "")) return undefined;
  if (value.type === ErrorType.ERROR) {
    // A parse error reaches the cells that use it without an origin: only the cell itself fails to parse.
    return hf.validateFormula(`=${toEngineFormula(f.formula)}`) ? undefined : `the formula cannot be read here (${value.message.replace(/\.$/, "")})`;
  }
  if (value.type !== ErrorType.NAME) return undefined;
  const fn = /Function name (\S+) not recognized/.exec(value.message);
  // A LOADPATH function that does not exist is a mistake in the formula (Excel shows #NAME? too).
  if (fn) return fn[1]!.toUpperCase().startsWith(`${NAMESPACE}.`) ? undefined : `function ${fn[1]} is not available headless`;
  const name = /Named expression (\S+) not recognized/.exec(value.message);
  if (name) return `name ${name[1]} is not defined in the workbook`;
  return undefined;
}

/** A cached value for a message: `the cached value 40`, `the cached text "x"`, `no cached value`. */
function describeCached(c: Cached): string {
  if (c === undefined) return "its formula (the file has no cached value for it)";
  if (typeof c === "object") return `its formula and cached value ${c.error}`;
  return `its formula and cached value ${typeof c === "string" ? JSON.stringify(c) : String(c).toUpperCase()}`;
}

/** A cached value as engine content (text kept as text). */
function cachedContent(c: Cached): RawCellContent {
  if (c === undefined) return null;
  if (typeof c === "object") return c.error;
  if (typeof c === "string") return c === "" ? null : `'${c}`;
  return c;
}

/**
 * Find the formula cells that cannot be evaluated headless and put their cached values in the
 * engine in their place (for an array formula, its whole area as the file holds it), so the
 * cells that use them compute from what Excel last computed rather than from an error.
 * @returns each such cell and why
 */
function keepUnevaluable(wb: XlsxWorkbook, hf: HyperFormula): Map<XlsxFormulaCell, string> {
  const kept = new Map<XlsxFormulaCell, string>();
  for (const f of wb.formulas) {
    const why = unevaluable(hf, f, hf.getCellValue({ sheet: hf.getSheetId(f.sheet)!, row: f.row, col: f.col }));
    if (why !== undefined) kept.set(f, why);
  }
  if (kept.size === 0) return kept;
  hf.batch(() => {
    for (const f of kept.keys()) {
      const sheet = hf.getSheetId(f.sheet)!;
      const ws = wb.excel.getWorksheet(f.sheet)!;
      for (const { row, col } of f.arrayRef ? areaCells(f.arrayRef, lastCell(ws)) : [{ row: f.row, col: f.col }]) {
        const content = row === f.row && col === f.col ? cachedContent(f.cached) : plainContent(ws.getCell(row + 1, col + 1) as unknown as CellModelish);
        hf.setCellContents({ sheet, row, col }, [[content]]);
      }
    }
  });
  return kept;
}

/**
 * Evaluate every formula and cache the results in the workbook's ExcelJS model: each formula
 * cell becomes `{ formula, result }` (LOADPATH calls in the file spelling), spilled results become
 * array formulas over their area with the values in the other cells.
 * @param wb - the workbook read by {@link readXlsx}.
 * @param headless - an engine built from `wb` by {@link evaluateWorkbook}.
 * A formula that cannot be evaluated headless (see {@link CellProblem}) is left as the file has it.
 * @returns counts and every formula cell whose value is an error or that was not evaluated.
 */
export function cacheResults(wb: XlsxWorkbook, headless: Headless): RecalcSummary {
  const hf = headless.hf;
  const problems: CellProblem[] = [];
  let loadpathCount = 0;
  const kept = keepUnevaluable(wb, hf);
  for (const f of wb.formulas) {
    const sheetId = hf.getSheetId(f.sheet)!;
    const ws = wb.excel.getWorksheet(f.sheet)!;
    const addr = { sheet: sheetId, row: f.row, col: f.col };
    if (callsLoadpath(f.formula)) loadpathCount++;
    const why = kept.get(f);
    if (why !== undefined) {
      // Left as the file has it (formula and cached value); its dependents read the cached value.
      problems.push({ sheet: f.sheet, address: cellAddress(f.row, f.col), kind: "notEvaluated", code: "", message: `${why}; not recalculated, the cell keeps ${describeCached(f.cached)}.`, loadpath: callsLoadpath(f.formula) });
      continue;
    }
    const value = hf.getCellValue(addr);
    if (value instanceof DetailedCellError) problems.push(problemOf(f, value));
    const formula = toFileFormula(f.formula);
    if (f.arrayRef) for (const { row, col } of areaCells(f.arrayRef, lastCell(ws))) if (row !== f.row || col !== f.col) ws.getCell(row + 1, col + 1).value = null;
    const cell = ws.getCell(f.row + 1, f.col + 1);
    if (hf.getCellType(addr) === "ARRAYFORMULA") {
      const size = arrayExtent(hf, sheetId, f.row, f.col);
      const ref = `${cellAddress(f.row, f.col)}:${cellAddress(f.row + size.rows - 1, f.col + size.cols - 1)}`;
      cell.value = { formula, result: cachedOf(value), shareType: "array", ref } as unknown as ExcelJS.CellValue;
      for (let r = 0; r < size.rows; r++) {
        for (let c = 0; c < size.cols; c++) {
          if (r === 0 && c === 0) continue;
          ws.getCell(f.row + r + 1, f.col + c + 1).value = plainOf(hf.getCellValue({ sheet: sheetId, row: f.row + r, col: f.col + c }));
        }
      }
    } else {
      const result = cachedOf(value);
      cell.value = (result === undefined ? { formula } : { formula, result }) as ExcelJS.CellValue;
    }
  }
  return { formulaCount: wb.formulas.length, loadpathCount, problems };
}

/** How {@link writeXlsx} wrote a file: streamed (generated sheets written directly), or through the ExcelJS model and why. */
export interface WriteReport {
  readonly streamed: boolean;
  /** Why the file was not streamed (undefined when it was, or when no sheets were generated). */
  readonly reason?: string;
}

/**
 * Write the workbook to a file. It writes exactly where it is told: callers (the CLI) write only
 * to a path the user named, so the input is replaced only when the user names it as the output.
 * The file is written to a temporary file in the same folder and renamed into place when
 * complete, so a failure leaves any earlier file at `output` as it was.
 *
 * With `generated` (the port a takedown was built in), the sheets the port generated are written
 * too, and the workbook's own formula cells get their computed values cached, in one of two ways:
 * - streamed (the usual case): when the workbook was read from a file and none of its own formula
 *   cells computes a value other than the one the file holds (within 1e-12 relative), the file's
 *   parts are copied byte for byte and only the generated sheets' XML is written, directly
 *   (src/workbook/xlsx-stream.ts);
 * - through the ExcelJS model otherwise (a workbook built in memory, an own formula whose value
 *   changed, e.g. one that reads the generated sheet, an array formula of the user's, or a
 *   package the direct writer does not read): every formula cached as by {@link cacheResults}.
 * @param wb - the workbook.
 * @param output - destination path.
 * @param generated - the port whose generated sheets and names are written (undefined: the model as it is)
 * @returns how the file was written
 */
export async function writeXlsx(wb: XlsxWorkbook, output: string, generated?: MemoryWorkbookPort): Promise<WriteReport> {
  if (generated === undefined) {
    await writeAtomically(output, (temporary) => wb.excel.xlsx.writeFile(temporary));
    return { streamed: false };
  }
  const sheets = generated.generatedSheets();
  const own = new Set(sheets.map((s) => s.toLowerCase()));
  const why = wb.bytes === undefined ? "built in memory" : ownFormulaChanged(wb, generated.headless, own);
  let refused: string | undefined;
  if (why === undefined) {
    await writeAtomically(output, (temporary) => {
      refused = writeWithGeneratedSheets(wb.bytes!, sheets.map((s) => generatedSheet(generated, s)), generated.definedNames(), temporary);
      if (refused !== undefined) throw new NotStreamed(refused);
    }).catch((e: unknown) => {
      if (!(e instanceof NotStreamed)) throw e;
    });
    if (refused === undefined) return { streamed: true };
  }
  cacheResults(wb, generated.headless);
  exportSheets(generated, wb.excel);
  await writeAtomically(output, (temporary) => wb.excel.xlsx.writeFile(temporary));
  return { streamed: false, reason: why ?? refused };
}

/** The direct writer declined the package (the reason is its message); nothing was written. */
class NotStreamed extends Error {}

/**
 * A computed value and the value a file caches alike: same kind, numbers within 1e-12 relative,
 * errors by their text. ExcelJS reads a cached 0 as no value, so a computed 0 matches a formula
 * without one (a program reading the file shows 0 for it either way).
 */
function sameCached(a: Cached, b: Cached): boolean {
  if (a === 0 && b === undefined) return true;
  if (typeof a === "number" && typeof b === "number") return a === b || Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
  if (typeof a === "object" && typeof b === "object") return a.error === b.error;
  const blank = (x: Cached): Cached => (x === "" ? undefined : x);
  return blank(a) === blank(b);
}

/**
 * The first of the workbook's own formula cells (outside the sheets `generated`) whose computed
 * value is not the one the file holds, as a reason; undefined when every one computes what the
 * file holds. Array formulas count as changed (their other cells are not compared).
 */
function ownFormulaChanged(wb: XlsxWorkbook, headless: Headless, generated: ReadonlySet<string>): string | undefined {
  const hf = headless.hf;
  for (const f of wb.formulas) {
    if (generated.has(f.sheet.toLowerCase())) continue;
    const where = `${sheetRef(f.sheet)}!${cellAddress(f.row, f.col)}`;
    const address = { sheet: hf.getSheetId(f.sheet)!, row: f.row, col: f.col };
    if (f.arrayRef !== undefined || hf.getCellType(address) === "ARRAYFORMULA") return `${where} is an array formula`;
    if (!sameCached(cachedOf(hf.getCellValue(address)), f.cached)) return `${where} computes a value the file does not hold`;
  }
  return undefined;
}

/**
 * A generated sheet of the engine as the direct writer takes it: formulas in the file spelling
 * with their values. Its content is what the port gave the engine when it has it (turning half a
 * million parsed formulas back into text takes the engine seconds), else the engine's.
 */
function generatedSheet(port: MemoryWorkbookPort, name: string): GeneratedSheet {
  const hf = port.hf;
  const sheet = hf.getSheetId(name)!;
  const content = port.writtenContent(name) ?? hf.getSheetSerialized(sheet);
  const values = hf.getSheetValues(sheet);
  const height = Math.max(content.length, values.length);
  return {
    name,
    *rows() {
      for (let r = 0; r < height; r++) yield { row: r, cells: cellsOf(r) };
    },
  };
  function* cellsOf(r: number): Generator<{ col: number; cell: GeneratedCell }> {
    const row = content[r] ?? [];
    const vals = values[r] ?? [];
    const width = Math.max(row.length, vals.length);
    for (let c = 0; c < width; c++) {
      const x = row[c];
      if (typeof x === "string" && x.startsWith("=")) {
        const value = cachedOf(vals[c] ?? null);
        const formula = toFileFormula(x.slice(1));
        const spills = (vals[c + 1] != null && row[c + 1] == null) || (values[r + 1]?.[c] != null && content[r + 1]?.[c] == null);
        if (spills && hf.getCellType({ sheet, row: r, col: c }) === "ARRAYFORMULA") {
          const size = arrayExtent(hf, sheet, r, c);
          yield { col: c, cell: { formula, arrayRef: `${cellAddress(r, c)}:${cellAddress(r + size.rows - 1, c + size.cols - 1)}`, value } };
        } else yield { col: c, cell: { formula, value } };
      } else if (x !== null && x !== undefined && x !== "") {
        yield { col: c, cell: { value: typeof x === "string" && x.startsWith("'") ? x.slice(1) : (x as number | string | boolean) } };
      } else {
        // A cell a spilled result reaches: its value (blank padding left out).
        const value = cachedOf(vals[c] ?? null);
        if (value !== undefined && value !== "") yield { col: c, cell: { value } };
      }
    }
  }
}

/** "Sheet!A1" for a problem, with the sheet quoted when it needs it. */
export function problemAddress(p: Pick<CellProblem, "sheet" | "address">): string {
  return `${sheetRef(p.sheet)}!${p.address}`;
}
