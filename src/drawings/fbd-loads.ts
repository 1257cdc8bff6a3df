/**
 * The loads of the free-body diagram, above the member: line loads as bands over their actual
 * intervals (stacked in lanes where they overlap), point loads as arrows labelled with the mark
 * of the member they come from, applied couples as arc arrows. The member axis is y = 0.
 */
import { truncate } from "./escape";
import { formatValue } from "./format";
import { type Block, type Frame, xOf } from "./frame";
import { drawLabel, type LabelLine, labelSize } from "./labels";
import { type Box, placeLabels, type PlaceRequest } from "./place";
import { arcArrow, arrow, el, FONT, line, PALETTE, points } from "./svg";
import type { DrawnLineLoad, DrawnMoment, DrawnPointLoad, DrawingUnits, MemberDrawing } from "./types";

/** Gap between the member axis and the lowest band. */
const BAND_BASE = 3;
/** Tallest band (the largest line load of the member). */
const BAND_MAX = 12;
/** Clearance above a lane's label. */
const LANE_CLEARANCE = 5;
/** Horizontal room a label may use. */
const MIN_X = 2;
const MAX_X = 318;
/** Arc radius of an applied couple. */
export const COUPLE_RADIUS = 9;

const markChars = 16;

function magnitudeText(l: DrawnLineLoad, units: DrawingUnits): string {
  const mag = l.w1 === l.w2 ? formatValue(l.w1) : `${formatValue(l.w1)} to ${formatValue(l.w2)}`;
  return `${mag} ${units.lineLoad}`;
}

function nameOf(l: DrawnLineLoad): string {
  return l.label !== undefined && l.label.trim() !== "" ? truncate(l.label, markChars) : "";
}

/** The label of a line load on one line ("Office: 1.2 kip/ft") or two (name above magnitude). */
function lineLoadLabel(l: DrawnLineLoad, i: number, units: DrawingUnits, twoLines: boolean): LabelLine[] {
  const style = { size: FONT.small, fill: PALETTE.load, halo: true };
  const name = nameOf(l);
  const magnitude = magnitudeText(l, units);
  const attrs = { "data-role": "line-label", "data-index": i };
  if (twoLines && name !== "") return [{ text: name, style, attrs: { "data-role": "line-name", "data-index": i } }, { text: magnitude, style, attrs }];
  return [{ text: name === "" ? magnitude : `${name}: ${magnitude}`, style, attrs }];
}

function bandHeight(w: number, wMax: number): number {
  if (w === 0) return 0;
  return Math.max(2, (Math.abs(w) / wMax) * BAND_MAX);
}

function clampBox(centre: number, width: number): [number, number] {
  const x0 = Math.min(Math.max(centre - width / 2, MIN_X), MAX_X - width);
  return [x0, x0 + width];
}

/**
 * Where a band's label goes: over the middle of the band unless an arrow of a point load or
 * couple would run through it there; then the nearest clear place along the band; null when
 * there is none.
 */
function clearSpan(x0: number, x1: number, width: number, avoid: readonly number[]): [number, number] | null {
  const clear = (b: [number, number]): boolean => avoid.every((x) => x < b[0] - 3 || x > b[1] + 3);
  const mid = (x0 + x1) / 2;
  const reach = Math.max(x1 - x0, width) / 2;
  for (let d = 0; d <= reach; d += 2) {
    for (const c of [mid - d, mid + d]) {
      const b = clampBox(c, width);
      if (clear(b)) return b;
    }
  }
  return null;
}

interface LaneItem {
  readonly load: DrawnLineLoad;
  readonly label: LabelLine[];
  readonly labelBox: [number, number];
  readonly lane: number;
}

/** A label and where it goes: one line where clear, else two lines where clear, else one line in the middle. */
function chooseLabel(l: DrawnLineLoad, i: number, x0: number, x1: number, units: DrawingUnits, avoid: readonly number[]): { label: LabelLine[]; box: [number, number] } {
  for (const twoLines of [false, true]) {
    const label = lineLoadLabel(l, i, units, twoLines);
    const box = clearSpan(x0, x1, labelSize(label).width, avoid);
    if (box !== null) return { label, box };
  }
  const label = lineLoadLabel(l, i, units, false);
  return { label, box: clampBox((x0 + x1) / 2, labelSize(label).width) };
}

function assignLanes(lines: readonly DrawnLineLoad[], frame: Frame, units: DrawingUnits, avoid: readonly number[]): LaneItem[] {
  const order = lines.map((l, i) => i).sort((a, b) => (lines[a] as DrawnLineLoad).start - (lines[b] as DrawnLineLoad).start);
  const lanes: [number, number][][] = [];
  const out: LaneItem[] = [];
  for (const i of order) {
    const l = lines[i] as DrawnLineLoad;
    const x0 = xOf(frame, Math.min(l.start, l.end));
    const x1 = xOf(frame, Math.max(l.start, l.end));
    const { label, box } = chooseLabel(l, i, x0, x1, units, avoid);
    const foot: [number, number] = [Math.min(x0, box[0]), Math.max(x1, box[1])];
    let lane = lanes.findIndex((taken) => taken.every(([a, b]) => foot[1] + 4 <= a || b + 4 <= foot[0]));
    if (lane < 0) {
      lanes.push([]);
      lane = lanes.length - 1;
    }
    (lanes[lane] as [number, number][]).push(foot);
    out.push({ load: l, label, labelBox: box, lane });
  }
  return out;
}

/** y of the bottom of each lane's band, and of the top of the last lane, from the lanes' labels. */
function laneBases(items: readonly LaneItem[]): number[] {
  const count = items.reduce((n, it) => Math.max(n, it.lane + 1), 0);
  const bases = [-BAND_BASE];
  for (let k = 0; k < count; k++) {
    const labelHeight = Math.max(0, ...items.filter((it) => it.lane === k).map((it) => labelSize(it.label).height));
    bases.push((bases[k] as number) - (BAND_MAX + labelHeight + LANE_CLEARANCE));
  }
  return bases;
}

function bandPieces(l: DrawnLineLoad): [number, number, number, number][] {
  const [a, b, wa, wb] = l.start <= l.end ? [l.start, l.end, l.w1, l.w2] : [l.end, l.start, l.w2, l.w1];
  if (wa * wb >= 0) return [[a, b, wa, wb]];
  const xz = a + ((b - a) * wa) / (wa - wb);
  return [
    [a, xz, wa, 0],
    [xz, b, 0, wb],
  ];
}

function drawBand(item: LaneItem, frame: Frame, wMax: number, bases: readonly number[]): string {
  const yb = bases[item.lane] as number;
  let out = "";
  let hTop = 0;
  for (const [a, b, wa, wb] of bandPieces(item.load)) {
    const xa = xOf(frame, a);
    const xb = xOf(frame, b);
    const ha = bandHeight(wa, wMax);
    const hb = bandHeight(wb, wMax);
    hTop = Math.max(hTop, ha, hb);
    out += el("polygon", {
      points: points([[xa, yb], [xb, yb], [xb, yb - hb], [xa, yb - ha]]),
      fill: PALETTE.loadFill,
      stroke: PALETTE.load,
      "stroke-width": 0.9,
    });
    const n = xb - xa < 4 ? 1 : Math.max(2, Math.round((xb - xa) / 10) + 1);
    for (let k = 0; k < n; k++) {
      const x = n === 1 ? (xa + xb) / 2 : xa + 1 + ((xb - xa - 2) * k) / (n - 1);
      const w = wa + ((wb - wa) * (x - xa)) / Math.max(xb - xa, 1e-9);
      const h = bandHeight(w, wMax);
      if (h < 4) continue;
      out += w > 0 ? arrow(x, yb - h, x, yb, PALETTE.load, 0.8, 3) : arrow(x, yb, x, yb - h, PALETTE.load, 0.8, 3);
    }
  }
  const size = labelSize(item.label);
  const box: Box = { x0: item.labelBox[0], y0: yb - hTop - 1.5 - size.height, x1: item.labelBox[1], y1: yb - hTop - 1.5 };
  return el(
    "g",
    { "data-role": "line-load", "data-start": item.load.start, "data-end": item.load.end, "data-w1": item.load.w1, "data-w2": item.load.w2 },
    out,
    drawLabel(item.label, box),
  );
}

interface Marker {
  readonly x: number;
  readonly kind: "point" | "moment";
  readonly label: LabelLine[];
  readonly total: number;
}

function pointMarkers(points: readonly DrawnPointLoad[], span: number, units: DrawingUnits): Marker[] {
  const tol = 1e-9 * span;
  const sorted = points.map((p, i) => ({ p, i })).sort((a, b) => a.p.x - b.p.x);
  const groups: { x: number; items: { p: DrawnPointLoad; i: number }[] }[] = [];
  for (const it of sorted) {
    const g = groups[groups.length - 1];
    if (g !== undefined && it.p.x - g.x <= tol) g.items.push(it);
    else groups.push({ x: it.p.x, items: [it] });
  }
  return groups.map((g) => ({
    x: g.x,
    kind: "point" as const,
    total: g.items.reduce((s, it) => s + it.p.p, 0),
    label: g.items.map(({ p, i }) => ({
      text: `${p.from !== undefined && p.from.trim() !== "" ? `${truncate(p.from, markChars)}: ` : ""}${formatValue(p.p)} ${units.force}`,
      style: { size: FONT.small, fill: PALETTE.load },
      attrs: { "data-role": "point-label", "data-index": i, "data-value": p.p },
    })),
  }));
}

function momentMarkers(moments: readonly DrawnMoment[], units: DrawingUnits): Marker[] {
  return moments.map((m, i) => ({
    x: m.x,
    kind: "moment" as const,
    total: m.m,
    label: [
      {
        text: `${m.from !== undefined && m.from.trim() !== "" ? `${truncate(m.from, markChars)}: ` : ""}${formatValue(Math.abs(m.m))} ${units.moment} ${m.m >= 0 ? "ccw" : "cw"}`,
        style: { size: FONT.small, fill: PALETTE.load },
        attrs: { "data-role": "moment-label", "data-index": i, "data-value": m.m },
      },
    ],
  }));
}

function drawMarker(m: Marker, box: Box, frame: Frame): string {
  const x = xOf(frame, m.x);
  if (m.kind === "point") {
    const shaft = m.total >= 0 ? arrow(x, box.y1, x, -2, PALETTE.load, 1.6, 6) : arrow(x, -2, x, box.y1, PALETTE.load, 1.6, 6);
    return el("g", { "data-role": "point-load", "data-x": m.x, "data-value": m.total, "data-draw-x": x }, shaft, drawLabel(m.label, box));
  }
  const leader = line(x, box.y1, x, -COUPLE_RADIUS - 1.5, PALETTE.load, 0.7, { "stroke-dasharray": "2 2" });
  const arc = arcArrow(x, 0, COUPLE_RADIUS, 20, 160, m.total >= 0, PALETTE.load, 1.5);
  return el("g", { "data-role": "moment-load", "data-x": m.x, "data-value": m.total, "data-draw-x": x }, leader, arc, drawLabel(m.label, box));
}

/**
 * Draw the loads of a member above its axis (y = 0, y up is negative).
 * @param drawing - the member
 * @param frame - the sheet's horizontal scale
 * @returns the markup and its extent (bottom is 0)
 */
export function drawLoads(drawing: MemberDrawing, frame: Frame): Block {
  const arrowXs = [...drawing.points.map((p) => xOf(frame, p.x)), ...drawing.moments.map((m) => xOf(frame, m.x))];
  const lanes = assignLanes(drawing.lines, frame, drawing.units, arrowXs);
  const wMax = Math.max(1e-300, ...drawing.lines.flatMap((l) => [Math.abs(l.w1), Math.abs(l.w2)]));
  const bases = laneBases(lanes);
  const bands = lanes.map((it) => drawBand(it, frame, wMax, bases)).join("");
  const baseY = bases.length > 1 ? (bases[bases.length - 1] as number) + 2 : -22;
  const markers = [...pointMarkers(drawing.points, drawing.span, drawing.units), ...momentMarkers(drawing.moments, drawing.units)].sort((a, b) => a.x - b.x);
  const requests: PlaceRequest[] = markers.map((m) => ({ anchorX: xOf(frame, m.x), ...labelSize(m.label), leader: true }));
  const placed = placeLabels(requests, { baseY, direction: "up", step: 6, minX: MIN_X, maxX: MAX_X });
  const drawn = markers.map((m, i) => drawMarker(m, (placed[i] as { box: Box }).box, frame)).join("");
  const tops = [baseY, ...placed.map((p) => p.box.y0), bases[bases.length - 1] as number];
  return { body: bands + drawn, top: Math.min(...tops), bottom: 0 };
}
