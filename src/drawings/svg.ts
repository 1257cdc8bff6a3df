/**
 * Small builders of SVG markup. Element and attribute names only ever come from this code;
 * every attribute value and every piece of text goes through {@link escapeXml}. No ids, no
 * style sheets, no references: several drawings can sit in one HTML page without clashing.
 */
import { escapeXml } from "./escape";
import { FONT_FAMILY } from "./metrics";

/** Neutral ink, the single accent colour of loads and the one of reactions. */
export const PALETTE = {
  ink: "#1f2328",
  muted: "#6b7280",
  guide: "#c9ced6",
  fill: "#e7e9ee",
  paper: "#ffffff",
  load: "#c2410c",
  loadFill: "#fde4d3",
  reaction: "#1d4ed8",
  reactionFill: "#dbe6ff",
} as const;

/** Font sizes in drawing units; the drawings are 320 units wide, so these are pixels at 320 px. */
export const FONT = { title: 13, label: 10.5, small: 9.5 } as const;

/** Attribute values; `undefined` leaves the attribute out. */
export type Attrs = Readonly<Record<string, string | number | undefined>>;

/**
 * A coordinate or length rounded to 0.01 drawing units.
 * @param v - the number
 */
export function num(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? "0" : String(r);
}

function attrText(attrs: Attrs): string {
  let out = "";
  for (const [k, v] of Object.entries(attrs)) {
    if (v === undefined) continue;
    // Geometry is rounded to 0.01 units; data-* values keep full precision for tooling.
    const value = typeof v === "number" ? (k.startsWith("data-") ? String(v) : num(v)) : escapeXml(v);
    out += ` ${k}="${value}"`;
  }
  return out;
}

/**
 * One element with already-built children (markup strings made by these builders).
 * @param name - element name, a constant of this code
 * @param attrs - attributes, values escaped here
 * @param children - child markup
 */
export function el(name: string, attrs: Attrs, ...children: string[]): string {
  const body = children.join("");
  return body === "" ? `<${name}${attrText(attrs)}/>` : `<${name}${attrText(attrs)}>${body}</${name}>`;
}

/** How a line of text is drawn. */
export interface TextStyle {
  readonly size: number;
  readonly bold?: boolean;
  readonly anchor?: "start" | "middle" | "end";
  readonly fill?: string;
  readonly italic?: boolean;
  /** A white outline under the letters, so a line running behind the text does not cut it. */
  readonly halo?: boolean;
}

/**
 * A line of text; `content` is escaped, so markup in a cell is drawn literally.
 * @param x - anchor x in drawing units
 * @param y - baseline y in drawing units
 * @param content - the text as the user should read it
 * @param style - size, weight, anchor, colour
 * @param extra - further attributes (data-* for tests and tooling)
 */
export function text(x: number, y: number, content: string, style: TextStyle, extra: Attrs = {}): string {
  return `<text${attrText({
    x,
    y,
    "font-size": style.size,
    "font-weight": style.bold ? "bold" : undefined,
    "font-style": style.italic ? "italic" : undefined,
    "text-anchor": style.anchor ?? "start",
    fill: style.fill ?? PALETTE.ink,
    ...(style.halo ? { stroke: PALETTE.paper, "stroke-width": 3, "stroke-linejoin": "round", "paint-order": "stroke" } : {}),
    ...extra,
  })}>${escapeXml(content)}</text>`;
}

/** A straight line. */
export function line(x1: number, y1: number, x2: number, y2: number, stroke: string, width = 1, extra: Attrs = {}): string {
  return el("line", { x1, y1, x2, y2, stroke, "stroke-width": width, ...extra });
}

/** Polyline or polygon points as an attribute value. */
export function points(pts: readonly (readonly [number, number])[]): string {
  return pts.map(([x, y]) => `${num(x)},${num(y)}`).join(" ");
}

/**
 * An arrow from (x1, y1) to a filled head at (x2, y2).
 * @param head - head length in drawing units
 */
export function arrow(x1: number, y1: number, x2: number, y2: number, color: string, width = 1.2, head = 6, extra: Attrs = {}): string {
  const len = Math.hypot(x2 - x1, y2 - y1);
  if (len === 0) return "";
  const ux = (x2 - x1) / len;
  const uy = (y2 - y1) / len;
  const h = Math.min(head, len);
  const bx = x2 - ux * h;
  const by = y2 - uy * h;
  const half = h * 0.45;
  const tri = points([
    [x2, y2],
    [bx - uy * half, by + ux * half],
    [bx + uy * half, by - ux * half],
  ]);
  return el("g", extra, line(x1, y1, bx, by, color, width), el("polygon", { points: tri, fill: color }));
}

/**
 * A circular arc around (cx, cy) covering the angles fromDeg..toDeg (degrees, counter-clockwise
 * from +x as seen on the page), with its head at toDeg when `ccw` (a counter-clockwise couple)
 * or at fromDeg otherwise.
 */
export function arcArrow(cx: number, cy: number, r: number, fromDeg: number, toDeg: number, ccw: boolean, color: string, width = 1.4): string {
  const at = (deg: number): [number, number] => [cx + r * Math.cos((deg * Math.PI) / 180), cy - r * Math.sin((deg * Math.PI) / 180)];
  const spanDeg = (((toDeg - fromDeg) % 360) + 360) % 360;
  const [startDeg, endDeg] = ccw ? [fromDeg, toDeg] : [toDeg, fromDeg];
  const [sx, sy] = at(startDeg);
  const [ex, ey] = at(endDeg);
  // On the page y grows downward: a counter-clockwise turn is SVG sweep-flag 0.
  const d = `M${num(sx)},${num(sy)} A${num(r)},${num(r)} 0 ${spanDeg > 180 ? 1 : 0} ${ccw ? 0 : 1} ${num(ex)},${num(ey)}`;
  // Unit tangent at the head, in the direction of travel.
  const rad = (endDeg * Math.PI) / 180;
  const sign = ccw ? 1 : -1;
  const tx = -Math.sin(rad) * sign;
  const ty = -Math.cos(rad) * sign;
  const head = 5.5;
  const half = head * 0.45;
  const bx = ex - tx * head * 0.6;
  const by = ey - ty * head * 0.6;
  const tri = points([
    [bx + tx * head, by + ty * head],
    [bx - ty * half, by + tx * half],
    [bx + ty * half, by - tx * half],
  ]);
  return el("path", { d, fill: "none", stroke: color, "stroke-width": width }) + el("polygon", { points: tri, fill: color });
}

/**
 * Wrap drawn content in a self-contained SVG document that scales to its container's width.
 * @param widthUnits - viewBox width (drawing units)
 * @param heightUnits - viewBox height (drawing units)
 * @param title - accessible title, escaped
 * @param body - the drawing's markup
 * @param extra - further attributes on the root (data-*)
 */
export function svgDocument(widthUnits: number, heightUnits: number, title: string, body: string, extra: Attrs = {}): string {
  const attrs = attrText({
    xmlns: "http://www.w3.org/2000/svg",
    viewBox: `0 0 ${num(widthUnits)} ${num(heightUnits)}`,
    width: "100%",
    role: "img",
    "font-family": FONT_FAMILY,
    ...extra,
  });
  return `<svg${attrs}><title>${escapeXml(title)}</title>${el("rect", { x: 0, y: 0, width: widthUnits, height: heightUnits, fill: PALETTE.paper })}${body}</svg>`;
}

/** Translate a group of markup by (dx, dy). */
export function translate(dx: number, dy: number, body: string, extra: Attrs = {}): string {
  return el("g", { transform: `translate(${num(dx)},${num(dy)})`, ...extra }, body);
}
