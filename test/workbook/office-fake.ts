/**
 * A small Excel object model for testing the Office.js adapter under vitest, built from
 * office-addin-mock objects (so a property read without load() + sync() reads as an error
 * string, as the real API would fail). Behind it sits a plain workbook (sheets of cells, tables,
 * names, settings) that queued operations change only when `context.sync()` runs, in queue order.
 * The fake counts syncs and records every write with the state of events and calculation.
 */
import { OfficeMockObject } from "office-addin-mock";
import { cellAddress, parseCell, sheetRef } from "../../src/workbook/a1";

type Raw = string | number | boolean;

export interface FakeTable {
  readonly name: string;
  readonly sheet: string;
  /** Header row and body as the user typed them. */
  readonly rows: readonly (readonly Raw[])[];
  /** Top-left cell, "A1" by default. */
  readonly at?: string;
}

/** One range write seen by the host. */
export interface WriteRecord {
  readonly sheet: string;
  readonly top: number;
  readonly left: number;
  readonly rows: number;
  readonly cols: number;
  readonly kind: "formulas" | "values";
  /** Sync (1-based) whose request carried it. */
  readonly sync: number;
  /** Were events on when it was applied? */
  readonly eventsOn: boolean;
  /** Had calculation been suspended in this request? */
  readonly calcSuspended: boolean;
  /** JSON size of the written array, a stand-in for the request payload. */
  readonly bytes: number;
}

interface Rect {
  sheet: string;
  top: number;
  left: number;
  rows: number;
  cols: number;
}

type Op = () => void;

/** A selection handler registered through the fake, and where (null = the worksheet collection). */
export interface FakeSelectionHandler {
  readonly sheet: string | null;
  readonly handler: (args: { address: string; worksheetId: string; type: string }) => Promise<unknown>;
  removed: boolean;
}

/** A picture placed through the fake's shapes API. */
export interface FakeShape {
  readonly sheet: string;
  name: string;
  left: number;
  top: number;
  width: number;
  height: number;
  readonly image: string;
  deleted: boolean;
}

/** Points per column and per row of the fake's grid (for a cell's left and top). */
export const FAKE_COL_PT = 64;
export const FAKE_ROW_PT = 20;

/** The backend workbook plus the fake `Excel` global over it. */
export class FakeExcel {
  readonly sheets = new Map<string, Map<string, unknown>>();
  readonly tables: FakeTable[] = [];
  readonly names = new Map<string, string>();
  readonly settings = new Map<string, unknown>();
  /** Number formats by sheet and "row,col" (0-based); a cell not listed is "General". */
  readonly formats = new Map<string, Map<string, string>>();
  readonly writes: WriteRecord[] = [];
  readonly cleared: string[] = [];
  readonly addedSheets: string[] = [];
  syncs = 0;
  selection: { sheet: string; address: string } | null = null;
  activeSheet: string | null = null;
  eventsOn = true;
  /** Selection handlers registered (with whether they were removed). */
  readonly selectionHandlers: FakeSelectionHandler[] = [];
  /** Pictures added through worksheet.shapes. */
  readonly shapes: FakeShape[] = [];
  private queue: Op[] = [];
  private mocks: OfficeMockObject[] = [];
  private suspendedThisBatch = false;

  constructor(sheets: Readonly<Record<string, readonly (readonly Raw[])[]>>, tables: readonly FakeTable[] = []) {
    for (const [name, rows] of Object.entries(sheets)) {
      const cells = new Map<string, unknown>();
      rows.forEach((row, r) => row.forEach((v, c) => v !== "" && cells.set(`${r},${c}`, v)));
      this.sheets.set(name, cells);
    }
    for (const t of tables) {
      this.tables.push(t);
      const { row, col } = parseCell(t.at ?? "A1");
      const cells = this.sheets.get(t.sheet) ?? new Map<string, unknown>();
      this.sheets.set(t.sheet, cells);
      t.rows.forEach((r, i) => r.forEach((v, j) => v !== "" && cells.set(`${row + i},${col + j}`, v)));
    }
  }

  /** Cell content (formulas with their "=") or undefined when blank. */
  cell(sheet: string, address: string): unknown {
    const { row, col } = parseCell(address);
    return this.sheets.get(sheet)?.get(`${row},${col}`);
  }

  /** A snapshot of one sheet's cells, to check nothing changed. */
  snapshot(sheet: string): string {
    return JSON.stringify([...(this.sheets.get(sheet) ?? new Map()).entries()].sort());
  }

  /** The id Excel would give a sheet (the fake derives it from the name). */
  idOf(sheet: string): string {
    return `{id:${sheet}}`;
  }

  private sheetOfId(key: string): string | undefined {
    const m = /^\{id:(.*)\}$/.exec(key);
    const name = m ? m[1]! : key;
    return this.sheets.has(name) ? name : undefined;
  }

  /** Raise the selection event as Excel would when the user selects `address` on `sheet`. */
  async fireSelection(sheet: string, address: string): Promise<void> {
    const args = { address, worksheetId: this.idOf(sheet), type: "WorksheetSelectionChanged" };
    for (const h of this.selectionHandlers) if (!h.removed && (h.sheet === null || h.sheet === sheet)) await h.handler(args);
  }

  /** The global to stub as `Excel` (run(batch), or run(context, batch) as for removing handlers). */
  excel(): unknown {
    return {
      run: async <T>(a: unknown, b?: (context: unknown) => Promise<T>): Promise<T> => {
        const batch = (typeof a === "function" ? a : b) as (context: unknown) => Promise<T>;
        return batch(this.context());
      },
    };
  }

  private selectionEvents(sheet: string | null): unknown {
    const fake = this;
    return {
      add: (handler: FakeSelectionHandler["handler"]) => {
        const entry: FakeSelectionHandler = { sheet, handler, removed: false };
        fake.queue.push(() => fake.selectionHandlers.push(entry));
        return { context: {}, remove: () => fake.queue.push(() => (entry.removed = true)) };
      },
    };
  }

  private context(): unknown {
    const fake = this;
    const runtime = {
      get enableEvents() {
        return fake.eventsOn;
      },
      set enableEvents(on: boolean) {
        fake.queue.push(() => (fake.eventsOn = on));
      },
    };
    return {
      runtime,
      workbook: this.workbook(),
      sync: async () => {
        this.syncs++;
        const ops = this.queue;
        this.queue = [];
        for (const op of ops) op();
        this.suspendedThisBatch = false;
        for (const m of this.mocks) await m.sync();
      },
    };
  }

  private track<T extends object>(data: Record<string, unknown>): T {
    const mock = new OfficeMockObject(data);
    this.mocks.push(mock);
    return mock as unknown as T;
  }

  /** A mock collection whose load("items/a,items/b/c") loads those paths on every item. */
  private collection(items: () => OfficeMockObject[], methods: Record<string, unknown>): unknown {
    const coll = this.track<OfficeMockObject>({ items: [] as unknown[] });
    Object.assign(coll, methods);
    // setValue is private in the typings but is how office-addin-mock stores a property.
    const open = coll as unknown as { setValue(name: string, value: unknown): void; load: (arg?: string) => unknown };
    open.load = (arg?: string) => {
      const list = items();
      open.setValue("items", list);
      OfficeMockObject.prototype.load.call(coll, "items");
      const paths = (arg ?? "").split(",").map((p) => p.trim()).filter((p) => p.startsWith("items/"));
      for (const item of list) for (const p of paths) item.load(p.slice("items/".length));
      return coll;
    };
    return coll;
  }

  private workbook(): unknown {
    const fake = this;
    return {
      application: {
        suspendApiCalculationUntilNextSync: () => fake.queue.push(() => (fake.suspendedThisBatch = true)),
      },
      getSelectedRange: () => {
        const sel = fake.selection ?? { sheet: [...fake.sheets.keys()][0]!, address: "A1" };
        return fake.rangeMock(rectOf(sel.sheet, sel.address));
      },
      tables: this.collection(
        () => fake.tables.map((t) => fake.tableMock(t)),
        {
          getItemOrNullObject: (name: string) => {
            const t = fake.tables.find((x) => x.name.toLowerCase() === name.toLowerCase());
            return t ? fake.tableMock(t) : fake.track({ isNullObject: true });
          },
        },
      ),
      worksheets: this.collection(
        () => [...fake.sheets.keys()].map((n) => fake.sheetMock(n)),
        {
          getItem: (name: string) => {
            if (!fake.sheets.has(name) && !fake.addedSheets.includes(name)) throw new Error(`ItemNotFound: ${name}`);
            return fake.sheetMock(name);
          },
          getItemOrNullObject: (key: string) => {
            const name = fake.sheetOfId(key);
            return name !== undefined ? fake.sheetMock(name) : fake.track({ isNullObject: true });
          },
          onSelectionChanged: fake.selectionEvents(null),
          add: (name: string) => {
            fake.addedSheets.push(name);
            fake.queue.push(() => fake.sheets.set(name, new Map()));
            return fake.sheetMock(name);
          },
        },
      ),
      names: this.collection(
        () => [...fake.names.keys()].map((n) => fake.track({ name: n })),
        {
          add: (name: string, ref: string) => fake.queue.push(() => fake.names.set(name, ref)),
          getItem: (name: string) => ({ delete: () => fake.queue.push(() => fake.names.delete(name)) }),
        },
      ),
      settings: {
        add: (key: string, value: unknown) => fake.queue.push(() => fake.settings.set(key, value)),
        getItemOrNullObject: (key: string) =>
          fake.track(fake.settings.has(key) ? { isNullObject: false, value: fake.settings.get(key) } : { isNullObject: true, value: "" }),
      },
    };
  }

  private tableMock(t: FakeTable): OfficeMockObject {
    const { row, col } = parseCell(t.at ?? "A1");
    const width = t.rows[0]?.length ?? 0;
    const whole: Rect = { sheet: t.sheet, top: row, left: col, rows: t.rows.length, cols: width };
    return this.track({
      isNullObject: false,
      name: t.name,
      worksheet: { name: t.sheet },
      getRange: () => this.rangeMock(whole),
      getHeaderRowRange: () => this.rangeMock({ ...whole, rows: 1 }),
    });
  }

  private sheetMock(name: string): OfficeMockObject {
    const fake = this;
    return this.track({
      isNullObject: false,
      name,
      id: fake.idOf(name),
      onSelectionChanged: fake.selectionEvents(name),
      shapes: fake.shapesOf(name),
      getCell: (row: number, col: number) => fake.rangeMock({ sheet: name, top: row, left: col, rows: 1, cols: 1 }),
      activate: () => fake.queue.push(() => (fake.activeSheet = name)),
      getRange: (address?: string) => fake.rangeMock(address === undefined ? { sheet: name, top: 0, left: 0, rows: 1048576, cols: 16384 } : rectOf(name, address)),
      getRangeByIndexes: (top: number, left: number, rows: number, cols: number) => fake.rangeMock({ sheet: name, top, left, rows, cols }),
      getUsedRange: () => fake.rangeMock(fake.usedRect(name) ?? { sheet: name, top: 0, left: 0, rows: 1, cols: 1 }),
      getUsedRangeOrNullObject: () => {
        const used = fake.usedRect(name);
        return used ? fake.rangeMock(used) : fake.track({ isNullObject: true, address: "" });
      },
    });
  }

  private shapesOf(sheet: string): unknown {
    const fake = this;
    return {
      addImage: (image: string) => {
        const shape: FakeShape = { sheet, name: "", left: 0, top: 0, width: 0, height: 0, image, deleted: false };
        const staged = { ...shape };
        fake.queue.push(() => fake.shapes.push(Object.assign(shape, staged)));
        return staged;
      },
      getItemOrNullObject: (name: string) => {
        const found = fake.shapes.find((x) => x.sheet === sheet && x.name === name && !x.deleted);
        const mock = fake.track<OfficeMockObject>({ isNullObject: found === undefined });
        Object.assign(mock, { delete: () => fake.queue.push(() => found && (found.deleted = true)) });
        return mock;
      },
    };
  }

  private usedRect(sheet: string): Rect | null {
    const keys = [...(this.sheets.get(sheet) ?? new Map()).keys()].map((k) => k.split(",").map(Number) as [number, number]);
    if (keys.length === 0) return null;
    const top = Math.min(...keys.map((k) => k[0]));
    const left = Math.min(...keys.map((k) => k[1]));
    const bottom = Math.max(...keys.map((k) => k[0]));
    const right = Math.max(...keys.map((k) => k[1]));
    return { sheet, top, left, rows: bottom - top + 1, cols: right - left + 1 };
  }

  private valuesOf(r: Rect): unknown[][] {
    const cells = this.sheets.get(r.sheet) ?? new Map<string, unknown>();
    if (r.rows * r.cols > 2_000_000) return []; // whole-sheet ranges are only cleared, never read
    return Array.from({ length: r.rows }, (_, i) =>
      Array.from({ length: r.cols }, (_, j) => {
        const v = cells.get(`${r.top + i},${r.left + j}`);
        return v === undefined ? "" : typeof v === "string" && v.startsWith("=") ? 0 : v;
      }),
    );
  }

  private formatsOf(r: Rect): string[][] {
    const formats = this.formats.get(r.sheet) ?? new Map<string, string>();
    if (r.rows * r.cols > 2_000_000) return [];
    return Array.from({ length: r.rows }, (_, i) => Array.from({ length: r.cols }, (_, j) => formats.get(`${r.top + i},${r.left + j}`) ?? "General"));
  }

  /** A range mock; assignments to `formulas`/`values` are queued as writes, `clear()` as a clear. */
  private rangeMock(r: Rect): OfficeMockObject {
    const fake = this;
    const address = `${sheetRef(r.sheet)}!${cellAddress(r.top, r.left)}${r.rows * r.cols > 1 ? ":" + cellAddress(r.top + r.rows - 1, r.left + r.cols - 1) : ""}`;
    const mock = this.track<OfficeMockObject>({
      isNullObject: false,
      address,
      left: r.left * FAKE_COL_PT,
      top: r.top * FAKE_ROW_PT,
      values: this.valuesOf(r),
      numberFormat: this.formatsOf(r),
      select: () => fake.queue.push(() => (fake.selection = { sheet: r.sheet, address: address.split("!")[1]! })),
      clear: () =>
        fake.queue.push(() => {
          fake.cleared.push(r.sheet);
          fake.sheets.set(r.sheet, new Map());
        }),
      getRow: (i: number) => fake.rangeMock({ ...r, top: r.top + i, rows: 1 }),
    });
    return new Proxy(mock, {
      get(target, prop) {
        const v = (target as unknown as Record<string | symbol, unknown>)[prop];
        return typeof v === "function" ? (v as (...a: unknown[]) => unknown).bind(target) : v;
      },
      set(target, prop, value) {
        if (prop === "formulas" || prop === "values") {
          const data = value as unknown[][];
          fake.queue.push(() => fake.apply(r, data, prop));
          return true;
        }
        (target as unknown as Record<string | symbol, unknown>)[prop] = value;
        return true;
      },
    });
  }

  private apply(r: Rect, data: unknown[][], kind: "formulas" | "values"): void {
    if (data.length !== r.rows || data.some((row) => row.length !== r.cols)) throw new Error(`InvalidArgument: ${data.length}x${data[0]?.length} into ${r.rows}x${r.cols}`);
    const cells = this.sheets.get(r.sheet);
    if (!cells) throw new Error(`ItemNotFound: ${r.sheet}`);
    data.forEach((row, i) =>
      row.forEach((v, j) => {
        if (v === null) return;
        const key = `${r.top + i},${r.left + j}`;
        if (v === "") cells.delete(key);
        else cells.set(key, v);
      }),
    );
    this.writes.push({ ...r, kind, sync: this.syncs, eventsOn: this.eventsOn, calcSuspended: this.suspendedThisBatch, bytes: JSON.stringify(data).length });
  }
}

function rectOf(sheet: string, address: string): Rect {
  const [a, b] = address.replace(/\$/g, "").split(":");
  const p = parseCell(a!);
  const q = parseCell(b ?? a!);
  return { sheet, top: p.row, left: p.col, rows: q.row - p.row + 1, cols: q.col - p.col + 1 };
}
