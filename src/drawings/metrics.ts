/**
 * Text width without a DOM: the drawings are laid out in Node as well as in the pane, so label
 * widths are estimated from per-character advance widths. Each character takes the wider of
 * two common sans-serif faces (Arial and its metric-compatible substitutes; DejaVu Sans, the
 * usual fallback on Linux), plus a small margin, so estimates err on the wide side wherever
 * the drawing is shown.
 */

/** Font stack of every drawing: Arial-metric faces first; {@link textWidth} also covers the usual fallback. */
export const FONT_FAMILY = "Arial, Helvetica, 'Liberation Sans', 'Nimbus Sans', sans-serif";

/** Advance widths (thousandths of an em), the wider of the two faces, A-Z and a-z. */
const UPPER = "684 686 722 770 667 611 778 752 295 500 667 557 863 748 787 667 787 722 667 611 732 684 989 685 667 685";
const LOWER = "613 635 550 635 615 352 635 634 278 278 579 278 974 634 612 635 635 411 521 392 634 592 818 592 592 525";

function table(): Map<string, number> {
  const m = new Map<string, number>();
  UPPER.split(" ").forEach((w, i) => m.set(String.fromCharCode(65 + i), Number(w)));
  LOWER.split(" ").forEach((w, i) => m.set(String.fromCharCode(97 + i), Number(w)));
  for (let d = 0; d <= 9; d++) m.set(String(d), 636);
  const others: [string, number][] = [
    [" ", 318], [".", 318], [",", 318], [":", 337], [";", 337], ["-", 361], ["\u2212", 838],
    ["/", 337], ["(", 390], [")", 390], ["@", 1015], ["=", 838], ["+", 838], ["\u00B7", 333],
    ["\u2026", 1000], ["'", 275], ['"', 460], ["#", 838], ["%", 950], ["&", 780], ["*", 500],
    ["_", 556], ["<", 838], [">", 838], ["[", 390], ["]", 390], ["\u0394", 684], ["\u00D7", 838],
    ["\u00B2", 400], ["\u2192", 1000], ["\u2190", 1000],
  ];
  for (const [c, w] of others) m.set(c, w);
  return m;
}

const ADVANCE = table();
/** Advance of a character not in the table (wide scripts, symbols), in thousandths of an em. */
const UNKNOWN_ADVANCE = 1000;
const SAFETY = 1.03;
const BOLD_FACTOR = 1.15;

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
