/** Reading single cells of the input tables: text, numbers and yes/no, with the reason a cell is unusable. */
import type { CellValue } from "./types";

/** Error values a spreadsheet shows in a cell ("#VALUE!", "#N/A", "#NAME?", ...). */
const ERROR_TEXT = /^#(NULL!|DIV\/0!|VALUE!|REF!|NAME\?|NUM!|N\/A|GETTING_DATA|SPILL!|CALC!|BUSY!|FIELD!|BLOCKED!|CONNECT!|UNKNOWN!|EXTERNAL!|PYTHON!|CYCLE!|ERROR!)$/i;

/** True when a cell's value is a spreadsheet error value. */
export function isErrorValue(v: CellValue | undefined): boolean {
  return typeof v === "string" && ERROR_TEXT.test(v.trim());
}

/** A cell read as text: trimmed, numbers and booleans spelled out, blank -> "". */
export function textOf(value: CellValue | undefined): string {
  if (value === null || value === undefined) return "";
  return String(value).trim();
}

/** A number read from a cell: blank, a number, or not a number (text, error). */
export type NumberCell = { readonly kind: "blank" } | { readonly kind: "number"; readonly value: number } | { readonly kind: "bad"; readonly text: string };

/**
 * Read a cell as a number: numbers as they are, numeric text ("12.5") as its number, blank or
 * empty text as blank, anything else (other text, an error value, TRUE/FALSE) as bad.
 */
export function numberOf(value: CellValue | undefined): NumberCell {
  if (value === null || value === undefined) return { kind: "blank" };
  if (typeof value === "number") return Number.isFinite(value) ? { kind: "number", value } : { kind: "bad", text: String(value) };
  if (typeof value === "string") {
    const t = value.trim();
    if (t === "") return { kind: "blank" };
    const n = Number(t);
    return Number.isFinite(n) && /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t) ? { kind: "number", value: n } : { kind: "bad", text: t };
  }
  return { kind: "bad", text: String(value).toUpperCase() };
}

/** A yes/no cell: true, false, or undefined when it is neither. Blank is "no". */
export function yesNoOf(value: CellValue | undefined): boolean | undefined {
  if (value === null || value === undefined) return false;
  if (typeof value === "boolean") return value;
  if (typeof value === "number") return value === 1 ? true : value === 0 ? false : undefined;
  const t = value.trim().toLowerCase();
  if (["yes", "y", "true", "x", "1", "reducible"].includes(t)) return true;
  if (["no", "n", "false", "0", "", "-"].includes(t)) return false;
  return undefined;
}

/** Format a number for a message: up to 4 significant decimals, no trailing zeros. */
export function formatNumber(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(6)));
}
