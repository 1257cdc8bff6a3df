/**
 * Reading the engineer's tables (docs/interface.md section 2): where the header row is (below a
 * title block, with a group row above it and a units row under it), header matching (the whole
 * header first, then without a trailing parenthesis that is a known unit), the user's column
 * references (a header, `Group/Header` or a column letter), and the check of each column's unit
 * against the chosen unit system. Two columns that fit one reference are a problem, never a pick.
 */
import { columnOfLetters } from "../a1";
import { a1, columnLetter } from "./a1";
import { isKnownUnit, unitFits, UNIT_NAMES, type Quantity } from "./units";
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

/**
 * One expected column, declared as data.
 * @param header - default header text
 * @param quantity - what the column holds (its unit is checked against the unit system)
 * @param required - whether the table needs the column
 */
export function spec(header: string, quantity: Quantity = "none", required = false): ColumnSpec {
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
 * support (Start overhang, End overhang), which lengthen the member past its span; the optional
 * deflection columns E (ksi, MPa), I (in⁴, mm⁴), Live limit and Total limit (span ratios: 360 or L/360).
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
    E: spec("E", "modulus"),
    I: spec("I", "inertia"),
    liveLimit: spec("Live limit"),
    totalLimit: spec("Total limit"),
  },
} as const satisfies TableSpec<string>;

/**
 * Loads (optional): partial area loads, line loads and point loads on named members. End width
 * (area) and End magnitude (line), both optional: the width or magnitude varies linearly from its
 * value at From to the end value at To (a trapezoid).
 */
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
    endWidth: spec("End width", "length"),
    endMagnitude: spec("End magnitude", "lineOrForce"),
  },
} as const satisfies TableSpec<string>;

/**
 * Bearings (optional): interior supports of continuous members. Each row puts a support under
 * member Mark at At (from its start end, overhang included), held by Support, at Support at along
 * it when that is a beam, girder or joist.
 */
export const BEARINGS_SPEC = {
  title: "Bearings",
  columns: {
    mark: spec("Mark", "none", true),
    support: spec("Support", "none", true),
    at: spec("At", "length", true),
    supportAt: spec("Support at", "length"),
  },
} as const satisfies TableSpec<string>;

export type ZonesColumn = keyof typeof ZONES_SPEC.columns;
export type BearingsColumn = keyof typeof BEARINGS_SPEC.columns;
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
  /** Index into `data.values` of the header row. */
  readonly headerRow: number;
}

/** A header split into its name (lower case, single spaces) and its unit in parentheses, if any. */
export interface HeaderParts {
  readonly name: string;
  readonly unit: string | null;
}

/** Header text as compared: trimmed, runs of spaces folded to one, lower case. */
export function foldHeader(header: CellValue | undefined): string {
  return header === null || header === undefined ? "" : String(header).replace(/\s+/g, " ").trim().toLowerCase();
}

/**
 * Split a header cell: "Span (ft)" -> { name: "span", unit: "ft" }. The trailing parenthesis is
 * a unit only when it is one the tool knows ({@link isKnownUnit}); otherwise it stays part of the
 * name: "Supported by (end)" -> { name: "supported by (end)", unit: null }.
 * @param header - the header cell as read
 */
export function splitHeader(header: CellValue): HeaderParts {
  const text = header === null ? "" : String(header).trim();
  const m = /^(.*?)\s*\(([^()]*)\)\s*$/.exec(text);
  if (m && m[1]!.trim() !== "" && isKnownUnit(m[2]!)) return { name: foldHeader(m[1]!), unit: m[2]!.trim() };
  return { name: foldHeader(text), unit: null };
}

/** The unit a units-row cell gives ("(ft)", "[kip]", "psf"), or null when the cell is not a unit. */
export function unitCell(cell: CellValue | undefined): string | null {
  if (typeof cell !== "string") return null;
  const text = cell.trim().replace(/^\((.*)\)$/, "$1").replace(/^\[(.*)\]$/, "$1").trim();
  return isKnownUnit(text) ? text : null;
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
function headerless(title: string, data: TableData, h: number, rows: readonly number[]): Problem[] {
  const headerCells = data.values[h] ?? [];
  const named = (col: number): boolean => foldHeader(headerCells[col]) !== "";
  const width = Math.max(0, ...rows.map((i) => data.values[i]!.length));
  const out: Problem[] = [];
  for (let col = 0; col < width; col++) {
    if (named(col)) continue;
    const filled = rows.find((i) => !isBlankCell(data.values[i]![col]));
    if (filled === undefined) continue;
    const left = col > 0 && named(col - 1) ? ` (a header merged with ${a1(data.top + h, data.left + col - 1)} "${String(headerCells[col - 1])}" reads as blank here)` : "";
    out.push(
      problemAt(data, h, col, "badValue", `The ${title} table's column ${columnLetter(data.left + col)} has values (${a1(data.top + filled, data.left + col)}) but a blank header${left}; give every column its own header cell, or the column is not read.`),
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
  /**
   * Needed columns left unmatched because their reference fits several columns (indices into
   * `data.values` rows, every candidate), or because their one column is already taken for
   * another needed column (that single index).
   */
  readonly ambiguous: Readonly<Partial<Record<K, readonly number[]>>>;
}

/**
 * How the user reads a table, beside the defaults: the column references and where the header
 * row is. Kept as plain data so that a saved matching (in the workbook) can carry it as it is.
 */
export interface TableReading {
  /** Canonical header ("Start at") -> the user's reference: a header, `Group/Header` or a column letter. */
  readonly mapping?: Readonly<Record<string, string>>;
  /** 1-based sheet row of the header row; left out: found (see {@link findHeaderRow}). */
  readonly headerRow?: number;
}

/** Canonical key of a mapping entry ("trib", "Trib (ft)" -> "trib"), or undefined when unknown. */
function keyOfHeaderName<K extends string>(tableSpec: TableSpec<K>, name: string): K | undefined {
  return (Object.keys(tableSpec.columns) as K[]).find((k) => splitHeader(tableSpec.columns[k].header).name === name);
}

/** What each known column is looked for under: its default header, or the user's reference. */
interface Wanted {
  readonly ref: string;
  readonly mapped: boolean;
}

function wantedRefs<K extends string>(tableSpec: TableSpec<K>, data: TableData, mapping: Readonly<Record<string, string>> | undefined, problems: Problem[]): Map<K, Wanted> {
  const wanted = new Map<K, Wanted>();
  for (const k of Object.keys(tableSpec.columns) as K[]) wanted.set(k, { ref: tableSpec.columns[k].header, mapped: false });
  for (const [from, to] of Object.entries(mapping ?? {})) {
    const key = keyOfHeaderName(tableSpec, splitHeader(from).name);
    if (key === undefined) {
      const known = Object.values<ColumnSpec>(tableSpec.columns).map((c) => c.header).join(", ");
      problems.push(problemAt(data, 0, 0, "badValue", `Column mapping for the ${tableSpec.title} table names "${from}", which is not one of its columns (${known}).`));
      continue;
    }
    if (to.trim() !== "") wanted.set(key, { ref: to.trim(), mapped: true });
  }
  return wanted;
}

/** The header row's cells as compared, with the group above each column and the units row's units. */
interface HeaderRow {
  readonly index: number;
  readonly full: readonly string[];
  readonly parts: readonly HeaderParts[];
  readonly groups: readonly string[];
}

/**
 * The groups over the columns: the cell of the row directly above the header row, a blank cell
 * taking the group to its left (a group title merged over several columns reads as its first cell).
 */
function groupsOver(data: TableData, h: number, width: number): string[] {
  const above = h > 0 ? (data.values[h - 1] ?? []) : [];
  const out: string[] = [];
  let current = "";
  for (let c = 0; c < width; c++) {
    const g = foldHeader(above[c]);
    if (g !== "") current = g;
    out.push(current);
  }
  return out;
}

function headerRowAt(data: TableData, h: number): HeaderRow {
  const cells = data.values[h] ?? [];
  return { index: h, full: cells.map(foldHeader), parts: cells.map(splitHeader), groups: groupsOver(data, h, cells.length) };
}

/**
 * A column letter of the sheet: "J" -> 9, or "column J" (explicit: no header is compared with it);
 * undefined when the text is not one (1 to 3 letters).
 */
function letterColumn(ref: string): { readonly col: number; readonly explicit: boolean } | undefined {
  const m = /^(column\s+)?([A-Za-z]{1,3})$/i.exec(ref.trim());
  const col = m ? columnOfLetters(m[2]!) : undefined;
  return col === undefined ? undefined : { col, explicit: m![1] !== undefined };
}

/**
 * Columns whose header fits a reference. A reference with a unit of its own ("Location (ft)")
 * takes the headers whose whole text it is, when there are any; otherwise headers match by their
 * name (a trailing known unit left out on both sides, so "D" fits "D" and "D (psf)" alike, and a
 * parenthesis that is no unit is part of the name: "Supported by (end)"); failing both, a
 * reference "Group/Header" takes the header under that group.
 */
function headerColumns(row: HeaderRow, ref: string): number[] {
  const all = (test: (c: number) => boolean): number[] => row.full.map((_, c) => c).filter(test);
  const full = foldHeader(ref);
  if (full === "") return [];
  const split = splitHeader(ref);
  const whole = split.unit !== null ? all((c) => row.full[c] === full) : [];
  if (whole.length > 0) return whole;
  const stripped = all((c) => row.parts[c]!.name === split.name);
  if (stripped.length > 0) return stripped;
  const slash = ref.indexOf("/");
  if (slash <= 0) return [];
  const group = foldHeader(ref.slice(0, slash));
  const inner = ref.slice(slash + 1);
  const innerFull = foldHeader(inner);
  const innerBare = splitHeader(inner).name;
  if (group === "" || innerFull === "") return [];
  const exact = all((c) => row.groups[c] === group && row.full[c] === innerFull);
  return exact.length > 0 ? exact : all((c) => row.groups[c] === group && row.parts[c]!.name === innerBare);
}

/** Where a reference leads: one column, none, or several (an ambiguity, never resolved by a guess). */
type Found = { readonly col: number } | { readonly none: true; readonly outside?: string } | { readonly several: readonly number[] };

function find(data: TableData, row: HeaderRow, wanted: Wanted): Found {
  const letter = wanted.mapped ? letterColumn(wanted.ref) : undefined;
  const byHeader = letter?.explicit ? [] : headerColumns(row, wanted.ref);
  if (letter !== undefined) {
    const col = letter.col - data.left;
    const width = data.values.reduce((w, r) => Math.max(w, r.length), row.full.length);
    const others = byHeader.filter((c) => c !== col);
    if (others.length > 0 && col >= 0 && col < width) return { several: [col, ...others] };
    if (col < 0 || col >= width) {
      if (byHeader.length === 1) return { col: byHeader[0]! };
      if (byHeader.length > 1) return { several: byHeader };
      return { none: true, outside: `${columnLetter(data.left)} to ${columnLetter(data.left + Math.max(0, width - 1))}` };
    }
    return { col };
  }
  if (byHeader.length === 1) return { col: byHeader[0]! };
  if (byHeader.length > 1) return { several: byHeader };
  return { none: true };
}

/** How many required columns a row would give, read as the header row. */
function requiredFound<K extends string>(tableSpec: TableSpec<K>, data: TableData, wanted: Map<K, Wanted>, h: number): number {
  const row = headerRowAt(data, h);
  let n = 0;
  for (const [key, w] of wanted) {
    if (!tableSpec.columns[key].required) continue;
    if (w.mapped && letterColumn(w.ref) !== undefined) continue; // a letter fits every row
    if (headerColumns(row, w.ref).length > 0) n++;
  }
  return n;
}

/** Rows looked at for the header row when it is not given: a title block rarely runs longer. */
export const HEADER_SEARCH_ROWS = 20;

/**
 * The header row when it is not given: among the first {@link HEADER_SEARCH_ROWS} rows of the
 * range, the first row at which the most required columns are found (by their default headers or
 * the user's references); the first row when no row finds any.
 */
function findHeaderRow<K extends string>(tableSpec: TableSpec<K>, data: TableData, wanted: Map<K, Wanted>): number {
  let best = 0;
  let bestCount = -1;
  for (let h = 0; h < Math.min(HEADER_SEARCH_ROWS, data.values.length); h++) {
    const n = requiredFound(tableSpec, data, wanted, h);
    if (n > bestCount) {
      best = h;
      bestCount = n;
    }
  }
  return best;
}

/**
 * The units row: the row directly under the headers when each of its non-blank cells is a unit
 * the tool knows ("ft", "(psf)", "[kip]") and at least one is; otherwise none.
 */
function unitsRow(data: TableData, h: number): (string | null)[] | null {
  const row = data.values[h + 1];
  if (!row || isBlankRow(row)) return null;
  const units = row.map(unitCell);
  return row.every((c, i) => isBlankCell(c) || units[i] !== null) ? units : null;
}

function cellName(data: TableData, h: number, col: number): string {
  return `${a1(data.top + h, data.left + col)} "${String(data.values[h]?.[col] ?? "")}"`;
}

/**
 * Match a table's header row against the expected columns.
 * @param tableSpec - the expected columns (ZONES_SPEC, MEMBERS_SPEC, LOADS_SPEC)
 * @param data - the table as read (a title block, a group row and a units row may come first)
 * @param units - the takedown's unit system (a unit of the other system is a problem)
 * @param mapping - canonical header -> the user's reference, for columns named differently
 * @param headerRow - 1-based sheet row of the header row; left out: found
 * @returns the matched table and every problem with its headers (missing, ambiguous, wrong unit)
 */
export function matchTable<K extends string>(tableSpec: TableSpec<K>, data: TableData, units: UnitSystem, mapping?: Readonly<Record<string, string>>, headerRow?: number): MatchResult<K> {
  const problems: Problem[] = [];
  const wanted = wantedRefs(tableSpec, data, mapping, problems);
  let h = 0;
  if (headerRow !== undefined) {
    h = headerRow - 1 - data.top;
    if (!Number.isInteger(headerRow) || h < 0 || h >= data.values.length) {
      problems.push(problemAt(data, 0, 0, "missingColumn", `The ${tableSpec.title} table's header row ${headerRow} is outside the table (rows ${data.top + 1} to ${data.top + data.values.length}).`));
      return { table: { title: tableSpec.title, data, columns: {} as Partial<Record<K, number>>, rows: [], headerRow: 0 }, problems, ambiguous: {} as Partial<Record<K, readonly number[]>> };
    }
  } else {
    h = findHeaderRow(tableSpec, data, wanted);
  }
  const row = headerRowAt(data, h);
  const unitRow = unitsRow(data, h);
  const columns: Partial<Record<K, number>> = {};
  const ambiguous: Partial<Record<K, readonly number[]>> = {};
  const takenBy = new Map<number, K>();
  for (const [key, w] of wanted) {
    const found = find(data, row, w);
    const columnSpec = tableSpec.columns[key];
    const mapOption = `--map ${tableSpec.title.toLowerCase()}.${columnSpec.header}=`;
    const mapHint = `${mapOption}<column letter>`;
    if ("none" in found) {
      if (columnSpec.required || w.mapped) {
        const what = w.mapped ? `"${w.ref}" (mapped to ${columnSpec.header})` : `"${columnSpec.header}"`;
        const where = found.outside !== undefined ? `; its columns run ${found.outside}` : "";
        problems.push(problemAt(data, h, 0, "missingColumn", `The ${tableSpec.title} table has no column ${what} (header row ${data.top + h + 1}${where}).`));
      }
      continue;
    }
    if ("several" in found) {
      ambiguous[key] = found.several;
      const cells = found.several.map((c) => cellName(data, h, c)).join(" and ");
      problems.push(
        problemAt(
          data,
          h,
          found.several[0]!,
          "ambiguousColumn",
          `The ${tableSpec.title} table's ${columnSpec.header} could be ${cells}; none is taken. Name one by its column letter (${found.several.map((c) => mapOption + columnLetter(data.left + c)).join(" or ")}; "column ${columnLetter(data.left + found.several[0]!)}" when a header reads like a letter), by its whole header, or as Group/Header under a group row.`,
        ),
      );
      continue;
    }
    const col = found.col;
    const other = takenBy.get(col);
    if (other !== undefined) {
      ambiguous[key] = [col];
      problems.push(
        problemAt(data, h, col, "ambiguousColumn", `The ${tableSpec.title} table's column ${cellName(data, h, col)} is taken for both ${tableSpec.columns[other].header} and ${columnSpec.header}; map each to its own column (${mapHint}).`),
      );
      continue;
    }
    takenBy.set(col, key);
    columns[key] = col;
    if (columnSpec.quantity === "none") continue;
    const headerUnit = row.parts[col]?.unit ?? null;
    const given: [string, number][] = [];
    if (headerUnit !== null) given.push([headerUnit, h]);
    const below = unitRow?.[col] ?? null;
    if (below !== null) given.push([below, h + 1]);
    for (const [unit, at] of given) {
      if (unitFits(columnSpec.quantity, units, unit)) continue;
      problems.push(
        problemAt(
          data,
          at,
          col,
          "unitMismatch",
          `${tableSpec.title} column "${String(data.values[h]![col])}"${at === h ? "" : ` (units row)`} is in ${unit}, but a ${units} takedown reads ${columnSpec.header} in ${UNIT_NAMES[columnSpec.quantity][units]}.`,
        ),
      );
    }
  }
  const first = h + (unitRow ? 2 : 1);
  const rows: number[] = [];
  for (let i = first; i < data.values.length; i++) if (!isBlankRow(data.values[i]!)) rows.push(i);
  problems.push(...headerless(tableSpec.title, data, h, rows));
  return { table: { title: tableSpec.title, data, columns, rows, headerRow: h }, problems, ambiguous };
}
