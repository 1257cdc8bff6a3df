/**
 * The supports of the free-body diagram, below the member: triangles for pins, hatched walls
 * for fixed ends, the reactions as arrows with their values and units, and the marks of what
 * holds the member up. The member axis is y = 0.
 */
import type { BeamSolution } from "../engine/beam/types";
import { truncate } from "./escape";
import { formatValue } from "./format";
import { type Block, type Frame, xOf } from "./frame";
import { drawLabel, type LabelLine, labelSize } from "./labels";
import { type Box, placeLabels } from "./place";
import { arcArrow, arrow, el, FONT, line, PALETTE, points } from "./svg";
import type { DrawnSupport, MemberDrawing } from "./types";

const ARROW_TIP = 17;
const ARROW_TAIL = 40;
const COUPLE_RADIUS = 21;
const WALL_HALF = 15;

function pinSymbol(x: number): string {
  return (
    el("polygon", { points: points([[x, 1.5], [x - 7, 13], [x + 7, 13]]), fill: PALETTE.paper, stroke: PALETTE.ink, "stroke-width": 1.2 }) +
    line(x - 10, 14.5, x + 10, 14.5, PALETTE.ink, 1.2)
  );
}

function wallSymbol(x: number, outward: -1 | 1): string {
  let hatch = "";
  for (let y = -WALL_HALF + 1; y <= WALL_HALF - 3; y += 4) hatch += line(x, y, x + outward * 5, y + 5, PALETTE.ink, 0.8);
  return line(x, -WALL_HALF, x, WALL_HALF, PALETTE.ink, 2) + hatch;
}

function interiorFixedSymbol(x: number): string {
  let hatch = "";
  for (let k = -10; k <= 6; k += 4) hatch += line(x + k, 19, x + k + 4, 15, PALETTE.ink, 0.8);
  return el("rect", { x: x - 4, y: 1.5, width: 8, height: 13.5, fill: PALETTE.ink }) + line(x - 10, 15, x + 10, 15, PALETTE.ink, 1.2) + hatch;
}

function endSide(s: DrawnSupport, span: number): "left" | "right" | "inside" {
  const tol = 1e-9 * span;
  if (s.x <= tol) return "left";
  if (s.x >= span - tol) return "right";
  return "inside";
}

function symbol(s: DrawnSupport, x: number, side: "left" | "right" | "inside"): string {
  if (s.type === "pin") return pinSymbol(x);
  if (side === "left") return wallSymbol(x, -1);
  if (side === "right") return wallSymbol(x, 1);
  return interiorFixedSymbol(x);
}

function coupleArc(x: number, m: number, side: "left" | "right" | "inside"): string {
  const [from, to] = side === "right" ? [130, 230] : [-50, 50];
  return arcArrow(x, 0, COUPLE_RADIUS, from, to, m > 0, PALETTE.reaction, 1.4);
}

/** The magnitudes a member's reactions are read against: round-off below 1e-9 of them prints as 0. */
interface Scale {
  readonly force: number;
  readonly moment: number;
}

function reactionLabel(s: DrawnSupport, i: number, r: number, m: number, drawing: MemberDrawing, scale: Scale): LabelLine[] {
  const lines: LabelLine[] = [
    {
      text: `${formatValue(r, 3, scale.force)} ${drawing.units.force}`,
      style: { size: FONT.label, bold: true, fill: PALETTE.reaction },
      attrs: { "data-role": "reaction", "data-index": i, "data-x": s.x, "data-value": r },
    },
  ];
  if (s.type === "fixed") {
    lines.push({
      text: `${formatValue(Math.abs(m), 3, scale.moment)} ${drawing.units.moment} ${m >= 0 ? "ccw" : "cw"}`,
      style: { size: FONT.small, fill: PALETTE.reaction },
      attrs: { "data-role": "reaction-moment", "data-index": i, "data-x": s.x, "data-value": m },
    });
  }
  if (s.label !== undefined && s.label.trim() !== "") {
    lines.push({ text: truncate(s.label, 24), style: { size: FONT.small }, attrs: { "data-role": "support-label", "data-index": i } });
  }
  return lines;
}

/**
 * Draw the supports, reaction arrows and their labels below the member axis.
 * @param drawing - the member
 * @param solution - the engine's solution of it (reactions in the order of drawing.supports)
 * @param frame - the sheet's horizontal scale
 */
export function drawSupports(drawing: MemberDrawing, solution: BeamSolution, frame: Frame): Block {
  let body = "";
  const labels: LabelLine[][] = [];
  const anchors: number[] = [];
  let top = -WALL_HALF;
  const largest = Math.max(0, ...solution.reactions.map(Math.abs).filter(Number.isFinite));
  const scale: Scale = { force: largest, moment: Math.max(largest * drawing.span, ...solution.reactionMoments.map(Math.abs).filter(Number.isFinite)) };
  drawing.supports.forEach((s, i) => {
    const x = xOf(frame, s.x);
    const side = endSide(s, drawing.span);
    const r = solution.reactions[i] ?? 0;
    const m = solution.reactionMoments[i] ?? 0;
    const force = r >= 0 ? arrow(x, ARROW_TAIL, x, ARROW_TIP, PALETTE.reaction, 1.8, 6) : arrow(x, ARROW_TIP, x, ARROW_TAIL, PALETTE.reaction, 1.8, 6);
    const couple = s.type === "fixed" && m !== 0 ? coupleArc(x, m, side) : "";
    if (couple !== "") top = Math.min(top, -COUPLE_RADIUS - 4);
    body += el("g", { "data-role": "support", "data-index": i, "data-x": s.x, "data-type": s.type, "data-draw-x": x }, symbol(s, x, side), force, couple);
    labels.push(reactionLabel(s, i, r, m, drawing, scale));
    anchors.push(x);
  });
  const order = anchors.map((_, i) => i).sort((a, b) => (anchors[a] as number) - (anchors[b] as number));
  const placed = placeLabels(
    order.map((i) => ({ anchorX: anchors[i] as number, ...labelSize(labels[i] as LabelLine[]), leader: true })),
    { baseY: ARROW_TAIL + 2, direction: "down", step: 6, minX: 2, maxX: 318 },
  );
  let bottom = ARROW_TAIL;
  order.forEach((i, k) => {
    const box = (placed[k] as { box: Box }).box;
    const x = anchors[i] as number;
    if (box.y0 > ARROW_TAIL + 3) body += line(x, ARROW_TAIL, x, box.y0, PALETTE.reaction, 0.7, { "stroke-dasharray": "2 2" });
    body += drawLabel(labels[i] as LabelLine[], box);
    bottom = Math.max(bottom, box.y1);
  });
  return { body, top, bottom };
}
