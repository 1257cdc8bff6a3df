/**
 * Engine errors are values, never exceptions: every engine entry point returns a
 * {@link Result}. The functions layer turns an {@link EngineError} into #VALUE!/#NUM!/#N/A,
 * the pane and the CLI show the same message.
 */

/** The closed set of things that can be wrong with an input. */
export type ErrorCode =
  | "notANumber" // text or an error where a number belongs
  | "notPositive" // must be > 0
  | "negative" // must be >= 0
  | "outOfMember" // a position or interval outside 0..span
  | "unknownKind" // load kind not line/point/moment
  | "unknownSupportType" // support type not pin/roller/fixed
  | "unstable" // supports cannot hold the member
  | "unknownUnits" // units key not recognised
  | "tooManyRows" // more rows than a sane input
  | "unknownKey" // a key not in a closed list (element, method, ...)
  | "missing" // a required argument is blank
  | "badShape" // a range of the wrong width
  | "invalid"; // anything else, message says what

/** Which Excel error a code becomes. Only #VALUE! and #N/A carry a message in Excel. */
export const excelErrorOf: Record<ErrorCode, "#VALUE!" | "#NUM!" | "#N/A"> = {
  notANumber: "#VALUE!",
  notPositive: "#VALUE!",
  negative: "#VALUE!",
  outOfMember: "#VALUE!",
  unknownKind: "#VALUE!",
  unknownSupportType: "#VALUE!",
  unstable: "#VALUE!",
  unknownUnits: "#VALUE!",
  tooManyRows: "#VALUE!",
  unknownKey: "#VALUE!",
  missing: "#VALUE!",
  badShape: "#VALUE!",
  invalid: "#VALUE!",
};

export interface EngineError {
  readonly code: ErrorCode;
  /** Full sentence for the user, naming the argument and, for ranges, the 1-based row. */
  readonly message: string;
  /** Argument name as the user sees it (e.g. "loads", "span"). */
  readonly argument?: string;
  /** 1-based row within a range argument. */
  readonly row?: number;
}

export type Result<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: EngineError };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

/**
 * Build a failed result. The message is composed here so that every error names its
 * argument and row the same way: `loads, row 3: start 12 is outside the member (0 to 10).`
 */
export function fail<T = never>(code: ErrorCode, detail: string, argument?: string, row?: number): Result<T> {
  const where = argument === undefined ? "" : row === undefined ? `${argument}: ` : `${argument}, row ${row}: `;
  const error: EngineError = { code, message: where + detail, ...(argument !== undefined ? { argument } : {}), ...(row !== undefined ? { row } : {}) };
  return { ok: false, error };
}
