/**
 * The loads each member carries, read back from the computed takedown sheet: every load row the
 * plan wrote for the member (its zone load over the trib width with extra line loads, its Loads
 * table rows, the reactions it receives from the members it carries, a column's self weight and
 * the load of the column above) with the computed magnitude of each channel, where it acts, and
 * where it comes from; the member's supports (what holds it up and where) and its computed
 * reactions. Nothing is recomputed here: the numbers are the sheet's, the origins are the model's
 * deliveries and Loads rows. This is what a calculation report or a drawing of the member needs.
 */
import { COL, type ChannelKey } from "./layout";
import { isFlexural, type Member, type MemberType, type TakedownModel } from "./model";
import type { SheetPlan } from "./plan";
import type { CellReader } from "./results";
import type { CellValue, LoadCase } from "./types";
import { deliveryLabel, type Delivery, type DeliveryEnd, type PlacedLoad } from "./validate";

/** Where a load on a member comes from. */
export type LoadOrigin =
  /** The member's own zone load over its trib width, with its extra line loads wX. */
  | { readonly kind: "zone"; readonly zone: string | null; readonly extras: readonly LoadCase[] }
  /** A row of the Loads table (1-based sheet row). */
  | { readonly kind: "loadsRow"; readonly sheet: string; readonly row: number; readonly zone: string | null; readonly loadCase: LoadCase | null }
  /** A reaction received from another member: its mark and which end (a column's base). */
  | { readonly kind: "member"; readonly mark: string; readonly type: MemberType; readonly end: DeliveryEnd }
  /** A column's self weight (wX x height). */
  | { readonly kind: "selfWeight" };

/** One load on a member, as written and computed on the takedown sheet. */
export interface AppliedLoad {
  /** "line" (over start..end), "point" (at start) or "reaction" (another member's reaction, at start). */
  readonly kind: "line" | "point" | "reaction";
  /** The Source text of the sheet's row (for the column above, "<mark> (column above)"). */
  readonly source: string;
  readonly origin: LoadOrigin;
  /** Trib or width of an area load (ft or m), when the row has one. */
  readonly width: number | null;
  /** Start of a line load, position of a point load or reaction (ft or m); null on columns, walls and foundations. */
  readonly start: number | null;
  /** End of a line load (ft or m); null for point loads and reactions. */
  readonly end: number | null;
  /**
   * Computed magnitude per channel: line loads in kip/ft or kN/m, point loads and reactions in
   * kip or kN; channel "AT" carries 1 per unit area (its line load is a width, its point load an area).
   */
  readonly magnitudes: Readonly<Partial<Record<ChannelKey, number>>>;
  /**
   * Computed magnitude at the end of a line load per channel, when the takedown's loads blocks
   * carry an end magnitude (some load varies linearly); equal to `magnitudes` for a uniform load.
   */
  readonly endMagnitudes?: Readonly<Partial<Record<ChannelKey, number>>>;
}

/** What holds a member up at one end. */
export interface MemberSupport {
  /** "start" or "end" of a beam, "interior" for a continuous member's Bearings row; "base" of a column. */
  readonly end: DeliveryEnd;
  /** Mark of the supporting member as entered. */
  readonly mark: string;
  /** Its type, when the mark is a member of the table. */
  readonly type: MemberType | null;
  /** Position of the support along this member (ft or m); null on columns. */
  readonly x: number | null;
  /** Position along the supporting beam or girder (Start at / End at), when it is one. */
  readonly at: number | null;
}

/** Everything a member carries and gives, from the computed sheet. */
export interface MemberLoads {
  readonly mark: string;
  readonly type: MemberType;
  readonly level: string;
  /** Length of a beam (overhangs included) or height of a column (ft or m); null when not given. */
  readonly length: number | null;
  readonly supports: readonly MemberSupport[];
  /** Load rows in the sheet's order, then (columns) the loads of the columns above. */
  readonly loads: readonly AppliedLoad[];
  /**
   * Computed reactions per channel: one per support in order along the member for beams; [total] for
   * columns (cumulative load at the base), walls and foundations.
   */
  readonly reactions: Readonly<Partial<Record<ChannelKey, readonly number[]>>>;
  /** Channels carried by this member, in the sheet's order. */
  readonly channels: readonly ChannelKey[];
  /**
   * The channel that carries the reducible part of the live load: "Lred" when the takedown
   * carries it apart (some live load is not reducible), "L" when all live load is reducible,
   * null when there is no live load to reduce.
   */
  readonly reducibleLive: "Lred" | "L" | null;
  /** Tributary area, K_LL, floors supported (columns) and the factor L/Lo of the sheet; null without live load. */
  readonly liveReduction: LiveReductionCells | null;
}

/** The computed live load reduction cells of a member's row (ASCE/SEI 7-22 Sec. 4.7). */
export interface LiveReductionCells {
  /** A_T, ft² or m². */
  readonly areaT: number;
  readonly kll: number;
  /** Floors supported (columns); null for beams (one floor). */
  readonly floors: number | null;
  /** L/Lo. */
  readonly llrFactor: number;
}

/** What the loads are read from: the planned takedown, its checked path, and the computed sheet. */
export interface MemberLoadsSource {
  readonly model: TakedownModel;
  readonly plan: SheetPlan;
  /** Deliveries of the checked path (checkPath(model).deliveries). */
  readonly deliveries: readonly Delivery[];
  /** Loads rows placed on members (checkPath(model).placedLoads). */
  readonly placedLoads: readonly PlacedLoad[];
  /** Computed cells of the generated sheet. */
  readonly read: CellReader;
}

/** A computed cell as a number: blank is null, text or an error NaN. */
function numberOf(v: CellValue | undefined): number | null {
  if (v === null || v === undefined || v === "") return null;
  return typeof v === "number" ? v : Number.NaN;
}

function textOf(v: CellValue | undefined): string {
  return v === null || v === undefined ? "" : String(v);
}

/** Origin of a sheet row that is not a received reaction. */
function originOf(m: Member, source: string, placed: readonly PlacedLoad[]): LoadOrigin {
  const row = placed.find((p) => source.startsWith(`Loads row ${p.load.sheetRow}:`));
  if (row) return { kind: "loadsRow", sheet: row.load.sheet, row: row.load.sheetRow, zone: row.load.zone?.name ?? null, loadCase: row.load.loadCase };
  if (source.startsWith("self weight")) return { kind: "selfWeight" };
  return { kind: "zone", zone: m.zone?.name ?? null, extras: Object.keys(m.extra) as LoadCase[] };
}

/** Index of the sources: places, deliveries into each member, Loads rows per member. */
interface Indexed {
  readonly byMark: ReadonlyMap<string, Member>;
  readonly placeOf: ReadonlyMap<number, SheetPlan["places"][number]>;
  readonly into: ReadonlyMap<number, readonly Delivery[]>;
  readonly placed: ReadonlyMap<number, readonly PlacedLoad[]>;
}

function push<T>(map: Map<number, T[]>, key: number, value: T): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

function indexOf(source: MemberLoadsSource): Indexed {
  const byMark = new Map<string, Member>();
  for (const m of source.model.members) if (m.firstOfMark) byMark.set(m.mark, m);
  const into = new Map<number, Delivery[]>();
  for (const d of source.deliveries) push(into, d.to, d);
  const placed = new Map<number, PlacedLoad[]>();
  for (const p of source.placedLoads) push(placed, p.member, p);
  return { byMark, placeOf: new Map(source.plan.places.map((p) => [p.member, p])), into, placed };
}

/** The magnitudes of the live channels on one row of the sheet. */
function magnitudesAt(source: MemberLoadsSource, row: number, live: readonly number[], cols: readonly number[]): Partial<Record<ChannelKey, number>> {
  const out: Partial<Record<ChannelKey, number>> = {};
  for (const i of live) {
    const v = numberOf(source.read(row, cols[i]!));
    if (v !== null) out[source.plan.layout.channels[i]!.key] = v;
  }
  return out;
}

function supportsOf(source: MemberLoadsSource, ix: Indexed, m: Member, place: SheetPlan["places"][number], length: number | null): MemberSupport[] {
  const row = place.row;
  const typeOf = (mark: string): MemberType | null => ix.byMark.get(mark)?.type ?? null;
  if (!isFlexural(m.type)) return m.start.mark === "" ? [] : [{ end: "base", mark: m.start.mark, type: typeOf(m.start.mark), x: null, at: null }];
  const count = 2 + (place.interiors ?? 0);
  const read = Array.from({ length: count }, (_, k) => numberOf(source.read(row + k, COL.supports)));
  const xs = read.every((x) => x !== null) ? read : [0, length];
  // Interior supports in order along the member: the deliveries out of it tell what holds each.
  const inner = source.deliveries.filter((d) => d.from === m.index && d.end === "interior").sort((a, b) => (a.interior ?? 0) - (b.interior ?? 0));
  const out: MemberSupport[] = [{ end: "start", mark: m.start.mark, type: typeOf(m.start.mark), x: xs[0] ?? null, at: m.start.at?.value ?? null }];
  inner.forEach((d, k) => {
    const holder = source.model.members[d.to]!;
    out.push({ end: "interior", mark: holder.mark, type: holder.type, x: xs[k + 1] ?? null, at: d.at?.value ?? null });
  });
  out.push({ end: "end", mark: m.end.mark, type: typeOf(m.end.mark), x: xs[count - 1] ?? null, at: m.end.at?.value ?? null });
  return out;
}

function loadsOf(source: MemberLoadsSource, ix: Indexed, m: Member, place: SheetPlan["places"][number], length: number | null): AppliedLoad[] {
  const { layout } = source.plan;
  const flexural = isFlexural(m.type);
  const magCols = layout.block.map((b) => b + 1);
  const received = new Map<string, Delivery>();
  for (const d of ix.into.get(m.index) ?? []) received.set(deliveryLabel(source.model.members[d.from]!.mark, d), d);
  const out: AppliedLoad[] = [];
  for (let r = place.row; r < place.row + place.rows; r++) {
    const kind = textOf(source.read(r, COL.kind));
    if (kind !== "line" && kind !== "point" && kind !== "reaction" && kind !== "wall") continue;
    const text = textOf(source.read(r, COL.source));
    const delivery = kind === "reaction" ? received.get(text) : kind === "wall" ? (ix.into.get(m.index) ?? []).find((d) => d.until !== undefined && `${source.model.members[d.from]!.mark} (wall)` === text) : undefined;
    const from = delivery ? source.model.members[delivery.from]! : undefined;
    const origin: LoadOrigin = from && delivery ? { kind: "member", mark: from.mark, type: from.type, end: delivery.end } : originOf(m, text, ix.placed.get(m.index) ?? []);
    const a = numberOf(source.read(r, COL.from));
    const b = numberOf(source.read(r, COL.to));
    const loaded = numberOf(source.read(r, COL.loaded));
    let start: number | null = null;
    let end: number | null = null;
    if (flexural) {
      start = a ?? 0;
      if (kind === "line") end = b ?? (a === null ? length : a + (loaded ?? 0));
      if (kind === "wall") end = b;
    }
    // A wall standing on the member is a line load over its extent (origin: the wall).
    const endMagnitudes = layout.blockWidth > 4 && (kind === "line" || kind === "wall") ? { endMagnitudes: magnitudesAt(source, r, place.live, layout.block.map((b) => b + 4)) } : {};
    out.push({ kind: kind === "wall" ? "line" : kind, source: text, origin, width: numberOf(source.read(r, COL.width)), start, end, magnitudes: magnitudesAt(source, r, place.live, magCols), ...endMagnitudes });
  }
  if (m.type === "column") {
    for (const d of ix.into.get(m.index) ?? []) {
      const above = source.model.members[d.from]!;
      const at = ix.placeOf.get(d.from);
      if (above.type !== "column" || at === undefined) continue;
      out.push({
        kind: "reaction",
        source: `${above.mark} (column above)`,
        origin: { kind: "member", mark: above.mark, type: above.type, end: d.end },
        width: null,
        start: null,
        end: null,
        magnitudes: magnitudesAt(source, at.row, at.live, layout.total),
      });
    }
  }
  return out;
}

function reactionsOf(source: MemberLoadsSource, m: Member, place: SheetPlan["places"][number]): Partial<Record<ChannelKey, number[]>> {
  const { layout } = source.plan;
  const out: Partial<Record<ChannelKey, number[]>> = {};
  for (const i of place.live) {
    const key = layout.channels[i]!.key;
    const at = (col: number): number => numberOf(source.read(place.row, col)) ?? 0;
    const inner = Array.from({ length: place.interiors ?? 0 }, (_, k) => numberOf(source.read(place.row + 1 + k, layout.r1[i]!)) ?? 0);
    out[key] = isFlexural(m.type) ? [at(layout.r1[i]!), ...inner, at(layout.r2[i]!)] : [at(layout.total[i]!)];
  }
  return out;
}

function liveReductionOf(source: MemberLoadsSource, m: Member, row: number): LiveReductionCells | null {
  const { layout } = source.plan;
  if (!layout.channels.some((c) => c.key === "AT") || !(isFlexural(m.type) || m.type === "column")) return null;
  const at = (col: number): number => numberOf(source.read(row, col)) ?? Number.NaN;
  return { areaT: at(layout.areaT), kll: at(layout.kll), floors: m.type === "column" ? at(layout.floors) : null, llrFactor: at(layout.llr) };
}

function reducibleLiveOf(plan: SheetPlan): MemberLoads["reducibleLive"] {
  const keys = plan.layout.channels.map((c) => c.key);
  if (keys.includes("Lred")) return "Lred";
  return keys.includes("AT") ? "L" : null;
}

function recordOf(source: MemberLoadsSource, ix: Indexed, m: Member): MemberLoads | null {
  const place = ix.placeOf.get(m.index);
  if (place === undefined) return null;
  const length = numberOf(source.read(place.row, COL.length));
  return {
    mark: m.mark,
    type: m.type,
    level: m.level,
    length,
    supports: supportsOf(source, ix, m, place, length),
    loads: loadsOf(source, ix, m, place, length),
    reactions: reactionsOf(source, m, place),
    channels: place.live.map((i) => source.plan.layout.channels[i]!.key),
    reducibleLive: reducibleLiveOf(source.plan),
    liveReduction: liveReductionOf(source, m, place.row),
  };
}

/**
 * The loads, supports and reactions of every member of the takedown, in takedown order.
 * @param source - model, plan, checked path and the computed sheet
 * @returns mark -> the member's loads (members left out of the takedown are absent)
 */
export function loadsOfMembers(source: MemberLoadsSource): ReadonlyMap<string, MemberLoads> {
  const ix = indexOf(source);
  const out = new Map<string, MemberLoads>();
  for (const place of source.plan.places) {
    const m = source.model.members[place.member]!;
    const rec = recordOf(source, ix, m);
    if (rec) out.set(m.mark, rec);
  }
  return out;
}

/**
 * The loads, supports and reactions of one member, as the takedown sheet computed them.
 * @param source - model, plan, checked path and the computed sheet
 * @param mark - the member's mark
 * @returns the member's loads, or null when no member of that mark is in the takedown
 */
export function memberLoads(source: MemberLoadsSource, mark: string): MemberLoads | null {
  const ix = indexOf(source);
  const m = ix.byMark.get(mark);
  return m === undefined ? null : recordOf(source, ix, m);
}
