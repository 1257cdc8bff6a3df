/**
 * A uniform grid of buckets over segments' bounding boxes, so that "which members pass near this
 * point or box" costs the few members nearby instead of every member of the level.
 */
import type { Point } from "./types";

/** Segments bucketed by the grid cells their bounding box (grown by a margin) covers. */
export class SegmentGrid<T extends { readonly p1: Point; readonly p2: Point }> {
  private readonly cells = new Map<string, T[]>();
  private readonly size: number;

  /**
   * @param items - the segments (ft or m)
   * @param margin - grown bounding boxes by this (ft or m), the snapping tolerance
   */
  constructor(items: readonly T[], private readonly margin: number) {
    const mean = items.reduce((s, m) => s + Math.hypot(m.p2.x - m.p1.x, m.p2.y - m.p1.y), 0) / Math.max(1, items.length);
    this.size = Math.max(mean, 100 * margin, 1e-9);
    for (const m of items) {
      for (const k of this.keys(Math.min(m.p1.x, m.p2.x) - margin, Math.min(m.p1.y, m.p2.y) - margin, Math.max(m.p1.x, m.p2.x) + margin, Math.max(m.p1.y, m.p2.y) + margin)) {
        const list = this.cells.get(k);
        if (list) list.push(m);
        else this.cells.set(k, [m]);
      }
    }
  }

  private *keys(x0: number, y0: number, x1: number, y1: number): Generator<string> {
    const s = this.size;
    for (let i = Math.floor(x0 / s); i <= Math.floor(x1 / s); i++) for (let j = Math.floor(y0 / s); j <= Math.floor(y1 / s); j++) yield `${i},${j}`;
  }

  /** Segments whose grown box may hold the point. */
  near(p: Point): readonly T[] {
    return this.cells.get(`${Math.floor(p.x / this.size)},${Math.floor(p.y / this.size)}`) ?? [];
  }

  /** Segments whose grown box may meet the box, each once, in their input order. */
  inBox(x0: number, y0: number, x1: number, y1: number): T[] {
    const seen = new Set<T>();
    for (const k of this.keys(x0 - this.margin, y0 - this.margin, x1 + this.margin, y1 + this.margin)) for (const m of this.cells.get(k) ?? []) seen.add(m);
    return [...seen];
  }
}
