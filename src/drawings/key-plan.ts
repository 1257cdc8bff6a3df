/**
 * A schematic key plan for typed member tables (no plan coordinates): one band per level, top
 * down, with the level's members as marked boxes in rows by type (joists above beams above
 * girders above walls and columns), a thin line from each member to what it bears on, and the
 * columns of a stack kept in one vertical line through the levels. It shows the load path's
 * structure, not positions: the drawing says so in its heading.
 */
import type { TakedownModel } from "../engine/takedown/model";
import { escapeXml, truncate } from "./escape";
import { textWidth } from "./metrics";
import { REVIEW_NOTICE } from "./notice";
import { el, FONT, line, PALETTE, svgDocument, text } from "./svg";

/** Member types of the typed tables. */
export type KeyPlanType = "joist" | "beam" | "girder" | "wall" | "column" | "foundation";

/** One member of the key plan: its mark, type, level and the marks it bears on. */
export interface KeyPlanMember {
  readonly mark: string;
  readonly type: KeyPlanType;
  readonly level: string;
  readonly supports: readonly string[];
}

/** What the key plan is drawn from. */
export interface KeyPlanInput {
  /** Level names, top down. */
  readonly levels: readonly string[];
  readonly members: readonly KeyPlanMember[];
}

/**
 * The key plan of a takedown model read from typed tables: every valid member (first row of a
 * mark) with what it bears on (start support, Bearings rows, end support).
 * @param model - the model as read (src/engine/takedown readModel / planTakedown)
 * @param levels - level names, top down
 */
export function keyPlanOfModel(model: Pick<TakedownModel, "members" | "bearings">, levels: readonly string[]): KeyPlanInput {
  const bearing = new Map<string, string[]>();
  for (const b of model.bearings) if (b.valid) bearing.set(b.mark, [...(bearing.get(b.mark) ?? []), b.support.mark]);
  const members = model.members
    .filter((m) => m.valid && m.firstOfMark)
    .map((m) => ({ mark: m.mark, type: m.type, level: m.level, supports: [m.start.mark, ...(bearing.get(m.mark) ?? []), m.end.mark].filter((s, i, all) => s !== "" && all.indexOf(s) === i) }));
  return { levels: levels.length > 0 ? [...levels] : [...new Set(members.map((m) => m.level))], members };
}

const ROWS: readonly KeyPlanType[] = ["joist", "beam", "girder", "wall", "column"];
const CHIP_H = 15;
const ROW_PITCH = 26;
const GAP = 6;
const LEFT = 74;
const FOUNDATIONS = "Foundations";

interface Chip {
  readonly m: KeyPlanMember;
  x: number;
  y: number;
  w: number;
}

/**
 * Draw the schematic key plan.
 * @param input - levels top down and the members with what they bear on
 * @param width - least width in drawing units (default 720); wider when a row needs it
 * @param selected - a member whose box and load path (down to the foundations) are highlighted
 */
export function renderKeyPlan(input: KeyPlanInput, width = 720, selected?: string): string {
  const byMark = new Map(input.members.map((m) => [m.mark, m]));
  // the selected member's load path: what it bears on, and what those bear on
  const path = new Set<string>();
  const queue = selected !== undefined && byMark.has(selected) ? [selected] : [];
  while (queue.length > 0) {
    for (const s of byMark.get(queue.shift()!)?.supports ?? []) {
      if (path.has(s) || s === selected) continue;
      path.add(s);
      queue.push(s);
    }
  }
  const members = [...input.members];
  // supports named but not in the table (a foundation named only as a support) get a box too
  for (const m of input.members)
    for (const s of m.supports)
      if (!byMark.has(s) && (m.type === "column" || m.type === "wall")) {
        const f: KeyPlanMember = { mark: s, type: "foundation", level: FOUNDATIONS, supports: [] };
        byMark.set(s, f);
        members.push(f);
      }
  const levels = [...input.levels.filter((l) => members.some((m) => m.level === l && m.type !== "foundation")), FOUNDATIONS];
  const levelOf = (m: KeyPlanMember): string => (m.type === "foundation" ? FOUNDATIONS : levels.includes(m.level) ? m.level : levels[0]!);
  const chipW = Math.max(40, ...members.map((m) => textWidth(truncate(m.mark, 14), FONT.small, m.type === "girder") + 10));
  const pitch = chipW + GAP;

  // column stacks: bottom up, a column on a column keeps its slot
  const slot = new Map<string, number>();
  let slots = 0;
  for (const level of [...levels].reverse()) {
    for (const m of members.filter((x) => levelOf(x) === level && (x.type === "column" || x.type === "foundation"))) {
      const below = m.supports.map((s) => slot.get(s)).find((k) => k !== undefined);
      const taken = new Set(members.filter((x) => levelOf(x) === level).map((x) => slot.get(x.mark)));
      slot.set(m.mark, below !== undefined && !taken.has(below) ? below : slots++);
    }
  }
  const W = Math.max(width, LEFT + slots * pitch + 10);
  const perLine = Math.max(1, Math.floor((W - LEFT - 10) / pitch));

  // bands top down; rows bottom up inside a band so supports are placed before what they carry
  const chips = new Map<string, Chip>();
  const bands: { level: string; y0: number; y1: number }[] = [];
  let y = 44;
  for (const level of levels) {
    const rows = level === FOUNDATIONS ? (["foundation"] as const) : ROWS;
    const rowChips: Chip[][] = [];
    for (const type of [...rows].reverse()) {
      const list = members.filter((m) => levelOf(m) === level && (m.type === type || (level !== FOUNDATIONS && type === "column" && m.type === "foundation")));
      if (list.length === 0) continue;
      const stacked = type === "column" || type === "foundation";
      const xOf = (m: KeyPlanMember): number => {
        if (stacked && slot.has(m.mark)) return LEFT + slot.get(m.mark)! * pitch;
        const known = m.supports.map((s) => chips.get(s)?.x).filter((v): v is number => v !== undefined);
        return known.length > 0 ? known.reduce((a, b) => a + b, 0) / known.length : Number.POSITIVE_INFINITY;
      };
      const sorted = list.map((m) => ({ m, x: xOf(m) })).sort((a, b) => a.x - b.x || (a.m.mark < b.m.mark ? -1 : 1));
      const lines: Chip[][] = [];
      if (stacked) lines.push(sorted.map(({ m, x }) => ({ m, x, y: 0, w: chipW })));
      else
        for (let i = 0; i < sorted.length; i += perLine) {
          const part = sorted.slice(i, i + perLine);
          // keep each box near its supports, in order, without overlaps
          let next = LEFT;
          const placed = part.map(({ m, x }) => {
            const want = Number.isFinite(x) ? x : next;
            const at = Math.max(next, Math.min(want, W - 10 - chipW - (part.length - 1 - part.findIndex((p) => p.m === m)) * pitch));
            next = at + pitch;
            return { m, x: at, y: 0, w: chipW };
          });
          lines.push(placed);
        }
      for (const l of lines) {
        for (const c of l) chips.set(c.m.mark, c); // known before the rows above are placed
        rowChips.unshift(l);
      }
    }
    const y0 = y;
    y += 10;
    for (const l of rowChips) {
      for (const c of l) {
        c.y = y;
        chips.set(c.m.mark, c);
      }
      y += ROW_PITCH;
    }
    bands.push({ level, y0, y1: y });
    y += 8;
  }

  const back: string[] = [];
  for (const [i, b] of bands.entries()) {
    back.push(el("rect", { x: 4, y: b.y0, width: W - 8, height: b.y1 - b.y0, fill: i % 2 === 0 ? "#f4f6f9" : PALETTE.paper, stroke: PALETTE.guide, "stroke-width": 0.6 }));
    back.push(text(10, b.y0 + 16, truncate(b.level === FOUNDATIONS ? "Foundations" : `Level ${b.level}`, 11), { size: FONT.small, bold: true, fill: PALETTE.muted }, { "data-role": "key-level-name" }));
  }
  const links: string[] = [];
  for (const c of chips.values())
    for (const s of c.m.supports) {
      const t = chips.get(s);
      if (!t) continue;
      const lit = (c.m.mark === selected || path.has(c.m.mark)) && path.has(s);
      links.push(line(c.x + c.w / 2, c.y + CHIP_H, t.x + t.w / 2, t.y, lit ? PALETTE.reaction : c.m.type === "column" ? PALETTE.ink : PALETTE.guide, lit ? 1.8 : c.m.type === "column" ? 1.2 : 0.8, { "data-role": "key-bears-on", "data-from": c.m.mark, "data-to": s }));
    }
  const boxes: string[] = [];
  for (const c of chips.values()) {
    const t = c.m.type;
    const dark = t === "column";
    const accent = c.m.mark === selected ? PALETTE.load : path.has(c.m.mark) ? PALETTE.reaction : undefined;
    const box = el("rect", {
      x: c.x,
      y: c.y,
      width: c.w,
      height: CHIP_H,
      rx: t === "foundation" ? 0 : 3,
      fill: accent !== undefined && dark ? accent : dark ? PALETTE.ink : c.m.mark === selected ? PALETTE.loadFill : path.has(c.m.mark) ? PALETTE.reactionFill : t === "wall" ? PALETTE.fill : PALETTE.paper,
      stroke: accent ?? PALETTE.ink,
      "stroke-width": t === "girder" ? 2 : t === "joist" ? 0.6 : 1,
      "stroke-dasharray": t === "joist" || t === "foundation" ? "3 2" : undefined,
    });
    const label = text(c.x + c.w / 2, c.y + 11, truncate(c.m.mark, 14), { size: FONT.small, anchor: "middle", bold: t === "girder", fill: dark ? PALETTE.paper : PALETTE.ink });
    const tip = `<title>${escapeXml(`${c.m.mark} (${t})${c.m.supports.length > 0 ? `: bears on ${c.m.supports.join(", ")}` : ""}`)}</title>`;
    boxes.push(el("g", { "data-role": "key-member", "data-plan-mark": c.m.mark, "data-type": t, "data-plan-level": c.m.level, "data-highlight": c.m.mark === selected ? "selected" : path.has(c.m.mark) ? "path" : undefined }, tip, box, label));
  }
  const head = text(8, 16, "Key plan (schematic): levels, members and what each bears on", { size: FONT.title, bold: true });
  const sub = text(8, 31, "Not to scale: the member tables give no positions. A line runs from each member to what it bears on.", { size: FONT.small, fill: PALETTE.muted });
  const notice = text(8, y + 10, REVIEW_NOTICE, { size: FONT.small, fill: PALETTE.muted });
  return svgDocument(W, y + 16, "Key plan (schematic) of the levels and column stacks", head + sub + back.join("") + links.join("") + boxes.join("") + notice, { "data-role": "key-plan" });
}
