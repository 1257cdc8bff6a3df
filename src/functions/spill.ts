/**
 * Sizes of spilled results, computed from the sizes of the argument ranges only (and from
 * numbers typed literally in the formula), never from cell values: the headless engine fixes a
 * spill's size when it parses the formula, before anything is evaluated (docs/interface.md section 1).
 * A function fills the size given here and pads with "" (blank-looking cells).
 *
 * One rule per spilling function id. A new spilling function adds one entry to {@link SPILL_RULES}.
 */

import { COMBINATION_TABLE_MAX_ROWS } from "../engine/loads/combination-sets";
import { COMBINATION_ROWS_MAX } from "../engine/loads/combinations";

/** Most load rows accepted by the beam functions. */
export const MAX_LOAD_ROWS = 1000;
/** Most support rows accepted by the beam functions. */
export const MAX_SUPPORT_ROWS = 100;
/** DIAGRAM's default number of equal intervals between evenly spaced stations. */
export const DEFAULT_STATIONS = 20;
/** Most stations DIAGRAM accepts. */
export const MAX_STATIONS = 1000;

/**
 * What is known about one argument before evaluation: its size (a range's rows and columns;
 * 1 x 1 for a scalar) and, for a number typed in the formula, its value.
 */
export interface ArgShape {
  readonly rows: number;
  readonly cols: number;
  /** The value when the argument is a number literal (or, inside a function, a single number). */
  readonly literal?: number;
}

/** Size of a spilled result. */
export interface SpillSize {
  readonly rows: number;
  readonly cols: number;
}

/** A spill rule: argument shapes in declaration order (`undefined` = left out) -> size. */
export type SpillRule = (args: readonly (ArgShape | undefined)[]) => SpillSize;

/** Rows of an argument, capped at the most a function accepts (more is an error anyway). */
function rowsOf(shape: ArgShape | undefined, whenMissing: number, cap: number): number {
  return Math.min(shape === undefined ? whenMissing : shape.rows, cap);
}

/**
 * REACTIONS(span, loads, [supports], [what]): one row, one cell per row of the supports range
 * (2 when supports is left out: pins at both ends).
 */
export function reactionsSize(args: readonly (ArgShape | undefined)[]): SpillSize {
  return { rows: 1, cols: Math.max(1, rowsOf(args[2], 2, MAX_SUPPORT_ROWS)) };
}

/**
 * Most distinct "base" positions of a member: both ends, every support and both ends of every
 * load row (a point load or a couple uses one).
 * @param loadRows - rows of the loads range (1 for a single number).
 * @param supportRows - rows of the supports range (2 when left out).
 */
export function maxBasePoints(loadRows: number, supportRows: number): number {
  return 2 + Math.max(supportRows, 2) + 2 * loadRows;
}

/**
 * Upper bound of DIAGRAM's rows: every base position may carry a jump (two rows, left and right
 * values); between two consecutive base positions the load is linear, so shear is at most
 * quadratic and has at most two zeros (the moment extremes, one row each); plus `stations + 1`
 * evenly spaced stations (0, span/stations, ..., span).
 * @param loadRows - rows of the loads range (1 for a single number).
 * @param supportRows - rows of the supports range (2 when left out).
 * @param stations - number of equal intervals.
 */
export function diagramRowBound(loadRows: number, supportRows: number, stations: number): number {
  const base = maxBasePoints(loadRows, supportRows);
  return 2 * base + 2 * (base - 1) + stations + 1;
}

/**
 * The stations count DIAGRAM is sized for: the number when typed in the formula, else the
 * default (a stations value from a cell reference cannot size a spill before evaluation).
 */
export function diagramStationsForSize(stations: ArgShape | undefined): number {
  const n = stations?.literal;
  return n !== undefined && Number.isInteger(n) && n >= 1 && n <= MAX_STATIONS ? n : DEFAULT_STATIONS;
}

/** DIAGRAM(span, loads, [supports], [stations]): columns x | V | M, rows from {@link diagramRowBound}. */
export function diagramSize(args: readonly (ArgShape | undefined)[]): SpillSize {
  const loadRows = Math.max(1, rowsOf(args[1], 1, MAX_LOAD_ROWS));
  const supportRows = rowsOf(args[2], 2, MAX_SUPPORT_ROWS);
  return { rows: diagramRowBound(loadRows, supportRows, diagramStationsForSize(args[3])), cols: 3 };
}

/**
 * COMBOS(D, ..., [combinations]): label | value. Without a combinations range, the longest
 * built-in list (25, LRFD; ASD and service pad with ""). With one, also room for every row below
 * its header with W or E reversed (at most 2 each: a row may not hold both W and E):
 * max(25, 2 x (rows - 1)).
 */
export function combosSize(args: readonly (ArgShape | undefined)[] = []): SpillSize {
  const table = args[10];
  const dataRows = table === undefined ? 0 : Math.min(Math.max(table.rows - 1, 0), COMBINATION_TABLE_MAX_ROWS);
  return { rows: Math.max(COMBINATION_ROWS_MAX, 2 * dataRows), cols: 2 };
}

/** Spill rules by function id (without the namespace). */
export const SPILL_RULES: Readonly<Record<string, SpillRule>> = {
  REACTIONS: reactionsSize,
  DIAGRAM: diagramSize,
  COMBOS: combosSize,
};

/**
 * Size of a function's spilled result.
 * @param functionId - id without the namespace, e.g. "DIAGRAM".
 * @param args - argument shapes in declaration order.
 * @returns the size, or undefined when the function does not spill (or has no rule).
 */
export function spillSize(functionId: string, args: readonly (ArgShape | undefined)[]): SpillSize | undefined {
  const rule = SPILL_RULES[functionId.toUpperCase()];
  return rule ? rule(args) : undefined;
}

/**
 * Shape of an argument value as a function receives it: a 2-D array's rows and columns; a
 * number is 1 x 1 with its value as `literal`; left out (`null`/`undefined`) is `undefined`.
 */
export function shapeOfValue(value: unknown): ArgShape | undefined {
  if (value === null || value === undefined) return undefined;
  if (Array.isArray(value)) {
    const rows = value.length;
    const first: unknown = value[0];
    const cols = Array.isArray(first) ? first.length : rows > 0 ? 1 : 0;
    if (rows === 1 && cols === 1 && Array.isArray(first) && typeof first[0] === "number") return { rows, cols, literal: first[0] };
    return { rows, cols };
  }
  return typeof value === "number" ? { rows: 1, cols: 1, literal: value } : { rows: 1, cols: 1 };
}

/**
 * Pad (or fail to fit) a result to its spill size: missing cells become "".
 * @returns the padded array, or undefined when the result is larger than the size.
 */
export function padToSize(values: readonly (readonly (number | string)[])[], size: SpillSize): (number | string)[][] | undefined {
  if (values.length > size.rows || values.some((r) => r.length > size.cols)) return undefined;
  const out: (number | string)[][] = [];
  for (let r = 0; r < size.rows; r++) {
    const row = values[r] ?? [];
    out.push(Array.from({ length: size.cols }, (_, c) => (c < row.length ? row[c]! : "")));
  }
  return out;
}
