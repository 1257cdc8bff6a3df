/**
 * The saved matching: which tables the takedown reads, how their columns are matched and the unit
 * system, kept in the workbook on a small visible sheet the add-in generates ("Loadpath
 * settings", marked in A1 like every sheet it makes). The pane writes it when the user saves the
 * matching, `loadpath takedown --save-mapping` writes it into its output, and every verb that
 * reads the tables reads it. Plain text cells only, so it survives a save by any spreadsheet
 * program (workbook settings of the add-in do not). Layout in docs/interface.md section 3.
 */
import type { CellInput, CellValue, WorkbookPort } from "./port";
import { GENERATED_MARKER } from "./port";
import type { ColumnMapping, HeaderRows, UnitSystem } from "./takedown-api";
import { a1, quoteSheet } from "../engine/a1";

/** Name of the settings sheet. */
export const SETTINGS_SHEET = "Loadpath settings";

/** A1 text of the settings sheet: the generated-sheet marker first. */
export const SETTINGS_TITLE = `${GENERATED_MARKER}: saved matching of the input tables, read by the pane and by the loadpath command (--map overrides it). Changing it rebuilds nothing by itself: build the takedown again.`;

/** The tables a saved matching covers, in the order written. */
export const MATCHING_TABLES = ["zones", "members", "loads", "bearings"] as const;
export type MatchingTable = (typeof MATCHING_TABLES)[number];

/** Header cells of the settings table (row 4 of the sheet). */
export const SETTINGS_HEADERS = ["Setting", "Table", "Column", "Value"] as const;

/** Everything a saved matching holds; each part optional. */
export interface SavedMatching {
  readonly units?: UnitSystem;
  /** Table (an Excel table, a sheet or `Sheet!A1:H20`) per role. */
  readonly tables?: Readonly<Partial<Record<MatchingTable, string>>>;
  /** 1-based sheet row of each table's header row, where it is given. */
  readonly headerRows?: HeaderRows;
  /** Needed column -> the user's reference (header, `Group/Header` or column letter), per table. */
  readonly mapping?: ColumnMapping;
}


/**
 * The settings sheet's cells: the title (marker), a line on how it is used, a blank row, then the
 * table `Setting | Table | Column | Value` with one row per setting: `units` (US or SI), `table`
 * (the table used for a role), `header row` (its 1-based sheet row), `column` (a needed column and
 * the reference it is taken from).
 * @param m - the matching to write
 */
export function settingsCells(m: SavedMatching): CellInput[][] {
  const rows: CellInput[][] = [
    [SETTINGS_TITLE],
    ["One row per setting: units (US or SI); table (the table or sheet read for zones, members, loads, bearings); header row (its sheet row); column (a needed column and your header, Group/Header or column letter it is taken from)."],
    [null],
    [...SETTINGS_HEADERS],
  ];
  if (m.units !== undefined) rows.push(["units", null, null, m.units]);
  for (const t of MATCHING_TABLES) {
    const name = m.tables?.[t];
    if (name !== undefined && name !== "") rows.push(["table", t, null, name]);
  }
  for (const t of MATCHING_TABLES) {
    const row = m.headerRows?.[t];
    if (row !== undefined) rows.push(["header row", t, null, row]);
  }
  for (const t of MATCHING_TABLES) {
    for (const [column, ref] of Object.entries(m.mapping?.[t] ?? {})) if (ref.trim() !== "") rows.push(["column", t, column, ref]);
  }
  return rows;
}

function text(v: CellValue | undefined): string {
  if (v === null || v === undefined) return "";
  return String(v).trim();
}

/**
 * Read the settings table from the sheet's cells (as any program left them: numbers may come
 * back as numbers, blank cells as null or "").
 * @param values - the sheet's cells from A1, row-major
 * @param sheet - the sheet's name (for messages)
 * @returns the matching, or a message naming the cell that cannot be read
 */
export function parseSettings(values: readonly (readonly CellValue[])[], sheet = SETTINGS_SHEET): { matching: SavedMatching } | { error: string } {
  const head = values.findIndex((r) => text(r[0]).toLowerCase() === "setting" && text(r[3]).toLowerCase() === "value");
  if (head < 0) return { error: `${quoteSheet(sheet)}!A1: no settings table (a row "Setting | Table | Column | Value" under the title); save the matching again from the pane or with loadpath takedown --save-mapping.` };
  let units: UnitSystem | undefined;
  const tables: Partial<Record<MatchingTable, string>> = {};
  const headerRows: Partial<Record<MatchingTable, number>> = {};
  const mapping: Record<MatchingTable, Record<string, string>> = { zones: {}, members: {}, loads: {}, bearings: {} };
  for (let i = head + 1; i < values.length; i++) {
    const r = values[i]!;
    const setting = text(r[0]).toLowerCase();
    const table = text(r[1]).toLowerCase();
    const column = text(r[2]);
    const value = text(r[3]);
    if (setting === "" && table === "" && column === "" && value === "") continue;
    const at = (col: number): string => `${quoteSheet(sheet)}!${a1(i, col)}`;
    if (setting === "units") {
      const u = value.toUpperCase();
      if (u !== "US" && u !== "SI") return { error: `${at(3)}: units are US or SI (got "${value}").` };
      units = u;
      continue;
    }
    if (!["table", "header row", "column"].includes(setting)) return { error: `${at(0)}: "${text(r[0])}" is not a setting (units, table, header row or column).` };
    if (!(MATCHING_TABLES as readonly string[]).includes(table)) return { error: `${at(1)}: "${text(r[1])}" is not a table (zones, members, loads or bearings).` };
    const t = table as MatchingTable;
    if (value === "") return { error: `${at(3)}: the ${setting} of ${t} has no value.` };
    if (setting === "table") tables[t] = value;
    else if (setting === "header row") {
      const n = Number(value);
      if (!Number.isSafeInteger(n) || n < 1) return { error: `${at(3)}: the header row of ${t} is a sheet row number, 1 or more (got "${value}").` };
      headerRows[t] = n;
    } else {
      if (column === "") return { error: `${at(2)}: a column setting of ${t} names no column.` };
      mapping[t][column] = value;
    }
  }
  return {
    matching: {
      ...(units !== undefined ? { units } : {}),
      ...(Object.keys(tables).length > 0 ? { tables } : {}),
      ...(Object.keys(headerRows).length > 0 ? { headerRows } : {}),
      ...(MATCHING_TABLES.some((t) => Object.keys(mapping[t]).length > 0) ? { mapping: Object.fromEntries(MATCHING_TABLES.filter((t) => Object.keys(mapping[t]).length > 0).map((t) => [t, mapping[t]])) } : {}),
    },
  };
}

/**
 * The workbook's saved matching: null when it has no settings sheet made by the add-in (a sheet
 * of that name the user made is not read).
 * @param port - the workbook
 * @returns the matching, null, or a message naming the cell that cannot be read
 */
export async function readSavedMatching(port: WorkbookPort): Promise<{ matching: SavedMatching } | { error: string } | null> {
  const names = await port.sheetNames();
  const sheet = names.find((n) => n.toLowerCase() === SETTINGS_SHEET.toLowerCase());
  if (sheet === undefined || (await port.sheetMarker(sheet)) === null) return null;
  const data = await port.readTable(sheet);
  // The used range may start below A1 in some hosts' reading: put it back at A1.
  const values: CellValue[][] = [];
  for (let i = 0; i < data.top; i++) values.push([]);
  for (const r of data.values) values.push([...Array<CellValue>(data.left).fill(null), ...r]);
  return parseSettings(values, sheet);
}

/**
 * Write the matching on the settings sheet (created, or cleared when it is the add-in's own; a
 * user's sheet of that name is never replaced: the port rejects). Writes nothing else.
 * @param port - the workbook
 * @param m - the matching
 * @param flush - apply it now (false: left queued for the caller's next flush)
 */
export async function writeSavedMatching(port: WorkbookPort, m: SavedMatching, flush = true): Promise<void> {
  const cells = settingsCells(m);
  await port.prepareSheet(SETTINGS_SHEET, SETTINGS_TITLE);
  await port.writeBlock(SETTINGS_SHEET, 1, 0, cells.slice(1));
  if (flush) await port.flush();
}

/**
 * A saved matching with the command line's own options over it: a table named on the command
 * line, a `--header-row` of a table, each `--map` entry and `--units` win; the rest is kept.
 * @param saved - the workbook's saved matching
 * @param given - what the command line gave
 */
export function overMatching(saved: SavedMatching, given: SavedMatching): SavedMatching {
  const mapping: Record<string, Record<string, string>> = {};
  for (const t of MATCHING_TABLES) {
    const both = { ...(saved.mapping?.[t] ?? {}), ...(given.mapping?.[t] ?? {}) };
    if (Object.keys(both).length > 0) mapping[t] = both;
  }
  const tables = { ...(saved.tables ?? {}), ...(given.tables ?? {}) };
  const headerRows = { ...(saved.headerRows ?? {}), ...(given.headerRows ?? {}) };
  const units = given.units ?? saved.units;
  return {
    ...(units !== undefined ? { units } : {}),
    ...(Object.keys(tables).length > 0 ? { tables } : {}),
    ...(Object.keys(headerRows).length > 0 ? { headerRows } : {}),
    ...(Object.keys(mapping).length > 0 ? { mapping } : {}),
  };
}
