/**
 * The takedown order: levels from the roof down, and within a level joists, beams, girders, then
 * the columns and walls that hold them; foundations and walls that end the path last. The order always puts a member after
 * every member it carries (graph.ts); these preferences only settle the rest.
 */
import { a1 } from "./a1";
import { sortGraph, type Edge } from "./graph";
import { endsPath, type Member, type MemberType, type TakedownModel } from "./model";
import type { Problem } from "./types";
import type { Delivery } from "./validate";

/** Rank of each type within a level. */
const TYPE_RANK: Readonly<Record<MemberType, number>> = { joist: 0, beam: 1, girder: 2, column: 3, wall: 4, foundation: 5 };

/**
 * Height suggested by a level's name: roof at the top, the number in the name otherwise
 * ("Level 3" -> 3, "L2" -> 2, "B1" -> -1 for a basement, "Ground" -> 0); NaN when the name says nothing.
 * @param level - the level as typed
 */
export function levelHeightHint(level: string): number {
  const t = level.trim().toLowerCase();
  if (/\b(roof|rf|top)\b/.test(t) || t === "r") return Number.POSITIVE_INFINITY;
  const basement = /^(b|basement\s*|p)(\d+)$/.exec(t.replace(/\s+/g, ""));
  if (basement) return -Number(basement[2]);
  const n = /-?\d+(\.\d+)?/.exec(t);
  if (n) return Number(n[0]);
  if (/\b(ground|grade|gf|g)\b/.test(t)) return 0;
  return Number.NaN;
}

/**
 * Levels from the top down. A member at level A that rests on a member at level B puts A above B;
 * where the path says nothing, a level's name decides (roof first, then higher numbers), then
 * the order levels first appear in the Members table.
 * @param members - all members (first appearance order)
 * @param deliveries - who rests on whom
 */
export function levelsTopDown(members: readonly Member[], deliveries: readonly Delivery[]): string[] {
  const levels: string[] = [];
  const position = new Map<string, number>();
  for (const m of members) {
    if (!m.valid || endsPath(m) || position.has(m.level)) continue;
    position.set(m.level, levels.length);
    levels.push(m.level);
  }
  const edges: Edge[] = [];
  const seen = new Set<string>();
  for (const d of deliveries) {
    const a = position.get(members[d.from]!.level);
    const b = position.get(members[d.to]!.level);
    if (a === undefined || b === undefined || a === b || levels[a] === "" || levels[b] === "") continue;
    const key = `${a}>${b}`;
    if (seen.has(key)) continue;
    seen.add(key);
    edges.push({ from: a, to: b, id: edges.length });
  }
  const hint = levels.map(levelHeightHint);
  const byName = (a: number, b: number): number => {
    const ha = hint[a]!;
    const hb = hint[b]!;
    if (!Number.isNaN(ha) && !Number.isNaN(hb) && ha !== hb) return hb - ha;
    if (Number.isNaN(ha) !== Number.isNaN(hb)) return Number.isNaN(ha) ? 1 : -1;
    return a - b;
  };
  const sorted = sortGraph(levels.length, edges, () => true, byName);
  const rest = sorted.cycles.map((c) => c.node).sort(byName);
  return [...sorted.order, ...rest].map((i) => levels[i]!);
}

/** The takedown order and the cycle problems. */
export interface TakedownOrder {
  /** Member indices in takedown order (members left out by problems or cycles are not in it). */
  readonly order: readonly number[];
  /** Levels from the top down. */
  readonly levels: readonly string[];
  /** Members on a cycle (left out of the order). */
  readonly cyclic: ReadonlySet<number>;
  readonly problems: readonly Problem[];
}

/**
 * Order the valid members of the model.
 * @param model - the takedown model
 * @param deliveries - the checked deliveries (validate.ts)
 * @returns the order, the levels top-down, and one problem per member on a cycle, with its path
 */
export function orderTakedown(model: TakedownModel, deliveries: readonly Delivery[]): TakedownOrder {
  const members = model.members;
  const levels = levelsTopDown(members, deliveries);
  const levelRank = new Map(levels.map((l, i) => [l, i]));
  const edges: Edge[] = deliveries.map((d, id) => ({ from: d.from, to: d.to, id }));
  const before = (a: number, b: number): number => {
    const ma = members[a]!;
    const mb = members[b]!;
    // Members that end the path last: they carry nothing onward, so they stay together at the end.
    const ta = endsPath(ma) ? 1 : 0;
    const tb = endsPath(mb) ? 1 : 0;
    if (ta !== tb) return ta - tb;
    const la = ta ? 0 : (levelRank.get(ma.level) ?? levels.length);
    const lb = tb ? 0 : (levelRank.get(mb.level) ?? levels.length);
    if (la !== lb) return la - lb;
    const ra = TYPE_RANK[ma.type];
    const rb = TYPE_RANK[mb.type];
    return ra !== rb ? ra - rb : a - b;
  };
  const sorted = sortGraph(members.length, edges, (i) => members[i]!.valid, before);
  const problems: Problem[] = sorted.cycles.map(({ node, cycle }) => {
    const m = members[node]!;
    const path = [...cycle.nodes, cycle.nodes[0]!].map((i) => members[i]!.mark).join(" -> ");
    const first = cycle.nodes.indexOf(node);
    const cell = deliveries[cycle.edges[first >= 0 ? first : 0]!]?.supportCell ?? m.markCell;
    return { code: "cycle", message: `${m.mark} is on a load path cycle: ${path}. Members on the cycle are left out.`, sheet: cell.sheet, cell: a1(cell.row, cell.col), mark: m.mark };
  });
  return { order: sorted.order, levels, cyclic: new Set(sorted.cycles.map((c) => c.node)), problems };
}
