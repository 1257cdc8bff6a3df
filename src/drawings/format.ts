/**
 * Numbers as an engineer reads them, in one place for the drawings, the report and the CLI's
 * tables: three significant figures for results on drawings, up to two decimals for positions,
 * a fixed count of decimals per quantity in tables, a true minus sign, no exponent notation for
 * round-off, and values equal but for floating-point noise printed alike.
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
 * and more keep all their digits. Values that round to zero print as "0", and so does round-off:
 * a value within 1e-9 of `reference` (the largest magnitude it is read against, e.g. the largest
 * reaction of the member) is floating-point noise, never printed as 1.2e-14.
 * @param value - the number to print
 * @param significant - significant figures (default 3)
 * @param reference - the magnitude the value is read against (0: none)
 * @example formatValue(96.5667) === "96.6"; formatValue(-10.58) === "−10.6"; formatValue(1.2e-14, 3, 30) === "0"
 */
export function formatValue(value: number, significant = 3, reference = 0): string {
  if (!Number.isFinite(value)) return "?";
  if (Number.isFinite(reference) && Math.abs(value) <= 1e-9 * Math.abs(reference)) return "0";
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

/**
 * How many decimals each quantity is printed with in tables (report and CLI): forces in kip or
 * kN and moments to 0.01, line loads to 0.001, lengths to 0.01, areas to 0.1, factors to 0.001.
 */
export const DECIMALS = { force: 2, moment: 2, line: 3, length: 2, area: 1, factor: 3, count: 0 } as const;

/** A kind of quantity in {@link DECIMALS}. */
export type Quantity = keyof typeof DECIMALS;

/**
 * The value rounded to `decimals` decimals as a plain decimal string (never exponent notation,
 * never "-0"), after cleaning round-off to 12 significant figures ({@link denoise}), so 3.7499999999999996
 * and 3.7500000000000004 both print as 3.75 and then as 3.8 at one decimal. Halves round away
 * from zero on the decimal digits (1.005 prints 1.01 at two decimals, as written, not as stored).
 * @param value - the number
 * @param decimals - decimals shown (0 to 20)
 * @param minus - the minus sign to use (the true minus by default; "-" for plain-text output)
 * @example fixedDecimals(3.7499999999999996, 1) === "3.8"; fixedDecimals(-1e-13, 3) === "0.000"
 */
export function fixedDecimals(value: number, decimals: number, minus: string = MINUS): string {
  if (!Number.isFinite(value)) return "?";
  const d = Math.max(0, Math.min(20, Math.trunc(decimals)));
  // |value| = DIGITS (12 digits, the denoised value) x 10^(exp - 11)
  const [mantissa, expText] = Math.abs(value).toExponential(11).split("e");
  const digits = mantissa!.replace(".", "");
  const shift = Number(expText) - 11 + d;
  let scaled: bigint;
  if (shift >= 0) scaled = BigInt(digits + "0".repeat(shift));
  else {
    const keep = digits.length + shift; // digits kept before the rounding digit
    const head = keep > 0 ? digits.slice(0, keep) : "0";
    const next = keep >= 0 && keep < digits.length ? Number(digits[keep]) : 0;
    scaled = BigInt(head) + (next >= 5 ? 1n : 0n);
  }
  let text = scaled.toString().padStart(d + 1, "0");
  if (d > 0) text = `${text.slice(0, text.length - d)}.${text.slice(text.length - d)}`;
  return value < 0 && scaled !== 0n ? minus + text : text;
}

/**
 * A quantity printed with its kind's decimals ({@link DECIMALS}).
 * @param value - the number
 * @param kind - what it is
 * @param minus - the minus sign ("-" for plain-text output)
 */
export function formatQuantity(value: number, kind: Quantity, minus: string = MINUS): string {
  return fixedDecimals(value, DECIMALS[kind], minus);
}

/**
 * Round-off relative to a reference (the load balance's applied load): a difference below
 * `relative` times the larger of the compared magnitudes is floating-point noise and prints as 0.
 * @param difference - the difference, e.g. applied - supports
 * @param reference - the magnitudes compared (the largest sets the tolerance)
 * @param decimals - decimals shown
 * @param minus - the minus sign
 * @param relative - the tolerance (1e-9 by default, far below any load an engineer enters)
 * @example formatDifference(1.1e-13, [63.4], 3) === "0.000"; formatDifference(63, [63], 3) === "63.000"
 */
export function formatDifference(difference: number, reference: readonly number[], decimals: number, minus: string = MINUS, relative = 1e-9): string {
  if (!Number.isFinite(difference)) return "?";
  const scale = Math.max(0, ...reference.filter(Number.isFinite).map(Math.abs));
  return fixedDecimals(Math.abs(difference) <= relative * scale ? 0 : difference, decimals, minus);
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
