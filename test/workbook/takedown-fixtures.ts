/**
 * Invented buildings for the takedown tests and benchmarks, as sheets of plain values: a regular
 * multi-storey steel frame of any size (column grid, girders on the column lines, beams between
 * girders, columns stacked level by level onto footings).
 */
import type { RawCellContent } from "hyperformula";

/** Size of a generated frame. */
export interface FrameSize {
  /** Number of levels (the top one is the roof). */
  readonly levels: number;
  /** Bays in each direction. */
  readonly bays: number;
  /** Beams per bay between the girders. */
  readonly beamsPerBay: number;
  /** Bay size (ft). */
  readonly bayFt?: number;
  /** Add the Members columns E (ksi) and I (in^4) for the deflection check: beams with I, girders without (required I). */
  readonly deflection?: boolean;
}

/** Sheets of a generated frame and its member count. */
export interface Frame {
  readonly sheets: Record<string, RawCellContent[][]>;
  readonly memberCount: number;
  /** Zone names by level name. */
  readonly zoneOfLevel: Readonly<Record<string, string>>;
}

/** Members of a frame of this size. */
export function frameMemberCount(size: FrameSize): number {
  const n = size.bays;
  const perLevel = (n + 1) * n + n * n * size.beamsPerBay + (n + 1) * (n + 1);
  return size.levels * perLevel + (n + 1) * (n + 1);
}

/**
 * A regular frame (3 beams per bay, 5 to 20 levels) with at least `members` members and as few
 * more as the grid allows.
 */
export function frameOfSize(members: number): FrameSize {
  let best: FrameSize = { levels: 5, bays: 1, beamsPerBay: 3 };
  let bestCount = Number.POSITIVE_INFINITY;
  for (let bays = 1; bays <= 200; bays++) {
    for (let levels = 5; levels <= 20; levels++) {
      const size = { levels, bays, beamsPerBay: 3 };
      const count = frameMemberCount(size);
      if (count >= members && count < bestCount) {
        best = size;
        bestCount = count;
      }
    }
  }
  return best;
}

/**
 * A regular frame: girders on column lines x = i·bay spanning in y, beams spanning in x between
 * them at the quarter points of each bay, one column per grid point per level, footings below.
 * Zones: a roof zone (D, Lr, S, not reducible) and one office zone per floor (D, L, reducible).
 */
export function makeFrame(size: FrameSize): Frame {
  const bay = size.bayFt ?? 30;
  const n = size.bays;
  const k = size.beamsPerBay;
  const spacing = bay / (k + 1);
  const levelName = (lv: number): string => (lv === size.levels ? "Roof" : `L${lv}`);
  const zones: RawCellContent[][] = [["Zone", "D (psf)", "L (psf)", "Lr (psf)", "S (psf)", "Reducible"]];
  const zoneOfLevel: Record<string, string> = {};
  for (let lv = size.levels; lv >= 1; lv--) {
    const roof = lv === size.levels;
    const name = roof ? "ROOF" : `OFF${lv}`;
    zoneOfLevel[levelName(lv)] = name;
    zones.push(roof ? [name, 25, null, 20, 30, "no"] : [name, 70, 50, null, null, "yes"]);
  }
  zones.push(["CORR", 70, 100, null, null, "no"]);
  const headers: RawCellContent[] = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)"];
  const members: RawCellContent[][] = [size.deflection ? [...headers, "E (ksi)", "I (in4)"] : headers];
  // Steel, E = 29,000 ksi; an invented I for the beams, blank for the girders (their required I is reported).
  const stiffness = (type: "beam" | "girder"): RawCellContent[] => (size.deflection ? [29000, type === "beam" ? 510 : null] : []);
  const col = (i: number, j: number, lv: number): string => `C${i}.${j}-${levelName(lv)}`;
  const girder = (i: number, j: number, lv: number): string => `G${i}.${j}-${levelName(lv)}`;
  for (let lv = size.levels; lv >= 1; lv--) {
    const L = levelName(lv);
    const zone = zoneOfLevel[L]!;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        for (let t = 1; t <= k; t++) {
          const at = spacing * t;
          members.push([`B${i}.${j}.${t}-${L}`, "beam", L, bay, zone, spacing, girder(i, j, lv), at, girder(i + 1, j, lv), at, null, 35, ...stiffness("beam")]);
        }
      }
    }
    for (let i = 0; i <= n; i++) {
      for (let j = 0; j < n; j++) {
        const edge = i === 0 || i === n;
        members.push([girder(i, j, lv), "girder", L, bay, zone, edge ? 1 : null, col(i, j, lv), null, col(i, j + 1, lv), null, null, edge ? 120 : 80, ...stiffness("girder")]);
      }
    }
    for (let i = 0; i <= n; i++) {
      for (let j = 0; j <= n; j++) {
        members.push([col(i, j, lv), "column", L, 13, null, null, lv > 1 ? col(i, j, lv - 1) : `F${i}.${j}`, null, null, null, null, 50]);
      }
    }
  }
  for (let i = 0; i <= n; i++) for (let j = 0; j <= n; j++) members.push([`F${i}.${j}`, "foundation", null, null, null, null, null, null, null, null, null, null]);
  return { sheets: { Zones: zones, Members: members }, memberCount: members.length - 1, zoneOfLevel };
}
