/**
 * The `loads` and `supports` arguments of the beam functions, read into the engine's
 * {@link BeamModel} (docs/interface.md section 1), and the deflection unit keys.
 *
 * Row numbers in messages are 1-based within the range the user passed. A row whose cells are
 * all blank is skipped (users reserve room); so is a loads row of zeros, because some hosts pass
 * blank cells as 0 and a zero load changes nothing.
 */
import { fail, ok, type EngineError, type Result } from "../engine/errors";
import type { BeamLoad, BeamModel, LineLoad, Support, SupportType } from "../engine/beam/types";
import { describeCell, formatNumber, isBlankOrZeroRow, isBlankRow, numberFromCell, type CellIn, type Grid } from "./args";

const LOADS = "loads";
const SUPPORTS = "supports";

/** Load kinds by lower-case spelling. */
const LOAD_KINDS: Readonly<Record<string, BeamLoad["kind"]>> = { line: "line", point: "point", moment: "moment" };

/** Support types by lower-case spelling; a roller restrains like a pin in a straight member. */
const SUPPORT_TYPES: Readonly<Record<string, SupportType>> = { pin: "pin", roller: "pin", fixed: "fixed" };

/** A cell that is blank, or 0 as some hosts pass blank cells. */
function blankish(cell: CellIn | undefined): boolean {
  return cell === null || cell === undefined || cell === 0;
}

/** A position read from a row, checked to lie on the member. */
function positionIn(cell: CellIn, what: string, spanLen: number, argument: string, row: number): Result<number> {
  const x = numberFromCell(cell, argument, row, what);
  if (!x.ok) return x;
  if (x.value < 0 || x.value > spanLen) {
    return fail("outOfMember", `${what} ${formatNumber(x.value)} is outside the member (0 to ${formatNumber(spanLen)}).`, argument, row);
  }
  return x;
}

/** An optional number cell: blank -> `fallback`. */
function optionalNumberIn(cell: CellIn | undefined, what: string, fallback: number, row: number): Result<number> {
  return cell === null || cell === undefined ? ok(fallback) : numberFromCell(cell, LOADS, row, what);
}

/** A line load from its cells; both ends blank (or both 0) = full length. */
function lineLoad(w1: number, startCell: CellIn, endCell: CellIn, endMagCell: CellIn | undefined, spanLen: number, row: number): Result<LineLoad> {
  const full = blankish(startCell) && blankish(endCell);
  const start = full || startCell === null ? ok(0) : positionIn(startCell, "start", spanLen, LOADS, row);
  if (!start.ok) return start;
  const end = full || endCell === null ? ok(spanLen) : positionIn(endCell, "end", spanLen, LOADS, row);
  if (!end.ok) return end;
  if (!(end.value > start.value)) {
    return fail("invalid", `end ${formatNumber(end.value)} must be greater than start ${formatNumber(start.value)} for a line load.`, LOADS, row);
  }
  const w2 = optionalNumberIn(endMagCell, "end magnitude", w1, row);
  if (!w2.ok) return w2;
  return ok({ kind: "line", start: start.value, end: end.value, w1, w2: w2.value });
}

/** A point load or a couple at `start`; a different end position is a mistake worth naming. */
function concentrated(kind: "point" | "moment", magnitude: number, startCell: CellIn, endCell: CellIn | undefined, spanLen: number, row: number): Result<BeamLoad> {
  const x = positionIn(startCell, "start", spanLen, LOADS, row);
  if (!x.ok) return x;
  if (typeof endCell === "number" && endCell !== 0 && endCell !== x.value) {
    return fail("invalid", `a ${kind} load acts at one position (start); end ${formatNumber(endCell)} must be blank.`, LOADS, row);
  }
  return ok(kind === "point" ? { kind, x: x.value, p: magnitude } : { kind, x: x.value, m: magnitude });
}

/** One row of the 5-column format: kind | magnitude | start | end | end magnitude. */
function kindRow(cells: readonly CellIn[], spanLen: number, row: number): Result<BeamLoad> {
  const [kindCell = null, magCell = null, startCell = null, endCell = null, endMagCell = null] = cells;
  if (blankish(kindCell)) return fail("missing", "kind is blank but the row has values; give line, point or moment.", LOADS, row);
  const kind = typeof kindCell === "string" ? LOAD_KINDS[kindCell.toLowerCase()] : undefined;
  if (!kind) return fail("unknownKind", `kind ${describeCell(kindCell)} is not line, point or moment.`, LOADS, row);
  const magnitude = numberFromCell(magCell, LOADS, row, "magnitude");
  if (!magnitude.ok) return magnitude;
  if (kind === "line") return lineLoad(magnitude.value, startCell, endCell, endMagCell, spanLen, row);
  return concentrated(kind, magnitude.value, startCell, endCell, spanLen, row);
}

/**
 * One row of the 4-column numeric format: magnitude | start | end | end magnitude.
 * Start and end blank = full-length line load; only start = point load at start; start and end =
 * line load from start to end (linear to end magnitude when given).
 */
function numericRow(cells: readonly CellIn[], spanLen: number, row: number): Result<BeamLoad> {
  const [magCell = null, startCell = null, endCell = null, endMagCell = null] = cells;
  const magnitude = numberFromCell(magCell, LOADS, row, "magnitude");
  if (!magnitude.ok) return magnitude;
  const onlyStart =
    (startCell !== null && endCell === null) || // start given, end blank
    (endCell === 0 && typeof startCell === "number" && startCell > 0); // the same from a host that passes blanks as 0
  if (onlyStart) return concentrated("point", magnitude.value, startCell, null, spanLen, row);
  return lineLoad(magnitude.value, startCell, endCell, endMagCell, spanLen, row);
}

/** True when a range uses the kind column: 5 columns, or 4 whose first filled cell is a kind word. */
function usesKindColumn(grid: Grid): boolean {
  const width = Math.max(0, ...grid.map((r) => r.length));
  if (width === 5) return true;
  const first = grid.find((r) => !isBlankOrZeroRow(r))?.[0];
  return width === 4 && typeof first === "string" && LOAD_KINDS[first.toLowerCase()] !== undefined;
}

/** Items read from a range with the 1-based range row each came from (blank rows are skipped). */
export interface RowItems<T> {
  readonly items: readonly T[];
  readonly rows: readonly number[];
}

/**
 * Read the `loads` argument.
 * @param loads - a number (uniform line load over the full length, force/length) or a range:
 *   5 columns `kind | magnitude | start | end | end magnitude`, or 4 numeric columns
 *   `magnitude | start | end | end magnitude` (a 4-column range whose first filled cell is a kind
 *   word is read as the kind format without the end magnitude column).
 * @param spanLen - member length (same length unit as the positions).
 * @returns the loads with their range rows, or an error naming the row.
 */
export function parseLoads(loads: number | Grid, spanLen: number): Result<RowItems<BeamLoad>> {
  if (typeof loads === "number") return ok({ items: [{ kind: "line", start: 0, end: spanLen, w1: loads, w2: loads }], rows: [1] });
  const readRow = usesKindColumn(loads) ? kindRow : numericRow;
  const items: BeamLoad[] = [];
  const rows: number[] = [];
  for (let i = 0; i < loads.length; i++) {
    const cells = loads[i]!;
    if (isBlankOrZeroRow(cells)) continue;
    const load = readRow(cells, spanLen, i + 1);
    if (!load.ok) return load;
    items.push(load.value);
    rows.push(i + 1);
  }
  return ok({ items, rows });
}

/** One supports row: position | type (blank type = pin). */
function supportRow(cells: readonly CellIn[], spanLen: number, row: number): Result<Support> {
  const [posCell = null, typeCell = null] = cells;
  const x = positionIn(posCell, "position", spanLen, SUPPORTS, row);
  if (!x.ok) return x;
  if (blankish(typeCell)) return ok({ x: x.value, type: "pin" });
  const type = typeof typeCell === "string" ? SUPPORT_TYPES[typeCell.toLowerCase()] : undefined;
  if (!type) return fail("unknownSupportType", `type ${describeCell(typeCell)} is not pin, roller or fixed.`, SUPPORTS, row);
  return ok({ x: x.value, type });
}

/** Pins at both ends: the supports when the argument is left out or blank. */
export function defaultSupports(spanLen: number): Support[] {
  return [
    { x: 0, type: "pin" },
    { x: spanLen, type: "pin" },
  ];
}

/**
 * Read the `supports` argument.
 * @param supports - rows of `position | type` (type pin, roller = pin, or fixed; blank = pin), a
 *   one-column range of positions (pins), or undefined for pins at 0 and span.
 * @param spanLen - member length.
 * @returns the supports in the order given with their range rows (blank rows skipped; none given
 *   = pins at both ends, with no rows).
 */
export function parseSupports(supports: Grid | undefined, spanLen: number): Result<RowItems<Support>> {
  if (supports === undefined) return ok({ items: defaultSupports(spanLen), rows: [] });
  const twoColumns = supports.some((r) => r.length >= 2);
  const items: Support[] = [];
  const rows: number[] = [];
  for (let i = 0; i < supports.length; i++) {
    const cells = supports[i]!;
    // A one-column 0 is a pin at 0; a two-column row of zeros is a blank row from a host that passes blanks as 0.
    if (twoColumns ? isBlankOrZeroRow(cells) : isBlankRow(cells)) continue;
    const s = supportRow(twoColumns ? cells : [cells[0] ?? null, null], spanLen, i + 1);
    if (!s.ok) return s;
    const previous = items.findIndex((t) => t.x === s.value.x);
    if (previous >= 0) {
      return fail("invalid", `position ${formatNumber(s.value.x)} repeats the support of row ${rows[previous]}; give each support once.`, SUPPORTS, i + 1);
    }
    items.push(s.value);
    rows.push(i + 1);
  }
  return ok(items.length > 0 ? { items, rows } : { items: defaultSupports(spanLen), rows: [] });
}

/** A member model read from the arguments, with the range row of every load and support. */
export interface MemberInput {
  readonly model: BeamModel;
  /** Range row (1-based) of each model load. */
  readonly loadRows: readonly number[];
  /** Range row (1-based) of each model support; empty when the default pins apply. */
  readonly supportRows: readonly number[];
}

/**
 * Build the member model from already-coerced arguments.
 * @param spanLen - member length (> 0, checked by the argument runner).
 * @param loads - the `loads` argument.
 * @param supports - the `supports` argument (undefined when left out).
 */
export function beamModel(spanLen: number, loads: number | Grid, supports: Grid | undefined): Result<MemberInput> {
  const l = parseLoads(loads, spanLen);
  if (!l.ok) return l;
  const s = parseSupports(supports, spanLen);
  if (!s.ok) return s;
  return ok({ model: { span: spanLen, loads: l.value.items, supports: s.value.items }, loadRows: l.value.rows, supportRows: s.value.rows });
}

/**
 * Restate an engine error about the n-th load or support with the row of the user's range
 * (the engine counts only the rows it was given; the range may have blank rows in between).
 */
export function withRangeRow(error: EngineError, input: MemberInput): EngineError {
  if (error.row === undefined || (error.argument !== LOADS && error.argument !== SUPPORTS)) return error;
  const rows = error.argument === LOADS ? input.loadRows : input.supportRows;
  const row = rows[error.row - 1];
  if (row === undefined || row === error.row) return error;
  const prefix = `${error.argument}, row ${error.row}: `;
  const detail = error.message.startsWith(prefix) ? error.message.slice(prefix.length) : error.message;
  return { ...error, row, message: `${error.argument}, row ${row}: ${detail}` };
}

/** A deflection unit set: factor k with deflection = k * (EI * deflection) / (E * I). */
export interface DeflectionUnits {
  readonly key: "kip-ft" | "kN-m" | "consistent";
  /** Converts EI*deflection (force·length^3 in the member's units) over E*I to the deflection unit. */
  readonly factor: number;
  /** Deflection units per member length unit (to express span/ratio in the deflection unit). */
  readonly deflectionPerLength: number;
  /** Name of the deflection unit, for help text. */
  readonly deflectionUnit: string;
}

/**
 * The `units` keys of the deflection functions.
 *
 * kip-ft: the solver gives EI*deflection in kip·ft^3 (loads in kip/ft and kip, lengths in ft).
 *   E in ksi (kip/in^2) and I in in^4 give E*I in kip·in^2 = E*I/144 kip·ft^2, so
 *   deflection [ft] = EIdefl / (E*I/144) = 144 EIdefl/(E I), and deflection [in] = 12 x that
 *   = 1728 EIdefl / (E I).
 * kN-m: EI*deflection in kN·m^3; E in MPa = 1e3 kN/m^2, I in mm^4 = 1e-12 m^4, so
 *   E*I [kN·m^2] = 1e-9 E I; deflection [m] = 1e9 EIdefl/(E I), deflection [mm] = 1e12 EIdefl/(E I).
 * consistent: every quantity in one consistent set; deflection = EIdefl/(E I) in the length unit.
 */
export const DEFLECTION_UNITS: Readonly<Record<DeflectionUnits["key"], DeflectionUnits>> = {
  "kip-ft": { key: "kip-ft", factor: 1728, deflectionPerLength: 12, deflectionUnit: "in" },
  "kN-m": { key: "kN-m", factor: 1e12, deflectionPerLength: 1000, deflectionUnit: "mm" },
  consistent: { key: "consistent", factor: 1, deflectionPerLength: 1, deflectionUnit: "length unit" },
};

/**
 * Accepted spellings of the units key (compared case-insensitively) -> canonical key. The load
 * functions' vocabulary is accepted too: `US` is kip-ft and `SI` is kN-m (the same unit sets).
 */
export const UNITS_CHOICES: Readonly<Record<string, DeflectionUnits["key"]>> = {
  "kip-ft": "kip-ft",
  US: "kip-ft",
  "kN-m": "kN-m",
  SI: "kN-m",
  consistent: "consistent",
};
