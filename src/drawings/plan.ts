/**
 * The framing plan of one level, drawn from the derived plan (src/engine/framing): grid lines
 * with their bubbles, columns, members by type (joist thin dashed, beam medium, girder heavy,
 * wall a double line), every member and column with its mark (a label where it fits, always a
 * tooltip title), deck areas with their edges and span arrows, openings crossed out, and each
 * member's tributary region shaded in alternating light tints so neighbours differ. A selected
 * member's region and its load path (what it bears on, down to the foundations) are highlighted.
 *
 * Plan coordinates (ft or m, y up) map to drawing units (y down) by one scale; the root carries
 * that transform in data-* attributes, and every member, column and region its plan coordinates,
 * so tests and tools can read the drawing back.
 */
import type { Derivation, DerivedMember, Plan, Point, TributaryRegion } from "../engine/framing/types";
import { interiorPoint, signedArea, strictlyInside } from "../engine/framing/geometry";
import { escapeXml, truncate } from "./escape";
import { formatLength, formatQuantity } from "./format";
import { wrapText } from "./labels";
import { textWidth } from "./metrics";
import { REVIEW_NOTICE } from "./notice";
import { arrow, el, FONT, line, num, PALETTE, points, svgDocument, text, type Attrs } from "./svg";

/** Grid lines by name (the names as the Grids table gives them, matched case-insensitively). */
export interface PlanGrids {
  readonly x: ReadonlyMap<string, number>;
  readonly y: ReadonlyMap<string, number>;
}

/** What a framing plan drawing is made from: the plan as read, its grids and its derivation. */
export interface FramingPlanModel {
  readonly plan: Plan;
  readonly grids: PlanGrids;
  readonly derivation: Derivation;
  /** Unit system of the coordinates (ft for US, m for SI). */
  readonly units: "US" | "SI";
}

/** Options of {@link renderFramingPlan}. */
export interface FramingPlanOptions {
  /** Mark of the member (or column) whose tributary region and load path are highlighted. */
  readonly selected?: string;
  /** Width of the drawing in drawing units (default 720). */
  readonly width?: number;
}

/** Light tints for tributary regions; neighbouring members get different ones. */
export const TRIBUTARY_TINTS = ["#dcecf7", "#f6ead2", "#e4f3e1", "#ece3f5", "#f8e0e0", "#e0f2f1"] as const;

/** Line weight and dash of each spanning type (ordinary drafting: heavier for what carries more). */
export const MEMBER_STYLE = {
  joist: { width: 0.7, dash: "5 2.5" },
  beam: { width: 1.4, dash: undefined },
  girder: { width: 2.6, dash: undefined },
  wall: { width: 0.8, dash: undefined },
} as const;

const WALL_GAP = 4.5;
const COLUMN_SIZE = 7;
const MARGIN = { left: 46, right: 40, top: 72, bottom: 22 } as const;
const BUBBLE_R = 8;

/** Axis-aligned box in drawing units. */
interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

const boxesOverlap = (a: Box, b: Box): boolean => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/** Names of the levels that have members, columns or decks, bottom up (the Levels table's order first). */
export function planLevels(model: FramingPlanModel): string[] {
  const used = new Set<string>();
  for (const m of model.derivation.members) if (m.type !== "foundation") used.add(m.level);
  for (const d of model.plan.decks) used.add(d.level);
  const ordered = model.plan.levels.map((l) => l.name).filter((n) => used.has(n));
  const rest = [...used].filter((n) => !ordered.includes(n)).sort();
  return [...ordered, ...rest];
}

/** The marks on a member's load path, in order: what it bears on, and what those bear on, to the foundations. */
export function loadPathOf(derivation: Derivation, mark: string): string[] {
  const byMark = new Map(derivation.members.map((m) => [m.mark, m]));
  const bearingsOf = new Map<string, string[]>();
  for (const b of derivation.bearings) bearingsOf.set(b.mark, [...(bearingsOf.get(b.mark) ?? []), b.support]);
  const out: string[] = [];
  const seen = new Set<string>([mark]);
  const queue = [mark];
  while (queue.length > 0) {
    const m = byMark.get(queue.shift()!);
    if (!m) continue;
    for (const s of [m.startSupport, ...(bearingsOf.get(m.mark) ?? []), m.endSupport]) {
      if (s === null || seen.has(s)) continue;
      seen.add(s);
      out.push(s);
      queue.push(s);
    }
  }
  return out;
}

/**
 * Colour index per member so that members whose regions touch get different tints (greedy, in
 * mark order, over the regions' bounding boxes).
 */
function tintsOf(regions: readonly TributaryRegion[], eps: number): Map<string, number> {
  const boxes = regions.map((r) => {
    const xs = r.polygon.map((p) => p.x), ys = r.polygon.map((p) => p.y);
    return { mark: r.mark, x0: Math.min(...xs) - eps, x1: Math.max(...xs) + eps, y0: Math.min(...ys) - eps, y1: Math.max(...ys) + eps };
  });
  const neighbours = new Map<string, Set<string>>();
  const sorted = [...boxes].sort((a, b) => a.x0 - b.x0);
  for (let i = 0; i < sorted.length; i++) {
    const a = sorted[i]!;
    for (let j = i + 1; j < sorted.length; j++) {
      const b = sorted[j]!;
      if (b.x0 > a.x1) break;
      if (a.mark === b.mark || b.y0 > a.y1 || a.y0 > b.y1) continue;
      (neighbours.get(a.mark) ?? neighbours.set(a.mark, new Set()).get(a.mark)!).add(b.mark);
      (neighbours.get(b.mark) ?? neighbours.set(b.mark, new Set()).get(b.mark)!).add(a.mark);
    }
  }
  const tint = new Map<string, number>();
  const marks = [...new Set(regions.map((r) => r.mark))].sort();
  for (const m of marks) {
    const used = new Set([...(neighbours.get(m) ?? [])].map((n) => tint.get(n)).filter((t): t is number => t !== undefined));
    let t = 0;
    while (used.has(t) && t < TRIBUTARY_TINTS.length) t++;
    tint.set(m, t % TRIBUTARY_TINTS.length);
  }
  return tint;
}


/** The area centroid of a polygon when it lies inside it, else a point surely inside (an ear's centroid). */
function centroidInside(poly: readonly Point[]): Point {
  const a = signedArea(poly);
  let cx = 0, cy = 0;
  for (let i = 0; i < poly.length; i++) {
    const p = poly[i]!, q = poly[(i + 1) % poly.length]!;
    const f = p.x * q.y - q.x * p.y;
    cx += (p.x + q.x) * f;
    cy += (p.y + q.y) * f;
  }
  const c = { x: cx / (6 * a), y: cy / (6 * a) };
  return Number.isFinite(c.x) && Number.isFinite(c.y) && strictlyInside(c, poly, 0) ? c : interiorPoint(poly);
}

function segmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b.x - a.x, dy = b.y - a.y;
  const L = dx * dx + dy * dy;
  const t = L === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / L));
  return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}

const inside = (p: Point, poly: readonly Point[]): boolean => strictlyInside(p, poly, 0);

/** Clearance of a point inside a deck: distance to the deck's edges and to its level's openings (0 inside one). */
function clearance(p: Point, deck: readonly Point[], openings: readonly (readonly Point[])[]): number {
  let d = Number.POSITIVE_INFINITY;
  for (const poly of [deck, ...openings]) {
    if (poly !== deck && inside(p, poly)) return 0;
    for (let i = 0; i < poly.length; i++) d = Math.min(d, segmentDistance(p, poly[i]!, poly[(i + 1) % poly.length]!));
  }
  return d;
}

/** Where a deck's span arrow goes: its centroid, else the point of a 9 x 9 lattice over it with most room. */
function arrowPoint(deck: readonly Point[], openings: readonly (readonly Point[])[]): Point {
  const c = centroidInside(deck);
  const xs = deck.map((p) => p.x), ys = deck.map((p) => p.y);
  const size = Math.min(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
  if (clearance(c, deck, openings) >= size * 0.25) return c;
  let best = c, room = clearance(c, deck, openings);
  for (let i = 1; i < 10; i++)
    for (let j = 1; j < 10; j++) {
      const p = { x: Math.min(...xs) + ((Math.max(...xs) - Math.min(...xs)) * i) / 10, y: Math.min(...ys) + ((Math.max(...ys) - Math.min(...ys)) * j) / 10 };
      if (!inside(p, deck)) continue;
      const r = clearance(p, deck, openings);
      if (r > room) (best = p), (room = r);
    }
  return best;
}

/** A tooltip: escaped text in an SVG <title> (shown on hover by browsers). */
function title(content: string): string {
  return `<title>${escapeXml(content)}</title>`;
}

/**
 * Draw the framing plan of one level.
 * @param model - the plan as read, its grids and its derivation
 * @param level - the level's name (Levels table)
 * @param options - a selected member, the drawing's width
 * @returns a self-contained SVG document
 */
export function renderFramingPlan(model: FramingPlanModel, level: string, options: FramingPlanOptions = {}): string {
  const W = options.width ?? 720;
  const unit = model.units === "SI" ? "m" : "ft";
  const areaUnit = model.units === "SI" ? "m\u00B2" : "ft\u00B2";
  const d = model.derivation;
  const members = d.members.filter((m) => m.level === level && m.type !== "foundation");
  const spanning = members.filter((m) => m.type !== "column");
  const columns = members.filter((m) => m.type === "column");
  const decks = model.plan.decks.filter((k) => k.level === level);
  const marks = new Set(spanning.map((m) => m.mark));
  const regions = d.regions.filter((r) => marks.has(r.mark));

  // extent of what is drawn (plan units), grid lines included
  const xs: number[] = [], ys: number[] = [];
  for (const m of members) xs.push(m.x1, m.x2), ys.push(m.y1, m.y2);
  for (const k of decks) for (const p of k.corners) xs.push(p.x), ys.push(p.y);
  if (xs.length === 0) xs.push(0), ys.push(0);
  let xmin = Math.min(...xs), xmax = Math.max(...xs), ymin = Math.min(...ys), ymax = Math.max(...ys);
  const gx = [...model.grids.x].sort((a, b) => a[1] - b[1]);
  const gy = [...model.grids.y].sort((a, b) => a[1] - b[1]);
  for (const [, x] of gx) (xmin = Math.min(xmin, x)), (xmax = Math.max(xmax, x));
  for (const [, y] of gy) (ymin = Math.min(ymin, y)), (ymax = Math.max(ymax, y));
  const extent = Math.max(xmax - xmin, ymax - ymin, 1e-9);
  if (xmax - xmin < extent * 0.2) (xmin -= extent * 0.1), (xmax += extent * 0.1);
  if (ymax - ymin < extent * 0.2) (ymin -= extent * 0.1), (ymax += extent * 0.1);
  const s = (W - MARGIN.left - MARGIN.right) / (xmax - xmin);
  const plotH = (ymax - ymin) * s;
  const X = (x: number): number => MARGIN.left + (x - xmin) * s;
  const Y = (y: number): number => MARGIN.top + (ymax - y) * s;
  const P = (p: Point): [number, number] => [X(p.x), Y(p.y)];

  const selected = options.selected !== undefined && d.members.some((m) => m.mark === options.selected) ? options.selected : undefined;
  const path = selected !== undefined ? loadPathOf(d, selected) : [];
  const onPath = new Set(path);
  const labels: Box[] = [];
  const parts: string[] = [];

  // tributary regions, tinted per member
  const tint = tintsOf(regions, 1e-9 * extent + d.tolerance);
  const regionMarkup = regions.map((r) => {
    const isSel = r.mark === selected;
    const fill = isSel ? PALETTE.loadFill : TRIBUTARY_TINTS[tint.get(r.mark) ?? 0];
    return el("polygon", {
      points: points(r.polygon.map(P)),
      fill,
      // a hairline of the fill's own colour hides the seams between pieces of one member
      stroke: isSel ? PALETTE.load : fill,
      "stroke-width": isSel ? 0.8 : 0.4,
      "data-role": "plan-tributary",
      "data-plan-mark": r.mark,
      "data-zone": r.zone,
      "data-area": r.area,
      "data-plan": r.polygon.map((p) => `${p.x},${p.y}`).join(" "),
    }, title(`${r.mark}: deck ${r.area}${r.zone !== "" ? `, zone ${r.zone}` : ""}, ${formatQuantity(signedArea(r.polygon), "area", "-")} ${areaUnit} of this piece`));
  });
  parts.push(el("g", { "data-role": "plan-tributaries" }, ...regionMarkup));

  // grid lines and bubbles
  const over = 14;
  const gridParts: string[] = [];
  for (const [name, x] of gx) {
    const top = MARGIN.top - over;
    gridParts.push(el("g", { "data-role": "plan-grid", "data-grid": name, "data-x": x }, line(X(x), top, X(x), MARGIN.top + plotH + 6, PALETTE.muted, 0.6, { "stroke-dasharray": "14 3 2 3" }), bubble(X(x), top - BUBBLE_R, name)));
  }
  for (const [name, y] of gy) {
    const left = MARGIN.left - over;
    gridParts.push(el("g", { "data-role": "plan-grid", "data-grid": name, "data-y": y }, line(left, Y(y), W - MARGIN.right + 6, Y(y), PALETTE.muted, 0.6, { "stroke-dasharray": "14 3 2 3" }), bubble(left - BUBBLE_R, Y(y), name)));
  }
  parts.push(el("g", {}, ...gridParts));

  // deck edges, openings, span arrows
  const openings = decks.filter((k) => k.kind === "opening");
  const deckLabels: { x: number; y: number; name: string; area: string }[] = [];
  for (const k of [...decks.filter((x) => x.kind !== "opening"), ...openings]) {
    const pts = points(k.corners.map(P));
    if (k.kind === "opening") {
      const bx0 = Math.min(...k.corners.map((p) => X(p.x))), bx1 = Math.max(...k.corners.map((p) => X(p.x)));
      const by0 = Math.min(...k.corners.map((p) => Y(p.y))), by1 = Math.max(...k.corners.map((p) => Y(p.y)));
      parts.push(el("g", { "data-role": "plan-opening", "data-area": k.area },
        title(`Opening ${k.area}`),
        el("polygon", { points: pts, fill: PALETTE.paper, stroke: PALETTE.ink, "stroke-width": 0.9 }),
        line(bx0, by0, bx1, by1, PALETTE.muted, 0.6), line(bx0, by1, bx1, by0, PALETTE.muted, 0.6)));
      continue;
    }
    const c = arrowPoint(k.corners, openings.map((o) => o.corners));
    const [cx, cy] = P(c);
    const size = Math.min(...[0, 1].map((axis) => {
      const v = k.corners.map((p) => (axis === 0 ? X(p.x) : Y(p.y)));
      return Math.max(...v) - Math.min(...v);
    }));
    const half = Math.max(8, Math.min(26, size * 0.3));
    const dirs = k.kind === "two-way" ? [0, Math.PI / 2] : [k.span];
    const arrows = dirs.map((a) => {
      const ux = Math.cos(a) * half, uy = -Math.sin(a) * half;
      return el("g", { "data-role": "plan-span-arrow" }, arrow(cx, cy, cx + ux, cy + uy, PALETTE.ink, 0.9, 5), arrow(cx, cy, cx - ux, cy - uy, PALETTE.ink, 0.9, 5));
    });
    const name = truncate(`${k.area}${k.zone !== "" ? ` \u00B7 ${k.zone}` : ""}`, 28);
    parts.push(el("g", { "data-role": "plan-deck", "data-area": k.area, "data-deck-kind": k.kind },
      title(`Deck ${k.area}: ${k.kind}${k.kind === "one-way" ? ` spanning at ${formatLength((k.span * 180) / Math.PI)}\u00B0 from +x` : ""}${k.zone !== "" ? `, zone ${k.zone}` : ""}`),
      el("polygon", { points: pts, fill: "none", stroke: PALETTE.ink, "stroke-width": 1.1, "data-role": "plan-slab-edge" }),
      ...arrows));
    deckLabels.push({ x: cx, y: cy + half + 11, name, area: k.area });
  }

  // members: walls, joists, beams, girders (heavier drawn last)
  const order = { wall: 0, joist: 1, beam: 2, girder: 3, column: 4, foundation: 5 } as const;
  const drawn = [...spanning].sort((a, b) => order[a.type] - order[b.type] || (a.mark < b.mark ? -1 : 1));
  const memberParts: string[] = [];
  for (const m of drawn) {
    const isSel = m.mark === selected;
    const colour = isSel ? PALETTE.load : onPath.has(m.mark) ? PALETTE.reaction : PALETTE.ink;
    const st = MEMBER_STYLE[m.type as keyof typeof MEMBER_STYLE];
    const [x1, y1, x2, y2] = [X(m.x1), Y(m.y1), X(m.x2), Y(m.y2)];
    const len = Math.hypot(x2 - x1, y2 - y1);
    const extraW = isSel || onPath.has(m.mark) ? 0.8 : 0;
    let body: string;
    if (m.type === "wall") {
      const nx = len > 0 ? (-(y2 - y1) / len) * (WALL_GAP / 2) : 0, ny = len > 0 ? ((x2 - x1) / len) * (WALL_GAP / 2) : 0;
      body = el("polygon", { points: points([[x1 + nx, y1 + ny], [x2 + nx, y2 + ny], [x2 - nx, y2 - ny], [x1 - nx, y1 - ny]]), fill: PALETTE.fill, stroke: colour, "stroke-width": st.width + extraW });
    } else body = line(x1, y1, x2, y2, colour, st.width + extraW, { "stroke-dasharray": st.dash, "stroke-linecap": "round" });
    memberParts.push(el("g", { "data-role": "plan-member", "data-plan-mark": m.mark, "data-type": m.type, "data-x1": m.x1, "data-y1": m.y1, "data-x2": m.x2, "data-y2": m.y2, "data-tributary-area": m.tributaryArea }, title(memberTip(m, unit, areaUnit)), body));
  }
  parts.push(el("g", {}, ...memberParts));

  // columns
  const colParts: string[] = [];
  for (const c of columns) {
    const [cx, cy] = P({ x: c.x1, y: c.y1 });
    const colour = c.mark === selected ? PALETTE.load : onPath.has(c.mark) ? PALETTE.reaction : PALETTE.ink;
    const h = COLUMN_SIZE / 2;
    colParts.push(el("g", { "data-role": "plan-column", "data-plan-mark": c.mark, "data-x1": c.x1, "data-y1": c.y1 }, title(`Column ${c.mark}${c.span !== null ? `, storey height ${formatLength(c.span)} ${unit}` : ""}${c.startSupport !== null ? `, on ${c.startSupport}` : ""}`), el("rect", { x: cx - h, y: cy - h, width: COLUMN_SIZE, height: COLUMN_SIZE, fill: colour })));
  }
  parts.push(el("g", {}, ...colParts));

  // labels where they fit: columns first, then members by rank (girders first)
  const labelParts: string[] = [];
  for (const c of columns) {
    const [cx, cy] = P({ x: c.x1, y: c.y1 });
    const t = truncate(c.mark, 14);
    const w = textWidth(t, FONT.small);
    // upper right of the column, else upper left
    const box = [cx + 5, cx - 5 - w].map((x0) => ({ x0, y0: cy - 5 - FONT.small, x1: x0 + w, y1: cy - 4 })).find((b) => b.x0 >= 0 && b.x1 <= W && !labels.some((o) => boxesOverlap(o, b)));
    if (!box) continue;
    labels.push(box);
    labelParts.push(text(box.x0, cy - 5, t, { size: FONT.small, fill: c.mark === selected ? PALETTE.load : PALETTE.ink, halo: true }, { "data-role": "plan-column-label", "data-plan-mark": c.mark }));
  }
  for (const m of [...drawn].reverse()) {
    const [x1, y1, x2, y2] = [X(m.x1), Y(m.y1), X(m.x2), Y(m.y2)];
    const len = Math.hypot(x2 - x1, y2 - y1);
    const t = truncate(m.mark, 16);
    const size = m.type === "joist" ? FONT.small - 1 : FONT.small;
    const w = textWidth(t, size, m.type === "girder");
    if (len < w + 10) continue;
    let ang = (Math.atan2(y2 - y1, x2 - x1) * 180) / Math.PI;
    if (ang > 90) ang -= 180;
    if (ang <= -90) ang += 180;
    const rad = (ang * Math.PI) / 180;
    const mx = (x1 + x2) / 2, my = (y1 + y2) / 2;
    // text just above the line (in the rotated text's frame), else just below it
    const off = m.type === "wall" ? WALL_GAP / 2 + 3 : 3;
    const place = [-off, off + size * 0.8].map((dn) => {
      const tx = mx - Math.sin(rad) * dn, ty = my + Math.cos(rad) * dn;
      const corners = [[-w / 2, 0], [w / 2, 0], [w / 2, -size], [-w / 2, -size]].map(([a, b]) => [tx + a! * Math.cos(rad) - b! * Math.sin(rad), ty + a! * Math.sin(rad) + b! * Math.cos(rad)] as const);
      return { tx, ty, box: { x0: Math.min(...corners.map((p) => p[0])), x1: Math.max(...corners.map((p) => p[0])), y0: Math.min(...corners.map((p) => p[1])), y1: Math.max(...corners.map((p) => p[1])) } };
    }).find((c) => !labels.some((b) => boxesOverlap(b, c.box)));
    if (!place) continue;
    const { tx, ty, box } = place;
    labels.push(box);
    const fill = m.mark === selected ? PALETTE.load : onPath.has(m.mark) ? PALETTE.reaction : PALETTE.ink;
    labelParts.push(text(0, 0, t, { size, anchor: "middle", bold: m.type === "girder", fill, halo: true }, { transform: `translate(${num(tx)},${num(ty)}) rotate(${num(ang)})`, "data-role": "plan-member-label", "data-plan-mark": m.mark }));
  }
  // deck names last, where they do not crowd a mark (the deck's title always names it)
  for (const dl of deckLabels) {
    const w = textWidth(dl.name, FONT.small) + 2;
    const box = { x0: dl.x - w / 2, x1: dl.x + w / 2, y0: dl.y - FONT.small, y1: dl.y + 2 };
    if (labels.some((b) => boxesOverlap(b, box))) continue;
    labels.push(box);
    labelParts.push(text(dl.x, dl.y, dl.name, { size: FONT.small, anchor: "middle", italic: true, fill: PALETTE.muted, halo: true }, { "data-role": "plan-deck-label", "data-area": dl.area }));
  }
  parts.push(el("g", {}, ...labelParts));

  // title, selection, legend and notice below the plan
  let y = MARGIN.top + plotH + MARGIN.bottom;
  const head = text(8, 17, truncate(`Level ${level} framing plan`, 60), { size: FONT.title, bold: true });
  const sub = text(8, 31, `Coordinates in ${unit}; shaded: the deck each member receives (tributary area)`, { size: FONT.small, fill: PALETTE.muted });
  const foot: string[] = [];
  if (selected !== undefined) {
    const sm = d.members.find((m) => m.mark === selected)!;
    const chain = [selected, ...path].map((p) => truncate(p, 16)).join(" \u2192 ");
    const lines = wrapText(`Selected ${selected}: tributary area ${formatQuantity(sm.tributaryArea, "area", "-")} ${areaUnit}; load path ${chain}`, W - 16, FONT.label).slice(0, 4);
    foot.push(el("g", { "data-role": "plan-selection" }, ...lines.map((l, i) => text(8, y + i * 13, l, { size: FONT.label, fill: PALETTE.load }))));
    y += 13 * lines.length + 4;
  }
  foot.push(legend(8, y, W));
  y += 30;
  foot.push(text(8, y, REVIEW_NOTICE, { size: FONT.small, fill: PALETTE.muted }));
  y += 8;
  const attrs: Attrs = { "data-role": "framing-plan", "data-plan-level": level, "data-scale": s, "data-xmin": xmin, "data-ymax": ymax, "data-left": MARGIN.left, "data-top": MARGIN.top };
  return svgDocument(W, y, `Framing plan, level ${level}`, head + sub + parts.join("") + foot.join(""), attrs);
}

/** A grid bubble: a circle (or a rounded box for a long name) holding the grid's name. */
function bubble(cx: number, cy: number, name: string): string {
  const t = truncate(name, 8);
  const w = Math.max(2 * BUBBLE_R, textWidth(t, FONT.small) + 6);
  const shape = w <= 2 * BUBBLE_R ? el("circle", { cx, cy, r: BUBBLE_R, fill: PALETTE.paper, stroke: PALETTE.muted, "stroke-width": 0.8 }) : el("rect", { x: cx - w / 2, y: cy - BUBBLE_R, width: w, height: 2 * BUBBLE_R, rx: BUBBLE_R, fill: PALETTE.paper, stroke: PALETTE.muted, "stroke-width": 0.8 });
  return shape + text(cx, cy + 3.4, t, { size: FONT.small, anchor: "middle", bold: true }, { "data-role": "plan-grid-name" });
}

function memberTip(m: DerivedMember, unit: string, areaUnit: string): string {
  const end = (s: string | null, at: number | null): string => (s === null ? "nothing" : at === null ? s : `${s} at ${formatLength(at)} ${unit}`);
  return `${m.mark} (${m.type})${m.span !== null ? `, ${formatLength(m.span)} ${unit}` : ""}: bears on ${end(m.startSupport, m.startAt)} and ${end(m.endSupport, m.endAt)}; tributary area ${formatQuantity(m.tributaryArea, "area", "-")} ${areaUnit}`;
}

/** The legend row: line styles, column, opening, span arrow, tributary tint. */
function legend(x: number, y: number, width: number): string {
  const items: string[] = [];
  let cx = x;
  const item = (sample: string, label: string): void => {
    const w = 24 + 4 + textWidth(label, FONT.small) + 12;
    if (cx + w > width) return;
    items.push(sample.replace(/@X/g, "") + text(cx + 28, y + 3.5, label, { size: FONT.small }));
    cx += w;
  };
  for (const t of ["joist", "beam", "girder"] as const) {
    const st = MEMBER_STYLE[t];
    item(line(cx, y, cx + 24, y, PALETTE.ink, st.width, { "stroke-dasharray": st.dash }), t);
  }
  item(el("rect", { x: cx, y: y - WALL_GAP / 2, width: 24, height: WALL_GAP, fill: PALETTE.fill, stroke: PALETTE.ink, "stroke-width": MEMBER_STYLE.wall.width }), "wall");
  item(el("rect", { x: cx + 8.5, y: y - COLUMN_SIZE / 2, width: COLUMN_SIZE, height: COLUMN_SIZE, fill: PALETTE.ink }), "column");
  item(el("rect", { x: cx + 4, y: y - 6, width: 16, height: 12, fill: PALETTE.paper, stroke: PALETTE.ink, "stroke-width": 0.9 }) + line(cx + 4, y - 6, cx + 20, y + 6, PALETTE.muted, 0.6) + line(cx + 4, y + 6, cx + 20, y - 6, PALETTE.muted, 0.6), "opening");
  item(arrow(cx + 12, y, cx + 24, y, PALETTE.ink, 0.9, 5) + arrow(cx + 12, y, cx, y, PALETTE.ink, 0.9, 5), "deck span");
  item(el("rect", { x: cx, y: y - 6, width: 12, height: 12, fill: TRIBUTARY_TINTS[0] }) + el("rect", { x: cx + 12, y: y - 6, width: 12, height: 12, fill: TRIBUTARY_TINTS[1] }), "tributary");
  return el("g", { "data-role": "plan-legend" }, ...items);
}
