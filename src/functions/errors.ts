/**
 * The one place where engine errors become worksheet errors. Engine code returns
 * {@link EngineError} values; the functions layer hands the host a `CustomFunctions.Error`
 * carrying the same message, so Excel, the headless evaluator and the CLI show the same words.
 *
 * `CustomFunctions` is the host's global (Excel, or the shim of src/workbook/headless-shim.ts).
 */
import { excelErrorOf, type EngineError } from "../engine/errors";

/**
 * Excel error text -> the host's error code. A function, not a table, so that nothing touches the
 * `CustomFunctions` global before the host has defined it.
 */
function codeOfExcelError(text: (typeof excelErrorOf)[keyof typeof excelErrorOf]): CustomFunctions.ErrorCode {
  if (text === "#NUM!") return CustomFunctions.ErrorCode.invalidNumber;
  if (text === "#N/A") return CustomFunctions.ErrorCode.notAvailable;
  return CustomFunctions.ErrorCode.invalidValue;
}

/**
 * Turn an engine error into the error value a worksheet function returns.
 * @param error - the engine's error value; its message names the argument and the 1-based row.
 * @returns a `CustomFunctions.Error` (#VALUE! for every input problem, which shows the message).
 */
export function toExcelError(error: EngineError): CustomFunctions.Error {
  return new CustomFunctions.Error(codeOfExcelError(excelErrorOf[error.code]), error.message);
}

/**
 * Error value for a result that is NaN or infinite (a degenerate input the checks did not catch).
 * @param what - the quantity that came out non-finite, e.g. "maximum moment".
 */
export function nonFiniteError(what: string): CustomFunctions.Error {
  return new CustomFunctions.Error(CustomFunctions.ErrorCode.invalidNumber, `${what} is not a finite number; check the inputs.`);
}

/**
 * Error value for an unexpected exception inside a function: the shared runner catches
 * everything so that no function ever throws into the host.
 * @param cause - whatever was thrown.
 */
export function internalError(cause: unknown): CustomFunctions.Error {
  const detail = cause instanceof Error ? cause.message : String(cause);
  return new CustomFunctions.Error(CustomFunctions.ErrorCode.invalidValue, `Internal error in Loadpath: ${detail}. Please report it with the inputs.`);
}

/** True when a value is an error object as hosts pass them (a `CustomFunctions.Error` or look-alike). */
export function isHostError(value: unknown): value is { readonly code: string; readonly message?: string } {
  return typeof value === "object" && value !== null && !Array.isArray(value) && typeof (value as { code?: unknown }).code === "string" && String((value as { code: string }).code).startsWith("#");
}
