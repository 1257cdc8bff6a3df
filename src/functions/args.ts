/**
 * Worksheet function arguments declared once, as data, and one runner that coerces and checks
 * them, so that a function body is only the mechanics.
 *
 * ```ts
 * const ARGS = defineArgs(arg.number("span", { greaterThan: 0 }), arg.numberOrRange("loads", LOADS_SHAPE));
 * export function momentMax(span: any, loads: any[][]) {
 *   return runFunction(ARGS, [span, loads], (a) => solve(a.span, a.loads));  // a.span: number
 * }
 * ```
 *
 * Hosts pass blanks as `null`, `undefined`, `0` or `""` (Excel differs by platform, the headless
 * evaluator passes `null`), optional arguments that were left out as `null` or `undefined`, and
 * ranges as row-major 2-D arrays. Everything is normalised here: in a range, a blank cell is
 * `null`, text is trimmed, an error cell becomes an {@link ErrorCell}. The runner never throws:
 * an exception inside a body becomes an error value naming it.
 */
import { fail, ok, type ErrorCode, type Result } from "../engine/errors";
import { internalError, isHostError, nonFiniteError, toExcelError } from "./errors";

/** An error value found in a cell of a range argument, e.g. `{ error: "#DIV/0!" }`. */
export interface ErrorCell {
  readonly error: string;
}

/** One normalised cell: a number, trimmed non-empty text, a boolean, blank (`null`) or an error. */
export type CellIn = number | string | boolean | null | ErrorCell;

/** A normalised range argument, row-major; trailing blank rows are dropped. */
export type Grid = readonly (readonly CellIn[])[];

/** Bounds of a numeric argument; each one broken gives its own message. */
export interface NumberBounds {
  /** Value must be > this (0 gives the "must be greater than 0" message, code notPositive). */
  readonly greaterThan?: number;
  /** Value must be >= this (0 gives the "must not be negative" message, code negative). */
  readonly atLeast?: number;
  /** Value must be <= this. */
  readonly atMost?: number;
  /** Value must be a whole number. */
  readonly integer?: boolean;
}

/** Accepted spellings of a text argument (compared case-insensitively) -> canonical value. */
export type Choices = Readonly<Record<string, string>>;

interface SpecBase<N extends string> {
  /** The argument's name as the user sees it in the function's help. */
  readonly name: N;
}

/** A required number. */
export interface NumberSpec<N extends string> extends SpecBase<N> {
  readonly kind: "number";
  readonly bounds?: NumberBounds;
}

/** An optional number; a blank or left-out argument takes `defaultValue`. */
export interface OptionalNumberSpec<N extends string, D extends number | undefined> extends SpecBase<N> {
  readonly kind: "optionalNumber";
  readonly defaultValue: D;
  readonly bounds?: NumberBounds;
}

/** Required text, optionally one of a closed list of keys. */
export interface TextSpec<N extends string> extends SpecBase<N> {
  readonly kind: "text";
  readonly choices?: Choices;
  /** Error code when the text is not one of the choices (default unknownKey). */
  readonly unknownCode?: ErrorCode;
}

/** Optional text; a blank or left-out argument takes `defaultValue`. */
export interface OptionalTextSpec<N extends string> extends SpecBase<N> {
  readonly kind: "optionalText";
  readonly defaultValue: string;
  readonly choices?: Choices;
  readonly unknownCode?: ErrorCode;
}

/** Shape limits of a range argument. */
export interface RangeShape {
  /** Most rows accepted (after dropping trailing blank rows). */
  readonly maxRows: number;
  /** Accepted widths (number of columns); any width when absent. */
  readonly widths?: readonly number[];
  /** What the columns are, for the wrong-width message, e.g. "position | type". */
  readonly columns?: string;
}

/** A range; when `optional`, a left-out or all-blank range is `undefined`. */
export interface RangeSpec<N extends string, O extends boolean> extends SpecBase<N> {
  readonly kind: "range";
  readonly optional: O;
  readonly shape: RangeShape;
}

/** A single number or a range (e.g. loads: a uniform line load or a table of loads). */
export interface NumberOrRangeSpec<N extends string> extends SpecBase<N> {
  readonly kind: "numberOrRange";
  readonly shape: RangeShape;
  /** Left out or blank reads as 0 (e.g. a load case with no load) instead of an error. */
  readonly optional?: boolean;
}

/** Any argument declaration. */
export type ArgSpec =
  | NumberSpec<string>
  | OptionalNumberSpec<string, number | undefined>
  | TextSpec<string>
  | OptionalTextSpec<string>
  | RangeSpec<string, boolean>
  | NumberOrRangeSpec<string>;

/** The coerced value type of one declaration. */
export type ValueOf<S> =
  S extends NumberSpec<string>
    ? number
    : S extends OptionalNumberSpec<string, infer D>
      ? D extends number
        ? number
        : number | undefined
      : S extends TextSpec<string> | OptionalTextSpec<string>
        ? string
        : S extends RangeSpec<string, infer O>
          ? O extends true
            ? Grid | undefined
            : Grid
          : S extends NumberOrRangeSpec<string>
            ? number | Grid
            : never;

/** Coerced arguments keyed by their declared names (typed keys: a misspelt name does not compile). */
export type ArgValues<S extends readonly ArgSpec[]> = { readonly [K in S[number] as K["name"]]: ValueOf<K> };

/** What a function body may return: a number, text, or a spilled 2-D array. */
export type FunctionOutput = number | string | (number | string)[][];

/** Declaration helpers; each returns a plain data object. */
export const arg = {
  /** A required number, e.g. `arg.number("span", { greaterThan: 0 })`. */
  number<N extends string>(name: N, bounds?: NumberBounds): NumberSpec<N> {
    return { name, kind: "number", ...(bounds ? { bounds } : {}) };
  },
  /** An optional number with its default (`undefined` = no default: the body sees `undefined`). */
  optionalNumber<N extends string, D extends number | undefined>(name: N, defaultValue: D, bounds?: NumberBounds): OptionalNumberSpec<N, D> {
    return { name, kind: "optionalNumber", defaultValue, ...(bounds ? { bounds } : {}) };
  },
  /** Required text, optionally from a closed list of keys. */
  text<N extends string>(name: N, choices?: Choices, unknownCode?: ErrorCode): TextSpec<N> {
    return { name, kind: "text", ...(choices ? { choices } : {}), ...(unknownCode ? { unknownCode } : {}) };
  },
  /** Optional text with its default, optionally from a closed list of keys. */
  optionalText<N extends string>(name: N, defaultValue: string, choices?: Choices, unknownCode?: ErrorCode): OptionalTextSpec<N> {
    return { name, kind: "optionalText", defaultValue, ...(choices ? { choices } : {}), ...(unknownCode ? { unknownCode } : {}) };
  },
  /** A required range. */
  range<N extends string>(name: N, shape: RangeShape): RangeSpec<N, false> {
    return { name, kind: "range", optional: false, shape };
  },
  /** An optional range: left out or all blank -> `undefined`. */
  optionalRange<N extends string>(name: N, shape: RangeShape): RangeSpec<N, true> {
    return { name, kind: "range", optional: true, shape };
  },
  /** A number, or a range of rows. A single cell holding a number is the number. */
  numberOrRange<N extends string>(name: N, shape: RangeShape): NumberOrRangeSpec<N> {
    return { name, kind: "numberOrRange", shape };
  },
  /** As numberOrRange, but left out or a blank cell reads as the number 0. */
  optionalNumberOrRange<N extends string>(name: N, shape: RangeShape): NumberOrRangeSpec<N> {
    return { name, kind: "numberOrRange", shape, optional: true };
  },
};

/** Keep the literal names of a list of declarations (for typed keys in the body). */
export function defineArgs<const S extends readonly ArgSpec[]>(...specs: S): S {
  return specs;
}

/**
 * Normalise one cell as a host passes it.
 * @param value - number, string, boolean, null/undefined, or a host error object.
 * @returns blank as `null`, trimmed text (whitespace-only text is blank), errors as {@link ErrorCell}.
 */
export function normalizeCell(value: unknown): CellIn {
  if (value === null || value === undefined) return null;
  if (typeof value === "number") return Number.isFinite(value) ? value : { error: "#NUM!" };
  if (typeof value === "string") {
    const t = value.trim();
    return t === "" ? null : t;
  }
  if (typeof value === "boolean") return value;
  if (isHostError(value)) return { error: value.code };
  return { error: "#VALUE!" };
}

/** True for a normalised error cell. */
export function isErrorCell(cell: CellIn): cell is ErrorCell {
  return typeof cell === "object" && cell !== null;
}

/** True when every cell of a row is blank (`null`; empty text is already `null`). */
export function isBlankRow(row: readonly CellIn[]): boolean {
  return row.every((c) => c === null);
}

/**
 * True when every cell of a row is blank or 0: some hosts pass blank cells of a range as 0, so a
 * row of zeros is treated as a blank row where a row of zeros means nothing anyway (a zero load).
 */
export function isBlankOrZeroRow(row: readonly CellIn[]): boolean {
  return row.every((c) => c === null || c === 0);
}

/** How a cell value reads in a message: text in quotes, TRUE/FALSE, an error code, "blank". */
export function describeCell(cell: CellIn): string {
  if (cell === null) return "blank";
  if (typeof cell === "string") return `"${cell.length > 40 ? cell.slice(0, 37) + "..." : cell}"`;
  if (typeof cell === "boolean") return cell ? "TRUE" : "FALSE";
  if (typeof cell === "number") return formatNumber(cell);
  return `the error ${cell.error}`;
}

/** A number as it reads in a message (up to 6 significant digits). */
export function formatNumber(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(6)));
}

/**
 * Read a number from a normalised cell; blank is "missing".
 * @param cell - the cell.
 * @param name - argument name for the message.
 * @param row - 1-based row within a range argument, if any.
 * @param what - what the number is, e.g. "start" (message: `loads, row 2: start "abc" is text ...`).
 */
export function numberFromCell(cell: CellIn, name: string, row?: number, what?: string): Result<number> {
  const subject = what ? `${what} ` : "";
  if (typeof cell === "number") return ok(cell);
  if (cell === null) return fail("missing", `${subject}is blank; a number is required.`, name, row);
  if (typeof cell === "string") return fail("notANumber", `${subject}${describeCell(cell)} is text where a number belongs.`, name, row);
  if (typeof cell === "boolean") return fail("notANumber", `${subject}${describeCell(cell)} is not a number.`, name, row);
  return fail("notANumber", `${subject}the cell holds ${describeCell(cell)}.`, name, row);
}

/**
 * Check a number against bounds.
 * @param x - the value.
 * @param bounds - the limits.
 * @param name - argument name for the message.
 * @param row - 1-based row within a range argument, if any.
 */
export function checkBounds(x: number, bounds: NumberBounds | undefined, name: string, row?: number): Result<number> {
  if (!bounds || withinBounds(x, bounds)) return ok(x);
  const got = ` (got ${formatNumber(x)})`;
  if (bounds.greaterThan !== undefined && !(x > bounds.greaterThan)) {
    return bounds.greaterThan === 0
      ? fail("notPositive", `must be greater than 0${got}.`, name, row)
      : fail("invalid", `must be greater than ${formatNumber(bounds.greaterThan)}${got}.`, name, row);
  }
  if (bounds.atLeast !== undefined && !(x >= bounds.atLeast)) {
    return bounds.atLeast === 0
      ? fail("negative", `must not be negative${got}.`, name, row)
      : fail("invalid", `must be at least ${formatNumber(bounds.atLeast)}${got}.`, name, row);
  }
  if (bounds.atMost !== undefined && !(x <= bounds.atMost)) return fail("invalid", `must be at most ${formatNumber(bounds.atMost)}${got}.`, name, row);
  if (bounds.integer && !Number.isInteger(x)) return fail("invalid", `must be a whole number${got}.`, name, row);
  return ok(x);
}

/** True when `x` meets every bound (the common case: no message is built). */
function withinBounds(x: number, bounds: NumberBounds): boolean {
  return (
    (bounds.greaterThan === undefined || x > bounds.greaterThan) &&
    (bounds.atLeast === undefined || x >= bounds.atLeast) &&
    (bounds.atMost === undefined || x <= bounds.atMost) &&
    (!bounds.integer || Number.isInteger(x))
  );
}

/** A 2-D (or 1-D, or scalar) host value as a normalised grid, trailing blank rows dropped. */
export function toGrid(raw: unknown): Grid {
  const rows: unknown[][] = Array.isArray(raw) ? (raw.every((r) => Array.isArray(r)) ? (raw as unknown[][]) : [raw as unknown[]]) : [[raw]];
  // Plain loops: every range argument of every call passes here (a takedown makes ~10^5 calls).
  const grid: CellIn[][] = new Array<CellIn[]>(rows.length);
  let n = 0;
  for (let i = 0; i < rows.length; i++) {
    const src = rows[i]!;
    const row = new Array<CellIn>(src.length);
    let blank = true;
    for (let j = 0; j < src.length; j++) {
      const c = normalizeCell(src[j]);
      row[j] = c;
      if (c !== null) blank = false;
    }
    grid[i] = row;
    if (!blank) n = i + 1;
  }
  grid.length = n; // trailing blank rows dropped
  return grid;
}

/** The single cell of a scalar argument; a range of more than one cell is an error. */
function scalarCell(raw: unknown, name: string): Result<CellIn> {
  if (typeof raw === "number") return Number.isFinite(raw) ? ok(raw) : ok(normalizeCell(raw));
  if (!Array.isArray(raw)) return ok(normalizeCell(raw));
  const rows = raw.length;
  const cols = rows > 0 && Array.isArray(raw[0]) ? (raw[0] as unknown[]).length : rows;
  if (rows === 1 && Array.isArray(raw[0]) && cols === 1) return ok(normalizeCell((raw[0] as unknown[])[0]));
  return fail("badShape", `expected a single value, got a range of ${rows} x ${cols} cells.`, name);
}

/**
 * The choices as a message lists them: each canonical value once, followed by its other spellings
 * (those that differ by more than case): `"kip-ft" (or "US"), "kN-m" (or "SI"), "consistent"`.
 */
function listChoices(choices: Choices): string {
  const byValue = new Map<string, string[]>();
  for (const [key, value] of Object.entries(choices)) {
    const list = byValue.get(value) ?? [];
    if (key.toLowerCase() !== value.toLowerCase()) list.push(key);
    byValue.set(value, list);
  }
  return [...byValue].map(([value, others]) => `"${value}"${others.length > 0 ? ` (or ${others.map((o) => `"${o}"`).join(", ")})` : ""}`).join(", ");
}

function matchChoice(text: string, spec: TextSpec<string> | OptionalTextSpec<string>): Result<string> {
  if (!spec.choices) return ok(text);
  const key = Object.keys(spec.choices).find((k) => k.toLowerCase() === text.toLowerCase());
  if (key !== undefined) return ok(spec.choices[key]!);
  const listed = listChoices(spec.choices);
  return fail(spec.unknownCode ?? "unknownKey", `"${text}" is not recognised; use one of ${listed}.`, spec.name);
}

function textFromCell(cell: CellIn, spec: TextSpec<string> | OptionalTextSpec<string>): Result<string> {
  if (cell === null) return fail("missing", "is blank; text is required.", spec.name);
  if (isErrorCell(cell)) return fail("invalid", `the cell holds ${describeCell(cell)}.`, spec.name);
  const text = typeof cell === "string" ? cell : typeof cell === "boolean" ? (cell ? "TRUE" : "FALSE") : formatNumber(cell);
  return matchChoice(text, spec);
}

function checkShape(grid: Grid, name: string, shape: RangeShape): Result<Grid> {
  if (grid.length > shape.maxRows) return fail("tooManyRows", `${grid.length} rows; at most ${shape.maxRows} are accepted.`, name);
  let cols = 0;
  for (const r of grid) if (r.length > cols) cols = r.length;
  if (grid.length > 0 && shape.widths && !shape.widths.includes(cols)) {
    const expected = shape.widths.join(" or ");
    return fail("badShape", `the range has ${cols} column${cols === 1 ? "" : "s"}; expected ${expected}${shape.columns ? ` (${shape.columns})` : ""}.`, name);
  }
  return ok(grid);
}

/**
 * Coerce and check one argument against its declaration.
 * @param spec - the declaration.
 * @param raw - the value as the host passed it.
 * @returns the coerced value, or an error naming the argument (and the row for ranges).
 */
export function coerceArg(spec: ArgSpec, raw: unknown): Result<unknown> {
  switch (spec.kind) {
    case "number":
    case "optionalNumber": {
      const cell = scalarCell(raw, spec.name);
      if (!cell.ok) return cell;
      if (cell.value === null && spec.kind === "optionalNumber") return ok(spec.defaultValue);
      const n = numberFromCell(cell.value, spec.name);
      return n.ok ? checkBounds(n.value, spec.bounds, spec.name) : n;
    }
    case "text":
    case "optionalText": {
      const cell = scalarCell(raw, spec.name);
      if (!cell.ok) return cell;
      if (cell.value === null && spec.kind === "optionalText") return spec.defaultValue === "" ? ok("") : matchChoice(spec.defaultValue, spec);
      return textFromCell(cell.value, spec);
    }
    case "range": {
      if (raw === null || raw === undefined) return spec.optional ? ok(undefined) : fail("missing", "is required.", spec.name);
      const grid = toGrid(raw);
      if (spec.optional && grid.length === 0) return ok(undefined);
      return checkShape(grid, spec.name, spec.shape);
    }
    case "numberOrRange": {
      if (raw === null || raw === undefined) return spec.optional === true ? ok(0) : fail("missing", "is required.", spec.name);
      const grid = toGrid(raw);
      if (spec.optional === true && grid.length === 0) return ok(0);
      const single = grid.length === 1 && grid[0]!.length === 1 ? grid[0]![0]! : undefined;
      if (typeof single === "number") return ok(single);
      if (single !== undefined) return fail("notANumber", `${describeCell(single)} is not a number; give a number or a range of rows.`, spec.name);
      return checkShape(grid, spec.name, spec.shape);
    }
  }
}

/** -0 reads as "-0" in some hosts; every zero goes out as 0. */
function plainZero<T>(v: T): T {
  return (v === 0 ? 0 : v) as T;
}

function finiteOutput(value: FunctionOutput): FunctionOutput | CustomFunctions.Error {
  if (typeof value === "number") return Number.isFinite(value) ? plainZero(value) : nonFiniteError("The result");
  if (typeof value === "string") return value;
  const bad = value.some((row) => row.some((c) => typeof c === "number" && !Number.isFinite(c)));
  return bad ? nonFiniteError("A value of the result") : value.map((row) => row.map(plainZero));
}

/**
 * The shared runner: coerce every argument by its declaration, run the body, turn an error
 * value into the host's error, check the output is finite, and catch anything thrown.
 * @param specs - the function's argument declarations, in order.
 * @param raw - the arguments as the host passed them, in the same order.
 * @param body - the mechanics: receives the coerced arguments by name, returns a Result.
 * @returns the output, or a `CustomFunctions.Error` whose message names the argument (and row).
 */
export function runFunction<const S extends readonly ArgSpec[], T extends FunctionOutput>(
  specs: S,
  raw: readonly unknown[],
  body: (args: ArgValues<S>) => Result<T>,
): T | CustomFunctions.Error {
  try {
    const values: Record<string, unknown> = {};
    for (let i = 0; i < specs.length; i++) {
      const spec = specs[i]!;
      const coerced = coerceArg(spec, raw[i]);
      if (!coerced.ok) return toExcelError(coerced.error);
      values[spec.name] = coerced.value;
    }
    const result = body(values as ArgValues<S>);
    if (!result.ok) return toExcelError(result.error);
    return finiteOutput(result.value) as T | CustomFunctions.Error;
  } catch (cause) {
    return internalError(cause);
  }
}

/**
 * A scalar function's result as its declaration reads it (`number`, for the metadata
 * generator); the host accepts an error value in place of any result.
 */
export function asHostNumber(result: number | CustomFunctions.Error): number {
  return result as number;
}

/**
 * A spilling function's result as its declaration reads it (`any[][]`, for the metadata
 * generator); the host accepts an error value in place of any result.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function asHostMatrix(result: (number | string)[][] | CustomFunctions.Error): any[][] {
  return result as (number | string)[][];
}
