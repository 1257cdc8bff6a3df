/**
 * One-way deck by the strip rule, exactly. In the deck's frame (u along the span, v across it),
 * the plan is cut into slabs between every v where something changes (a corner, a member end,
 * two lines crossing). Inside a slab the order along u of members and deck edges is fixed, so on
 * each strip the deck between two consecutive members splits at mid-distance, deck past the last
 * member goes to that member, and each member's share is a linear function of v: its load is
 * piecewise linear along it. Openings are cut from the strips as intervals; no polygon clipping.
 */
import type { PlanDeck, Point, TributaryPiece, TributaryRegion } from "./types";
import { crossing } from "./geometry";

/** A spanning member as the deck sees it: mark, snapped ends (ft or m). */
export interface DeckMember {
  readonly mark: string;
  readonly p1: Point;
  readonly p2: Point;
}

/** A line of the slab: u = a + b·v over its v range. */
interface Line {
  readonly a: number;
  readonly b: number;
  readonly vlo: number;
  readonly vhi: number;
}

/** A deck piece of one member, and whether some strip of the deck had no member. */
export interface OneWayResult {
  readonly pieces: ReadonlyMap<string, TributaryPiece[]>;
  /** The region of deck behind each piece, in the same order as the pieces are found. */
  readonly regions: readonly TributaryRegion[];
  readonly unsupported: boolean;
}

/** cos and sin of an angle, exact at multiples of 90 degrees. */
export function direction(theta: number): { c: number; s: number } {
  const quarter = theta / (Math.PI / 2);
  const k = Math.round(quarter);
  if (Math.abs(quarter - k) < 1e-12) {
    const m = ((k % 4) + 4) % 4;
    return [{ c: 1, s: 0 }, { c: 0, s: 1 }, { c: -1, s: 0 }, { c: 0, s: -1 }][m]!;
  }
  return { c: Math.cos(theta), s: Math.sin(theta) };
}

function lineOf(p: { u: number; v: number }, q: { u: number; v: number }): Line | null {
  if (p.v === q.v) return null;
  const b = (q.u - p.u) / (q.v - p.v);
  return { a: p.u - b * p.v, b, vlo: Math.min(p.v, q.v), vhi: Math.max(p.v, q.v) };
}

const at = (l: Line, v: number): number => l.a + l.b * v;

function edgesOf(poly: readonly Point[], toUV: (p: Point) => { u: number; v: number }): Line[] {
  const out: Line[] = [];
  for (let i = 0; i < poly.length; i++) {
    const l = lineOf(toUV(poly[i]!), toUV(poly[(i + 1) % poly.length]!));
    if (l) out.push(l);
  }
  return out;
}

/** Even-odd intervals of a polygon's edges on the strip at v: pairs of edges [lo, hi]. */
function intervals(edges: readonly Line[], v: number): [Line, Line][] {
  const hit = edges.filter((e) => e.vlo < v && v < e.vhi).sort((p, q) => at(p, v) - at(q, v));
  const out: [Line, Line][] = [];
  for (let i = 0; i + 1 < hit.length; i += 2) out.push([hit[i]!, hit[i + 1]!]);
  return out;
}

/** Intervals minus intervals on the strip at v, bounds kept as the lines they come from. */
function subtract(keep: [Line, Line][], cut: [Line, Line][], v: number): [Line, Line][] {
  let out = keep;
  for (const [clo, chi] of cut) {
    const next: [Line, Line][] = [];
    for (const [lo, hi] of out) {
      if (at(chi, v) <= at(lo, v) || at(clo, v) >= at(hi, v)) next.push([lo, hi]);
      else {
        if (at(clo, v) > at(lo, v)) next.push([lo, clo]);
        if (at(chi, v) < at(hi, v)) next.push([chi, hi]);
      }
    }
    out = next;
  }
  return out;
}

/**
 * The strip-rule loads of one one-way deck.
 * @param deck - the deck (polygon, counter-clockwise; span angle)
 * @param openings - polygons of the openings of its level
 * @param members - the spanning members of its level (snapped)
 * @param tol - snapping tolerance (ft or m): members within it of a deck edge are on it; members whose ends differ by less across the span are parallel to it
 * @returns pieces per member mark, widths in ft or m of deck per ft or m of member
 */
export function oneWayDeck(deck: PlanDeck, openings: readonly (readonly Point[])[], members: readonly DeckMember[], tol: number): OneWayResult {
  const { c, s } = direction(deck.span);
  const toUV = (p: Point): { u: number; v: number } => ({ u: p.x * c + p.y * s, v: -p.x * s + p.y * c });
  const toXY = (u: number, v: number): Point => ({ x: u * c - v * s, y: u * s + v * c });
  const regions: TributaryRegion[] = [];
  const deckEdges = edgesOf(deck.corners, toUV);
  const cuts = openings.map((o) => edgesOf(o, toUV));
  const vs = deck.corners.map((p) => toUV(p).v);
  const vmin = Math.min(...vs);
  const vmax = Math.max(...vs);
  const umin = Math.min(...deck.corners.map((p) => toUV(p).u));
  const umax = Math.max(...deck.corners.map((p) => toUV(p).u));
  const mem: { m: DeckMember; line: Line; p1: { u: number; v: number }; len: number }[] = [];
  for (const m of members) {
    const p1 = toUV(m.p1);
    const p2 = toUV(m.p2);
    if (Math.abs(p2.v - p1.v) < tol) continue; // parallel to the span: carries none of this deck
    if (Math.max(p1.v, p2.v) <= vmin || Math.min(p1.v, p2.v) >= vmax) continue;
    if (Math.max(p1.u, p2.u) < umin - tol || Math.min(p1.u, p2.u) > umax + tol) continue;
    mem.push({ m, line: lineOf(p1, p2)!, p1, len: Math.hypot(p2.u - p1.u, p2.v - p1.v) });
  }
  // events: every corner and end, and every crossing of two lines
  const events = new Set<number>([vmin, vmax, ...mem.flatMap((x) => [x.line.vlo, x.line.vhi])]);
  for (const o of openings) for (const p of o) events.add(toUV(p).v);
  const segs: [Point, Point][] = [...mem.map((x) => [x.m.p1, x.m.p2] as [Point, Point])];
  for (const poly of [deck.corners, ...openings]) for (let i = 0; i < poly.length; i++) segs.push([poly[i]!, poly[(i + 1) % poly.length]!]);
  const boxes = segs.map(([a, b]) => [Math.min(a.x, b.x), Math.max(a.x, b.x), Math.min(a.y, b.y), Math.max(a.y, b.y)] as const);
  const order = segs.map((_, i) => i).sort((i, j) => boxes[i]![0] - boxes[j]![0]);
  for (let oi = 0; oi < order.length; oi++) {
    const i = order[oi]!;
    const bi = boxes[i]!;
    for (let oj = oi + 1; oj < order.length; oj++) {
      const j = order[oj]!;
      const bj = boxes[j]!;
      if (bj[0] > bi[1]) break;
      if (bj[3] < bi[2] || bj[2] > bi[3]) continue;
      const x = crossing(segs[i]![0], segs[i]![1], segs[j]![0], segs[j]![1]);
      if (!x) continue;
      const a = segs[i]![0], b = segs[i]![1];
      const L = Math.hypot(b.x - a.x, b.y - a.y);
      events.add(toUV({ x: a.x + ((b.x - a.x) * x.s) / L, y: a.y + ((b.y - a.y) * x.s) / L }).v);
    }
  }
  const vsorted = [...events].filter((v) => v >= vmin && v <= vmax).sort((p, q) => p - q);
  const scale = Math.max(1, vmax - vmin, umax - umin);
  const pieces = new Map<string, TributaryPiece[]>();
  let unsupported = false;
  for (let k = 0; k + 1 < vsorted.length; k++) {
    const va = vsorted[k]!;
    const vb = vsorted[k + 1]!;
    if (vb - va <= 1e-12 * scale) continue;
    const vm = (va + vb) / 2;
    let strips = intervals(deckEdges, vm);
    for (const cut of cuts) strips = subtract(strips, intervals(cut, vm), vm);
    const active = mem.filter((x) => x.line.vlo < vm && vm < x.line.vhi);
    for (const [lo, hi] of strips) {
      if (at(hi, vm) - at(lo, vm) <= 1e-12 * scale) continue;
      const inside = active.filter((x) => at(x.line, vm) >= at(lo, vm) - tol && at(x.line, vm) <= at(hi, vm) + tol).sort((p, q) => at(p.line, vm) - at(q.line, vm));
      if (inside.length === 0) {
        if (vb - va >= tol) unsupported = true; // a sliver thinner than the tolerance is round-off, not a strip
        continue;
      }
      inside.forEach((x, i) => {
        const left = (v: number): number => (i === 0 ? at(lo, v) : (at(inside[i - 1]!.line, v) + at(x.line, v)) / 2);
        const right = (v: number): number => (i === inside.length - 1 ? at(hi, v) : (at(inside[i + 1]!.line, v) + at(x.line, v)) / 2);
        const dv = x.line.vhi - x.line.vlo;
        const sin = dv / x.len;
        const along = (v: number): number => (x.len * (v - x.p1.v)) / (x.p1.v === x.line.vlo ? dv : -dv);
        let from = along(va), to = along(vb);
        let w0 = (right(va) - left(va)) * sin, w1 = (right(vb) - left(vb)) * sin;
        if (from > to) {
          [from, to] = [to, from];
          [w0, w1] = [w1, w0];
        }
        const list = pieces.get(x.m.mark) ?? [];
        list.push({ zone: deck.zone, area: deck.area, from, to, width: w0, endWidth: w1 });
        pieces.set(x.m.mark, list);
        // the deck behind the piece: between left(v) and right(v) for v in [va, vb], counter-clockwise
        regions.push({ mark: x.m.mark, zone: deck.zone, area: deck.area, polygon: [toXY(left(va), va), toXY(right(va), va), toXY(right(vb), vb), toXY(left(vb), vb)] });
      });
    }
  }
  return { pieces, regions, unsupported };
}
