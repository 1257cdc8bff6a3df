/**
 * Reading the engineer's tables: header matching (case-insensitive, a trailing "(unit)" ignored),
 * the user's column mapping for headers that differ, and the check of each header's unit against
 * the chosen unit system (docs/interface.md section 2).
 */
import { a1 } from "./a1";
import { unitFits, UNIT_NAMES, type Quantity } from "./units";
import type { CellRef, CellValue, Problem, TableData, UnitSystem } from "./types";

/** One expected column: its default header, whether the table needs it, what it holds. */
export interface ColumnSpec {
  readonly header: string;
  readonly required: boolean;
  readonly quantity: Quantity;
}

/** An input table's expected columns. */
export interface TableSpec<K extends string> {
  /** Role name used in messages ("Members"). */
  readonly title: string;
  readonly columns: Readonly<Record<K, ColumnSpec>>;
}

function spec(header: string, quantity: Quantity = "none", required = false): ColumnSpec {
  return { header, required, quantity };
}

/** Zones (load schedule): area loads per case and whether live load may be reduced. */
export const ZONES_SPEC = {
  title: "Zones",
  columns: {
    zone: spec("Zone", "none", true),
    D: spec("D", "areaLoad"),
    L: spec("L", "areaLoad"),
    Lr: spec("Lr", "areaLoad"),
    S: spec("S", "areaLoad"),
    R: spec("R", "areaLoad"),
    reducible: spec("Reducible"),
  },
} as const satisfies TableSpec<string>;

/**
 * Members: docs/interface.md section 2, plus wR (rain line load) and the optional overhangs beyond each
 * support (Start overhang, End overhang), which lengthen the member past its span.
 */
export const MEMBERS_SPEC = {
  title: "Members",
  columns: {
    mark: spec("Mark", "none", true),
    type: spec("Type"),
    level: spec("Level"),
    span: spec("Span", "length", true),
    zone: spec("Zone"),
    trib: spec("Trib", "length"),
    startSupport: spec("Start support", "none", true),
    startAt: spec("Start at", "length"),
    endSupport: spec("End support"),
    endAt: spec("End at", "length"),
    kll: spec("KLL"),
    wD: spec("wD", "lineLoad"),
    wL: spec("wL", "lineLoad"),
    wLr: spec("wLr", "lineLoad"),
    wS: spec("wS", "lineLoad"),
    wR: spec("wR", "lineLoad"),
    startOverhang: spec("Start overhang", "length"),
    endOverhang: spec("End overhang", "length"),
  },
} as const satisfies TableSpec<string>;

/** Loads (optional): partial area loads, line loads and point loads on named members. */
export const LOADS_SPEC = {
  title: "Loads",
  columns: {
    mark: spec("Mark", "none", true),
    kind: spec("Kind", "none", true),
    zoneOrCase: spec("Zone or case", "none", true),
    magnitude: spec("Magnitude", "lineOrForce"),
    width: spec("Width", "length"),
    from: spec("From", "length"),
    to: spec("To", "length"),
  },
} as const satisfies TableSpec<string>;

export type ZonesColumn = keyof typeof ZONES_SPEC.columns;
export type MembersColumn = keyof typeof MEMBERS_SPEC.columns;
export type LoadsColumn = keyof typeof LOADS_SPEC.columns;

/** A table whose headers were matched: where each known column is and which body rows hold data. */
export interface MatchedTable<K extends string> {
  readonly title: string;
  readonly data: TableData;
  /** Column index within `data.values` rows, per known column present. */
  readonly columns: Readonly<Partial<Record<K, number>>>;
  /** Indices into `data.values` of the body rows that are not entirely blank. */
  readonly rows: readonly number[];
}

/** A header split into its name (lower case, single spaces) and its unit in parentheses, if any. */
export interface HeaderParts {
  readonly name: string;
  readonly unit: string | null;
}

/**
 * Split a header cell: "Span (ft)" -> { name: "span", unit: "ft" }.
 * @param header - the header cell as read
 */
export function splitHeader(header: CellValue): HeaderParts {
  const text = header === null ? "" : String(header).trim();
  const m = /^(.*?)\s*\(([^()]*)\)\s*$/.exec(text);
  const name = (m ? m[1]! : text).replace(/\s+/g, " ").trim().toLowerCase();
  return { name, unit: m ? m[2]!.trim() : null };
}

/** True when every cell of a row is blank (null or empty text). */
export function isBlankRow(row: readonly CellValue[]): boolean {
  return row.every((c) => c === null || (typeof c === "string" && c.trim() === ""));
}

/** The sheet cell of a table cell (row/col indices into `data.values`). */
export function tableCell(data: TableData, rowIndex: number, colIndex: number): CellRef {
  return { sheet: data.sheet, row: data.top + rowIndex, col: data.left + colIndex };
}

/** A problem at a table cell. */
export function problemAt(data: TableData, rowIndex: number, colIndex: number, code: Problem["code"], message: string, mark?: string): Problem {
  return { code, message, sheet: data.sheet, cell: a1(data.top + rowIndex, data.left + colIndex), ...(mark !== undefined ? { mark } : {}) };
}

/**
 * Columns that hold values under a blank header cell. A header merged across two columns reads as
 * its text in the first and a blank in the second, so the second column's values would be lost
 * without a word: each such column is a problem naming its header cell (and the merged neighbour).
 */
function headerless(title: string, data: TableData, headers: readonly HeaderParts[], rows: readonly number[]): Problem[] {
  const width = Math.max(0, ...rows.map((i) => data.values[i]!.length));
  const out: Problem[] = [];
  for (let col = 0; col < width; col++) {
    if ((headers[col]?.name ?? "") !== "") continue;
    const filled = rows.find((i) => !isBlankCell(data.values[i]![col]));
    if (filled === undefined) continue;
    const left = col > 0 && (headers[col - 1]?.name ?? "") !== "" ? ` (a header merged with ${a1(data.top, data.left + col - 1)} "${String(data.values[0]![col - 1])}" reads as blank here)` : "";
    out.push(
      problemAt(data, 0, col, "badValue", `The ${title} table's column ${a1(data.top, data.left + col).replace(/\d+$/, "")} has values (${a1(data.top + filled, data.left + col)}) but a blank header${left}; give every column its own header cell, or the column is not read.`),
    );
  }
  return out;
}

function isBlankCell(c: CellValue | undefined): boolean {
  return c === null || c === undefined || (typeof c === "string" && c.trim() === "");
}

/** Result of matching a table's headers. */
export interface MatchResult<K extends string> {
  readonly table: MatchedTable<K>;
  readonly problems: readonly Problem[];
}

/** Canonical key of a mapping entry ("trib", "Trib (ft)" -> "trib"), or undefined when unknown. */
function keyOfHeaderName<K extends string>(tableSpec: TableSpec<K>, name: string): K | undefined {
  return (Object.keys(tableSpec.columns) as K[]).find((k) => splitHeader(tableSpec.columns[k].header).name === name);
}

/** Header name each known column is looked for under: the default, or the user's mapping. */
function wantedNames<K extends string>(tableSpec: TableSpec<K>, data: TableData, mapping: Readonly<Record<string, string>> | undefined, problems: Problem[]): Map<K, { name: string; mapped: boolean }> {
  const wanted = new Map<K, { name: string; mapped: boolean }>();
  for (const k of Object.keys(tableSpec.columns) as K[]) wanted.set(k, { name: splitHeader(tableSpec.columns[k].header).name, mapped: false });
  for (const [from, to] of Object.entries(mapping ?? {})) {
    const key = keyOfHeaderName(tableSpec, splitHeader(from).name);
    if (key === undefined) {
      const known = Object.values<ColumnSpec>(tableSpec.columns).map((c) => c.header).join(", ");
      problems.push(problemAt(data, 0, 0, "badValue", `Column mapping for the ${tableSpec.title} table names "${from}", which is not one of its columns (${known}).`));
      continue;
    }
    if (to.trim() !== "") wanted.set(key, { name: splitHeader(to).name, mapped: true });
  }
  return wanted;
}

/**
 * Match a table's header row against the expected columns.
 * @param tableSpec - the expected columns (ZONES_SPEC, MEMBERS_SPEC, LOADS_SPEC)
 * @param data - the table as read, header row first
 * @param units - the takedown's unit system (a header unit of the other system is a problem)
 * @param mapping - canonical header -> the user's header, for columns named differently
 * @returns the matched table and every problem with its headers (missing, duplicated, wrong unit)
 */
export function matchTable<K extends string>(tableSpec: TableSpec<K>, data: TableData, units: UnitSystem, mapping?: Readonly<Record<string, string>>): MatchResult<K> {
  const problems: Problem[] = [];
  const wanted = wantedNames(tableSpec, data, mapping, problems);
  const headers = (data.values[0] ?? []).map(splitHeader);
  const columns: Partial<Record<K, number>> = {};
  for (const [key, { name, mapped }] of wanted) {
    const found = headers.map((h, i) => (h.name === name && name !== "" ? i : -1)).filter((i) => i >= 0);
    const columnSpec = tableSpec.columns[key];
    if (found.length === 0) {
      if (columnSpec.required || mapped) {
        const what = mapped ? `"${name}" (mapped to ${columnSpec.header})` : `"${columnSpec.header}"`;
        problems.push(problemAt(data, 0, 0, "missingColumn", `The ${tableSpec.title} table has no column ${what}.`));
      }
      continue;
    }
    const col = found[0]!;
    columns[key] = col;
    for (const extra of found.slice(1)) {
      problems.push(problemAt(data, 0, extra, "badValue", `The ${tableSpec.title} table has the column "${columnSpec.header}" twice; the first one (${a1(data.top, data.left + col)}) is used.`));
    }
    const unit = headers[col]!.unit;
    if (unit !== null && columnSpec.quantity !== "none" && !unitFits(columnSpec.quantity, units, unit)) {
      problems.push(
        problemAt(data, 0, col, "unitMismatch", `${tableSpec.title} column "${String(data.values[0]![col])}" is in ${unit}, but a ${units} takedown reads ${columnSpec.header} in ${UNIT_NAMES[columnSpec.quantity][units]}.`),
      );
    }
  }
  const rows: number[] = [];
  for (let i = 1; i < data.values.length; i++) if (!isBlankRow(data.values[i]!)) rows.push(i);
  problems.push(...headerless(tableSpec.title, data, headers, rows));
  return { table: { title: tableSpec.title, data, columns, rows }, problems };
}
