/**
 * A member sheet: title, free-body diagram, shear and moment diagrams (and the deflected shape
 * when EI is known) on one horizontal scale, and a legend of the sign conventions. One
 * self-contained SVG string, usable in the pane and in an HTML report.
 */
import type { BeamSolution } from "../engine/beam/types";
import { truncate } from "./escape";
import { formatLength, formatValue } from "./format";
import { type Block, memberFrame, SHEET_WIDTH } from "./frame";
import { drawFreeBody } from "./fbd";
import { wrapParts, wrapText } from "./labels";
import { textWidth } from "./metrics";
import { solveDrawing } from "./model";
import { REVIEW_NOTICE } from "./notice";
import { drawPanel } from "./panels";
import { deflectionPanel, momentPanel, shearPanel } from "./results";
import { el, FONT, PALETTE, svgDocument, text, translate } from "./svg";
import type { MemberDrawing } from "./types";


const PAD = 4;
const GAP = 10;

function lines(content: string, y0: number, size: number, fill: string, role: string): { body: string; height: number } {
  const wrapped = wrapText(content, SHEET_WIDTH - 2 * PAD, size);
  const lh = size * 1.25;
  const body = wrapped.map((l, i) => text(PAD, y0 + size + i * lh, l, { size, fill }, { "data-role": role })).join("");
  return { body, height: wrapped.length * lh };
}

/** Shorten text (ellipsis) until it fits `room` drawing units at the given size. */
function fit(content: string, room: number, size: number, bold: boolean): string {
  let t = content;
  for (let n = Array.from(t).length; n > 1 && textWidth(t, size, bold) > room; n--) t = truncate(content, n - 1);
  return textWidth(t, size, bold) > room ? "" : t;
}

function titleBlock(drawing: MemberDrawing): Block {
  const room = SHEET_WIDTH - 2 * PAD;
  const mark = fit(truncate(drawing.mark, 28), room, FONT.title, true);
  let body = text(PAD, 13, mark, { size: FONT.title, bold: true }, { "data-role": "mark" });
  const typeRoom = room - textWidth(mark, FONT.title, true) - 6;
  const type = drawing.memberType === undefined ? "" : fit(truncate(drawing.memberType, 16), typeRoom, FONT.label, false);
  if (type.trim() !== "") body += text(PAD + textWidth(mark, FONT.title, true) + 6, 13, type, { size: FONT.label, fill: PALETTE.muted });
  // Up to 120 characters: a governing case names its quantity, combination and live load pattern; long parts wrap.
  const parts = [`Case ${truncate(drawing.caseLabel, 120)}`];
  if (drawing.level !== undefined && drawing.level.trim() !== "") {
    const level = truncate(drawing.level, 20);
    parts.push(/^level\b/i.test(level) ? level : `Level ${level}`);
  }
  if (Number.isFinite(drawing.span)) parts.push(`span ${formatLength(drawing.span)} ${drawing.units.length}`);
  if (drawing.ei !== undefined && drawing.ei > 0) parts.push(`EI ${formatValue(drawing.ei)} ${drawing.units.force}\u00B7${drawing.units.length}\u00B2`);
  // Lines break between parts, so a unit never ends up alone on a line.
  const wrapped = wrapParts(parts, " \u00B7 ", room, FONT.label);
  const lh = FONT.label * 1.25;
  const sub = wrapped.map((l, i) => text(PAD, 17 + FONT.label + i * lh, l, { size: FONT.label }, { "data-role": "case" })).join("");
  return { body: body + sub, top: 0, bottom: 20 + wrapped.length * lh };
}

function legend(drawing: MemberDrawing, y0: number): Block {
  const conventions =
    `Loads down +, reactions up +, couples ccw +. V = dM/dx. M sagging + (tension at bottom). ` +
    `${drawing.ei !== undefined && drawing.ei > 0 ? "Deflection down +. " : ""}Positions in ${drawing.units.length} from the left end.`;
  const a = lines(conventions, y0, FONT.small, PALETTE.muted, "legend");
  const b = lines(REVIEW_NOTICE, y0 + a.height + 2, FONT.small, PALETTE.muted, "notice");
  return { body: a.body + b.body, top: y0, bottom: y0 + a.height + 2 + b.height };
}

function stack(blocks: readonly Block[], start: number): { body: string; height: number } {
  let y = start;
  let body = "";
  for (const b of blocks) {
    body += translate(0, y - b.top, b.body);
    y += b.bottom - b.top + GAP;
  }
  return { body, height: y };
}

function sheetOf(drawing: MemberDrawing, solution: BeamSolution): string {
  const frame = memberFrame(drawing.span);
  const title = titleBlock(drawing);
  const parts: Block[] = [drawFreeBody(drawing, solution, frame), drawPanel(shearPanel(drawing, solution), frame), drawPanel(momentPanel(drawing, solution), frame)];
  const deflection = deflectionPanel(drawing, solution);
  if (deflection !== null) parts.push(drawPanel(deflection, frame));
  const body = stack(parts, title.bottom + GAP);
  const foot = legend(drawing, body.height);
  return svgDocument(SHEET_WIDTH, foot.bottom + PAD, `${drawing.mark}, case ${drawing.caseLabel}: free-body, shear and moment diagrams`, title.body + body.body + foot.body, {
    "data-role": "member-sheet",
  });
}

function problemSheet(drawing: MemberDrawing, message: string): string {
  const title = titleBlock(drawing);
  const msg = lines(`Cannot draw this member: ${message}`, title.bottom + GAP, FONT.label, PALETTE.load, "error");
  const y = title.bottom + GAP + msg.height + GAP;
  const note = lines(REVIEW_NOTICE, y, FONT.small, PALETTE.muted, "notice");
  return svgDocument(SHEET_WIDTH, y + note.height + PAD, `${drawing.mark}: cannot draw`, title.body + el("g", {}, msg.body) + note.body, { "data-role": "member-sheet" });
}

/**
 * Draw one member under one load case or combination: free-body diagram to scale (supports
 * labelled with what holds the member up, line loads over their intervals, point loads with the
 * marks they come from, couples, reactions with values and units), then shear and moment
 * diagrams on the same x axis with their exact extremes and zero crossings, and the deflected
 * shape when `drawing.ei` is given. Every number comes from the exact beam engine.
 *
 * Never throws for bad input: when the engine refuses the member (unstable, load outside the
 * member...) the SVG shows its message instead.
 * @param drawing - the member, its loads (units per drawing.units) and its supports
 * @returns a self-contained SVG document (viewBox 320 wide, width 100%; no scripts, no links)
 */
export function renderMemberSheet(drawing: MemberDrawing): string {
  const solved = solveDrawing(drawing);
  return solved.ok ? sheetOf(drawing, solved.value) : problemSheet(drawing, solved.error.message);
}
