/**
 * The derivation: a read plan -> member rows in the shape of the Members table, bearings where a
 * member crosses one of higher rank, tributary pieces per member, and problems with their cells.
 * Pure and independent of row order: points are snapped into nodes first and every list is
 * processed sorted by mark.
 */
import { a1 } from "../a1";
import type { CellRef, UnitSystem } from "../takedown/types";
import { crossing, dist, polygonsOverlap, project } from "./geometry";
import { oneWayDeck, type DeckMember } from "./oneway";
import { readPlan, type PlanReadings, type PlanTables } from "./read";
import { snapPoints } from "./snap";
import { SegmentGrid } from "./spatial";
import { twoWayPanel } from "./twoway";
import { RANK, type Derivation, type DerivedBearing, type DerivedMember, type DeriveOptions, type FramingProblem, type FramingProblemCode, type Plan, type PlanMember, type Point, type TributaryPiece, type TributaryRegion } from "./types";

/** Default snapping tolerance: 1/16 in in ft (US) or 1.5 mm in m (SI). */
export const DEFAULT_TOLERANCE = { US: 1 / 16 / 12, SI: 0.0015 } as const;

function problem(cell: CellRef, code: FramingProblemCode, message: string, mark?: string): FramingProblem {
  return { code, message, sheet: cell.sheet, cell: a1(cell.row, cell.col), ...(mark !== undefined ? { mark } : {}) };
}

const spanning = (m: PlanMember): boolean => m.type !== "column" && m.type !== "foundation";
const byMark = (a: { mark: string }, b: { mark: string }): number => (a.mark < b.mark ? -1 : a.mark > b.mark ? 1 : 0);
const samePoint = (a: Point, b: Point): boolean => a.x === b.x && a.y === b.y;

/** Adjacent pieces of one deck that continue each other (same slope, meeting widths) become one. */
function mergePieces(list: TributaryPiece[], len: number): TributaryPiece[] {
  list.sort((a, b) => a.from - b.from || (a.area < b.area ? -1 : a.area > b.area ? 1 : 0));
  const out: TributaryPiece[] = [];
  const eps = 1e-9 * Math.max(1, len);
  for (const p of list) {
    const q = out[out.length - 1];
    if (q && q.area === p.area && q.zone === p.zone && Math.abs(q.to - p.from) <= eps && Math.abs(q.endWidth - p.width) <= eps) {
      const s1 = (q.endWidth - q.width) / (q.to - q.from);
      const s2 = (p.endWidth - p.width) / (p.to - p.from);
      if (Math.abs(s1 - s2) <= 1e-9 * Math.max(1, Math.abs(s1), Math.abs(s2))) {
        out[out.length - 1] = { ...q, to: p.to, endWidth: p.endWidth };
        continue;
      }
    }
    out.push(p);
  }
  return out;
}

/**
 * Derive member rows, bearings and tributary pieces from a plan.
 * @param plan - the plan as read (readPlan)
 * @param options - snapping tolerance (ft or m) and unit system
 */
export function derive(plan: Plan, options: DeriveOptions = {}): Derivation {
  const tol = options.tolerance ?? DEFAULT_TOLERANCE[options.units ?? "US"];
  const problems: FramingProblem[] = [];
  const sorted = [...plan.members].sort(byMark);
  const sortedDecks = [...plan.decks].sort((a, b) => (a.area < b.area ? -1 : a.area > b.area ? 1 : 0));
  // member ends and deck corners snap together, so a deck edge on a member is on it exactly
  const nodes = snapPoints([...sorted.flatMap((m) => [m.p1, m.p2]), ...sortedDecks.flatMap((d) => d.corners)], tol);
  const snapped = sorted.map((m, i) => ({ ...m, p1: nodes[2 * i]!, p2: nodes[2 * i + 1]! }));
  let next = 2 * sorted.length;
  const snappedDecks = sortedDecks.map((d) => ({ ...d, corners: d.corners.map(() => nodes[next++]!) }));
  const levelIndex = new Map(plan.levels.map((l, i) => [l.name, i]));
  const byLevel = new Map<string, typeof snapped>();
  for (const m of snapped) {
    const list = byLevel.get(m.level) ?? [];
    list.push(m);
    byLevel.set(m.level, list);
  }
  const valid = new Set<string>();
  for (const m of snapped) {
    if (spanning(m) && samePoint(m.p1, m.p2)) problems.push(problem(m.cells.x2, "zeroLength", `${m.mark}: its two ends are one point (within ${tol}).`, m.mark));
    else valid.add(m.mark);
  }
  type Snapped = (typeof snapped)[number];
  const spanCache = new Map<string, { list: Snapped[]; grid: SegmentGrid<Snapped> }>();
  const spanIndex = (level: string): { list: Snapped[]; grid: SegmentGrid<Snapped> } => {
    let c = spanCache.get(level);
    if (!c) {
      const list = (byLevel.get(level) ?? []).filter((m) => spanning(m) && valid.has(m.mark));
      c = { list, grid: new SegmentGrid(list, tol) };
      spanCache.set(level, c);
    }
    return c;
  };
  const spanOn = (level: string): Snapped[] => spanIndex(level).list;
  const colCache = new Map<string, { list: Snapped[]; at: Map<string, Snapped> }>();
  const colIndex = (level: string): { list: Snapped[]; at: Map<string, Snapped> } => {
    let c = colCache.get(level);
    if (!c) {
      const list = (byLevel.get(level) ?? []).filter((m) => m.type === "column");
      const at = new Map<string, Snapped>();
      for (const m of list) if (!at.has(`${m.p1.x},${m.p1.y}`)) at.set(`${m.p1.x},${m.p1.y}`, m);
      c = { list, at };
      colCache.set(level, c);
    }
    return c;
  };
  const columnsOn = (level: string): Snapped[] => colIndex(level).list;
  const columnAt = (level: string, p: Point): Snapped | undefined => colIndex(level).at.get(`${p.x},${p.y}`);
  const foundations = snapped.filter((m) => m.type === "foundation");
  const allMarks = new Set(snapped.map((m) => m.mark));

  // pairs on one level: duplicate columns, collinear overlaps, crossings
  const bearings: DerivedBearing[] = [];
  for (const [level] of byLevel) {
    for (const c of columnsOn(level)) {
      const first = columnAt(level, c.p1)!;
      if (first !== c) problems.push(problem(c.cells.mark, "duplicateColumn", `Columns ${first.mark} and ${c.mark} of level ${level} stand at one point.`, c.mark));
    }
    const { list: sp, grid } = spanIndex(level);
    const order = new Map(sp.map((m, i) => [m, i]));
    for (let i = 0; i < sp.length; i++) {
      const a = sp[i]!;
      const near = grid.inBox(Math.min(a.p1.x, a.p2.x), Math.min(a.p1.y, a.p2.y), Math.max(a.p1.x, a.p2.x), Math.max(a.p1.y, a.p2.y)).filter((b) => order.get(b)! > i).sort((p, q) => order.get(p)! - order.get(q)!);
      for (const b of near) {
        if (Math.max(b.p1.x, b.p2.x) < Math.min(a.p1.x, a.p2.x) - tol || Math.min(b.p1.x, b.p2.x) > Math.max(a.p1.x, a.p2.x) + tol) continue;
        if (Math.max(b.p1.y, b.p2.y) < Math.min(a.p1.y, a.p2.y) - tol || Math.min(b.p1.y, b.p2.y) > Math.max(a.p1.y, a.p2.y) + tol) continue;
        const q1 = project(b.p1, a.p1, a.p2);
        const q2 = project(b.p2, a.p1, a.p2);
        if (q1.off <= tol && q2.off <= tol) {
          const overlap = Math.min(q1.length, Math.max(q1.along, q2.along)) - Math.max(0, Math.min(q1.along, q2.along));
          if (overlap > tol) problems.push(problem(b.cells.mark, "collinearOverlap", `${a.mark} and ${b.mark} lie on one line and overlap by ${overlap}: their load would be counted twice.`, b.mark));
          continue;
        }
        const x = crossing(a.p1, a.p2, b.p1, b.p2);
        if (!x || x.s <= tol || x.s >= q1.length - tol || x.t <= tol || x.t >= dist(b.p1, b.p2) - tol) continue;
        if (RANK[a.type] === RANK[b.type]) {
          problems.push(problem(b.cells.mark, "equalRankCrossing", `${a.mark} and ${b.mark} (both ${a.type}s) cross: which bears on which is not known; end one on the other or change a Type.`, b.mark));
          continue;
        }
        const [low, high, atLow, atHigh] = RANK[a.type] < RANK[b.type] ? [a, b, x.s, x.t] : [b, a, x.t, x.s];
        bearings.push({ mark: low.mark, support: high.mark, at: atLow, supportAt: atHigh });
      }
    }
    // a member passing over a column of its level is continuous over it
    for (const c of columnsOn(level))
      for (const m of grid.near(c.p1)) {
        const pr = project(c.p1, m.p1, m.p2);
        if (pr.off <= tol && pr.along > tol && pr.along < pr.length - tol) bearings.push({ mark: m.mark, support: c.mark, at: pr.along, supportAt: null });
      }
  }
  bearings.sort((p, q) => (p.mark < q.mark ? -1 : p.mark > q.mark ? 1 : p.at - q.at));

  /** The member of `candidates` of highest rank (above `above`) through p, ties by mark. */
  const through = (p: Point, level: string, above: number, self?: string): { mark: string; at: number } | null => {
    let best: { mark: string; at: number; rank: number } | null = null;
    for (const m of spanIndex(level).grid.near(p)) {
      if (m.mark === self || RANK[m.type] <= above) continue;
      const pr = project(p, m.p1, m.p2);
      if (pr.off > tol || pr.along < -tol || pr.along > pr.length + tol) continue;
      if (!best || RANK[m.type] > best.rank) best = { mark: m.mark, at: Math.min(pr.length, Math.max(0, pr.along)), rank: RANK[m.type] };
    }
    return best;
  };

  /**
   * A member of the same rank whose interior the end p of `m` meets at an angle (a header framing
   * into the side of a trimmer, a beam into the side of a beam): it bears on that member. Only
   * an end meeting the interior counts; two members meeting end to end, or lying on one line, do not.
   */
  const framesInto = (p: Point, m: Snapped): { mark: string; at: number } | null => {
    const len = dist(m.p1, m.p2);
    let best: { mark: string; at: number } | null = null;
    for (const o of spanIndex(m.level).grid.near(p)) {
      if (o.mark === m.mark || RANK[o.type] !== RANK[m.type]) continue;
      const pr = project(p, o.p1, o.p2);
      if (pr.off > tol || pr.along <= tol || pr.along >= pr.length - tol) continue;
      // not along the same line: the far end of m lies off the other member's line
      const far = samePoint(p, m.p1) ? m.p2 : m.p1;
      if (project(far, o.p1, o.p2).off <= tol || len <= tol) continue;
      if (!best || o.mark < best.mark) best = { mark: o.mark, at: pr.along };
    }
    return best;
  };

  const out: DerivedMember[] = [];
  const added: DerivedMember[] = [];
  const rowOf = (m: (typeof snapped)[number], span: number | null, start: { mark: string; at: number | null } | null, end: { mark: string; at: number | null } | null): DerivedMember => ({
    mark: m.mark,
    type: m.type,
    level: m.level,
    span,
    startSupport: start?.mark ?? null,
    startAt: start?.at ?? null,
    endSupport: end?.mark ?? null,
    endAt: end?.at ?? null,
    x1: m.p1.x,
    y1: m.p1.y,
    x2: m.p2.x,
    y2: m.p2.y,
    extra: m.extra,
    tributary: [],
    tributaryArea: 0,
    source: m.cells.mark,
  });
  /** What stands under a point of a level: column below, else a member of the level below (transfer), else a foundation. */
  const base = (m: (typeof snapped)[number], p: Point, cell: CellRef): { mark: string; at: number | null } => {
    const li = levelIndex.get(m.level);
    const below = li !== undefined && li > 0 ? plan.levels[li - 1]!.name : null;
    if (below !== null) {
      const col = columnAt(below, p);
      if (col) return { mark: col.mark, at: null };
      const t = through(p, below, 0);
      if (t) return t;
    }
    const f = foundations.find((c) => samePoint(c.p1, p));
    if (f) return { mark: f.mark, at: null };
    let mark = `F-${m.mark}`;
    for (let k = 2; allMarks.has(mark); k++) mark = `F-${m.mark}-${k}`; // never a mark of the Framing table
    if (!added.some((a) => a.mark === mark)) added.push({ ...rowOf({ ...m, mark, type: "foundation", p1: p, p2: p, extra: {} }, null, null, null), source: cell });
    return { mark, at: null };
  };
  for (const m of snapped) {
    if (!valid.has(m.mark) || m.type === "foundation") {
      if (m.type === "foundation") out.push(rowOf(m, null, null, null));
      continue;
    }
    if (m.type === "column") {
      const li = levelIndex.get(m.level);
      const height = li !== undefined && li > 0 ? plan.levels[li]!.elevation - plan.levels[li - 1]!.elevation : null;
      out.push(rowOf(m, height, base(m, m.p1, m.cells.mark), null));
      continue;
    }
    if (m.type === "wall") {
      const s = base(m, m.p1, m.cells.x1);
      const e = base(m, m.p2, m.cells.x2);
      out.push(rowOf(m, dist(m.p1, m.p2), s, e));
      continue;
    }
    const ends = ([[m.p1, m.cells.x1, "start"], [m.p2, m.cells.x2, "end"]] as const).map(([p, cell, which]) => {
      const col = columnAt(m.level, p);
      if (col) return { mark: col.mark, at: null };
      const t = through(p, m.level, RANK[m.type], m.mark) ?? framesInto(p, m);
      if (t) return t;
      problems.push(problem(cell, "endOnNothing", `The ${which} of ${m.mark} (${p.x}, ${p.y}) is on no column of level ${m.level} and no member of higher rank than a ${m.type}.`, m.mark));
      return null;
    });
    out.push(rowOf(m, dist(m.p1, m.p2), ends[0]!, ends[1]!));
  }

  // decks, level by level, in order of area name
  const pieces = new Map<string, TributaryPiece[]>();
  const regions: TributaryRegion[] = [];
  const decks = snappedDecks;
  const loaded = decks.filter((d) => d.kind !== "opening");
  const box = (d: (typeof loaded)[number]): [number, number, number, number] => {
    const xs = d.corners.map((p) => p.x), ys = d.corners.map((p) => p.y);
    return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
  };
  const boxes = new Map(loaded.map((d) => [d, box(d)]));
  // pairs whose boxes overlap by more than the tolerance, found by a sweep along x per level
  const sweep = [...loaded].sort((a, b) => (a.level < b.level ? -1 : a.level > b.level ? 1 : boxes.get(a)![0] - boxes.get(b)![0]));
  const pairs: [(typeof loaded)[number], (typeof loaded)[number]][] = [];
  for (let i = 0; i < sweep.length; i++)
    for (let j = i + 1; j < sweep.length; j++) {
      const a = sweep[i]!, b = sweep[j]!;
      const ba = boxes.get(a)!, bb = boxes.get(b)!;
      if (a.level !== b.level || bb[0] >= ba[2] - tol) break;
      if (bb[1] >= ba[3] - tol || bb[3] <= ba[1] + tol) continue;
      pairs.push(a.area < b.area ? [a, b] : [b, a]);
    }
  pairs.sort((p, q) => (p[0].area < q[0].area ? -1 : p[0].area > q[0].area ? 1 : p[1].area < q[1].area ? -1 : 1));
  for (const [a, b] of pairs)
    if (polygonsOverlap(a.corners, b.corners, tol)) problems.push(problem(b.cells.shape, "overlappingDecks", `Decks ${a.area} and ${b.area} of level ${a.level} overlap: their load would be counted twice.`));
  const add = (from: ReadonlyMap<string, TributaryPiece[]>): void => {
    for (const [mark, list] of from) pieces.set(mark, [...(pieces.get(mark) ?? []), ...list]);
  };
  for (const d of loaded) {
    const xs = d.corners.map((p) => p.x), ys = d.corners.map((p) => p.y);
    const members: DeckMember[] = spanIndex(d.level).grid.inBox(Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)).sort(byMark);
    const openings = decks.filter((o) => o.kind === "opening" && o.level === d.level).map((o) => o.corners);
    if (d.kind === "two-way") {
      if (openings.some((o) => polygonsOverlap(o, d.corners, tol))) {
        problems.push(problem(d.cells.shape, "badTwoWay", `Two-way deck ${d.area} has an opening in it; a two-way panel by 45-degree lines is a whole rectangle (describe the deck around the opening as one-way areas).`));
        continue;
      }
      const r = twoWayPanel(d, members, tol);
      if (r.ok) {
        add(r.pieces);
        regions.push(...r.regions);
      }
      else problems.push(problem(d.cells.shape, "badTwoWay", `Two-way deck ${d.area} ${r.message}.`));
      continue;
    }
    const r = oneWayDeck(d, openings, members, tol);
    add(r.pieces);
    regions.push(...r.regions);
    if (r.unsupported) problems.push(problem(d.cells.shape, "unsupportedDeck", `Deck ${d.area} has strips with no supporting member across them (in its span direction): that deck carries no load anywhere.`));
  }
  const members = [...out, ...added].map((m) => {
    const list = pieces.get(m.mark);
    if (!list) return m;
    const tributary = mergePieces(list, m.span ?? 1);
    const tributaryArea = tributary.reduce((s, p) => s + ((p.to - p.from) * (p.width + p.endWidth)) / 2, 0);
    return { ...m, tributary, tributaryArea };
  });
  // regions of members that are in the result (a zero-length member receives none), by mark then deck
  const kept = new Set(members.map((m) => m.mark));
  const ordered = regions.filter((r) => kept.has(r.mark)).map((r, i) => ({ r, i }));
  ordered.sort((p, q) => (p.r.mark < q.r.mark ? -1 : p.r.mark > q.r.mark ? 1 : p.i - q.i));
  return { members, bearings, problems, regions: ordered.map((o) => o.r), tolerance: tol };
}

/**
 * Read the plan tables and derive, problems of both steps together (reading first).
 * @param tables - Grids, Levels, Framing and Decks as read from the sheets
 * @param units - unit system of the lengths (ft or m); also picks the default tolerance
 * @param tolerance - snapping tolerance (ft or m); default 1/16 in (US) or 1.5 mm (SI)
 * @param readings - per table, the user's column mapping and header row
 */
export function derivePlan(tables: PlanTables, units: UnitSystem = "US", tolerance?: number, readings: PlanReadings = {}): Derivation {
  const r = readPlan(tables, units, readings);
  const d = derive(r.plan, { units, ...(tolerance !== undefined ? { tolerance } : {}) });
  return { ...d, problems: [...r.problems, ...d.problems] };
}
