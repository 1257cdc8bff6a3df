/**
 * The Office.js adapter of the workbook port: the only module of the add-in that calls
 * `Excel.run`. Reads load only the properties they use and sync a fixed number of times each;
 * writes and names are queued and sent by {@link OfficeWorkbookPort.flush} in requests of
 * bounded size, with calculation suspended and events off, so a build costs the same handful of
 * round trips whether the building has 50 members or 5,000 (plus one per ~4 MB of formulas).
 */
import { ForeignSheetError, GENERATED_MARKER, type CellInput, type CellSelection, type PictureInput, type RangeData, type TableInfo, type WorkbookPort } from "./port";
import { isDateFormat } from "./number-format";
import { DEFAULT_CHUNK_BYTES, fromExcelValue, parseRangeAddress, planChunks, splitSheetRef, type QueuedBlock } from "./office-chunks";

/** The cell that holds the generated-sheet marker on a sheet the add-in made. */
export const MARKER_CELL = "A1";

/** Options of the adapter (tests shrink the request budget to see chunking at small sizes). */
export interface OfficePortOptions {
  /** Request size budget in bytes (default 4 MB, under the ~5 MB limit of Excel on the web). */
  readonly chunkBytes?: number;
}

/** True when the host supports an ExcelApi requirement set (assumed when Office is absent, as in tests). */
function supports(version: string): boolean {
  if (typeof Office === "undefined" || !Office.context?.requirements) return true;
  return Office.context.requirements.isSetSupported("ExcelApi", version);
}

function textOf(value: unknown): string {
  return value === null || value === undefined ? "" : String(value);
}

/**
 * The first cell of an address as a selection event gives it ("B3", "$B$3:$D$9", "Sheet1!B3:C4",
 * "B3:C4,F7" for several areas), as a plain A1 address; null when it is not one (whole columns
 * "B:B" and whole rows "3:3" start at their first cell).
 * @param address - the range address
 */
export function firstCellOf(address: string): string | null {
  const area = address.slice(address.lastIndexOf("!") + 1).split(",")[0]!.split(":")[0]!.replace(/\$/g, "").trim();
  if (/^[A-Za-z]{1,3}\d+$/.test(area)) return area.toUpperCase();
  if (/^[A-Za-z]{1,3}$/.test(area)) return `${area.toUpperCase()}1`;
  if (/^\d+$/.test(area)) return `A${area}`;
  return null;
}

type SelectionRegistration = OfficeExtension.EventHandlerResult<Excel.WorksheetSelectionChangedEventArgs>;

/** Remove event handlers, each in its own request context (as Office.js requires). */
async function removeHandlers(registrations: readonly SelectionRegistration[]): Promise<void> {
  for (const r of registrations) {
    await Excel.run(r.context, async (context) => {
      r.remove();
      await context.sync();
    });
  }
}

/** WorkbookPort over the workbook open in Excel (task pane, shared runtime). */
export class OfficeWorkbookPort implements WorkbookPort {
  private readonly chunkBytes: number;
  private blocks: QueuedBlock[] = [];
  private names: Record<string, string> = {};
  /** Sheets prepared through this port: the only ones it writes to. */
  private readonly ownSheets = new Set<string>();

  constructor(options: OfficePortOptions = {}) {
    this.chunkBytes = options.chunkBytes ?? DEFAULT_CHUNK_BYTES;
  }

  /** Three round trips: the lists, then the header rows, then the first rows of used ranges. */
  async listTables(): Promise<TableInfo[]> {
    return Excel.run(async (context) => {
      const tables = context.workbook.tables.load("items/name,items/worksheet/name");
      const sheets = context.workbook.worksheets.load("items/name");
      await context.sync();
      const withTable = new Set(tables.items.map((t) => t.worksheet.name));
      const headerRanges = tables.items.map((t) => t.getHeaderRowRange().load("values"));
      const used = sheets.items
        .filter((ws) => !withTable.has(ws.name))
        .map((ws) => ({ name: ws.name, range: ws.getUsedRangeOrNullObject(true).load("isNullObject,address") }));
      await context.sync();
      const present = used.filter((u) => !u.range.isNullObject);
      const firstRows = present.map((u) => u.range.getRow(0).load("values"));
      await context.sync();
      const out: TableInfo[] = tables.items.map((t, i) => ({
        name: t.name,
        sheet: t.worksheet.name,
        kind: "table" as const,
        headers: (headerRanges[i]!.values[0] ?? []).map(textOf),
      }));
      present.forEach((u, i) => {
        const headers = (firstRows[i]!.values[0] ?? []).map(textOf);
        if (headers.some((h) => h !== "")) out.push({ name: u.name, sheet: u.name, kind: "range", headers });
      });
      return out;
    });
  }

  /** Two round trips: find what the reference names, then read its address and values. */
  async readTable(ref: string, options: { readonly dates?: boolean } = {}): Promise<RangeData> {
    return Excel.run(async (context) => {
      const wb = context.workbook;
      const typed = splitSheetRef(ref);
      let range: Excel.Range;
      if (typed) {
        range = wb.worksheets.getItem(typed.sheet).getRange(typed.address);
      } else {
        const table = wb.tables.getItemOrNullObject(ref).load("isNullObject");
        const sheet = wb.worksheets.getItemOrNullObject(ref).load("isNullObject");
        await context.sync();
        if (!table.isNullObject) range = table.getRange();
        else if (!sheet.isNullObject) range = sheet.getUsedRange(true);
        else throw new Error(`No table or sheet named "${ref}" in this workbook.`);
      }
      range.load(options.dates === true ? "address,values,numberFormat" : "address,values");
      await context.sync();
      const { sheet, top, left } = parseRangeAddress(range.address);
      const values = range.values.map((row) => row.map(fromExcelValue));
      if (options.dates !== true || !Array.isArray(range.numberFormat)) return { sheet, top, left, values };
      const formats = range.numberFormat as unknown[][];
      const dates = range.values.map((row, i) => row.map((v, j) => typeof v === "number" && isDateFormat(formats[i]?.[j] as string | undefined)));
      return { sheet, top, left, values, ...(dates.some((row) => row.includes(true)) ? { dates } : {}) };
    });
  }

  async sheetNames(): Promise<string[]> {
    return Excel.run(async (context) => {
      const sheets = context.workbook.worksheets.load("items/name");
      await context.sync();
      return sheets.items.map((ws) => ws.name);
    });
  }

  async sheetMarker(sheet: string): Promise<string | null> {
    return Excel.run(async (context) => {
      const found = await this.markerIn(context, sheet);
      return found.marker;
    });
  }

  /** Two round trips to find the sheet and its marker, one to clear or add it and write the marker. */
  async prepareSheet(sheet: string, marker: string, replaceForeign = false): Promise<void> {
    await Excel.run(async (context) => {
      const found = await this.markerIn(context, sheet);
      if (found.exists && found.marker === null && !replaceForeign) throw new ForeignSheetError(sheet);
      const sheets = context.workbook.worksheets;
      const ws = found.exists ? sheets.getItem(sheet) : sheets.add(sheet);
      if (supports("1.8")) context.runtime.enableEvents = false;
      if (found.exists) ws.getRange().clear();
      ws.getRange(MARKER_CELL).values = [[marker]];
      if (supports("1.8")) context.runtime.enableEvents = true;
      await context.sync();
    });
    this.ownSheets.add(sheet);
  }

  /** Queued until flush; only sheets prepared through this port can be written. */
  async writeBlock(sheet: string, top: number, left: number, cells: readonly (readonly CellInput[])[]): Promise<void> {
    if (!this.ownSheets.has(sheet)) throw new Error(`Loadpath writes only to sheets it prepared; "${sheet}" was not.`);
    if (top < 0 || left < 0) throw new Error(`writeBlock: top and left must be >= 0 (got ${top}, ${left}).`);
    this.blocks.push({ sheet, top, left, cells });
  }

  /** Queued until flush. */
  async setNames(names: Readonly<Record<string, string>>): Promise<void> {
    this.names = { ...this.names, ...names };
  }

  async select(sheet: string, address: string): Promise<void> {
    await Excel.run(async (context) => {
      const ws = context.workbook.worksheets.getItem(sheet);
      ws.activate();
      ws.getRange(address).select();
      await context.sync();
    });
  }

  async getSetting(key: string): Promise<string | null> {
    return Excel.run(async (context) => {
      const item = context.workbook.settings.getItemOrNullObject(key).load("isNullObject,value");
      await context.sync();
      return item.isNullObject ? null : textOf(item.value);
    });
  }

  async setSetting(key: string, value: string): Promise<void> {
    await Excel.run(async (context) => {
      context.workbook.settings.add(key, value);
      await context.sync();
    });
  }

  /**
   * Send the queued blocks and names: one request per chunk of at most `chunkBytes` (calculation
   * suspended for each), the names and the restored events in one last request.
   */
  async flush(): Promise<void> {
    const chunks = planChunks(this.blocks, this.chunkBytes);
    const names = this.names;
    this.blocks = [];
    this.names = {};
    if (chunks.length === 0 && Object.keys(names).length === 0) return;
    const events = supports("1.8");
    const suspend = supports("1.6");
    await Excel.run(async (context) => {
      const wb = context.workbook;
      if (events) context.runtime.enableEvents = false;
      const existing = wb.names.load("items/name");
      try {
        for (const chunk of chunks.length > 0 ? chunks : [[]]) {
          if (suspend) wb.application.suspendApiCalculationUntilNextSync();
          for (const w of chunk) wb.worksheets.getItem(w.sheet).getRangeByIndexes(w.top, w.left, w.rows, w.cols).formulas = w.formulas;
          await context.sync();
        }
        const taken = new Set(existing.items.map((n) => n.name.toUpperCase()));
        for (const [name, ref] of Object.entries(names)) {
          if (taken.has(name.toUpperCase())) wb.names.getItem(name).delete();
          wb.names.add(name, ref.startsWith("=") ? ref : "=" + ref);
        }
      } finally {
        if (events) context.runtime.enableEvents = true;
        await context.sync();
      }
    });
  }

  /** Selection events need ExcelApi 1.7 (per worksheet); 1.9 adds one event for every sheet. */
  followsSelection(): boolean {
    return supports("1.7");
  }

  /**
   * Follow the selection: one handler on the worksheet collection (ExcelApi 1.9), or on each
   * worksheet present now (1.7). Each event costs one round trip to turn the sheet's id into
   * its name. Handlers are not saved with the file; the returned function removes them.
   */
  async onSelectionChanged(handler: (selection: CellSelection) => void): Promise<() => void> {
    if (!supports("1.7")) throw new Error("This version of Excel does not report selection changes (ExcelApi 1.7 is needed).");
    const onEvent = async (args: Excel.WorksheetSelectionChangedEventArgs): Promise<void> => {
      const address = firstCellOf(args.address);
      if (address === null) return;
      const sheet = await this.sheetNameOf(args.worksheetId);
      if (sheet !== null) handler({ sheet, address });
    };
    const registrations = await Excel.run(async (context) => {
      const out: SelectionRegistration[] = [];
      if (supports("1.9")) {
        out.push(context.workbook.worksheets.onSelectionChanged.add(onEvent));
      } else {
        const sheets = context.workbook.worksheets.load("items/name");
        await context.sync();
        for (const ws of sheets.items) out.push(ws.onSelectionChanged.add(onEvent));
      }
      await context.sync();
      return out;
    });
    let removed = false;
    return () => {
      if (removed) return;
      removed = true;
      void removeHandlers(registrations).catch(() => undefined);
    };
  }

  /** One round trip: the selected range (ExcelApi 1.1) and its top-left cell. */
  async activeCell(): Promise<CellSelection | null> {
    return Excel.run(async (context) => {
      const range = context.workbook.getSelectedRange().load("address");
      await context.sync();
      const bang = range.address.lastIndexOf("!");
      const address = firstCellOf(range.address);
      if (bang < 0 || address === null) return null;
      const raw = range.address.slice(0, bang);
      const sheet = raw.startsWith("'") && raw.endsWith("'") ? raw.slice(1, -1).replace(/''/g, "'") : raw;
      return { sheet, address };
    });
  }

  /** Pictures go in through the shapes API (ExcelApi 1.9). */
  canInsertPicture(): boolean {
    return supports("1.9");
  }

  /**
   * Place a PNG on a sheet the add-in made, at a cell: the marker is checked first (any other
   * sheet is refused), a picture of the same name is replaced (ExcelApi 1.14; older hosts add
   * another), then the picture is added and sized. Four round trips.
   */
  async insertPicture(sheet: string, picture: PictureInput): Promise<void> {
    if (!supports("1.9")) throw new Error("This version of Excel cannot insert pictures from an add-in (ExcelApi 1.9 is needed).");
    await Excel.run(async (context) => {
      const found = await this.markerIn(context, sheet);
      if (found.marker === null) throw new Error(`Loadpath places pictures only on sheets it made; "${sheet}" is not one.`);
      const ws = context.workbook.worksheets.getItem(sheet);
      const old = supports("1.14") ? ws.shapes.getItemOrNullObject(picture.name).load("isNullObject") : null;
      const anchor = ws.getCell(picture.row, picture.col).load("left,top");
      await context.sync();
      if (old && !old.isNullObject) old.delete();
      const shape = ws.shapes.addImage(picture.pngBase64);
      shape.name = picture.name;
      shape.left = anchor.left;
      shape.top = anchor.top;
      shape.width = picture.widthPt;
      shape.height = picture.heightPt;
      await context.sync();
    });
  }

  /** A worksheet's name from its id (one round trip); null when it is gone. */
  private async sheetNameOf(id: string): Promise<string | null> {
    return Excel.run(async (context) => {
      const ws = context.workbook.worksheets.getItemOrNullObject(id).load("isNullObject,name");
      await context.sync();
      return ws.isNullObject ? null : ws.name;
    });
  }

  /** Whether the sheet exists and the marker on it (two round trips). */
  private async markerIn(context: Excel.RequestContext, sheet: string): Promise<{ exists: boolean; marker: string | null }> {
    const ws = context.workbook.worksheets.getItemOrNullObject(sheet).load("isNullObject");
    await context.sync();
    if (ws.isNullObject) return { exists: false, marker: null };
    const cell = ws.getRange(MARKER_CELL).load("values");
    await context.sync();
    const text = textOf(cell.values[0]?.[0]);
    return { exists: true, marker: text.startsWith(GENERATED_MARKER) ? text : null };
  }
}
