/**
 * Multi-line labels: measured without a DOM, placed by place.ts, drawn centred in their box.
 */
import { textWidth } from "./metrics";
import { type Attrs, text, type TextStyle } from "./svg";
import type { Box } from "./place";

/** One line of a label, with its own style and attributes (data-* for tooling). */
export interface LabelLine {
  readonly text: string;
  readonly style: TextStyle;
  readonly attrs?: Attrs;
}

/** Line height as a multiple of the font size. */
const LINE_HEIGHT = 1.18;

/**
 * Width and height a label needs.
 * @param lines - the label's lines
 */
export function labelSize(lines: readonly LabelLine[]): { width: number; height: number } {
  const width = Math.max(0, ...lines.map((l) => textWidth(l.text, l.style.size, l.style.bold)));
  const height = lines.reduce((h, l) => h + l.style.size * LINE_HEIGHT, 0);
  return { width, height };
}

/**
 * Draw a label centred in its box (the box from {@link labelSize} and place.ts), with a halo
 * unless its style says `halo: false`.
 * @param lines - the label's lines
 * @param box - where it goes
 * @param align - "middle" (default) centres each line; "start"/"end" align to a box edge
 */
export function drawLabel(lines: readonly LabelLine[], box: Box, align: "start" | "middle" | "end" = "middle"): string {
  const x = align === "start" ? box.x0 : align === "end" ? box.x1 : (box.x0 + box.x1) / 2;
  let y = box.y0;
  let out = "";
  for (const l of lines) {
    const h = l.style.size * LINE_HEIGHT;
    // Baseline a third of the font size below the middle of the line box: capitals look centred.
    out += text(x, y + h * 0.5 + l.style.size * 0.35, l.text, { halo: true, ...l.style, anchor: align }, l.attrs ?? {});
    y += h;
  }
  return out;
}

/**
 * Split text into lines no wider than `maxWidth` (words kept whole unless a word alone is wider).
 * @param content - the text
 * @param maxWidth - line width in drawing units
 * @param fontSize - font size in drawing units
 */
export function wrapText(content: string, maxWidth: number, fontSize: number): string[] {
  const words = content.split(/\s+/).filter((w) => w !== "");
  const lines: string[] = [];
  let current = "";
  for (const w of words) {
    const tryLine = current === "" ? w : `${current} ${w}`;
    if (current !== "" && textWidth(tryLine, fontSize) > maxWidth) {
      lines.push(current);
      current = w;
    } else current = tryLine;
  }
  if (current !== "") lines.push(current);
  return lines;
}

/**
 * Join parts with a separator into lines no wider than `maxWidth`, breaking only between parts
 * (a part wider than a line on its own is broken between words).
 * @param parts - pieces of text that must stay whole, e.g. "span 30 ft"
 * @param separator - drawn between parts on one line, e.g. " · "
 * @param maxWidth - line width in drawing units
 * @param fontSize - font size in drawing units
 */
export function wrapParts(parts: readonly string[], separator: string, maxWidth: number, fontSize: number): string[] {
  const lines: string[] = [];
  let current = "";
  for (const part of parts) {
    const tryLine = current === "" ? part : current + separator + part;
    if (textWidth(tryLine, fontSize) <= maxWidth) {
      current = tryLine;
      continue;
    }
    if (current !== "") lines.push(current);
    if (textWidth(part, fontSize) <= maxWidth) current = part;
    else {
      const broken = wrapText(part, maxWidth, fontSize);
      lines.push(...broken.slice(0, -1));
      current = broken[broken.length - 1] ?? "";
    }
  }
  if (current !== "") lines.push(current);
  return lines;
}
