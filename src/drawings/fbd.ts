/**
 * The free-body diagram of one member, to scale along its length: loads above, supports and
 * reactions below, and a dimension line with every position that matters.
 */
import type { BeamSolution } from "../engine/beam/types";
import { formatLength } from "./format";
import { type Block, distinctPositions, type Frame, xOf } from "./frame";
import { drawLoads } from "./fbd-loads";
import { drawSupports } from "./fbd-supports";
import { drawLabel, type LabelLine, labelSize } from "./labels";
import { type Box, placeLabels } from "./place";
import { el, FONT, line, PALETTE } from "./svg";
import type { MemberDrawing } from "./types";

/**
 * Positions shown on the dimension line: the ends, supports, load ends, point loads, couples.
 * @param drawing - the member
 */
export function stationsOf(drawing: MemberDrawing): number[] {
  const xs = [
    0,
    drawing.span,
    ...drawing.supports.map((s) => s.x),
    ...drawing.lines.flatMap((l) => [l.start, l.end]),
    ...drawing.points.map((p) => p.x),
    ...drawing.moments.map((m) => m.x),
  ].filter((x) => x >= 0 && x <= drawing.span);
  return distinctPositions(xs, 1e-9 * drawing.span);
}

function dimensionLine(drawing: MemberDrawing, frame: Frame, y: number): Block {
  const stations = stationsOf(drawing);
  let body = line(xOf(frame, 0), y, xOf(frame, drawing.span), y, PALETTE.muted, 0.8);
  for (const s of stations) {
    body += line(xOf(frame, s), y - 4, xOf(frame, s), y + 4, PALETTE.muted, 0.9, { "data-role": "station", "data-x": s });
  }
  const labels: LabelLine[][] = stations.map((s) => [
    {
      text: s === drawing.span ? `${formatLength(s)} ${drawing.units.length}` : formatLength(s),
      style: { size: FONT.small, fill: PALETTE.ink },
      attrs: { "data-role": "station-label", "data-x": s },
    },
  ]);
  const placed = placeLabels(
    stations.map((s, i) => ({ anchorX: xOf(frame, s), ...labelSize(labels[i] as LabelLine[]), leader: true })),
    { baseY: y + 5, direction: "down", step: 5, minX: 2, maxX: 318, gap: 3 },
  );
  let bottom = y + 5;
  stations.forEach((s, i) => {
    const box = (placed[i] as { box: Box }).box;
    if (box.y0 > y + 7) body += line(xOf(frame, s), y + 4, xOf(frame, s), box.y0, PALETTE.guide, 0.7);
    body += drawLabel(labels[i] as LabelLine[], box);
    bottom = Math.max(bottom, box.y1);
  });
  return { body: el("g", { "data-role": "dimensions" }, body), top: y - 4, bottom };
}

/**
 * Draw the free-body diagram (member axis at y = 0).
 * @param drawing - the member
 * @param solution - the engine's solution of it
 * @param frame - the sheet's horizontal scale
 */
export function drawFreeBody(drawing: MemberDrawing, solution: BeamSolution, frame: Frame): Block {
  const loads = drawLoads(drawing, frame);
  const supports = drawSupports(drawing, solution, frame);
  const member = line(xOf(frame, 0), 0, xOf(frame, drawing.span), 0, PALETTE.ink, 3, { "data-role": "member", "stroke-linecap": "butt" });
  const dims = dimensionLine(drawing, frame, supports.bottom + 12);
  return {
    body: el("g", { "data-role": "free-body" }, loads.body, member, supports.body, dims.body),
    top: Math.min(loads.top, supports.top),
    bottom: dims.bottom,
  };
}
