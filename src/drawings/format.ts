/**
 * Numbers as an engineer reads them on a drawing: three significant figures for results, up to
 * two decimals for positions, a true minus sign, no exponent for ordinary magnitudes.
 */

/** The minus sign used on drawings (U+2212), wider and clearer than a hyphen. */
export const MINUS = "\u2212";

function trimZeros(s: string): string {
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
}

function withMinus(s: string): string {
  return s.startsWith("-") ? MINUS + s.slice(1) : s;
}

/**
 * Format a result (force, moment, deflection) to `significant` figures; whole numbers of 1000
 * and more keep all their digits. Values that round to zero print as "0".
 * @param value - the number to print
 * @param significant - significant figures (default 3)
 * @example formatValue(96.5667) === "96.6"; formatValue(-10.58) === "−10.6"; formatValue(1234.5) === "1235"
 */
export function formatValue(value: number, significant = 3): string {
  if (!Number.isFinite(value)) return "?";
  return formatClean(denoise(value), significant);
}

/**
 * The value with round-off below 12 significant figures removed, so two results equal but for
 * floating-point noise (19.849999999999998 and 19.850000000000001, the two reactions of a
 * symmetric beam) print alike.
 */
export function denoise(value: number): number {
  return Number(value.toPrecision(12));
}

function formatClean(value: number, significant: number): string {
  const a = Math.abs(value);
  if (a === 0) return "0";
  let s: string;
  if (a >= 10 ** significant) s = Math.round(value).toString();
  else if (a < 1e-4) s = value.toExponential(significant - 1);
  else s = trimZeros(value.toPrecision(significant));
  if (/^-?0(\.0*)?$/.test(s)) return "0";
  return withMinus(s);
}

/**
 * Format a position or length along a member: at most two decimals, trailing zeros dropped.
 * @param length - position in the drawing's length unit
 * @example formatLength(12.5) === "12.5"; formatLength(21.1654) === "21.17"
 */
export function formatLength(length: number): string {
  if (!Number.isFinite(length)) return "?";
  const s = trimZeros(denoise(length).toFixed(2));
  return s === "-0" ? "0" : withMinus(s);
}

/**
 * Read back a number printed by {@link formatValue} or {@link formatLength} (true minus sign
 * accepted). Used by tests and by anyone parsing labels.
 * @param text - the printed number
 * @returns the number, or NaN when the text is not a number
 */
export function parseDrawnNumber(text: string): number {
  const t = text.trim().replace(MINUS, "-");
  return /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t) ? Number(t) : Number.NaN;
}
