/**
 * The headless adapter of the workbook port: a workbook held in a HyperFormula instance with the
 * LOADPATH functions registered from the built bundle (headless.ts). The CLI builds takedowns
 * through it, tests and benchmarks drive it, and `exportSheets` copies what the port wrote into
 * an ExcelJS workbook (formulas in the file spelling with their computed values cached).
 *
 * Writes are queued and applied by `flush()`: a sheet the port prepared gets its whole content in
 * one `setSheetContent` call, the cheapest way into HyperFormula (per-cell calls are far slower).
 * HyperFormula is GPL-3.0; this module is for Node and never enters the add-in bundle.
 */
import type ExcelJS from "exceljs";
import { DetailedCellError, type RawCellContent, type SimpleCellAddress } from "hyperformula";
import { HEADER_SEARCH_ROWS } from "../engine/takedown/tables";
import { cellAddress, parseCell, sheetRef } from "./a1";
import { HyperFormula } from "hyperformula";
import { createHeadless, defaultDistDir, defineBooleans, excelErrorText, HEADLESS_CONFIG, NAMESPACE, registerLoadpathFunctions, toFileFormula, type Headless, type HeadlessOptions } from "./headless";
import { ForeignSheetError, GENERATED_MARKER, type CellInput, type CellSelection, type CellValue, type RangeData, type TableInfo, type WorkbookPort } from "./port";

/** An Excel table of the workbook: name, sheet and extent including the header row ("A1:H20"). */
export interface MemoryTable {
  readonly name: string;
  readonly sheet: string;
  readonly ref: string;
}

/** Options of {@link MemoryWorkbookPort.create}. */
export interface MemoryPortOptions extends Omit<HeadlessOptions, "sheets"> {
  /** Sheets: name -> rows of values and "=formulas". */
  readonly sheets?: Readonly<Record<string, RawCellContent[][]>>;
  /** Excel tables over those sheets. */
  readonly tables?: readonly MemoryTable[];
  /** Cells holding dates, by sheet, as "row,col" (0-based): tables read report them. */
  readonly dates?: Readonly<Record<string, ReadonlySet<string>>>;
}

/** Excel's sheet size: the headless engine accepts as much (its default is smaller). */
export const SHEET_LIMITS = { maxRows: 1_048_576, maxColumns: 16_384 } as const;

/** Default of {@link maxTableCells}: cells of one table or area read at once. */
export const DEFAULT_MAX_TABLE_CELLS = 10_000_000;

/**
 * The most cells one table (or area) may have when it is read: `LOADPATH_MAX_CELLS` when set
 * to a positive whole number, else {@link DEFAULT_MAX_TABLE_CELLS}. Checked before anything is
 * allocated, so a table too large for memory stops with a message instead of aborting.
 */
export function maxTableCells(): number {
  const env = typeof process !== "undefined" ? process.env?.LOADPATH_MAX_CELLS : undefined;
  const n = env !== undefined ? Number(env) : NaN;
  return Number.isInteger(n) && n > 0 ? n : DEFAULT_MAX_TABLE_CELLS;
}

/** Sheets larger than this many cells (height x width) are copied cell by cell from the engine's map of filled cells. */
const DENSE_COPY_CELLS = 4_000_000;

/**
 * A sheet's content as the engine holds it ("=formula" strings, values), rows of cells. A sheet
 * whose extent is huge but sparse (one stray value in XFD1048576, say) is copied from the cells
 * that hold something, never by walking the whole grid.
 */
function sheetContent(hf: HyperFormula, sheet: number): RawCellContent[][] {
  const { width, height } = hf.getSheetDimensions(sheet);
  if (width * height <= DENSE_COPY_CELLS) return hf.getSheetSerialized(sheet);
  const rows: RawCellContent[][] = [];
  for (const [address] of hf.addressMapping.sheetEntries(sheet)) {
    const content = hf.getCellSerialized(address);
    if (content === null || content === undefined) continue;
    while (rows.length <= address.row) rows.push([]);
    const row = rows[address.row]!;
    while (row.length < address.col) row.push(null);
    row[address.col] = content;
  }
  return rows;
}

interface QueuedBlock {
  readonly top: number;
  readonly left: number;
  readonly cells: readonly (readonly CellInput[])[];
}

/** A value written through the port -> cell content for the engine (text is kept as text). */
function toContent(cell: CellInput | undefined): RawCellContent {
  if (cell === null || cell === undefined) return null;
  if (typeof cell === "object") return "=" + cell.formula;
  if (typeof cell === "string") return cell === "" ? null : `'${cell}`;
  return cell;
}

/** A computed value -> what the port reads: errors as their Excel text ("#VALUE!"). */
function toValue(v: unknown): CellValue {
  if (v instanceof DetailedCellError) return excelErrorText(v.type);
  if (v === undefined || v === null) return null;
  if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") return v;
  return String(v);
}

/** "Sheet!A1:H20" or "'My sheet'!A1:H20" -> sheet and area; null when it is not that form. */
function splitRangeRef(ref: string): { sheet: string; area: string } | null {
  const m = /^(?:'((?:[^']|'')+)'|([^!']+))!(\$?[A-Za-z]{1,3}\$?\d+(?::\$?[A-Za-z]{1,3}\$?\d+)?)$/.exec(ref.trim());
  if (!m) return null;
  return { sheet: m[1] !== undefined ? m[1].replace(/''/g, "'") : m[2]!, area: m[3]! };
}

/** WorkbookPort over an in-memory HyperFormula workbook. */
export class MemoryWorkbookPort implements WorkbookPort {
  private readonly queued = new Map<string, QueuedBlock[]>();
  /** Sheets the port created or cleared (their content is only what the port wrote). */
  private readonly prepared = new Set<string>();
  private readonly settings = new Map<string, string>();
  private readonly names = new Map<string, string>();
  /** Last selection made through the port ("Sheet!A1"). */
  selection: string | null = null;
  /** The active cell (moved by select() and setActiveCell()), and who is told when it moves. */
  private active: CellSelection | null = null;
  private readonly selectionHandlers = new Set<(selection: CellSelection) => void>();

  private current: Headless;
  /**
   * The content each sheet the port filled whole was given to the engine with ("=formula" in the
   * port's spelling, values), kept so that writing a file need not turn the engine's parsed
   * formulas back into text; dropped by any later write to that sheet.
   */
  private readonly written = new Map<string, RawCellContent[][]>();

  /**
   * @param headless - the engine holding the workbook
   * @param tables - the workbook's Excel tables
   * @param options - how to build a new engine when a flush rebuilds it (bundle folder, configuration)
   */
  /** Cells holding dates, by sheet, as "row,col" (0-based). */
  private dates: Readonly<Record<string, ReadonlySet<string>>> = {};

  constructor(
    headless: Headless,
    readonly tables: readonly MemoryTable[] = [],
    private readonly options: Omit<HeadlessOptions, "sheets"> = {},
  ) {
    this.current = headless;
  }

  /**
   * A port over a new headless engine loaded with the sheets given.
   * @param options - sheets, tables, bundle folder and engine configuration
   */
  static async create(options: MemoryPortOptions = {}): Promise<MemoryWorkbookPort> {
    const { sheets, tables, dates, ...rest } = options;
    const engine = { ...rest, config: { ...SHEET_LIMITS, ...rest.config } };
    const headless = await createHeadless({ ...engine, sheets: sheets ?? {} });
    const port = new MemoryWorkbookPort(headless, tables ?? [], engine);
    port.dates = dates ?? {};
    return port;
  }

  /** The engine holding the workbook (a flush that fills a prepared sheet builds a new one). */
  get headless(): Headless {
    return this.current;
  }

  /** The HyperFormula instance. */
  get hf(): Headless["hf"] {
    return this.current.hf;
  }

  private sheetId(sheet: string): number {
    const id = this.hf.getSheetId(sheet);
    if (id === undefined) throw new Error(`There is no sheet named "${sheet}".`);
    return id;
  }

  private tableNamed(name: string): MemoryTable | undefined {
    const key = name.trim().toLowerCase();
    return this.tables.find((t) => t.name.toLowerCase() === key);
  }

  /**
   * The table a sheet holds, by its real extent ("A1:A1" for an empty sheet): it starts at the
   * first row with a value (a title block above the headers stays in, for the takedown to find
   * the header row), its columns run from the first to the last non-blank cell of the fullest of
   * the first HEADER_SEARCH_ROWS rows (the header row; the earliest on a tie), and its rows down to
   * the last row with a value in those columns. Values outside (a note to the
   * right, one stray value in XFD1048576) do not widen it. Only the cells that hold something are
   * visited, never the whole grid.
   */
  usedArea(sheet: string): string {
    const id = this.sheetId(sheet);
    const filled: { row: number; col: number }[] = [];
    for (const [address] of this.hf.addressMapping.sheetEntries(id)) {
      const v = this.hf.getCellValue(address);
      if (v !== null && v !== "") filled.push({ row: address.row, col: address.col });
    }
    if (filled.length === 0) return "A1:A1";
    let top = Number.POSITIVE_INFINITY;
    for (const c of filled) top = Math.min(top, c.row);
    // The columns are the filled span of the fullest row among the first rows (the header row,
    // below any title block, group or units row: the takedown looks for it in as many rows).
    const counts = new Map<number, number>();
    for (const c of filled) if (c.row < top + HEADER_SEARCH_ROWS) counts.set(c.row, (counts.get(c.row) ?? 0) + 1);
    let headerRow = top;
    for (const [row, n] of counts) if (n > counts.get(headerRow)! || (n === counts.get(headerRow)! && row < headerRow)) headerRow = row;
    let left = Number.POSITIVE_INFINITY;
    let right = -1;
    for (const c of filled) {
      if (c.row !== headerRow) continue;
      left = Math.min(left, c.col);
      right = Math.max(right, c.col);
    }
    let bottom = top;
    for (const c of filled) if (c.col >= left && c.col <= right) bottom = Math.max(bottom, c.row);
    return `${cellAddress(top, left)}:${cellAddress(bottom, right)}`;
  }

  /** Values of an area of a sheet, computed. */
  readArea(sheet: string, area: string): RangeData {
    const [a, b = a] = area.replace(/\$/g, "").split(":");
    const p = parseCell(a!);
    const q = parseCell(b!);
    const sheetId = this.sheetId(sheet);
    const top = Math.min(p.row, q.row);
    const left = Math.min(p.col, q.col);
    const height = Math.max(p.row, q.row) - top + 1;
    const width = Math.max(p.col, q.col) - left + 1;
    const limit = maxTableCells();
    if (height * width > limit) {
      throw new Error(
        `${sheetRef(sheet)}!${cellAddress(top, left)}:${cellAddress(top + height - 1, left + width - 1)} is ${height.toLocaleString("en-US")} rows x ${width.toLocaleString("en-US")} columns, ` +
          `more than the ${limit.toLocaleString("en-US")} cells a table may have; make the table smaller, or raise the limit with the environment variable LOADPATH_MAX_CELLS (e.g. LOADPATH_MAX_CELLS=${(2 * limit).toFixed(0)}).`,
      );
    }
    // Cell by cell through one address object: the engine's getRangeValues makes an address
    // object and a second array for every cell, which counts when a takedown reads ~10^6 cells.
    const at: SimpleCellAddress = { sheet: sheetId, row: top, col: left };
    const values: CellValue[][] = new Array<CellValue[]>(height);
    for (let i = 0; i < height; i++) {
      const row = new Array<CellValue>(width);
      at.row = top + i;
      for (let j = 0; j < width; j++) {
        at.col = left + j;
        row[j] = toValue(this.hf.getCellValue(at));
      }
      values[i] = row;
    }
    const dated = this.dates[sheet];
    if (dated === undefined) return { sheet, top, left, values };
    let any = false;
    const dates = values.map((row, i) =>
      row.map((_, j) => {
        const d = dated.has(`${top + i},${left + j}`);
        any ||= d;
        return d;
      }),
    );
    return { sheet, top, left, values, ...(any ? { dates } : {}) };
  }

  async listTables(): Promise<TableInfo[]> {
    const out: TableInfo[] = this.tables.map((t) => ({ name: t.name, sheet: t.sheet, kind: "table", headers: this.headersOf(this.readArea(t.sheet, t.ref)) }));
    const withTable = new Set(this.tables.map((t) => t.sheet));
    for (const sheet of this.hf.getSheetNames()) {
      if (withTable.has(sheet)) continue;
      const data = this.readArea(sheet, this.usedArea(sheet));
      if (data.values.every((r) => r.every((v) => v === null))) continue;
      out.push({ name: sheet, sheet, kind: "range", headers: this.headersOf(data) });
    }
    return out;
  }

  private headersOf(data: RangeData): string[] {
    return (data.values[0] ?? []).map((v) => (v === null ? "" : String(v)));
  }

  async readTable(ref: string): Promise<RangeData> {
    const table = this.tableNamed(ref);
    if (table) return this.readArea(table.sheet, table.ref);
    const range = splitRangeRef(ref);
    if (range) return this.readArea(range.sheet, range.area);
    const sheet = this.hf.getSheetNames().find((s) => s.toLowerCase() === ref.trim().toLowerCase());
    if (sheet !== undefined) return this.readArea(sheet, this.usedArea(sheet));
    throw new Error(`There is no table or sheet named "${ref}".`);
  }

  async sheetNames(): Promise<string[]> {
    return this.hf.getSheetNames();
  }

  async sheetMarker(sheet: string): Promise<string | null> {
    const id = this.hf.getSheetId(sheet);
    if (id === undefined) return null;
    const v = this.hf.getCellValue({ sheet: id, row: 0, col: 0 });
    return typeof v === "string" && v.startsWith(GENERATED_MARKER) ? v : null;
  }

  async prepareSheet(sheet: string, marker: string, replaceForeign = false): Promise<void> {
    const id = this.hf.getSheetId(sheet);
    if (id !== undefined) {
      if ((await this.sheetMarker(sheet)) === null && !replaceForeign) throw new ForeignSheetError(sheet);
      this.hf.clearSheet(id);
    } else {
      this.hf.addSheet(sheet);
    }
    this.prepared.add(sheet);
    this.written.delete(sheet);
    this.queued.set(sheet, [{ top: 0, left: 0, cells: [[marker]] }]);
  }

  async writeBlock(sheet: string, top: number, left: number, cells: readonly (readonly CellInput[])[]): Promise<void> {
    this.sheetId(sheet);
    const list = this.queued.get(sheet) ?? [];
    list.push({ top, left, cells });
    this.queued.set(sheet, list);
  }

  async setNames(names: Readonly<Record<string, string>>): Promise<void> {
    for (const [name, ref] of Object.entries(names)) {
      const expression = ref.startsWith("=") ? ref : `=${ref}`;
      if (this.hf.listNamedExpressions().includes(name)) this.hf.changeNamedExpression(name, expression);
      else this.hf.addNamedExpression(name, expression);
      this.names.set(name, expression.slice(1));
    }
  }

  async select(sheet: string, address: string): Promise<void> {
    this.selection = `${sheet}!${address}`;
    this.setActiveCell(sheet, address);
  }

  /** The in-memory workbook always reports selection changes (made by setActiveCell or select). */
  followsSelection(): boolean {
    return true;
  }

  async onSelectionChanged(handler: (selection: CellSelection) => void): Promise<() => void> {
    this.selectionHandlers.add(handler);
    return () => {
      this.selectionHandlers.delete(handler);
    };
  }

  async activeCell(): Promise<CellSelection | null> {
    return this.active;
  }

  /**
   * Move the active cell as a user clicking a cell would (there is no grid: the demo page and
   * tests stand in for Excel's selection), and tell every selection handler.
   * @param sheet - sheet name
   * @param address - A1 address; a range ("B3:D5") makes its top-left cell active
   */
  setActiveCell(sheet: string, address: string): void {
    const first = address.replace(/\$/g, "").split(":")[0]!.trim().toUpperCase();
    this.active = { sheet, address: first };
    for (const h of [...this.selectionHandlers]) h(this.active);
  }

  async getSetting(key: string): Promise<string | null> {
    return this.settings.get(key) ?? null;
  }

  async setSetting(key: string, value: string): Promise<void> {
    this.settings.set(key, value);
  }

  /**
   * Apply the queued writes. When prepared (generated) sheets receive their content, the engine
   * is rebuilt from every sheet's content at once, which is several times faster for large sheets
   * than adding the cells to the running engine; other writes go in one batch.
   */
  async flush(): Promise<void> {
    if (this.queued.size === 0) return;
    const fresh = [...this.queued.keys()].filter((s) => this.prepared.has(s) && this.hf.getSheetDimensions(this.sheetId(s)).height === 0);
    if (fresh.length > 0) {
      const sheets: Record<string, RawCellContent[][]> = {};
      for (const name of this.hf.getSheetNames()) {
        const blocks = this.queued.get(name);
        sheets[name] = fresh.includes(name) ? mergeBlocks(blocks!) : sheetContent(this.hf, this.sheetId(name));
        if (blocks && !fresh.includes(name)) overlay(sheets[name]!, blocks);
      }
      const names = this.hf.getAllNamedExpressionsSerialized().filter((n) => n.scope === undefined && !["TRUE", "FALSE"].includes(n.name.toUpperCase()));
      for (const name of this.hf.getSheetNames()) {
        if (fresh.includes(name)) this.written.set(name, sheets[name]!);
        else if (this.queued.has(name)) this.written.delete(name);
      }
      this.current = this.rebuild(sheets);
      for (const n of names) this.hf.addNamedExpression(n.name, n.expression as string);
    } else {
      for (const sheet of this.queued.keys()) this.written.delete(sheet);
      this.hf.batch(() => {
        for (const [sheet, blocks] of this.queued) {
          const id = this.sheetId(sheet);
          for (const b of blocks) this.hf.setCellContents({ sheet: id, row: b.top, col: b.left }, b.cells.map((r) => r.map(toContent)));
        }
      });
    }
    this.queued.clear();
  }

  /**
   * A new engine over sheets whose formulas are already in the engine's spelling (what the port
   * holds and writes): no per-formula translation, unlike reading a file.
   */
  private rebuild(sheets: Record<string, RawCellContent[][]>): Headless {
    const bundle = registerLoadpathFunctions(this.options.distDir ?? defaultDistDir());
    const hf = HyperFormula.buildFromSheets(sheets, { ...HEADLESS_CONFIG, ...this.options.config });
    defineBooleans(hf);
    return { hf, bundle, functionIds: bundle.metadata.map((f) => `${NAMESPACE}.${f.id.toUpperCase()}`) };
  }

  /** Sheets the port created or rebuilt, in the order first prepared. */
  generatedSheets(): string[] {
    return [...this.prepared];
  }

  /**
   * A generated sheet's content as the port gave it to the engine ("=formula" in the engine's
   * spelling, text marked with a leading apostrophe), or undefined when the sheet was written to
   * since it was filled (then read it from the engine).
   * @param sheet - the sheet's name as prepared
   */
  writtenContent(sheet: string): readonly (readonly RawCellContent[])[] | undefined {
    return this.written.get(sheet);
  }

  /** Workbook names defined through the port: name -> reference. */
  definedNames(): ReadonlyMap<string, string> {
    return this.names;
  }

  /**
   * Set one cell as a user would (a value, or "=formula"); the engine recalculates what depends on it.
   * @param sheet - sheet name
   * @param address - A1 address
   * @param content - number, text, boolean, null or "=formula"
   */
  setCell(sheet: string, address: string, content: RawCellContent): void {
    const { row, col } = parseCell(address);
    this.written.delete(sheet);
    this.hf.setCellContents({ sheet: this.sheetId(sheet), row, col }, [[content]]);
  }

  /** A computed cell value (errors as their Excel text). */
  value(sheet: string, address: string): CellValue {
    const { row, col } = parseCell(address);
    return toValue(this.hf.getCellValue({ sheet: this.sheetId(sheet), row, col }));
  }

  /** A cell's formula ("=..."), or undefined when it holds a value. */
  formula(sheet: string, address: string): string | undefined {
    const { row, col } = parseCell(address);
    return this.hf.getCellFormula({ sheet: this.sheetId(sheet), row, col });
  }
}

/** The queued blocks of one sheet merged into rows of engine content. */
function mergeBlocks(blocks: readonly QueuedBlock[]): RawCellContent[][] {
  const rows: RawCellContent[][] = [];
  overlay(rows, blocks);
  return rows;
}

/** Write blocks over rows of engine content (blank cells of a block leave what is there). */
function overlay(rows: RawCellContent[][], blocks: readonly QueuedBlock[]): void {
  for (const b of blocks) {
    b.cells.forEach((cells, i) => {
      const r = b.top + i;
      while (rows.length <= r) rows.push([]);
      const row = rows[r]!;
      cells.forEach((cell, j) => {
        if (cell === null || cell === undefined) return;
        const c = b.left + j;
        while (row.length < c) row.push(null);
        row[c] = toContent(cell);
      });
    });
  }
}

/** A computed value as a file caches it. */
function cached(v: unknown): number | string | boolean | { error: string } | undefined {
  if (v instanceof DetailedCellError) return { error: excelErrorText(v.type) };
  if (v === null || v === undefined) return undefined;
  return v as number | string | boolean;
}

/**
 * Copy the sheets the port generated into an ExcelJS workbook, replacing same-named sheets:
 * formulas in the file spelling (`_xldudf_LOADPATH_NAME(`) with their computed values cached,
 * values as they are. Names defined through the port are added as workbook names.
 * @param port - the port that wrote the sheets
 * @param excel - the ExcelJS workbook to write into (e.g. the one read from the input file)
 */
export function exportSheets(port: MemoryWorkbookPort, excel: ExcelJS.Workbook): void {
  const hf = port.hf;
  for (const sheet of port.generatedSheets()) {
    const old = excel.getWorksheet(sheet);
    if (old) excel.removeWorksheet(old.id);
    const ws = excel.addWorksheet(sheet);
    const id = hf.getSheetId(sheet)!;
    const content = hf.getSheetSerialized(id);
    const values = hf.getSheetValues(id);
    content.forEach((row, r) => {
      row.forEach((c, col) => {
        if (c === null || c === undefined || c === "") return;
        const cell = ws.getCell(r + 1, col + 1);
        if (typeof c === "string" && c.startsWith("=")) {
          const result = cached(values[r]?.[col]);
          const formula = toFileFormula(c.slice(1));
          cell.value = (result === undefined ? { formula } : { formula, result }) as ExcelJS.CellValue;
        } else {
          cell.value = (typeof c === "string" && c.startsWith("'") ? c.slice(1) : c) as ExcelJS.CellValue;
        }
      });
    });
  }
  for (const [name, ref] of port.definedNames()) excel.definedNames.add(ref, name);
}
