/**
 * The load path of one member as a compact tree: what it carries above it (each member that
 * delivers a reaction to it, and what those carry, up to the deck zones), the member itself,
 * and below it where its reactions go (down to the foundations). Edges carry the force passed
 * along them, printed in a right-hand column on the row of the edge's far end.
 */
import { truncate } from "./escape";
import { formatLength, formatValue } from "./format";
import { SHEET_WIDTH } from "./frame";
import { wrapText } from "./labels";
import type { LoadPathBranch, LoadPathTree } from "./load-path-types";
import { textWidth } from "./metrics";
import { REVIEW_NOTICE } from "./notice";
import { arrow, el, FONT, line, PALETTE, svgDocument, text } from "./svg";

const PITCH = 21;
const PILL_H = 15;
const INDENT = 14;
const LEFT = 8;
const RIGHT = SHEET_WIDTH - 4;
/** Most rows drawn on each side of the member; deeper levels are summarised beyond that. */
export const MAX_ROWS_PER_SIDE = 40;
/** Levels never followed further, whatever the tree holds (guards against a cyclic object). */
const HARD_DEPTH = 24;

type Side = "up" | "down" | "centre" | "header" | "more";

interface Row {
  readonly side: Side;
  readonly depth: number;
  readonly branch?: LoadPathBranch;
  /** Rows beyond the limit summarised on this row. */
  readonly hidden: number;
  parent: number;
  readonly text?: string;
}

function countNodes(bs: readonly LoadPathBranch[], maxDepth: number, depth = 1): number {
  if (depth > maxDepth || depth > HARD_DEPTH) return 0;
  return bs.reduce((n, b) => n + 1 + countNodes(b.children, maxDepth, depth + 1), 0);
}

/** Deepest level that keeps the side within the row limit (0 when even level 1 is too many). */
function depthLimit(bs: readonly LoadPathBranch[], limit: number): number {
  let d = 0;
  while (countNodes(bs, d + 1) <= limit && countNodes(bs, d + 1) > countNodes(bs, d)) d++;
  return d;
}

function addUp(rows: Row[], b: LoadPathBranch, depth: number, maxDepth: number): number {
  const kids = depth < maxDepth ? b.children.map((c) => addUp(rows, c, depth + 1, maxDepth)) : [];
  const hidden = depth < maxDepth ? 0 : countNodes(b.children, Number.POSITIVE_INFINITY);
  rows.push({ side: "up", depth, branch: b, hidden, parent: -1 });
  const me = rows.length - 1;
  for (const k of kids) (rows[k] as Row).parent = me;
  return me;
}

function addDown(rows: Row[], b: LoadPathBranch, depth: number, maxDepth: number, parent: number): void {
  const hidden = depth < maxDepth ? 0 : countNodes(b.children, Number.POSITIVE_INFINITY);
  rows.push({ side: "down", depth, branch: b, hidden, parent });
  const me = rows.length - 1;
  if (depth < maxDepth) for (const c of b.children) addDown(rows, c, depth + 1, maxDepth, me);
}

/** Level-1 branches beyond the limit when even one level is too many. */
function firstLevel(bs: readonly LoadPathBranch[]): { shown: readonly LoadPathBranch[]; more: number } {
  if (bs.length <= MAX_ROWS_PER_SIDE) return { shown: bs, more: 0 };
  const shown = bs.slice(0, MAX_ROWS_PER_SIDE - 1);
  return { shown, more: countNodes(bs.slice(MAX_ROWS_PER_SIDE - 1), Number.POSITIVE_INFINITY) };
}

function buildRows(tree: LoadPathTree): Row[] {
  const rows: Row[] = [];
  const up = firstLevel(tree.upstream);
  const upDepth = Math.max(1, depthLimit(up.shown, MAX_ROWS_PER_SIDE));
  if (tree.upstream.length > 0) rows.push({ side: "header", depth: 0, hidden: 0, parent: -1, text: "CARRIES" });
  if (up.more > 0) rows.push({ side: "more", depth: 1, hidden: up.more, parent: -1 });
  const upTops = up.shown.map((b) => addUp(rows, b, 1, upDepth));
  rows.push({ side: "centre", depth: 0, hidden: 0, parent: -1 });
  const centre = rows.length - 1;
  for (const k of upTops) (rows[k] as Row).parent = centre;
  const down = firstLevel(tree.downstream);
  const downDepth = Math.max(1, depthLimit(down.shown, MAX_ROWS_PER_SIDE));
  if (tree.downstream.length > 0) rows.push({ side: "header", depth: 0, hidden: 0, parent: -1, text: "DELIVERS TO" });
  for (const b of down.shown) addDown(rows, b, 1, downDepth, centre);
  if (down.more > 0) rows.push({ side: "more", depth: 1, hidden: down.more, parent: -1 });
  return rows;
}

function pillX(depth: number): number {
  return LEFT + depth * INDENT;
}

function edgeText(b: LoadPathBranch, tree: LoadPathTree): string {
  const parts: string[] = [];
  if (b.value !== undefined && Number.isFinite(b.value)) parts.push(`${formatValue(b.value)} ${b.unit ?? tree.units.force}`);
  if (b.at !== undefined && Number.isFinite(b.at)) parts.push(`@ ${formatLength(b.at)} ${tree.units.length}`);
  if (b.note !== undefined && b.note.trim() !== "") parts.push(truncate(b.note, 18));
  return parts.join(" \u00B7 ").replace(" \u00B7 @", " @");
}

function pillShape(memberType: string, x: number, y: number, w: number, h: number, centre: boolean): string {
  const t = memberType.trim().toLowerCase();
  const square = t === "column" || t === "wall" || t === "foundation";
  return el("rect", {
    x,
    y: y - h / 2,
    width: w,
    height: h,
    rx: square ? 1.5 : h / 2,
    fill: centre ? PALETTE.fill : PALETTE.paper,
    stroke: PALETTE.ink,
    "stroke-width": centre ? 1.6 : t === "foundation" ? 1.8 : 1,
    "stroke-dasharray": t === "zone" ? "3 2" : undefined,
  });
}

/** Mark and type inside a pill that fits in `room`; the mark is shortened when needed. */
function pill(mark: string, memberType: string, x: number, y: number, room: number, centre: boolean): { body: string; x1: number } {
  const size = centre ? FONT.title : FONT.label;
  const h = centre ? PILL_H + 4 : PILL_H;
  const type = truncate(memberType, 12);
  let m = truncate(mark, 24);
  const widthOf = (s: string): number => 12 + textWidth(s, size, true) + (type === "" ? 0 : 5 + textWidth(type, FONT.small));
  for (let n = Array.from(m).length; n > 2 && widthOf(m) > room; n--) m = truncate(mark, n - 1);
  const w = widthOf(m);
  const base = y + size * 0.35;
  let body = pillShape(memberType, x, y, w, h, centre) + text(x + 6, base, m, { size, bold: true }, { "data-role": "path-mark" });
  if (type !== "") body += text(x + 11 + textWidth(m, size, true), base, type, { size: FONT.small, fill: PALETTE.muted });
  return { body, x1: x + w };
}

function rowMarkup(row: Row, y: number, tree: LoadPathTree): string {
  if (row.side === "header") return text(LEFT + 14, y + 4, row.text ?? "", { size: FONT.small, bold: true, fill: PALETTE.muted });
  if (row.side === "more") return text(pillX(row.depth), y + 4, `\u2026 ${row.hidden} more not shown`, { size: FONT.small, fill: PALETTE.muted, italic: true });
  if (row.side === "centre") return el("g", { "data-role": "path-centre" }, pill(tree.mark, tree.memberType, LEFT, y, RIGHT - LEFT, true).body);
  const b = row.branch as LoadPathBranch;
  const colour = row.side === "up" ? PALETTE.load : PALETTE.reaction;
  const edge = edgeText(b, tree) + (row.hidden > 0 ? ` (+${row.hidden})` : "");
  const ew = textWidth(edge, FONT.small);
  const x = pillX(row.depth);
  const p = pill(b.mark, b.memberType, x, y, Math.max(40, RIGHT - ew - 10 - x), false);
  let body = p.body;
  if (edge !== "") {
    if (RIGHT - ew - 4 - p.x1 > 6) body += line(p.x1 + 3, y, RIGHT - ew - 3, y, PALETTE.guide, 0.8, { "stroke-dasharray": "1 2.5" });
    body += text(RIGHT, y + FONT.small * 0.35, edge, { size: FONT.small, anchor: "end", fill: colour }, { "data-role": "edge-value", "data-value": b.value, "data-at": b.at });
  }
  return el("g", { "data-role": "path-node", "data-side": row.side, "data-depth": row.depth }, body);
}

function connectors(rows: readonly Row[], yOf: (i: number) => number): string {
  let out = "";
  rows.forEach((parentRow, p) => {
    const tx = pillX(parentRow.depth) + 7;
    const half = (parentRow.side === "centre" ? PILL_H + 4 : PILL_H) / 2;
    for (const side of ["up", "down"] as const) {
      const kids = rows.map((r, i) => (r.parent === p && r.side === side ? i : -1)).filter((i) => i >= 0);
      if (kids.length === 0) continue;
      const ys = kids.map(yOf);
      // Upstream: loads flow down the trunk into the parent. Downstream: out along each short branch line.
      if (side === "up") out += arrow(tx, Math.min(...ys), tx, yOf(p) - half, PALETTE.load, 1, 5);
      else out += line(tx, yOf(p) + half, tx, Math.max(...ys), PALETTE.reaction, 1);
      for (const k of kids) {
        const x1 = pillX((rows[k] as Row).depth);
        out += side === "up" ? line(tx, yOf(k), x1, yOf(k), PALETTE.load, 1) : arrow(tx, yOf(k), x1, yOf(k), PALETTE.reaction, 1, 4.5);
      }
    }
  });
  return out;
}

/**
 * Draw the load path of one member: what it carries (upstream), the member, where its
 * reactions go (downstream), with the force on every edge. Large trees are cut to
 * {@link MAX_ROWS_PER_SIDE} rows per side, deepest levels first, with the count left out shown.
 * @param tree - the member and its two trees (see load-path-types.ts for how to fill them)
 * @returns a self-contained SVG document (viewBox 320 wide, width 100%; no scripts, no links)
 */
export function renderLoadPath(tree: LoadPathTree): string {
  const title = text(4, 13, `Load path of ${truncate(tree.mark, 24)}`, { size: FONT.title, bold: true });
  const subParts = [tree.caseLabel ? `Case ${truncate(tree.caseLabel, 30)}` : "", tree.level ? `Level ${truncate(tree.level, 16)}` : "", `forces in ${tree.units.force}`].filter((s) => s !== "");
  const sub = wrapText(subParts.join(" \u00B7 "), RIGHT - 4, FONT.small);
  let body = title + sub.map((s, i) => text(4, 27 + i * 12, s, { size: FONT.small, fill: PALETTE.muted })).join("");
  const rows = buildRows(tree);
  const top = 27 + sub.length * 12 + 4;
  const yOf = (i: number): number => top + i * PITCH + PITCH / 2;
  body += connectors(rows, yOf);
  body += rows.map((r, i) => rowMarkup(r, yOf(i), tree)).join("");
  const noteY = top + rows.length * PITCH + 14;
  body += text(4, noteY, REVIEW_NOTICE, { size: FONT.small, fill: PALETTE.muted }, { "data-role": "notice" });
  return svgDocument(SHEET_WIDTH, noteY + 6, `Load path of ${tree.mark}`, body, { "data-role": "load-path" });
}
