/**
 * Two-way rectangular panels by 45-degree lines from the corners: each short side (Lx) carries a
 * triangle (total q·Lx²/4), each long side (Ly) a trapezoid (total q·(Lx·Ly/2 − Lx²/4)). Only a
 * rectangle with a member along every side is taken; anything else is reported, not guessed.
 */
import { dist, project } from "./geometry";
import type { DeckMember } from "./oneway";
import type { PlanDeck, TributaryPiece } from "./types";

/** Pieces per member mark, or the reason the panel is not a two-way rectangle bounded by members. */
export type TwoWayResult = { readonly ok: true; readonly pieces: ReadonlyMap<string, TributaryPiece[]> } | { readonly ok: false; readonly message: string };

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
  for (let i = 0; i < 4; i++) {
    const a = p[i]!, b = p[(i + 1) % 4]!;
    const ls = dist(a, b);
    const on = members.find((m) => {
      const pa = project(a, m.p1, m.p2);
      const pb = project(b, m.p1, m.p2);
      return pa.off <= tol && pb.off <= tol && Math.min(pa.along, pb.along) >= -tol && Math.max(pa.along, pb.along) <= pa.length + tol;
    });
    if (!on) return { ok: false, message: `has no member along its side from (${a.x}, ${a.y}) to (${b.x}, ${b.y})` };
    const sa = project(a, on.p1, on.p2).along;
    const dir = project(b, on.p1, on.p2).along >= sa ? 1 : -1;
    // width along the side from a: 0 -> h over [0, h], h over [h, ls - h], h -> 0 over [ls - h, ls]
    const shape: [number, number, number, number][] = ls - lx <= 0 ? [[0, h, 0, h], [h, ls, h, 0]] : [[0, h, 0, h], [h, ls - h, h, h], [ls - h, ls, h, 0]];
    const list = pieces.get(on.mark) ?? [];
    for (const [s0, s1, w0, w1] of shape) {
      const f = sa + dir * s0, t = sa + dir * s1;
      list.push(dir > 0 ? { zone: deck.zone, area: deck.area, from: f, to: t, width: w0, endWidth: w1 } : { zone: deck.zone, area: deck.area, from: t, to: f, width: w1, endWidth: w0 });
    }
    pieces.set(on.mark, list);
  }
  return { ok: true, pieces };
}
