/**
 * Two-way rectangular panels by 45-degree lines from the corners: each short side (Lx) carries a
 * triangle (total q·Lx²/4), each long side (Ly) a trapezoid (total q·(Lx·Ly/2 − Lx²/4)). Only a
 * rectangle with members along every side (one, or several end to end) is taken; anything else is
 * reported, not guessed.
 */
import { dist, project } from "./geometry";
import type { DeckMember } from "./oneway";
import type { PlanDeck, TributaryPiece, TributaryRegion } from "./types";

/** Pieces per member mark, or the reason the panel is not a two-way rectangle bounded by members. */
export type TwoWayResult = { readonly ok: true; readonly pieces: ReadonlyMap<string, TributaryPiece[]>; readonly regions: readonly TributaryRegion[] } | { readonly ok: false; readonly message: string };

/**
 * Loads of one two-way panel on its four bounding members.
 * @param deck - the panel (4 corners, counter-clockwise)
 * @param members - the spanning members of its level (snapped), sorted by mark
 * @param tol - snapping tolerance (ft or m)
 */
export function twoWayPanel(deck: PlanDeck, members: readonly DeckMember[], tol: number): TwoWayResult {
  const p = deck.corners;
  if (p.length !== 4) return { ok: false, message: `has ${p.length} corners; a two-way panel is a rectangle` };
  for (let i = 0; i < 4; i++) {
    const a = p[(i + 3) % 4]!, b = p[i]!, c = p[(i + 1) % 4]!;
    const dot = ((a.x - b.x) * (c.x - b.x) + (a.y - b.y) * (c.y - b.y)) / dist(a, b);
    if (Math.abs(dot) > tol) return { ok: false, message: "is not a rectangle (a corner is not square)" };
  }
  const lx = Math.min(dist(p[0]!, p[1]!), dist(p[1]!, p[2]!));
  const h = lx / 2;
  const pieces = new Map<string, TributaryPiece[]>();
  const regions: TributaryRegion[] = [];
  for (let i = 0; i < 4; i++) {
    const a = p[i]!, b = p[(i + 1) % 4]!;
    const ls = dist(a, b);
    // the panel lies to the left of a -> b (counter-clockwise corners): inward unit normal
    const nx = -(b.y - a.y) / ls, ny = (b.x - a.x) / ls;
    const onSide = (t: number, w: number): { x: number; y: number } => ({ x: a.x + ((b.x - a.x) * t) / ls + nx * w, y: a.y + ((b.y - a.y) * t) / ls + ny * w });
    // members along the side (both ends within tol of its line), as intervals along the side from a
    const along: { m: DeckMember; s0: number; s1: number }[] = [];
    for (const m of members) {
      const q1 = project(m.p1, a, b);
      const q2 = project(m.p2, a, b);
      if (q1.off > tol || q2.off > tol) continue;
      const s0 = Math.max(0, Math.min(q1.along, q2.along));
      const s1 = Math.min(ls, Math.max(q1.along, q2.along));
      if (s1 - s0 > tol) along.push({ m, s0, s1 });
    }
    along.sort((x, y) => x.s0 - y.s0);
    let covered = 0;
    for (const x of along) if (x.s0 <= covered + tol) covered = Math.max(covered, x.s1);
    if (covered < ls - tol) return { ok: false, message: `has no member along its side from (${a.x}, ${a.y}) to (${b.x}, ${b.y})${covered > 0 ? ` beyond ${covered} from its start` : ""}` };
    // width along the side from a: 0 -> h over [0, h], h over [h, ls - h], h -> 0 over [ls - h, ls]
    const shape: [number, number, number, number][] = ls - lx <= 0 ? [[0, h, 0, h], [h, ls, h, 0]] : [[0, h, 0, h], [h, ls - h, h, h], [ls - h, ls, h, 0]];
    let from = 0;
    for (const x of along) {
      // each part of the side goes to the first member (by position) that covers it
      const lo = Math.max(from, x.s0), hi = x.s1;
      if (hi - lo <= 0) continue;
      from = hi;
      const sa = project(a, x.m.p1, x.m.p2).along;
      const dir = project(b, x.m.p1, x.m.p2).along >= sa ? 1 : -1;
      const list = pieces.get(x.m.mark) ?? [];
      for (const [s0, s1, w0, w1] of shape) {
        const c0 = Math.max(s0, lo), c1 = Math.min(s1, hi);
        if (c1 - c0 <= 0) continue;
        const wAt = (t: number): number => w0 + ((w1 - w0) * (t - s0)) / (s1 - s0);
        const f = sa + dir * c0, t = sa + dir * c1;
        regions.push({ mark: x.m.mark, zone: deck.zone, area: deck.area, polygon: [onSide(c0, 0), onSide(c1, 0), onSide(c1, wAt(c1)), onSide(c0, wAt(c0))] });
        list.push(dir > 0 ? { zone: deck.zone, area: deck.area, from: f, to: t, width: wAt(c0), endWidth: wAt(c1) } : { zone: deck.zone, area: deck.area, from: t, to: f, width: wAt(c1), endWidth: wAt(c0) });
      }
      pieces.set(x.m.mark, list);
    }
  }
  return { ok: true, pieces, regions };
}
