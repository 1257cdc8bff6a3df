/**
 * Small exact plan geometry: orientation, segment tests and polygon checks. Orientation signs use
 * plain products of differences; callers compare lengths against the snapping tolerance, never
 * against zero, so round-off near collinearity is decided by the tolerance.
 */
import type { Point } from "./types";

/** Twice the signed area of triangle a, b, c (ft² or m²; > 0 counter-clockwise). */
export function cross(a: Point, b: Point, c: Point): number {
  return (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
}

/** Distance between two points (ft or m). */
export function dist(a: Point, b: Point): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Signed area of a polygon (ft² or m²; > 0 counter-clockwise). */
export function signedArea(poly: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < poly.length; i++) {
    const a = poly[i]!;
    const b = poly[(i + 1) % poly.length]!;
    s += a.x * b.y - b.x * a.y;
  }
  return s / 2;
}

/**
 * Position of p along segment a-b and its distance from the segment's line (ft or m).
 * @returns `along` from a (may be outside 0..length), `off` perpendicular distance, `length`
 */
export function project(p: Point, a: Point, b: Point): { along: number; off: number; length: number } {
  const length = dist(a, b);
  const ux = (b.x - a.x) / length;
  const uy = (b.y - a.y) / length;
  const dx = p.x - a.x;
  const dy = p.y - a.y;
  return { along: dx * ux + dy * uy, off: Math.abs(dx * uy - dy * ux), length };
}

/**
 * Where segments a-b and c-d cross, as positions along each (ft or m from a and from c), or null
 * when they are parallel or do not meet.
 */
export function crossing(a: Point, b: Point, c: Point, d: Point): { s: number; t: number } | null {
  const rx = b.x - a.x;
  const ry = b.y - a.y;
  const sx = d.x - c.x;
  const sy = d.y - c.y;
  const den = rx * sy - ry * sx;
  const l1 = Math.hypot(rx, ry);
  const l2 = Math.hypot(sx, sy);
  if (Math.abs(den) <= 1e-12 * l1 * l2) return null;
  const qx = c.x - a.x;
  const qy = c.y - a.y;
  const u = (qx * sy - qy * sx) / den;
  const v = (qx * ry - qy * rx) / den;
  if (u < 0 || u > 1 || v < 0 || v > 1) return null;
  return { s: u * l1, t: v * l2 };
}

/** True when two edges of the polygon cross or touch other than at their shared corner. */
export function selfIntersects(poly: readonly Point[], tol: number): boolean {
  const n = poly.length;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (j === i + 1 || (i === 0 && j === n - 1)) continue;
      const a = poly[i]!, b = poly[(i + 1) % n]!, c = poly[j]!, d = poly[(j + 1) % n]!;
      if (crossing(a, b, c, d)) return true;
      // touching: a corner of one edge within tol of the other edge
      for (const [p, q, r] of [[a, c, d], [b, c, d], [c, a, b], [d, a, b]] as const) {
        const pr = project(p, q, r);
        if (pr.off <= tol && pr.along >= -tol && pr.along <= pr.length + tol) return true;
      }
    }
  }
  return false;
}

/** Strict inside test (even-odd) of a point against a polygon; points on an edge within tol are not inside. */
export function strictlyInside(p: Point, poly: readonly Point[], tol: number): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const a = poly[j]!, b = poly[i]!;
    const pr = project(p, a, b);
    if (pr.off <= tol && pr.along >= -tol && pr.along <= pr.length + tol) return false;
    if (a.y > p.y !== b.y > p.y && p.x < a.x + ((p.y - a.y) * (b.x - a.x)) / (b.y - a.y)) inside = !inside;
  }
  return inside;
}

/** A point strictly inside a simple polygon: the centroid of an ear (a convex corner's triangle holding no other corner). */
export function interiorPoint(poly: readonly Point[]): Point {
  const n = poly.length;
  const ccw = signedArea(poly) > 0;
  for (let i = 0; i < n; i++) {
    const a = poly[(i + n - 1) % n]!, b = poly[i]!, c = poly[(i + 1) % n]!;
    const turn = cross(a, b, c);
    if (ccw ? turn <= 0 : turn >= 0) continue;
    const tri = [a, b, c];
    if (poly.some((p) => p !== a && p !== b && p !== c && strictlyInside(p, tri, 0))) continue;
    return { x: (a.x + b.x + c.x) / 3, y: (a.y + b.y + c.y) / 3 };
  }
  return poly[0]!;
}

/**
 * Whether two simple polygons overlap with some area: two edges cross away from their ends (by
 * more than tol), or an interior point of one is strictly inside the other. Polygons that only
 * share edges or corners do not overlap.
 */
export function polygonsOverlap(a: readonly Point[], b: readonly Point[], tol: number): boolean {
  const edgesCross = a.some((p, k) =>
    b.some((q, l) => {
      const p2 = a[(k + 1) % a.length]!;
      const q2 = b[(l + 1) % b.length]!;
      const x = crossing(p, p2, q, q2);
      return x !== null && x.s > tol && x.t > tol && x.s < dist(p, p2) - tol && x.t < dist(q, q2) - tol;
    }),
  );
  return edgesCross || strictlyInside(interiorPoint(a), b, tol) || strictlyInside(interiorPoint(b), a, tol);
}
