/**
 * Text width without a DOM: the drawings are laid out in Node as well as in the pane, so label
 * widths are estimated from per-character advance widths of a common sans-serif face (Arial and
 * its metric-compatible substitutes), with a small margin so estimates err on the wide side.
 */

/** Font stack of every drawing: widely installed faces sharing one set of metrics. */
export const FONT_FAMILY = "Arial, Helvetica, 'Liberation Sans', 'Nimbus Sans', sans-serif";

const UPPER = "667 667 722 722 667 611 778 722 278 500 667 556 833 722 778 667 778 722 667 611 722 667 944 667 667 611";
const LOWER = "556 556 500 556 556 278 556 556 222 222 500 222 833 556 556 556 556 333 500 278 556 500 722 500 500 500";

function table(): Map<string, number> {
  const m = new Map<string, number>();
  UPPER.split(" ").forEach((w, i) => m.set(String.fromCharCode(65 + i), Number(w)));
  LOWER.split(" ").forEach((w, i) => m.set(String.fromCharCode(97 + i), Number(w)));
  for (let d = 0; d <= 9; d++) m.set(String(d), 556);
  const others: [string, number][] = [
    [" ", 278], [".", 278], [",", 278], [":", 278], [";", 278], ["-", 333], ["\u2212", 584],
    ["/", 278], ["(", 333], [")", 333], ["@", 1015], ["=", 584], ["+", 584], ["\u00B7", 333],
    ["\u2026", 1000], ["'", 191], ['"', 355], ["#", 556], ["%", 889], ["&", 667], ["*", 389],
    ["_", 556], ["<", 584], [">", 584], ["[", 278], ["]", 278], ["\u0394", 668], ["\u00D7", 584],
    ["\u2192", 1000], ["\u2190", 1000],
  ];
  for (const [c, w] of others) m.set(c, w);
  return m;
}

const ADVANCE = table();
/** Advance of a character not in the table (wide scripts, symbols), in thousandths of an em. */
const UNKNOWN_ADVANCE = 1000;
const SAFETY = 1.04;
const BOLD_FACTOR = 1.07;

/**
 * Estimated width of a line of text.
 * @param text - the text as drawn (not escaped)
 * @param fontSizePx - font size in drawing units
 * @param bold - whether the text is bold
 * @returns width in drawing units
 */
export function textWidth(text: string, fontSizePx: number, bold = false): number {
  let milli = 0;
  for (const ch of text) milli += ADVANCE.get(ch) ?? UNKNOWN_ADVANCE;
  return (milli / 1000) * fontSizePx * SAFETY * (bold ? BOLD_FACTOR : 1);
}
