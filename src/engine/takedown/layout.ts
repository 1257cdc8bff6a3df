/**
 * Columns of the generated takedown sheet. Loads are carried through the takedown in channels:
 * one per load case present, plus "L red." (the part of L on reducible zones) when some live load
 * is not reducible, and "A_T" (1 per unit area on reducible zones: its reaction is the
 * tributary area for live load reduction, docs/interface.md section 2).
 */
import { RESULT_UNITS } from "./units";
import type { LoadCase, UnitSystem } from "./types";

/** A quantity carried down the load path. */
export type ChannelKey = LoadCase | "Lred" | "AT";

/** One carried quantity and how it is shown. */
export interface Channel {
  readonly key: ChannelKey;
  /** Short label in headers ("D", "L red.", "A_T"). */
  readonly label: string;
  /** True for the load cases (shears, moments and the balance are given for them). */
  readonly isCase: boolean;
  /** Unit of the magnitudes (line/force) and of the reactions. */
  readonly lineUnit: string;
  readonly forceUnit: string;
}

/** Fixed columns on the left of the member rows. */
export const COL = {
  mark: 0,
  type: 1,
  level: 2,
  length: 3,
  supports: 4,
  kind: 5,
  source: 6,
  width: 7,
  from: 8,
  to: 9,
  loaded: 10,
} as const;

/** Columns of one channel's loads block: kind | magnitude | from | to. */
export const BLOCK_WIDTH = 4;

/**
 * Columns of one channel's loads block when some load varies linearly (a Loads row with End width
 * or End magnitude): kind | magnitude | from | to | end magnitude.
 */
export const TRAPEZOID_BLOCK_WIDTH = 5;

/** Every column position of the sheet for a set of channels. */
export interface Layout {
  readonly units: UnitSystem;
  readonly channels: readonly Channel[];
  /** Channels that are load cases. */
  readonly cases: readonly Channel[];
  /** First column of each channel's loads block (kind); magnitude is +1, from +2, to +3, end magnitude +4 when the block has it. */
  readonly block: readonly number[];
  /** Columns of each loads block: {@link BLOCK_WIDTH}, or {@link TRAPEZOID_BLOCK_WIDTH} when some load varies linearly. */
  readonly blockWidth: number;
  /** Reaction at the first and second support, per channel. */
  readonly r1: readonly number[];
  readonly r2: readonly number[];
  /** Largest shear and moment per load case (index into `cases`). */
  readonly vMax: readonly number[];
  readonly mMax: readonly number[];
  /** Loads arriving at a column or support, and its running total, per channel. */
  readonly arriving: readonly number[];
  readonly total: readonly number[];
  readonly areaT: number;
  readonly kll: number;
  readonly floors: number;
  readonly kllAt: number;
  readonly llr: number;
  readonly reducedLive: number;
  readonly factored: number;
  /** Walls and foundations: the length the load is spread over (ft or m), where known. */
  readonly wallLength: number;
  /** Walls and foundations: total per unit length, per channel (kip/ft or kN/m). */
  readonly perLength: readonly number[];
  /**
   * Beams, girders, joists: governing LRFD values over the combinations and live load patterns
   * (LOADPATH.GOVERNING), each value followed by a text column "combination; pattern". Reactions at
   * the first support (interior supports of a continuous member on the rows below) and at the last.
   */
  readonly governing: GoverningColumns;
  /** Deflection columns (members with E given), or null when no member has E. */
  readonly deflection: DeflectionColumns | null;
  /** Number of columns. */
  readonly width: number;
}

/** Value columns of the governing values; the text column of each is the next column. */
export interface GoverningColumns {
  readonly momentMax: number;
  readonly momentMin: number;
  readonly shearMax: number;
  readonly reactionMaxFirst: number;
  readonly reactionMaxLast: number;
  readonly reactionMinFirst: number;
  readonly reactionMinLast: number;
}

/** Columns of the deflection check (LOADPATH.DEFLECTION_CHECK). */
export interface DeflectionColumns {
  readonly live: number;
  readonly total: number;
  readonly liveLimit: number;
  readonly totalLimit: number;
  readonly ratio: number;
  readonly requiredI: number;
}

/**
 * The channels of a takedown.
 * @param cases - load cases present
 * @param splitLive - carry reducible live load separately (some live load is not reducible)
 * @param units - unit system (for the unit labels)
 */
export function channelsOf(cases: readonly LoadCase[], splitLive: boolean, units: UnitSystem): Channel[] {
  const u = RESULT_UNITS[units];
  const out: Channel[] = cases.map((c) => ({ key: c, label: c, isCase: true, lineUnit: u.line, forceUnit: u.force }));
  if (cases.includes("L")) {
    if (splitLive) out.push({ key: "Lred", label: "L red.", isCase: false, lineUnit: u.line, forceUnit: u.force });
    out.push({ key: "AT", label: "A_T", isCase: false, lineUnit: u.length, forceUnit: u.area });
  }
  return out;
}

/**
 * Column positions for the channels.
 * @param channels - from {@link channelsOf}
 * @param units - unit system
 * @param deflection - some member has E: the deflection check columns are added
 * @param endMagnitudes - some load varies linearly: each loads block gets an end magnitude column
 */
export function layoutOf(channels: readonly Channel[], units: UnitSystem, deflection = false, endMagnitudes = false): Layout {
  const blockWidth = endMagnitudes ? TRAPEZOID_BLOCK_WIDTH : BLOCK_WIDTH;
  let next = COL.loaded + 1;
  const take = (n: number): number[] => Array.from({ length: n }, () => next++);
  const block = channels.map(() => {
    const first = next;
    next += blockWidth;
    return first;
  });
  const cases = channels.filter((c) => c.isCase);
  const r1: number[] = [];
  const r2: number[] = [];
  for (let i = 0; i < channels.length; i++) {
    r1.push(next++);
    r2.push(next++);
  }
  const vMax: number[] = [];
  const mMax: number[] = [];
  for (let i = 0; i < cases.length; i++) {
    vMax.push(next++);
    mMax.push(next++);
  }
  const arriving: number[] = [];
  const total: number[] = [];
  for (let i = 0; i < channels.length; i++) {
    arriving.push(next++);
    total.push(next++);
  }
  const [areaT, kll, floors, kllAt, llr, reducedLive, factored, wallLength] = take(8) as [number, number, number, number, number, number, number, number];
  const perLength = take(channels.length);
  const pair = (): number => {
    const c = next;
    next += 2;
    return c;
  };
  const governing: GoverningColumns = {
    momentMax: pair(),
    momentMin: pair(),
    shearMax: pair(),
    reactionMaxFirst: pair(),
    reactionMaxLast: pair(),
    reactionMinFirst: pair(),
    reactionMinLast: pair(),
  };
  const defl = deflection ? (take(6) as [number, number, number, number, number, number]) : null;
  const deflectionColumns = defl === null ? null : { live: defl[0], total: defl[1], liveLimit: defl[2], totalLimit: defl[3], ratio: defl[4], requiredI: defl[5] };
  return {
    units,
    channels,
    cases,
    block,
    blockWidth,
    r1,
    r2,
    vMax,
    mMax,
    arriving,
    total,
    areaT,
    kll,
    floors,
    kllAt,
    llr,
    reducedLive,
    factored,
    wallLength,
    perLength,
    governing,
    deflection: deflectionColumns,
    width: next,
  };
}
