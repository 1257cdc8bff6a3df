/**
 * Greedy placement of labels so that none overlaps another: each label is tried at its
 * anchor (centred, then beside it), then one step further from the baseline, and so on.
 * Labels may carry a leader (a vertical line from the label back to the baseline at the anchor)
 * that other labels must not cover either.
 */

/** An axis-aligned box in drawing units (x0 < x1, y0 < y1, y down). */
export interface Box {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/**
 * Whether two boxes overlap by more than touching.
 * @param pad - clearance kept between them, in drawing units
 */
export function overlaps(a: Box, b: Box, pad = 0): boolean {
  return a.x0 < b.x1 + pad && b.x0 < a.x1 + pad && a.y0 < b.y1 + pad && b.y0 < a.y1 + pad;
}

/** One label to place: its size and the x it belongs to. */
export interface PlaceRequest {
  readonly anchorX: number;
  readonly width: number;
  readonly height: number;
  /** Draw (and reserve) a vertical leader from the label back to the baseline at anchorX. */
  readonly leader?: boolean;
}

/** Where and how labels may go. */
export interface PlaceOptions {
  /** y of the baseline the labels grow away from. */
  readonly baseY: number;
  /** "up": labels sit above baseY; "down": below. */
  readonly direction: "up" | "down";
  /** Distance moved away from the baseline at each retry. */
  readonly step: number;
  readonly minX: number;
  readonly maxX: number;
  /** Clearance between labels (default 2). */
  readonly gap?: number;
  /** Boxes already taken (other labels, symbols). */
  readonly obstacles?: readonly Box[];
  /** Retries away from the baseline before giving up on leaders (default 60). */
  readonly maxSteps?: number;
}

/** A placed label: its box and the leader box reserved with it (if any). */
export interface Placed {
  readonly box: Box;
  readonly leader?: Box;
}

const LEADER_HALF_WIDTH = 1;

function xCandidates(anchorX: number, width: number, minX: number, maxX: number): number[] {
  const clamp = (x0: number): number => Math.min(Math.max(x0, minX), Math.max(minX, maxX - width));
  const xs = [clamp(anchorX - width / 2), clamp(anchorX + 3), clamp(anchorX - 3 - width)];
  return xs.filter((x, i) => xs.indexOf(x) === i);
}

function boxAt(req: PlaceRequest, x0: number, offset: number, o: PlaceOptions): Placed {
  const near = o.direction === "up" ? o.baseY - offset : o.baseY + offset;
  const box: Box = o.direction === "up" ? { x0, y0: near - req.height, x1: x0 + req.width, y1: near } : { x0, y0: near, x1: x0 + req.width, y1: near + req.height };
  if (!req.leader || offset === 0) return { box };
  const lx0 = req.anchorX - LEADER_HALF_WIDTH;
  const lx1 = req.anchorX + LEADER_HALF_WIDTH;
  const leader: Box = o.direction === "up" ? { x0: lx0, y0: box.y1, x1: lx1, y1: o.baseY } : { x0: lx0, y0: o.baseY, x1: lx1, y1: box.y0 };
  return { box, leader };
}

function boxesOf(p: Placed): Box[] {
  return p.leader ? [p.box, p.leader] : [p.box];
}

function clashes(candidate: Placed, taken: readonly Box[], gap: number, strictLeader: boolean): boolean {
  if (taken.some((b) => overlaps(candidate.box, b, gap))) return true;
  return strictLeader && candidate.leader !== undefined && taken.some((b) => overlaps(candidate.leader as Box, b, 0));
}

/** Every placement of a request that clashes with nothing, nearest the baseline first. */
function* strictPlacements(req: PlaceRequest, taken: readonly Box[], o: PlaceOptions): Generator<Placed> {
  const gap = o.gap ?? 2;
  const xs = xCandidates(req.anchorX, req.width, o.minX, o.maxX);
  for (let k = 0; k <= (o.maxSteps ?? 60); k++) {
    for (const x0 of xs) {
      const c = boxAt(req, x0, k * o.step, o);
      if (!clashes(c, taken, gap, true)) yield c;
    }
  }
}

function firstStrict(req: PlaceRequest, taken: readonly Box[], o: PlaceOptions): Placed | null {
  for (const p of strictPlacements(req, taken, o)) return p;
  return null;
}

/** A placement whose leader may cross other labels (used only when nothing else fits). */
function placeLoose(req: PlaceRequest, taken: readonly Box[], o: PlaceOptions): Placed {
  const gap = o.gap ?? 2;
  const maxSteps = o.maxSteps ?? 60;
  const xs = xCandidates(req.anchorX, req.width, o.minX, o.maxX);
  for (let k = 0; k <= maxSteps; k++) {
    for (const x0 of xs) {
      const c = boxAt(req, x0, k * o.step, o);
      if (!clashes(c, taken, gap, false)) return c;
    }
  }
  return boxAt(req, xs[0] ?? o.minX, (maxSteps + 1) * o.step, o);
}

function takenBoxes(o: PlaceOptions, placed: readonly (Placed | undefined)[]): Box[] {
  return [...(o.obstacles ?? []), ...placed.flatMap((p) => (p === undefined ? [] : boxesOf(p)))];
}

/**
 * When a label's leader cannot avoid an earlier label, move that earlier label aside (to a
 * place clear of this anchor) if both then fit without clashes. Returns the new placements or null.
 */
function moveAside(req: PlaceRequest, reqs: readonly PlaceRequest[], out: readonly Placed[], o: PlaceOptions): { index: number; moved: Placed; placed: Placed } | null {
  const margin = 1 + (o.gap ?? 2);
  for (let k = 0; k < out.length; k++) {
    const box = (out[k] as Placed).box;
    if (req.anchorX < box.x0 - margin || req.anchorX > box.x1 + margin) continue;
    const others = takenBoxes(o, out.map((p, i) => (i === k ? undefined : p)));
    let tries = 0;
    for (const alt of strictPlacements(reqs[k] as PlaceRequest, others, o)) {
      if (++tries > 40) break;
      if (req.anchorX >= alt.box.x0 - margin && req.anchorX <= alt.box.x1 + margin) continue;
      const placed = firstStrict(req, [...others, ...boxesOf(alt)], o);
      if (placed !== null) return { index: k, moved: alt, placed };
    }
  }
  return null;
}

/**
 * Place labels one after the other (in the order given) without overlaps. A label whose leader
 * would run through an earlier label first tries moving that label aside; only when that fails
 * does its leader cross.
 * @param requests - labels with their anchors and sizes (drawing units)
 * @param options - baseline, direction, step and horizontal bounds
 * @returns one placement per request, same order
 */
export function placeLabels(requests: readonly PlaceRequest[], options: PlaceOptions): Placed[] {
  const out: Placed[] = [];
  for (const req of requests) {
    const taken = takenBoxes(options, out);
    const strict = firstStrict(req, taken, options);
    if (strict !== null) {
      out.push(strict);
      continue;
    }
    const aside = moveAside(req, requests, out, options);
    if (aside !== null) {
      out[aside.index] = aside.moved;
      out.push(aside.placed);
      continue;
    }
    out.push(placeLoose(req, taken, options));
  }
  return out;
}
