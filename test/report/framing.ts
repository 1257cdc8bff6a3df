/**
 * A small invented framing for the report tests, with its hand statics written out here (never
 * taken from the engine): one floor bay 24 ft x 24 ft at level 2. Girders G1 (x = 0) and G2
 * (x = 24) span 24 ft between columns; beams B1 (at y = 10 ft) and B2 (at y = 18 ft) span 24 ft
 * between the girders; four columns stand on four footings.
 *
 * Loads: office zone OFF (D 50 psf, L 80 psf, reducible); B1 trib 10 ft, B2 trib 6 ft, wD 40 plf
 * on both beams, wD 60 plf on the girders; Loads table: a storage strip on B1 (line L 200 plf from
 * 0 to 12 ft, not reducible as a Loads-table live load) and a unit on B2 (point D 3000 lb at 8 ft).
 * Members may be renamed (to hostile marks) by {@link framingSheets}.
 */
import type { RawCellContent } from "hyperformula";
import { handMaxMoment, handReactions, type Patch, type Point } from "../workbook/takedown-helpers";

/** Marks of the framing, renameable. */
export interface Marks {
  readonly B1: string;
  readonly B2: string;
  readonly G1: string;
  readonly G2: string;
}

export const PLAIN_MARKS: Marks = { B1: "B1", B2: "B2", G1: "G1", G2: "G2" };

/** The Zones, Members and Loads sheets of the framing (US units). */
export function framingSheets(marks: Marks = PLAIN_MARKS, zoneName = "OFF"): Record<string, RawCellContent[][]> {
  const { B1, B2, G1, G2 } = marks;
  return {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      [zoneName, 50, 80, "yes"],
    ],
    Members: [
      ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)"],
      [B1, "beam", "2", 24, zoneName, 10, G1, 10, G2, 10, null, 40],
      [B2, "beam", "2", 24, zoneName, 6, G1, 18, G2, 18, null, 40],
      [G1, "girder", "2", 24, null, null, "C1", null, "C2", null, null, 60],
      [G2, "girder", "2", 24, null, null, "C3", null, "C4", null, null, 60],
      ["C1", "column", "2", 12, null, null, "F1", null, null, null, null, null],
      ["C2", "column", "2", 12, null, null, "F2", null, null, null, null, null],
      ["C3", "column", "2", 12, null, null, "F3", null, null, null, null, null],
      ["C4", "column", "2", 12, null, null, "F4", null, null, null, null, null],
      ["F1", "foundation", null, null, null, null, null, null, null, null, null, null],
      ["F2", "foundation", null, null, null, null, null, null, null, null, null, null],
      ["F3", "foundation", null, null, null, null, null, null, null, null, null, null],
      ["F4", "foundation", null, null, null, null, null, null, null, null, null, null],
    ],
    Loads: [
      ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"],
      [B1, "line", "L", 200, null, 0, 12],
      [B2, "point", "D", 3000, null, 8, null],
    ],
  };
}

/** Hand results of one simply supported member under one case (kip, kip-ft). */
export interface HandCase {
  readonly points: readonly Point[];
  readonly patches: readonly Patch[];
  readonly left: number;
  readonly right: number;
  /** Largest shear magnitude: the larger end reaction (downward loads only, common practice). */
  readonly vMax: number;
  readonly mMax: number;
}

function handCase(span: number, points: readonly Point[], patches: readonly Patch[]): HandCase {
  const r = handReactions(span, points, patches);
  return { points, patches, left: r.left, right: r.right, vMax: Math.max(r.left, r.right), mMax: handMaxMoment(span, points, patches) };
}

/** ASCE/SEI 7-22 Eq. 4.7-1 factor L/Lo with the 0.50 floor for one level, US (recalled from memory). */
export function handLlr(kll: number, areaFt2: number): number {
  const kllAt = kll * areaFt2;
  return kllAt < 400 ? 1 : Math.min(1, Math.max(0.5, 0.25 + 15 / Math.sqrt(kllAt)));
}

/**
 * The hand takedown of the framing. Line loads: psf x ft + plf = plf, /1000 = kip/ft. Reactions of
 * each member by moments about one support (test/workbook/takedown-helpers.ts, common practice).
 */
export function handFraming() {
  const span = 24;
  const b1 = { wD: (50 * 10 + 40) / 1000, wL: (80 * 10) / 1000, strip: 0.2 };
  const b2 = { wD: (50 * 6 + 40) / 1000, wL: (80 * 6) / 1000, unit: 3 };
  const B1 = {
    D: handCase(span, [], [{ w: b1.wD, a: 0, b: span }]),
    L: handCase(span, [], [{ w: b1.wL, a: 0, b: span }, { w: b1.strip, a: 0, b: 12 }]),
    /** Tributary area: trib x span (ft²); K_LL = 2 (interior beam, ASCE/SEI 7-22 Table 4.7-2, recalled from memory). */
    areaT: 10 * span,
    llr: handLlr(2, 10 * span),
  };
  const B2 = {
    D: handCase(span, [{ p: b2.unit, x: 8 }], [{ w: b2.wD, a: 0, b: span }]),
    L: handCase(span, [], [{ w: b2.wL, a: 0, b: span }]),
    areaT: 6 * span,
  };
  const girder = (end: "left" | "right") => ({
    D: handCase(span, [{ p: B1.D[end], x: 10 }, { p: B2.D[end], x: 18 }], [{ w: 0.06, a: 0, b: span }]),
    L: handCase(span, [{ p: B1.L[end], x: 10 }, { p: B2.L[end], x: 18 }], []),
    // A_T of a girder: the tributary areas its beams deliver (half of each beam's).
    areaT: B1.areaT / 2 + B2.areaT / 2,
  });
  const G1 = { ...girder("left"), llr: handLlr(2, B1.areaT / 2 + B2.areaT / 2) };
  const G2 = girder("right");
  // What each girder hands to its columns of tributary area (ft²) and of reducible live load (kip,
  // the zone's part: the storage strip of the Loads table is not reducible), by statics: each beam
  // end delivers half its area and half its zone live load at 10 ft (B1) and 18 ft (B2).
  const onGirder = (b1: number, b2: number) => handReactions(span, [{ p: b1, x: 10 }, { p: b2, x: 18 }]);
  const areaT = onGirder(B1.areaT / 2, B2.areaT / 2);
  const reducible = onGirder((b1.wL * span) / 2, (b2.wL * span) / 2);
  // Columns carry one girder end each (one floor; K_LL = 4, interior column, Table 4.7-2, recalled
  // from memory); a footing carries one column. Reduced live: the non-reducible part as is, the
  // reducible part times L/Lo (ASCE/SEI 7-22 Sec. 4.7).
  const column = (D: number, L: number, at: number, lred: number) => {
    const llr = handLlr(4, at);
    return { D, L, areaT: at, kllAt: 4 * at, llr, reducedLive: L - (1 - llr) * lred };
  };
  const columns = {
    C1: column(G1.D.left, G1.L.left, areaT.left, reducible.left),
    C2: column(G1.D.right, G1.L.right, areaT.right, reducible.right),
    C3: column(G2.D.left, G2.L.left, areaT.left, reducible.left),
    C4: column(G2.D.right, G2.L.right, areaT.right, reducible.right),
  };
  const applied = {
    D: b1.wD * span + b2.wD * span + b2.unit + 2 * 0.06 * span,
    L: b1.wL * span + b1.strip * 12 + b2.wL * span,
  };
  return { span, b1, b2, B1, B2, G1, G2, columns, applied };
}
