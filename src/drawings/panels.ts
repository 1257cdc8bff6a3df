/**
 * One result diagram (shear, moment or deflection) under the free-body diagram, on the same
 * horizontal scale: the curve filled to its axis, the labelled extremes with their positions,
 * zero crossings marked, support positions as faint guides.
 */
import type { CurvePoint } from "./curves";
import { formatLength, formatValue } from "./format";
import { type Block, type Frame, xOf } from "./frame";
import { drawLabel, type LabelLine, labelSize } from "./labels";
import { textWidth } from "./metrics";
import { type Box, placeLabels, type PlaceRequest } from "./place";
import { type Attrs, el, FONT, line, PALETTE, points, text } from "./svg";

/** A labelled extreme: an exact value from the engine and where it occurs. */
export interface PanelExtreme {
  readonly value: number;
  /** Position, length units. */
  readonly x: number;
  /** What it is, for tooling: "max-shear", "max-sagging", "max-hogging", "max-down", "max-up". */
  readonly kind: string;
}

/** Everything one panel shows. */
export interface PanelSpec {
  /** "shear", "moment" or "deflection". */
  readonly role: string;
  readonly title: string;
  /** Sign convention in a few words, printed beside the title. */
  readonly note: string;
  /** Unit of the values. */
  readonly unit: string;
  /** Unit of positions. */
  readonly lengthUnit: string;
  readonly curve: readonly CurvePoint[];
  /** Positive values drawn above the axis (false: drawn below, as for deflection down +). */
  readonly positiveUp: boolean;
  readonly extremes: readonly PanelExtreme[];
  /** Interior positions where the value changes sign. */
  readonly crossings: readonly number[];
  /** Support positions, drawn as faint guides. */
  readonly guides: readonly number[];
  /** Height of the plotting area in drawing units. */
  readonly plotHeight: number;
  /**
   * true: a diagram filled to its axis and closed by verticals at the ends (V, M);
   * false: a line only (a deflected shape).
   */
  readonly closed: boolean;
}

const PAD_X = 4;
const MAX_X = 318;

function titleBlock(spec: PanelSpec): { body: string; height: number } {
  const title = `${spec.title} (${spec.unit})`;
  const tw = textWidth(title, FONT.label, true);
  const nw = textWidth(spec.note, FONT.small);
  const oneLine = PAD_X + tw + 8 + nw <= MAX_X;
  const body =
    text(PAD_X, 11, title, { size: FONT.label, bold: true }) +
    (oneLine ? text(MAX_X, 11, spec.note, { size: FONT.small, anchor: "end", fill: PALETTE.muted }) : text(PAD_X, 24, spec.note, { size: FONT.small, fill: PALETTE.muted }));
  return { body, height: oneLine ? 16 : 29 };
}

/** Vertical scale: maps a value to y within [0, plotHeight] of the plotting area. */
function scaleOf(spec: PanelSpec): (v: number) => number {
  const drawn = (v: number): number => (spec.positiveUp ? v : -v);
  const values = [...spec.curve.map((p) => drawn(p.v)), ...spec.extremes.map((e) => drawn(e.value))];
  const hi = Math.max(0, ...values);
  const lo = Math.min(0, ...values);
  const h = spec.plotHeight;
  if (hi - lo <= 0) return () => h / 2;
  return (v: number) => ((hi - drawn(v)) / (hi - lo)) * h;
}

/** The largest magnitude on a panel: an extreme within 1e-9 of it is round-off and prints as 0. */
function panelMagnitude(spec: PanelSpec): number {
  return Math.max(0, ...spec.curve.map((p) => Math.abs(p.v)), ...spec.extremes.map((e) => Math.abs(e.value)));
}

function extremeLabel(e: PanelExtreme, spec: PanelSpec): LabelLine[] {
  const attrs: Attrs = { "data-role": "extreme", "data-kind": e.kind, "data-value": e.value, "data-x": e.x };
  return [
    { text: `${formatValue(e.value, 3, panelMagnitude(spec))} ${spec.unit}`, style: { size: FONT.label, bold: true }, attrs },
    { text: `at ${formatLength(e.x)} ${spec.lengthUnit}`, style: { size: FONT.small, fill: PALETTE.muted }, attrs: { "data-role": "extreme-at", "data-x": e.x } },
  ];
}

function curveMarkup(spec: PanelSpec, frame: Frame, y: (v: number) => number): string {
  const y0 = y(0);
  const pts = spec.curve.map((p): [number, number] => [xOf(frame, p.x), y(p.v)]);
  if (pts.length === 0) return "";
  if (!spec.closed) return el("polyline", { points: points(pts), fill: "none", stroke: PALETTE.ink, "stroke-width": 1.6, "stroke-linejoin": "round", "data-role": "curve" });
  const first = pts[0] as [number, number];
  const last = pts[pts.length - 1] as [number, number];
  const outline: [number, number][] = [[first[0], y0], ...pts, [last[0], y0]];
  return (
    el("polygon", { points: points(outline), fill: PALETTE.fill }) +
    el("polyline", { points: points(outline), fill: "none", stroke: PALETTE.ink, "stroke-width": 1.3, "stroke-linejoin": "round", "data-role": "curve" })
  );
}

interface Labelled {
  readonly lines: LabelLine[];
  /** Position along the member (length units) and its drawing x. */
  readonly at: number;
  readonly x: number;
  readonly pointY: number;
  readonly above: boolean;
  readonly crossing: boolean;
}

function placeSide(items: readonly Labelled[], above: boolean, baseY: number): { item: Labelled; box: Box }[] {
  const chosen = items.filter((it) => it.above === above);
  // Extremes first (they matter most), then crossings, each left to right.
  const order = [...chosen].sort((a, b) => Number(a.crossing) - Number(b.crossing) || a.x - b.x);
  const requests: PlaceRequest[] = order.map((it) => ({ anchorX: it.x, ...labelSize(it.lines), leader: true }));
  const placed = placeLabels(requests, { baseY, direction: above ? "up" : "down", step: 5, minX: 2, maxX: MAX_X, gap: 3 });
  return order.map((item, i) => ({ item, box: (placed[i] as { box: Box }).box }));
}

/**
 * Draw one result panel; its top is y = 0.
 * @param spec - what to show
 * @param frame - the sheet's horizontal scale (shared with the free-body diagram)
 */
export function drawPanel(spec: PanelSpec, frame: Frame): Block {
  const head = titleBlock(spec);
  const y = scaleOf(spec);
  const h = spec.plotHeight;
  const items: Labelled[] = [
    ...spec.extremes.map((e) => ({ lines: extremeLabel(e, spec), at: e.x, x: xOf(frame, e.x), pointY: y(e.value), above: (spec.positiveUp ? e.value : -e.value) >= 0, crossing: false })),
    ...spec.crossings.map((c) => ({
      lines: [{ text: formatLength(c), style: { size: FONT.small, fill: PALETTE.muted }, attrs: { "data-role": "crossing-label", "data-x": c } }],
      at: c,
      x: xOf(frame, c),
      pointY: y(0),
      above: false,
      crossing: true,
    })),
  ];
  // Plot coordinates: the plotting area spans y = 0..h; labels go above 0 or below h.
  const placed = [...placeSide(items, true, -3), ...placeSide(items, false, h + 3)];
  const minY = Math.min(0, ...placed.map((p) => p.box.y0));
  const maxY = Math.max(h, ...placed.map((p) => p.box.y1));
  let plot = "";
  for (const g of spec.guides) plot += line(xOf(frame, g), 0, xOf(frame, g), h, PALETTE.guide, 0.8, { "stroke-dasharray": "2 3" });
  plot += curveMarkup(spec, frame, y);
  plot += line(xOf(frame, 0), y(0), xOf(frame, frame.span), y(0), PALETTE.ink, 0.8, { "data-role": "axis" });
  for (const { item, box } of placed) {
    const edge = item.above ? box.y1 : box.y0;
    if (Math.abs(edge - item.pointY) > 4) {
      plot += line(item.x, item.pointY, item.x, edge, item.crossing ? PALETTE.guide : PALETTE.muted, 0.7, { "stroke-dasharray": item.crossing ? "1.5 2" : undefined });
    }
    plot += item.crossing
      ? el("circle", { cx: item.x, cy: item.pointY, r: 2.3, fill: PALETTE.paper, stroke: PALETTE.ink, "stroke-width": 1, "data-role": "zero-crossing", "data-x": item.at })
      : el("circle", { cx: item.x, cy: item.pointY, r: 2, fill: PALETTE.ink });
    plot += drawLabel(item.lines, box);
  }
  const plotTop = head.height - minY + 2;
  const body = el(
    "g",
    { "data-role": spec.role },
    head.body,
    el("g", { transform: `translate(0,${Math.round(plotTop * 100) / 100})`, "data-plot-top": plotTop, "data-plot-height": h }, plot),
  );
  return { body, top: 0, bottom: plotTop + maxY };
}
