/**
 * Workbooks for the hand-off tests: writing an invented building with its add-in takedown to an
 * .xlsx, finding the inputs to edit (a zone live load, a span), reading a computed takedown sheet
 * the way a user reads it (rows by mark, columns by header), and the headless engine's results
 * for the same inputs. Test-only code.
 */
import ExcelJS from "exceljs";
import type { RawCellContent } from "hyperformula";
import { takedownsOf, type TakedownSpec } from "../../src/cli/commands/export";
import { exportSheets, MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";
import type { TakedownJson } from "../../src/workbook/takedown-api";
import { engineSheets, readXlsx } from "../../src/workbook/xlsx";
import type { ReadValue } from "./programs";

/**
 * Write sheets of plain values (and "=formulas" with LOADPATH calls) to an .xlsx together with
 * their add-in takedown built headless, with every formula's value cached, as a user's file would
 * be after a build in Excel.
 */
export async function writeBuildingWorkbook(path: string, sheets: Record<string, RawCellContent[][]>, options: { loads: boolean }): Promise<void> {
  const port = await MemoryWorkbookPort.create({ sheets });
  const result = await buildTakedown(port, { zones: "Zones", members: "Members", ...(options.loads ? { loads: "Loads" } : {}), units: "US" });
  if (!result.ok) throw new Error(`test building: ${result.problems.map((p) => p.message).join("; ")}`);
  const excel = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) {
    const ws = excel.addWorksheet(name);
    const id = port.hf.getSheetId(name)!;
    rows.forEach((row, r) =>
      row.forEach((v, c) => {
        if (v === null || v === undefined) return;
        if (typeof v === "string" && v.startsWith("=")) {
          const value = port.hf.getCellValue({ sheet: id, row: r, col: c });
          const formula = v.slice(1).replace(/\bLOADPATH\.([A-Z_]+)\(/g, "_xldudf_LOADPATH_$1(");
          ws.getCell(r + 1, c + 1).value = { formula, ...(typeof value === "number" ? { result: value } : {}) } as ExcelJS.CellFormulaValue;
        } else ws.getCell(r + 1, c + 1).value = v as ExcelJS.CellValue;
      }),
    );
  }
  exportSheets(port, excel);
  await excel.xlsx.writeFile(path);
}

/** A cell to edit: sheet, A1 address and its current number. */
export interface EditableCell {
  readonly sheet: string;
  readonly address: string;
  readonly value: number;
}

/** Header row and body of a table given as a sheet name or "Sheet!A1:G20", read from ExcelJS. */
function tableArea(excel: ExcelJS.Workbook, ref: string): { ws: ExcelJS.Worksheet; top: number; left: number; bottom: number; right: number } {
  const m = /^(?:'((?:[^']|'')+)'|([^!]+))!\$?([A-Z]+)\$?(\d+):\$?([A-Z]+)\$?(\d+)$/.exec(ref);
  const sheetName = m ? (m[1]?.replace(/''/g, "'") ?? m[2]!) : ref;
  const ws = excel.getWorksheet(sheetName);
  if (!ws) throw new Error(`no sheet for table "${ref}"`);
  if (!m) return { ws, top: 1, left: 1, bottom: ws.rowCount, right: ws.columnCount };
  const col = (letters: string): number => letters.split("").reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
  return { ws, top: Number(m[4]), left: col(m[3]!), bottom: Number(m[6]), right: col(m[5]!) };
}

/** Plain header name: lower case, a trailing "(unit)" dropped. */
function headerName(v: unknown): string {
  return String(v ?? "").replace(/\(.*\)\s*$/, "").trim().toLowerCase();
}

/**
 * The two inputs the hand-off round trip edits: the live load of the first zone that has one, and
 * the span of the first beam (or girder) that has a numeric span.
 */
export function editableInputs(excel: ExcelJS.Workbook, spec: TakedownSpec): { zoneLive: EditableCell; span: EditableCell } {
  const find = (ref: string, header: string, rowOk: (get: (h: string) => unknown) => boolean): EditableCell => {
    const t = tableArea(excel, ref);
    const headers = new Map<string, number>();
    for (let c = t.left; c <= t.right; c++) headers.set(headerName(t.ws.getCell(t.top, c).value), c);
    const col = headers.get(header);
    if (col === undefined) throw new Error(`table ${ref} has no ${header} column`);
    for (let r = t.top + 1; r <= t.bottom; r++) {
      const get = (h: string): unknown => (headers.has(h) ? t.ws.getCell(r, headers.get(h)!).value : undefined);
      const v = t.ws.getCell(r, col).value;
      if (typeof v === "number" && v > 0 && rowOk(get)) return { sheet: t.ws.name, address: t.ws.getCell(r, col).address, value: v };
    }
    throw new Error(`no ${header} to edit in ${ref}`);
  };
  return {
    zoneLive: find(spec.options.zones, "l", () => true),
    span: find(spec.options.members, "span", (get) => ["beam", "girder", "joist", ""].includes(String(get("type") ?? "").toLowerCase())),
  };
}

/** Column totals and the load balance read from a computed takedown sheet (address -> value). */
export interface SheetResults {
  /** Mark -> header -> value, for every column, wall and foundation row and every "total" column. */
  readonly totals: Record<string, Record<string, ReadValue | undefined>>;
  /** Case -> applied and supported load. */
  readonly balance: Record<string, { applied: ReadValue | undefined; supports: ReadValue | undefined }>;
}

/** Split "AB12" into column letters and row number. */
function splitAddress(a: string): { col: string; row: number } {
  const m = /^([A-Z]+)(\d+)$/.exec(a)!;
  return { col: m[1]!, row: Number(m[2]) };
}

/**
 * Read a takedown sheet's results from its computed values: the header line is the row whose A
 * cell is "Mark"; column, wall and foundation rows are found by the Type column; totals by their
 * "<case> total (<unit>)" headers; the balance from the "Load balance" block.
 */
export function readTakedownSheet(values: ReadonlyMap<string, ReadValue>): SheetResults {
  const rows = new Map<number, Map<string, ReadValue>>();
  for (const [addr, v] of values) {
    const { col, row } = splitAddress(addr);
    if (!rows.has(row)) rows.set(row, new Map());
    rows.get(row)!.set(col, v);
  }
  const headerRow = [...rows].find(([, r]) => r.get("A") === "Mark")?.[0];
  if (headerRow === undefined) throw new Error("no header row (Mark) on the takedown sheet");
  const headers = [...rows.get(headerRow)!].filter(([, v]) => typeof v === "string" && / total \(/.test(v as string));
  const totals: SheetResults["totals"] = {};
  for (const [r, cells] of rows) {
    if (r <= headerRow) continue;
    const type = cells.get("B");
    if (typeof cells.get("A") !== "string" || !["column", "wall", "foundation"].includes(String(type))) continue;
    totals[String(cells.get("A"))] = Object.fromEntries(headers.map(([col, h]) => [String(h), cells.get(col)]));
  }
  const balanceTop = [...rows].find(([, r]) => typeof r.get("A") === "string" && (r.get("A") as string).startsWith("Load balance"));
  const balance: SheetResults["balance"] = {};
  if (balanceTop) {
    const [top, labels] = balanceTop;
    for (const [col, label] of labels) {
      if (col === "A") continue;
      balance[String(label)] = { applied: rows.get(top + 1)?.get(col), supports: rows.get(top + 2)?.get(col) };
    }
  }
  return { totals, balance };
}

/** The same results from the headless engine's takedown JSON (column cumulative loads, foundation loads, balance). */
export function resultsOfJson(json: TakedownJson, forceUnit: string): SheetResults {
  const totals: SheetResults["totals"] = {};
  for (const [mark, c] of Object.entries(json.columns)) totals[mark] = Object.fromEntries(Object.entries(c.cumulative).map(([k, v]) => [`${k} total (${forceUnit})`, v]));
  for (const [mark, f] of Object.entries(json.foundations)) totals[mark] = Object.fromEntries(Object.entries(f).map(([k, v]) => [`${k} total (${forceUnit})`, v]));
  const balance = Object.fromEntries(Object.entries(json.balance).map(([k, b]) => [k, { applied: b.applied, supports: b.supports }]));
  return { totals, balance };
}

/**
 * The reference's results that the sheet does not match to 1e-9 relative: every total and balance
 * entry of the reference, read from the sheet (a blank cell is 0, as the takedown reads it).
 * Totals the sheet has but the reference does not (the carried A_T and reducible-live channels)
 * are not compared.
 */
export function mismatchedResults(reference: SheetResults, got: SheetResults, rel = 1e-9): string[] {
  const bad: string[] = [];
  const check = (where: string, want: unknown, have: unknown): void => {
    const h = have === null || have === undefined || have === "" ? 0 : have;
    if (typeof want !== "number" || typeof h !== "number" || Math.abs(want - h) > rel * Math.max(1, Math.abs(want))) bad.push(`${where}: expected ${String(want)}, sheet ${String(have)}`);
  };
  for (const [mark, totals] of Object.entries(reference.totals)) {
    if (!(mark in got.totals)) bad.push(`${mark}: not on the sheet`);
    for (const [header, want] of Object.entries(totals)) check(`${mark} ${header}`, want, got.totals[mark]?.[header]);
  }
  for (const [c, b] of Object.entries(reference.balance)) {
    check(`balance ${c} applied`, b.applied, got.balance[c]?.applied);
    check(`balance ${c} supports`, b.supports, got.balance[c]?.supports);
  }
  return bad;
}

/** Number of values {@link mismatchedResults} compares. */
export function comparedCount(reference: SheetResults): number {
  return Object.values(reference.totals).reduce((n, t) => n + Object.keys(t).length, 0) + 2 * Object.keys(reference.balance).length;
}

/**
 * The headless engine's takedown (add-in version) of a workbook file: the reference the hand-off
 * file is compared with after the same edits.
 */
export async function headlessTakedown(path: string): Promise<{ json: TakedownJson; spec: TakedownSpec }> {
  const wb = await readXlsx(path);
  const spec = takedownsOf(wb)[0];
  if (!spec) throw new Error(`${path}: no takedown sheet`);
  const port = await MemoryWorkbookPort.create({ sheets: engineSheets(wb), tables: wb.tables.map(({ name, sheet, ref }) => ({ name, sheet, ref })) });
  const result = await buildTakedown(port, { ...spec.options, native: false, sheetName: spec.sheet });
  if (!result.ok || !result.json) throw new Error(`${path}: ${result.problems.map((p) => p.message).join("; ")}`);
  return { json: result.json, spec };
}

/** Every cell of every sheet whose computed value is an error, named, with its formula. */
export function errorCellsOf(excel: ExcelJS.Workbook): string[] {
  const out: string[] = [];
  excel.eachSheet((ws) =>
    ws.eachRow((row) =>
      row.eachCell((cell) => {
        const f = cell.formula;
        if (!f) return;
        const r = cell.result as unknown;
        const err = typeof r === "object" && r !== null && "error" in r ? String((r as { error: string }).error) : typeof r === "string" && /^#[A-Z/0!?]+[!?]?$/.test(r) ? r : null;
        if (err) out.push(`${ws.name}!${cell.address} = ${err} (formula ${f.slice(0, 120)}${f.length > 120 ? "..." : ""})`);
      }),
    ),
  );
  return out;
}
