/**
 * The input tables as the pane presents them: the four roles, their expected columns with the
 * units shown beside each, and which of the workbook's tables plays which role. The expected
 * columns and the header matching are the takedown engine's (src/engine/takedown/tables.ts);
 * this module only adds the words shown in the pane.
 */
import { BEARINGS_SPEC, foldHeader, LOADS_SPEC, matchTable, MEMBERS_SPEC, ZONES_SPEC, type TableSpec } from "../engine/takedown/tables";
import { a1, columnLetter } from "../engine/a1";
import type { TableData } from "../engine/takedown/types";
import { UNIT_NAMES } from "../engine/takedown/units";
import type { TableInfo } from "../workbook/port";
import type { ColumnMapping, UnitSystem } from "../workbook/takedown-api";

/** The input tables of docs/interface.md section 2 (Loads and Bearings optional). */
export type TableRole = "zones" | "members" | "loads" | "bearings";

/** Roles in the order the pane lists them. */
export const ROLES: readonly TableRole[] = ["zones", "members", "loads", "bearings"];

/** Roles the takedown can do without. */
export const OPTIONAL_ROLES: ReadonlySet<TableRole> = new Set(["loads", "bearings"]);

/** One expected column as the pane shows it. */
export interface ColumnView {
  readonly header: string;
  readonly required: boolean;
  /** Units per system, or null for text and plain numbers. */
  readonly units: Readonly<Record<UnitSystem, string>> | null;
  /** A few plain words on what goes in it. */
  readonly hint: string;
}

const SPECS: Readonly<Record<TableRole, TableSpec<string>>> = { zones: ZONES_SPEC, members: MEMBERS_SPEC, loads: LOADS_SPEC, bearings: BEARINGS_SPEC };

/** Plain words for each default header (display only). */
const HINTS: Readonly<Record<string, string>> = {
  Zone: "name of the load zone",
  D: "dead load",
  L: "floor live load",
  Lr: "roof live load",
  S: "snow load",
  R: "rain load",
  Reducible: "yes/no: live load may be reduced",
  Mark: "member mark",
  Type: "beam, girder, joist, column, wall or foundation",
  Level: "floor or roof level",
  Span: "length between supports",
  Trib: "tributary width",
  "Start support": "mark of what holds the start",
  "Start at": "position along that support",
  "End support": "mark of what holds the end",
  "End at": "position along that support",
  KLL: "live load element factor",
  wD: "extra dead line load",
  wL: "extra live line load",
  wLr: "extra roof live line load",
  wS: "extra snow line load",
  wR: "extra rain line load",
  "Start overhang": "length beyond the start support",
  "End overhang": "length beyond the end support",
  Kind: "area, line or point",
  "Zone or case": "zone (area load) or load case",
  Magnitude: "line load or point load",
  Width: "width loaded (area loads)",
  From: "start along the member",
  To: "end along the member",
  Support: "mark of what holds the member there (interior support)",
  At: "position of the support along the member",
  "Support at": "position along that support (beam, girder or joist)",
};

function viewsOf(spec: TableSpec<string>): ColumnView[] {
  return Object.values(spec.columns).map((c) => ({
    header: c.header,
    required: c.required,
    units: c.quantity === "none" ? null : UNIT_NAMES[c.quantity],
    hint: HINTS[c.header] ?? "",
  }));
}

/** Expected columns per role, in the engine's order. */
export const ROLE_COLUMNS: Readonly<Record<TableRole, readonly ColumnView[]>> = {
  zones: viewsOf(ZONES_SPEC),
  members: viewsOf(MEMBERS_SPEC),
  loads: viewsOf(LOADS_SPEC),
  bearings: viewsOf(BEARINGS_SPEC),
};

/** Plain-words title of each role. */
export const ROLE_TITLES: Readonly<Record<TableRole, string>> = {
  zones: "Load zones",
  members: "Members",
  loads: "Extra loads",
  bearings: "Bearings (continuous members)",
};

/** The engine's match of a header row (units are not judged here: the build reports them). */
function matchHeaders(role: TableRole, headers: readonly string[], mapping: ColumnMapping): Readonly<Partial<Record<string, number>>> {
  const data = { sheet: "", top: 0, left: 0, values: [headers] };
  return matchTable(SPECS[role], data, "US", mapping[role]).table.columns;
}

/**
 * For each expected column of a role, the user's header that carries it (the default name or
 * the user's mapping, as the engine matches them), or null.
 */
export function matchColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): Record<string, string | null> {
  const found = matchHeaders(role, headers, mapping);
  const out: Record<string, string | null> = {};
  for (const [key, c] of Object.entries(SPECS[role].columns)) {
    const index = found[key];
    out[c.header] = index === undefined ? null : headers[index] ?? null;
  }
  return out;
}

/** Required columns of a role that the table lacks under the current mapping. */
export function missingColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): string[] {
  const found = matchColumns(role, headers, mapping);
  return ROLE_COLUMNS[role].filter((c) => c.required && found[c.header] === null).map((c) => c.header);
}

/** True when a zones table has at least one load case column. */
function hasLoadCase(headers: readonly string[], mapping: ColumnMapping): boolean {
  const found = matchColumns("zones", headers, mapping);
  return ["D", "L", "Lr", "S", "R"].some((c) => found[c] !== null);
}

/** The first table whose headers carry every required column of each role. */
export function detectRoles(tables: readonly TableInfo[], mapping: ColumnMapping): Partial<Record<TableRole, string>> {
  const out: Partial<Record<TableRole, string>> = {};
  const taken = new Set<string>();
  // Members first: its required columns are the most specific, so no other table is taken for it.
  for (const role of ["members", "loads", "bearings", "zones"] as const) {
    const hit = tables.find(
      (t) => !taken.has(t.name) && missingColumns(role, t.headers, mapping).length === 0 && (role !== "zones" || hasLoadCase(t.headers, mapping)),
    );
    if (hit) {
      out[role] = hit.name;
      taken.add(hit.name);
    }
  }
  return out;
}

/** A header cell of the header row, as the column step offers it. */
export interface HeaderCell {
  /** Index of the column within the table as read. */
  readonly col: number;
  /** A1 address of the header cell on its sheet ("H5"). */
  readonly address: string;
  readonly text: string;
  /** The group title over it (row above the headers), "" when none. */
  readonly group: string;
  /**
   * The reference that names exactly this column, as saved in the matching: its whole header
   * when no other column has it, else Group/Header, else its column letter.
   */
  readonly ref: string;
}

/** How one needed column is read: taken from one header cell, fitting several, or absent. */
export type ColumnState = "ambiguous" | "missing" | "found" | "absent";

/** One expected column in the column step, with the cell it is taken from. */
export interface ColumnReport extends ColumnView {
  readonly state: ColumnState;
  /** found: the one cell; ambiguous: every candidate cell; otherwise none. */
  readonly cells: readonly HeaderCell[];
  /** Why it is ambiguous or missing, in plain words with the cells. */
  readonly note?: string;
}

/** A chosen table's columns as the column step shows them. */
export interface TableReport {
  /** 1-based sheet row of the header row used. */
  readonly headerRow: number;
  /** Ambiguous columns first, then missing ones, then found, then optional ones not present. */
  readonly columns: readonly ColumnReport[];
  /** Every non-blank header cell, to pick from. */
  readonly options: readonly HeaderCell[];
}

const STATE_ORDER: Readonly<Record<ColumnState, number>> = { ambiguous: 0, missing: 1, found: 2, absent: 3 };

/**
 * The column step of one chosen table, by the engine's own matching (header row found or given,
 * group row, units row): for each expected column the header cell it is taken from (address
 * included), the candidates when several fit (never one picked), or that it is missing.
 * @param role - which table
 * @param data - the table as read (title block and all)
 * @param mapping - the user's references
 * @param headerRow - 1-based sheet row of the header row, when given
 */
export function reportColumns(role: TableRole, data: TableData, mapping: ColumnMapping, headerRow?: number): TableReport {
  const spec = SPECS[role];
  const match = matchTable(spec, data, "US", mapping[role], headerRow);
  const h = match.table.headerRow;
  const sheetRow = data.top + h + 1;
  const headerCells = data.values[h] ?? [];
  const above = h > 0 ? (data.values[h - 1] ?? []) : [];
  const groupOf = (col: number): string => {
    for (let c = col; c >= 0; c--) if (foldHeader(above[c]) !== "") return String(above[c]).trim();
    return "";
  };
  // A reference resolves as the engine resolves it: tried on the header rows alone, for the first column.
  const slim: TableData = { ...data, values: data.values.slice(0, h + 2) };
  const probe = Object.values<{ header: string }>(spec.columns)[0]!.header;
  const names = (ref: string, col: number): boolean => matchTable(spec, slim, "US", { [probe]: ref }, sheetRow).table.columns[Object.keys(spec.columns)[0] as keyof typeof spec.columns] === col;
  const options: HeaderCell[] = [];
  headerCells.forEach((v, col) => {
    const text = v === null ? "" : String(v).trim();
    if (text === "") return;
    const group = groupOf(col);
    const letter = columnLetter(data.left + col);
    const refs = [text, ...(group !== "" ? [`${group}/${text}`] : []), letter, `column ${letter}`];
    const ref = refs.find((r) => names(r, col)) ?? `column ${letter}`;
    options.push({ col, address: a1(data.top + h, data.left + col), text, group, ref });
  });
  const cellOf = (col: number): HeaderCell =>
    options.find((o) => o.col === col) ?? { col, address: a1(data.top + h, data.left + col), text: "", group: groupOf(col), ref: `column ${columnLetter(data.left + col)}` };
  const views = ROLE_COLUMNS[role];
  const keys = Object.keys(spec.columns);
  const shown = (c: HeaderCell): string => `${c.address} "${c.text}"${c.group !== "" ? ` (under "${c.group}")` : ""}`;
  const columns: ColumnReport[] = views.map((view, i) => {
    const key = keys[i]!;
    const found = (match.table.columns as Record<string, number | undefined>)[key];
    const several = (match.ambiguous as Record<string, readonly number[] | undefined>)[key];
    const mapped = mapping[role]?.[view.header];
    if (several !== undefined && several.length > 1) {
      const cells = several.map(cellOf);
      return { ...view, state: "ambiguous", cells, note: `${cells.map(shown).join(" and ")} both fit; none is taken. Pick the one that holds ${view.header}.` };
    }
    if (several !== undefined) {
      const cell = cellOf(several[0]!);
      const owner = keys.findIndex((k) => (match.table.columns as Record<string, number | undefined>)[k] === several[0]);
      return { ...view, state: "ambiguous", cells: [cell], note: `${shown(cell)} is already taken for ${owner >= 0 ? views[owner]!.header : "another column"}; pick the column that holds ${view.header}.` };
    }
    if (found !== undefined) return { ...view, state: "found", cells: [cellOf(found)] };
    if (view.required || (mapped !== undefined && mapped.trim() !== "")) {
      const outside = headerRow !== undefined && (headerRow - 1 < data.top || headerRow - 1 >= data.top + data.values.length);
      if (outside) return { ...view, state: "missing", cells: [], note: `The header row given, ${headerRow}, is outside the table (rows ${data.top + 1} to ${data.top + data.values.length}).` };
      const note = mapped ? `No column fits "${mapped}" in header row ${sheetRow}; pick the column that holds it.` : `Needed for a build: no header "${view.header}" in row ${sheetRow}; pick the column that holds it.`;
      return { ...view, state: "missing", cells: [], note };
    }
    return { ...view, state: "absent", cells: [] };
  });
  columns.sort((a, b) => STATE_ORDER[a.state] - STATE_ORDER[b.state]);
  return { headerRow: sheetRow, columns, options };
}

/** Columns of a report that stop a build: ambiguous ones, and missing ones (required, or mapped to no column). */
export function blockingColumns(report: TableReport): string[] {
  return report.columns.filter((c) => c.state === "ambiguous" || c.state === "missing").map((c) => c.header);
}
