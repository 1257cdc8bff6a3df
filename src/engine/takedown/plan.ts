/**
 * The sheet plan: every cell of the generated takedown sheet, values and formulas, in takedown
 * order. Each member gets a block of rows: one row per load it carries (its zone load over the
 * trib width with any extra line loads, its Loads-table rows, and the reactions of the members
 * it carries, referenced from their cells), and on its first row its results. Columns
 * accumulate level by level; foundations and walls close the path; a load balance per case
 * compares all applied load with all foundation and wall reactions. Nothing is copied as a value:
 * inputs are referenced from the user's tables, so editing them recalculates the sheet.
 *
 * The layout (which rows and columns) lives here; the spelling of member computations is the
 * {@link FormulaWriter}'s.
 */
import { a1, a1Absolute, columnLetter, sheetCellRef } from "./a1";
import { ADD_IN_WRITER, deflectionFormula, governingFormula, type CaseLoads, type ChannelRefs, type FormulaWriter, type MemberRefs } from "./formulas";
import { channelsOf, COL, layoutOf, type Channel, type Layout } from "./layout";
import { cellKey, endsPath, isFlexural, isTerminal, isTrapezoid, type LimitInput, type Member, type TakedownModel, type Zone } from "./model";
import { RESULT_UNITS } from "./units";
import type { CellRef, CellValue, LoadCase } from "./types";
import { deliveryLabel, type Delivery, type InteriorSupport, type PlacedLoad } from "./validate";

/** A cell of the plan: a value, or a formula (text without "="). */
export type PlanCell = CellValue | { readonly formula: string };

/** Where a member's block sits and what it holds. */
export interface MemberPlace {
  readonly member: number;
  /** 0-based sheet row of the block's first row (the row with the member's results). */
  readonly row: number;
  readonly rows: number;
  /** Indices into the layout's channels that carry load on this member. */
  readonly live: readonly number[];
  /** Interior supports of a continuous member (their reactions sit in R1 on the rows below its first row); absent = none. */
  readonly interiors?: number;
}

/** The generated sheet, cell by cell, and where the results are. */
export interface SheetPlan {
  readonly sheet: string;
  /** Rows of cells from A1 (undefined or null = blank). */
  readonly cells: readonly (readonly (PlanCell | undefined)[])[];
  readonly layout: Layout;
  /** Members in takedown order with their blocks. */
  readonly places: readonly MemberPlace[];
  /** Rows of the load balance, and the column of each load case in it. */
  readonly balance: { readonly appliedRow: number; readonly supportsRow: number; readonly caseCols: readonly number[] };
  /** 0-based row of the column header line (members start on the next row). */
  readonly headerRow: number;
  /**
   * Cells the writer could not spell (a continuous member's results in the hand-off version):
   * written here with the add-in's functions, to be replaced by their computed values and listed.
   * `governing` marks the governing values and deflection checks, which nothing else on the
   * sheet reads (the loads carried down, column loads and the balance stay live without them).
   */
  readonly valueOnly: readonly { readonly row: number; readonly col: number; readonly mark: string; readonly reason: string; readonly governing?: true }[];
}

/** What the plan is made from. */
export interface PlanInput {
  readonly model: TakedownModel;
  /** Member indices in takedown order. */
  readonly order: readonly number[];
  readonly deliveries: readonly Delivery[];
  readonly placedLoads: readonly PlacedLoad[];
  /** Interior supports of continuous members (Bearings rows), by member index, in order along each. */
  readonly interiors?: ReadonlyMap<number, readonly InteriorSupport[]>;
  /** Name of the generated sheet. */
  readonly sheet: string;
  /** First line of the sheet (the generated-sheet marker and a title). */
  readonly title: string;
  readonly writer?: FormulaWriter;
}

/** Caution carried by every generated sheet (DEVELOPERS.md, Rules every change keeps). */
export const CAUTION =
  "Caution: a calculation aid. Every result needs review by a qualified engineer, who remains responsible for the design; code provisions apply where the local jurisdiction adopts them, and local codes govern.";

/** K_LL keys of ASCE/SEI 7-22 Table 4.7-2 used when the KLL cell is blank (common practice: interior values). */
const DEFAULT_ELEMENT = { column: "interior column", flexural: "interior beam" } as const;

/** A formula cell. */
function f(formula: string): PlanCell {
  return { formula };
}

/** Sparse rows of cells. */
class Grid {
  readonly rows: (PlanCell | undefined)[][] = [];
  set(row: number, col: number, value: PlanCell): void {
    let r = this.rows[row];
    if (r === undefined) {
      for (let i = this.rows.length; i <= row; i++) this.rows.push([]);
      r = this.rows[row]!;
    }
    r[col] = value;
  }
}

/** Relative reference with an absolute column: "$D12". */
function colAbs(row: number, col: number): string {
  return `$${columnLetter(col)}${row + 1}`;
}

/** One load row of a member block before it is written. */
interface LoadRow {
  /** "wall": a wall standing on the member, its load per unit length from `from` to `to`. */
  readonly kind: "line" | "point" | "reaction" | "wall";
  readonly source: string;
  readonly width?: PlanCell;
  /** Start position (null = full length for a line, 0 for axial members). */
  readonly from: PlanCell | null;
  readonly to: PlanCell | null;
  /** Magnitude formula per channel index (absent = none of that channel). */
  readonly mags: ReadonlyMap<number, string>;
  /** True when the row's live load (if any) is all reducible (ASCE/SEI 7-22 Sec. 4.7). */
  readonly reducibleLive?: boolean;
  /**
   * Magnitude at the end (To) per channel, for a load varying linearly from `mags` at its start
   * (a Loads row with End width or End magnitude); absent for uniform loads.
   */
  readonly endMags?: ReadonlyMap<number, string>;
}

/** Everything the block writers share. */
interface Context {
  readonly model: TakedownModel;
  readonly layout: Layout;
  readonly writer: FormulaWriter;
  readonly grid: Grid;
  readonly splitLive: boolean;
  readonly channelIndex: ReadonlyMap<string, number>;
  readonly places: Map<number, MemberPlace>;
  /** Deliveries into each member, in takedown order of the carried member. */
  readonly into: ReadonlyMap<number, readonly Delivery[]>;
  readonly loadsOn: ReadonlyMap<number, readonly PlacedLoad[]>;
  readonly interiors: ReadonlyMap<number, readonly InteriorSupport[]>;
  readonly valueOnly: { row: number; col: number; mark: string; reason: string; governing?: true }[];
  /** What each wall bears on (its delivery), by wall index. */
  readonly baseOf: ReadonlyMap<number, Delivery>;
  /** Walls and foundations whose length cell is written. */
  readonly wallLengths: Set<number>;
  /** Flexural members whose live load is all reducible (their reactions carry reducible live load only). */
  readonly reducibleLive: Set<number>;
}

/** Unit conversion of a pound-based input to kips, visible in the formula (US); none in SI. */
function toKips(ctx: Context, term: string, compound: boolean): string {
  if (ctx.model.units === "SI") return term;
  return compound ? `(${term})/1000` : `${term}/1000`;
}

/**
 * Reference to a number cell of the user's tables: a number stored as text (which the checks
 * accepted as that number) is converted with VALUE, so no formula, sum or function is handed text.
 */
function inputRef(ctx: Context, cell: CellRef): string {
  const ref = sheetCellRef(cell);
  return ctx.model.textNumbers.has(cellKey(cell)) ? `VALUE(${ref})` : ref;
}

/** Channel index of a key, if carried. */
function ch(ctx: Context, key: string): number | undefined {
  return ctx.channelIndex.get(key);
}

/**
 * Magnitudes of an area load of `zone` over the width in column H of `row`, plus extra line loads:
 * psf x ft (+ plf), /1000 -> kip/ft in US; kPa x m (+ kN/m) = kN/m in SI.
 */
function areaMags(ctx: Context, zone: Zone | null, row: number, extra: Readonly<Partial<Record<LoadCase, CellRef>>>): Map<number, string> {
  return areaMagsOver(ctx, zone, colAbs(row, COL.width), extra);
}

/** Magnitudes of an area load of `zone` over the width in cell `width`, plus extra line loads. */
function areaMagsOver(ctx: Context, zone: Zone | null, width: string, extra: Readonly<Partial<Record<LoadCase, CellRef>>>): Map<number, string> {
  const mags = new Map<number, string>();
  for (const c of ctx.model.cases) {
    const zoneCell = zone?.loadCells[c];
    const extraCell = extra[c];
    const terms = [...(zoneCell ? [`${inputRef(ctx, zoneCell)}*${width}`] : []), ...(extraCell ? [inputRef(ctx, extraCell)] : [])];
    if (terms.length > 0) mags.set(ch(ctx, c)!, toKips(ctx, terms.join("+"), terms.length > 1));
  }
  const liveCell = zone?.loadCells.L;
  if (zone?.reducible && liveCell) {
    const lred = ch(ctx, "Lred");
    if (lred !== undefined) mags.set(lred, toKips(ctx, `${inputRef(ctx, liveCell)}*${width}`, false));
    const at = ch(ctx, "AT");
    // A load of 1 per unit area over the width: its reactions are tributary areas (1* also reads a blank width as 0).
    if (at !== undefined) mags.set(at, `1*${width}`);
  }
  return mags;
}

/** The zone-and-extras row of a flexural member (null when it carries neither). */
function zoneRow(ctx: Context, m: Member, row: number): LoadRow | null {
  const extras = Object.keys(m.extra) as LoadCase[];
  const zone = m.zone;
  if (zone === null && extras.length === 0) return null;
  const mags = areaMags(ctx, zone, row, m.extra);
  if (mags.size === 0) return null;
  const parts = [...(zone ? [`zone ${zone.name} × trib`] : []), ...extras.map((c) => `w${c}`)];
  const width = zone && m.trib ? f(inputRef(ctx, m.trib.cell)) : undefined;
  return { kind: "line", source: parts.join(" + "), ...(width ? { width } : {}), from: null, to: null, mags, reducibleLive: zone?.reducible === true && m.extra.L === undefined };
}

/** A Loads-table row on a member. */
function extraLoadRow(ctx: Context, p: PlacedLoad, row: number, axial: boolean): LoadRow {
  const l = p.load;
  const ref = (n: { cell: CellRef } | null): PlanCell | null => (n === null ? null : f(inputRef(ctx, n.cell)));
  const label = `Loads row ${l.sheetRow}`;
  if (l.kind === "area") {
    const partial = l.from?.value != null && l.to?.value != null;
    // End width: the width varies linearly from Width at From to End width at To (a trapezoid).
    const endWidth = isTrapezoid(l) ? inputRef(ctx, l.endWidth!.cell) : null;
    return {
      kind: "line",
      source: `${label}: zone ${l.zone!.name} × width${endWidth !== null ? " (to end width)" : ""}`,
      width: ref(l.width),
      from: partial ? ref(l.from) : null,
      to: partial ? ref(l.to) : null,
      mags: areaMags(ctx, l.zone, row, {}),
      reducibleLive: l.zone?.reducible === true,
      ...(endWidth !== null ? { endMags: areaMagsOver(ctx, l.zone, endWidth, {}) } : {}),
    };
  }
  const c = l.loadCase!;
  const mag = new Map([[ch(ctx, c)!, toKips(ctx, inputRef(ctx, l.magnitude!.cell), false)]]);
  if (l.kind === "point") return { kind: "point", source: `${label}: point ${c}`, from: axial ? null : ref(l.from), to: null, mags: mag };
  const partial = l.from?.value != null && l.to?.value != null;
  const endMags = isTrapezoid(l) ? new Map([[ch(ctx, c)!, toKips(ctx, inputRef(ctx, l.endMagnitude!.cell), false)]]) : null;
  return {
    kind: "line",
    source: `${label}: line ${c}${endMags !== null ? " (to end magnitude)" : ""}`,
    from: partial ? ref(l.from) : null,
    to: partial ? ref(l.to) : null,
    mags: mag,
    ...(endMags !== null ? { endMags } : {}),
  };
}

/** Cell (absolute, on the generated sheet) holding what a delivery hands over in channel i. */
function deliveredCell(ctx: Context, d: Delivery, i: number): string | null {
  const place = ctx.places.get(d.from)!;
  if (!place.live.includes(i)) return null;
  const from = ctx.model.members[d.from]!;
  if (!isFlexural(from.type)) return a1Absolute(place.row, ctx.layout.total[i]!);
  // R2 holds the last support; R1 the first, with the interior supports of a continuous member below it, in order.
  if (d.end === "end") return a1Absolute(place.row, ctx.layout.r2[i]!);
  return a1Absolute(place.row + (d.end === "interior" ? (d.interior ?? 0) : 0), ctx.layout.r1[i]!);
}

/** A received reaction as a load row. */
function receivedRow(ctx: Context, d: Delivery, axial: boolean): LoadRow {
  const from = ctx.model.members[d.from]!;
  if (d.until !== undefined && d.at !== null) {
    // A wall on a beam: its total per unit length, over Start at..End at of the beam.
    const place = ctx.places.get(d.from)!;
    const wallMags = new Map<number, string>();
    for (const i of place.live) wallMags.set(i, a1Absolute(place.row, ctx.layout.perLength[i]!));
    return { kind: "wall", source: `${from.mark} (wall)`, from: f(inputRef(ctx, d.at.cell)), to: f(inputRef(ctx, d.until.cell)), mags: wallMags };
  }
  const mags = new Map<number, string>();
  for (let i = 0; i < ctx.layout.channels.length; i++) {
    const cell = deliveredCell(ctx, d, i);
    if (cell !== null) mags.set(i, cell);
  }
  return {
    kind: "reaction",
    source: deliveryLabel(from.mark, d),
    from: axial || d.at === null ? null : f(inputRef(ctx, d.at.cell)),
    to: null,
    mags,
    reducibleLive: ctx.reducibleLive.has(d.from),
  };
}

/** The member's identity cells (mark, type, level). */
function writeIdentity(ctx: Context, m: Member, row: number): void {
  ctx.grid.set(row, COL.mark, m.mark);
  ctx.grid.set(row, COL.type, m.type);
  if (m.level !== "") ctx.grid.set(row, COL.level, m.level);
}

/** Write the load rows; returns the channels that carry load. */
function writeLoadRows(ctx: Context, rows: readonly LoadRow[], top: number, first: number, uniform: boolean, axial: boolean): number[] {
  const { grid, layout } = ctx;
  const live = new Set<number>();
  rows.forEach((lr, k) => {
    const r = top + k;
    grid.set(r, COL.kind, lr.kind);
    grid.set(r, COL.source, lr.source);
    if (lr.width !== undefined) grid.set(r, COL.width, lr.width);
    if (lr.from !== null) grid.set(r, COL.from, lr.from);
    if (lr.to !== null) grid.set(r, COL.to, lr.to);
    if (lr.kind === "line") grid.set(r, COL.loaded, f(lr.to !== null ? `${a1(r, COL.to)}-${a1(r, COL.from)}` : colAbs(first, COL.length)));
    for (const [i, mag] of lr.mags) {
      live.add(i);
      const b = layout.block[i]!;
      grid.set(r, b + 1, f(mag));
      if (axial || uniform || !ctx.writer.writesLoadRanges) continue;
      grid.set(r, b, lr.kind === "line" || lr.kind === "wall" ? "line" : "point");
      if (lr.from !== null) grid.set(r, b + 2, f(colAbs(r, COL.from)));
      if (lr.to !== null) grid.set(r, b + 3, f(colAbs(r, COL.to)));
      // The end magnitude of every line load is written (the start magnitude for a uniform one), so
      // that no host reading a blank cell as 0 turns a uniform load into a triangle.
      if (layout.blockWidth > 4 && lr.kind !== "point" && lr.kind !== "reaction") grid.set(r, b + 4, f(lr.endMags?.get(i) ?? a1(r, b + 1)));
    }
  });
  return [...live].sort((a, b) => a - b);
}

/**
 * References of one channel's loads over a member's rows; the ranges a hand-off writer needs are
 * spelt on demand. A class, so the getters live once on its prototype (an object literal with
 * getters costs four closures per member and channel).
 */
class ChannelRanges implements ChannelRefs {
  readonly loads: string;
  /**
   * @param b - first column of the channel's loads block
   * @param top - first row of the member's block
   * @param n - rows of the member's block
   * @param uniform - the member carries one full-length line load (its magnitude cell is the loads argument)
   */
  constructor(
    private readonly b: number,
    private readonly top: number,
    private readonly n: number,
    uniform: boolean,
    width: number,
  ) {
    this.loads = uniform ? a1(top, b + 1) : this.range(b, b + width - 1);
  }
  private range(c0: number, c1: number): string {
    return `${a1(this.top, c0)}:${a1(this.top + this.n - 1, c1)}`;
  }
  get magnitude(): string {
    return this.range(this.b + 1, this.b + 1);
  }
  get kind(): string {
    return this.range(COL.kind, COL.kind);
  }
  get from(): string {
    return this.range(COL.from, COL.from);
  }
  get loaded(): string {
    return this.range(COL.loaded, COL.loaded);
  }
}

/** References of channel i's loads over rows top..top+n-1. */
function channelRefs(ctx: Context, i: number, top: number, n: number, uniform: boolean): ChannelRefs {
  return new ChannelRanges(ctx.layout.block[i]!, top, n, uniform, ctx.layout.blockWidth);
}

/** Row and columns of the K_LL defaults in the sheet's header (one LOADPATH.KLL call each). */
const KLL_DEFAULTS = { row: 4, flexural: 2, column: 4 } as const;

/** The KLL cell formula: the Members KLL cell when filled, else the Table 4.7-2 default in the header. */
function kllFormula(ctx: Context, m: Member, kind: "flexural" | "column"): string {
  const fallback = a1Absolute(KLL_DEFAULTS.row, KLL_DEFAULTS[kind]);
  if (m.kll === null) return fallback;
  return `IF(${sheetCellRef(m.kll.cell)}="",${fallback},${inputRef(ctx, m.kll.cell)})`;
}

/** Length and supports cells of a flexural member; returns the member refs for its formulas. */
function writeGeometry(ctx: Context, m: Member, row: number): MemberRefs {
  const span = inputRef(ctx, m.span!.cell);
  // A blank overhang cell is no overhang (a filled one, even 0, is referenced and stays live).
  const so = m.startOverhang && m.startOverhang.value !== null ? inputRef(ctx, m.startOverhang.cell) : null;
  const eo = m.endOverhang && m.endOverhang.value !== null ? inputRef(ctx, m.endOverhang.cell) : null;
  const interiors = ctx.interiors.get(m.index) ?? [];
  if (so === null && eo === null && interiors.length === 0) {
    ctx.grid.set(row, COL.length, f(span));
    return { span: colAbs(row, COL.length), supports: null };
  }
  ctx.grid.set(row, COL.length, f([so, span, eo].filter((x) => x !== null).join("+")));
  // Supports in order along the member: start, the interior supports (Bearings At cells), end.
  ctx.grid.set(row, COL.supports, so === null ? 0 : f(so));
  interiors.forEach((s, k) => ctx.grid.set(row + 1 + k, COL.supports, f(inputRef(ctx, s.at.cell))));
  const last = row + 1 + interiors.length;
  ctx.grid.set(last, COL.supports, f(so === null ? span : `${so}+${span}`));
  return { span: colAbs(row, COL.length), supports: `${colAbs(row, COL.supports)}:${colAbs(last, COL.supports)}` };
}

/** A beam, girder or joist: loads, reactions, shear and moment maxima, A_T and live load reduction. */
function writeFlexural(ctx: Context, m: Member, row: number): MemberPlace {
  const { grid, layout } = ctx;
  writeIdentity(ctx, m, row);
  const rows: LoadRow[] = [];
  const zr = zoneRow(ctx, m, row);
  if (zr) rows.push(zr);
  for (const p of ctx.loadsOn.get(m.index) ?? []) rows.push(extraLoadRow(ctx, p, row + rows.length, false));
  for (const d of ctx.into.get(m.index) ?? []) rows.push(receivedRow(ctx, d, false));
  const overhangs = (m.startOverhang?.value ?? null) !== null || (m.endOverhang?.value ?? null) !== null;
  const interiors = (ctx.interiors.get(m.index) ?? []).length;
  const supportCount = 2 + interiors;
  const n = Math.max(1, rows.length, overhangs || interiors > 0 ? supportCount : 1);
  const member = writeGeometry(ctx, m, row);
  // A writer that cannot spell a continuous member (classic functions: statics of two supports only)
  // leaves its results to the add-in's functions, replaced by their values after calculation.
  const trapezoid = rows.some((r) => r.endMags !== undefined);
  const handOff = ((interiors > 0 || rows.some((r) => r.kind === "wall")) && ctx.writer.continuous !== true) || (trapezoid && ctx.writer.trapezoids !== true);
  const writer = handOff ? ADD_IN_WRITER : ctx.writer;
  const put = (r: number, c: number, formula: string): void => {
    grid.set(r, c, f(formula));
    const why =
      interiors > 0 && ctx.writer.continuous !== true
        ? `is continuous over ${interiors + 2} supports`
        : rows.some((r) => r.kind === "wall") && ctx.writer.continuous !== true
          ? "carries a wall's load over part of its length"
          : "carries a load varying linearly along it (End width or End magnitude), which the classic functions do not spell";
    if (handOff) ctx.valueOnly.push({ row: r, col: c, mark: m.mark, reason: `${m.mark} ${why}: its reactions, shear and moment are computed by the add-in's exact solution` });
  };
  const uniform = rows.length === 1 && rows[0]!.kind === "line" && rows[0]!.to === null && !trapezoid;
  const live = writeLoadRows(ctx, rows, row, row, uniform, false);
  for (const i of live) {
    const refs = channelRefs(ctx, i, row, n, uniform);
    put(row, layout.r1[i]!, writer.reaction(member, refs, 1));
    for (let k = 1; k <= interiors; k++) put(row + k, layout.r1[i]!, writer.reaction(member, refs, k + 1));
    put(row, layout.r2[i]!, writer.reaction(member, refs, supportCount));
    const c = layout.cases.indexOf(layout.channels[i]!);
    if (c >= 0) {
      put(row, layout.vMax[c]!, writer.shearMax(member, refs));
      put(row, layout.mMax[c]!, writer.momentMax(member, refs));
    }
  }
  const at = ch(ctx, "AT");
  writeGoverning(ctx, m, row, n, uniform, live, rows, member, interiors);
  if (at !== undefined) {
    // A_T is an area, never negative: a member that only takes the uplift end of an overhanging
    // member it carries gets 0 (no reduction, the conservative reading), in both versions alike.
    const reactions = [a1(row, layout.r1[at]!), ...Array.from({ length: interiors }, (_, k) => a1(row + 1 + k, layout.r1[at]!)), a1(row, layout.r2[at]!)];
    grid.set(row, layout.areaT, live.includes(at) ? f(`MAX(0,${reactions.join("+")})`) : 0);
    grid.set(row, layout.kll, f(kllFormula(ctx, m, "flexural")));
    grid.set(row, layout.llr, f(ctx.writer.llrFactor(a1(row, layout.kll), a1(row, layout.areaT), "1", ctx.model.units)));
  }
  return { member: m.index, row, rows: n, live, ...(interiors > 0 ? { interiors } : {}) };
}

/** The cases GOVERNING and DEFLECTION_CHECK take, in their argument order. */
const MEMBER_CASES = ["D", "L", "Lr", "S", "R"] as const;

/** A limit ratio argument: the cell (L/360 text read by the formula), or the default when the cell is blank. */
function limitArg(ctx: Context, limit: LimitInput | null, fallback: number): string {
  if (limit === null) return String(fallback);
  const ref = sheetCellRef(limit.cell);
  return limit.text ? `VALUE(MID(${ref},FIND("/",${ref})+1,20))` : inputRef(ctx, limit.cell);
}

/**
 * Governing LRFD values of a beam, girder or joist over the combinations and live load patterns
 * (M+, M-, |V|, each reaction's max and min, each with its combination and pattern), and its
 * deflection check when E is given. The live load is multiplied by the member's LLR factor when all
 * of it is reducible, else taken unreduced (conservative).
 */
function writeGoverning(ctx: Context, m: Member, row: number, n: number, uniform: boolean, live: readonly number[], rows: readonly LoadRow[], member: MemberRefs, interiors: number): void {
  const { grid, layout } = ctx;
  const loads: Record<(typeof MEMBER_CASES)[number], string> = { D: "0", L: "0", Lr: "0", S: "0", R: "0" };
  for (const c of MEMBER_CASES) {
    const i = ch(ctx, c);
    if (i !== undefined && live.includes(i)) loads[c] = channelRefs(ctx, i, row, n, uniform).loads;
  }
  const cases: CaseLoads = loads;
  const liveIndex = ch(ctx, "L");
  const reducible = liveIndex !== undefined && rows.every((r) => !r.mags.has(liveIndex) || r.reducibleLive === true);
  if (reducible) ctx.reducibleLive.add(m.index);
  const liveFactor = reducible && ch(ctx, "AT") !== undefined ? a1(row, layout.llr) : "1";
  const handOff = ctx.writer.governing !== true;
  const put = (r: number, c: number, formula: string): void => {
    grid.set(r, c, f(formula));
    if (handOff) ctx.valueOnly.push({ row: r, col: c, mark: m.mark, reason: `${m.mark}: governing values over the load combinations and live load patterns, and the deflection check, are computed by the add-in`, governing: true });
  };
  const both = (r: number, c: number, quantity: string): void => {
    put(r, c, governingFormula(member, cases, quantity, liveFactor, "value"));
    put(r, c + 1, governingFormula(member, cases, quantity, liveFactor, "case"));
  };
  const g = layout.governing;
  const supports = interiors + 2;
  both(row, g.momentMax, "moment max");
  both(row, g.momentMin, "moment min");
  both(row, g.shearMax, "shear max");
  both(row, g.reactionMaxFirst, "reaction max 1");
  both(row, g.reactionMinFirst, "reaction min 1");
  for (let k = 1; k <= interiors; k++) {
    both(row + k, g.reactionMaxFirst, `reaction max ${k + 1}`);
    both(row + k, g.reactionMinFirst, `reaction min ${k + 1}`);
  }
  both(row, g.reactionMaxLast, `reaction max ${supports}`);
  both(row, g.reactionMinLast, `reaction min ${supports}`);
  const d = layout.deflection;
  const input = m.deflection;
  if (d === null || input === undefined || input.E === null) return;
  const E = inputRef(ctx, input.E.cell);
  const I = input.I === null ? "" : inputRef(ctx, input.I.cell);
  const liveRatio = limitArg(ctx, input.liveLimit, 360);
  const totalRatio = limitArg(ctx, input.totalLimit, 240);
  const check = (c: number, what: string): void => put(row, c, deflectionFormula(member, E, I, ctx.model.units, cases, liveRatio, totalRatio, what));
  if (input.I !== null) {
    check(d.live, "live");
    check(d.total, "total");
    check(d.ratio, "ratio");
  }
  check(d.liveLimit, "live limit");
  check(d.totalLimit, "total limit");
  check(d.requiredI, "required I");
}

/** Sum of cells as formula text ("0" when none). */
function sumOf(cells: readonly string[]): string {
  return cells.length === 0 ? "0" : cells.join("+");
}

/** Self weight of a column over its height: wX (plf or kN/m) x height, as a point load row. */
function selfWeightRow(ctx: Context, m: Member, row: number): LoadRow | null {
  const cases = Object.keys(m.extra) as LoadCase[];
  if (cases.length === 0 || m.span === null || m.span.value === null || m.span.value <= 0) return null;
  const mags = new Map<number, string>();
  for (const c of cases) mags.set(ch(ctx, c)!, toKips(ctx, `${inputRef(ctx, m.extra[c]!)}*${colAbs(row, COL.length)}`, false));
  return { kind: "point", source: `self weight: ${cases.map((c) => `w${c}`).join(", ")} × height`, from: null, to: null, mags };
}

/** A column: loads arriving at its level, running totals, A_T, floors, live load reduction, factored load. */
function writeColumn(ctx: Context, m: Member, row: number): MemberPlace {
  const { grid, layout, writer } = ctx;
  writeIdentity(ctx, m, row);
  if (m.span !== null && m.span.value !== null) grid.set(row, COL.length, f(inputRef(ctx, m.span.cell)));
  const into = ctx.into.get(m.index) ?? [];
  const above = into.filter((d) => ctx.model.members[d.from]!.type === "column");
  const rows: LoadRow[] = into.filter((d) => !above.includes(d)).map((d) => receivedRow(ctx, d, true));
  for (const p of ctx.loadsOn.get(m.index) ?? []) rows.push(extraLoadRow(ctx, p, row + rows.length, true));
  const sw = selfWeightRow(ctx, m, row);
  if (sw) rows.push(sw);
  const n = Math.max(1, rows.length);
  const liveRows = writeLoadRows(ctx, rows, row, row, false, true);
  const live: number[] = [];
  for (let i = 0; i < layout.channels.length; i++) {
    const fromAbove = above.map((d) => deliveredCell(ctx, d, i)).filter((c): c is string => c !== null);
    const here = liveRows.includes(i);
    if (!here && fromAbove.length === 0) continue;
    live.push(i);
    const b = layout.block[i]! + 1;
    grid.set(row, layout.arriving[i]!, here ? f(`SUM(${a1(row, b)}:${a1(row + n - 1, b)})`) : 0);
    grid.set(row, layout.total[i]!, f(sumOf([a1(row, layout.arriving[i]!), ...fromAbove])));
  }
  const totalOf = (key: string): string => {
    const i = ch(ctx, key);
    return i !== undefined && live.includes(i) ? a1(row, layout.total[i]!) : "0";
  };
  const at = ch(ctx, "AT");
  if (at !== undefined) {
    const aboveFloors = above.map((d) => a1Absolute(ctx.places.get(d.from)!.row, layout.floors));
    // A level counts as a floor supported when floor live load (reducible or not) arrives there.
    const liveIndex = ch(ctx, "L");
    const here = liveIndex !== undefined && live.includes(liveIndex) ? `IF(${a1(row, layout.arriving[liveIndex]!)}>0,1,0)` : "0";
    const floorsAbove = aboveFloors.length === 0 ? "" : aboveFloors.length === 1 ? `+${aboveFloors[0]}` : `+MAX(${aboveFloors.join(",")})`;
    grid.set(row, layout.areaT, f(`MAX(0,${totalOf("AT")})`));
    grid.set(row, layout.floors, f(here + floorsAbove));
    grid.set(row, layout.kll, f(kllFormula(ctx, m, "column")));
    grid.set(row, layout.kllAt, f(`${a1(row, layout.kll)}*${a1(row, layout.areaT)}`));
    grid.set(row, layout.llr, f(writer.llrFactor(a1(row, layout.kll), a1(row, layout.areaT), `MAX(1,${a1(row, layout.floors)})`, ctx.model.units)));
    const llr = a1(row, layout.llr);
    const live_ = totalOf("L");
    const lred = totalOf("Lred");
    grid.set(row, layout.reducedLive, f(ctx.splitLive ? `${live_}-${lred}+${llr}*${lred}` : `${llr}*${live_}`));
  }
  const reduced = at !== undefined ? a1(row, layout.reducedLive) : totalOf("L");
  grid.set(row, layout.factored, f(writer.combine(totalOf("D"), reduced, totalOf("Lr"), totalOf("S"), totalOf("R"))));
  return { member: m.index, row, rows: n, live };
}

/**
 * A wall's own weight: wX (plf or kN/m of wall) x the wall's length, as a point load row (the
 * total, like a column's self weight over its height); null without wX cells or without a length.
 */
function wallWeightRow(ctx: Context, m: Member, length: string | null): LoadRow | null {
  const cases = Object.keys(m.extra) as LoadCase[];
  if (m.type !== "wall" || cases.length === 0 || length === null) return null;
  const mags = new Map<number, string>();
  for (const c of cases) mags.set(ch(ctx, c)!, toKips(ctx, `${inputRef(ctx, m.extra[c]!)}*(${length})`, false));
  return { kind: "point", source: `own weight: ${cases.map((c) => `w${c}`).join(", ")} × wall length`, from: null, to: null, mags };
}

/**
 * A wall's live load reduction, level by level like a column's (ASCE/SEI 7-22 Sec. 4.7): A_T is
 * the accumulated tributary area, floors counted as for columns. Table 4.7-2 lists no bearing wall,
 * so K_LL is never defaulted: a wall's live load is reduced only when its KLL cell holds a value
 * (Sec. 4.7.3, K_LL from an approved analysis); a blank KLL cell means no reduction (factor 1).
 * Written live: filling the KLL cell later reduces the wall's live load on the next recalculation.
 */
function writeWallReduction(ctx: Context, m: Member, row: number, live: readonly number[], above: readonly Delivery[]): void {
  const { grid, layout, writer } = ctx;
  const at = ch(ctx, "AT");
  if (at === undefined) return;
  const totalOf = (key: string): string => {
    const i = ch(ctx, key);
    return i !== undefined && live.includes(i) ? a1(row, layout.total[i]!) : "0";
  };
  const liveIndex = ch(ctx, "L");
  const fromAbove = (i: number): string[] => above.map((d) => deliveredCell(ctx, d, i)).filter((c): c is string => c !== null);
  // Floor live load arriving at this level: the total less what the walls above hand down.
  const here = liveIndex !== undefined && live.includes(liveIndex) ? `IF(${[totalOf("L"), ...fromAbove(liveIndex)].join("-")}>0.000000001,1,0)` : "0";
  const aboveFloors = above.map((d) => a1Absolute(ctx.places.get(d.from)!.row, layout.floors));
  const floorsAbove = aboveFloors.length === 0 ? "" : aboveFloors.length === 1 ? `+${aboveFloors[0]}` : `+MAX(${aboveFloors.join(",")})`;
  grid.set(row, layout.areaT, f(`MAX(0,${totalOf("AT")})`));
  grid.set(row, layout.floors, f(here + floorsAbove));
  const kll = a1(row, layout.kll);
  const none = "no reduction (KLL blank)";
  if (m.kll === null) {
    grid.set(row, layout.kll, none);
    grid.set(row, layout.llr, 1);
  } else {
    const cell = sheetCellRef(m.kll.cell);
    grid.set(row, layout.kll, f(`IF(${cell}="","${none}",${inputRef(ctx, m.kll.cell)})`));
    grid.set(row, layout.kllAt, f(`IF(${cell}="","",${kll}*${a1(row, layout.areaT)})`));
    grid.set(row, layout.llr, f(`IF(${cell}="",1,${writer.llrFactor(kll, a1(row, layout.areaT), `MAX(1,${a1(row, layout.floors)})`, ctx.model.units)})`));
  }
  const llr = a1(row, layout.llr);
  const lred = totalOf("Lred");
  grid.set(row, layout.reducedLive, f(ctx.splitLive ? `${totalOf("L")}-${lred}+${llr}*${lred}` : `${llr}*${totalOf("L")}`));
  grid.set(row, layout.factored, f(writer.combine(totalOf("D"), a1(row, layout.reducedLive), totalOf("Lr"), totalOf("S"), totalOf("R"))));
}

/**
 * A wall or foundation: what it receives, summed per channel (the reactions that close the path);
 * a wall also its own weight and, level by level like a column, its live load reduction and
 * factored load.
 */
function writeTerminal(ctx: Context, m: Member, row: number): MemberPlace {
  const { grid, layout } = ctx;
  const base = ctx.baseOf.get(m.index);
  writeIdentity(ctx, m, row);
  // The length the load is spread over: a wall on a beam, End at - Start at; else the Span cell (a
  // wall's or footing's length); a footing without one under a single wall, that wall's length.
  let length: string | null = null;
  if (base?.until !== undefined && base.at !== null) length = `${inputRef(ctx, base.until.cell)}-${inputRef(ctx, base.at.cell)}`;
  else if (m.span !== null && m.span.value !== null && m.span.value > 0) length = inputRef(ctx, m.span.cell);
  else {
    const walls = (ctx.into.get(m.index) ?? []).filter((d) => ctx.model.members[d.from]!.type === "wall");
    const only = walls.length === 1 && (ctx.into.get(m.index) ?? []).length === 1 ? ctx.places.get(walls[0]!.from) : undefined;
    if (only !== undefined && ctx.wallLengths.has(only.member)) length = a1Absolute(only.row, layout.wallLength);
  }
  const into = ctx.into.get(m.index) ?? [];
  const rows: LoadRow[] = into.map((d) => receivedRow(ctx, d, true));
  for (const p of ctx.loadsOn.get(m.index) ?? []) rows.push(extraLoadRow(ctx, p, row + rows.length, true));
  const own = wallWeightRow(ctx, m, length === null ? null : a1Absolute(row, layout.wallLength));
  if (own) rows.push(own);
  const n = Math.max(1, rows.length);
  const live = writeLoadRows(ctx, rows, row, row, false, true);
  for (const i of live) {
    const b = layout.block[i]! + 1;
    grid.set(row, layout.total[i]!, f(`SUM(${a1(row, b)}:${a1(row + n - 1, b)})`));
  }
  if (length !== null) {
    ctx.wallLengths.add(m.index);
    grid.set(row, layout.wallLength, f(length));
    for (const i of live) grid.set(row, layout.perLength[i]!, f(`${a1(row, layout.total[i]!)}/${a1(row, layout.wallLength)}`));
  }
  if (m.type === "wall") writeWallReduction(ctx, m, row, live, into.filter((d) => d.end === "base" && ctx.model.members[d.from]!.type === "wall"));
  return { member: m.index, row, rows: n, live };
}

/** Header lines: marker and title, caution, units, the balance, the column headers. */
function writeHeader(ctx: Context, title: string): { appliedRow: number; supportsRow: number; caseCols: number[]; headerRow: number } {
  const { grid, layout } = ctx;
  const u = RESULT_UNITS[ctx.model.units];
  grid.set(0, 0, title);
  grid.set(1, 0, CAUTION);
  const conv = ctx.model.units === "US" ? "inputs in ft, psf, plf and lb; psf × ft = plf and /1000 = kip/ft (lb/1000 = kip) in the formulas" : "inputs in m, kPa, kN/m and kN; kPa × m = kN/m";
  grid.set(
    2,
    0,
    `Units ${ctx.model.units}: lengths ${u.length}, line loads ${u.line}, forces ${u.force}, moments ${u.moment}, areas ${u.area} (${conv}). Gravity loads down +, reactions up +, sagging moment +. Positions are measured from each member's start end.`,
  );
  grid.set(3, 0, `Members in takedown order: each after every member it carries. Formulas by ${ctx.writer.name}. Rebuilt in place by the next takedown; edits here are lost.`);
  if (ctx.channelIndex.has("AT")) {
    grid.set(KLL_DEFAULTS.row, 0, "K_LL where the KLL cell is blank (ASCE/SEI 7-22 Table 4.7-2):");
    grid.set(KLL_DEFAULTS.row, KLL_DEFAULTS.flexural - 1, `beams: ${DEFAULT_ELEMENT.flexural}`);
    grid.set(KLL_DEFAULTS.row, KLL_DEFAULTS.flexural, f(ctx.writer.kllDefault(DEFAULT_ELEMENT.flexural)));
    grid.set(KLL_DEFAULTS.row, KLL_DEFAULTS.column - 1, `columns: ${DEFAULT_ELEMENT.column}`);
    grid.set(KLL_DEFAULTS.row, KLL_DEFAULTS.column, f(ctx.writer.kllDefault(DEFAULT_ELEMENT.column)));
  }
  const top = 5;
  grid.set(top, 0, `Load balance (${u.force})`);
  grid.set(top + 1, 0, "Applied");
  grid.set(top + 2, 0, "Foundations and walls");
  grid.set(top + 3, 0, "Difference");
  const caseCols = layout.cases.map((_, k) => 1 + k);
  layout.cases.forEach((c, k) => {
    grid.set(top, caseCols[k]!, c.label);
    grid.set(top + 3, caseCols[k]!, f(`${a1(top + 1, caseCols[k]!)}-${a1(top + 2, caseCols[k]!)}`));
  });
  const headerRow = top + 6;
  writeColumnHeaders(ctx, headerRow);
  return { appliedRow: top + 1, supportsRow: top + 2, caseCols, headerRow };
}

/** The two header lines above the member rows. */
function writeColumnHeaders(ctx: Context, row: number): void {
  const { grid, layout } = ctx;
  const u = RESULT_UNITS[ctx.model.units];
  const names: [number, string][] = [
    [COL.mark, "Mark"],
    [COL.type, "Type"],
    [COL.level, "Level"],
    [COL.length, `Length (${u.length})`],
    [COL.supports, `Supports at (${u.length})`],
    [COL.kind, "Load"],
    [COL.source, "Source"],
    [COL.width, `Trib or width (${u.length})`],
    [COL.from, `Start (${u.length})`],
    [COL.to, `End (${u.length})`],
    [COL.loaded, `Loaded length (${u.length})`],
  ];
  grid.set(row - 1, COL.mark, "Member");
  grid.set(row - 1, COL.kind, "Loads on the member");
  layout.channels.forEach((c: Channel, i) => {
    const b = layout.block[i]!;
    grid.set(row - 1, b, `${c.label} loads`);
    names.push([b, "kind"], [b + 1, `w (${c.lineUnit}) or P (${c.forceUnit})`], [b + 2, `start (${u.length})`], [b + 3, `end (${u.length})`]);
    if (layout.blockWidth > 4) names.push([b + 4, `w at end (${c.lineUnit})`]);
    names.push([layout.r1[i]!, `${c.label} R1 (${c.forceUnit})`], [layout.r2[i]!, `${c.label} R2 (${c.forceUnit})`]);
    names.push([layout.arriving[i]!, `${c.label} arriving (${c.forceUnit})`], [layout.total[i]!, `${c.label} total (${c.forceUnit})`]);
  });
  layout.cases.forEach((c, k) => names.push([layout.vMax[k]!, `${c.label} V max (${u.force})`], [layout.mMax[k]!, `${c.label} M max (${u.moment})`]));
  grid.set(row - 1, layout.r1[0] ?? 0, "Reactions at the first (R1) and last (R2) support; a continuous member's interior supports in R1 below its first row, in order");
  if (layout.vMax.length > 0) grid.set(row - 1, layout.vMax[0]!, "Shear and moment maxima");
  grid.set(row - 1, layout.arriving[0] ?? 0, "Columns: loads arriving at the level and totals; foundations and walls: totals");
  grid.set(row - 1, layout.areaT, "Live load reduction (ASCE/SEI 7-22 Sec. 4.7) and factored load (Sec. 2.3.1)");
  names.push(
    [layout.areaT, `A_T (${u.area})`],
    [layout.kll, "KLL"],
    [layout.floors, "Floors"],
    [layout.kllAt, `KLL·A_T (${u.area})`],
    [layout.llr, "LLR factor"],
    [layout.reducedLive, `L reduced (${u.force})`],
    [layout.factored, `Factored LRFD (${u.force})`],
    [layout.wallLength, `Wall length (${u.length})`],
  );
  grid.set(row - 1, layout.wallLength, "Walls and foundations: length and load per unit length");
  layout.channels.forEach((c: Channel, i) => names.push([layout.perLength[i]!, `${c.label} per length (${c.lineUnit})`]));
  const g = layout.governing;
  grid.set(
    row - 1,
    g.momentMax,
    "Governing LRFD values (ASCE/SEI 7-22 Sec. 2.3.1) over live load patterns (Sec. 4.3.3: L and Lr on or off span by span and on each overhang; D, S, R everywhere), each with its combination and pattern. L multiplied by the member's LLR factor when all its live load is reducible, else not reduced (conservative). Reactions: first support (a continuous member's interior supports below) and last.",
  );
  const governingNames: [number, string][] = [
    [g.momentMax, `M+ max (${u.moment})`],
    [g.momentMin, `M- max (${u.moment})`],
    [g.shearMax, `|V| max (${u.force})`],
    [g.reactionMaxFirst, `R1 max (${u.force})`],
    [g.reactionMaxLast, `R2 max (${u.force})`],
    [g.reactionMinFirst, `R1 min (${u.force})`],
    [g.reactionMinLast, `R2 min (${u.force})`],
  ];
  for (const [c, name] of governingNames) names.push([c, name], [c + 1, `${name.replace(/ \(.*\)$/, "")}: combination; pattern`]);
  const d = layout.deflection;
  if (d !== null) {
    const defl = ctx.model.units === "US" ? "in" : "mm";
    grid.set(
      row - 1,
      d.live,
      "Deflection (members with E): service live and total load under every live load pattern, each segment held to its span between supports / ratio, an overhang to twice its length / ratio; defaults L/360 live, L/240 total (common practice); ratio <= 1 passes",
    );
    names.push(
      [d.live, `Live deflection (${defl})`],
      [d.total, `Total deflection (${defl})`],
      [d.liveLimit, `Live allowable (${defl})`],
      [d.totalLimit, `Total allowable (${defl})`],
      [d.ratio, "Deflection ratio"],
      [d.requiredI, `Required I (${ctx.model.units === "US" ? "in⁴" : "mm⁴"})`],
    );
  }
  for (const [c, name] of names) grid.set(row, c, name);
}

/** The balance formulas, once every member row is known. */
function writeBalance(ctx: Context, b: { appliedRow: number; supportsRow: number; caseCols: number[] }, first: number, last: number, terminals: readonly MemberPlace[]): void {
  const { grid, layout } = ctx;
  layout.cases.forEach((c, k) => {
    const i = layout.channels.indexOf(c);
    const mag = columnLetter(layout.block[i]! + 1);
    const kind = columnLetter(COL.kind);
    const loaded = columnLetter(COL.loaded);
    const span = (col: string): string => `$${col}$${first + 1}:$${col}$${last + 1}`;
    const magRange = `${mag}$${first + 1}:${mag}$${last + 1}`;
    grid.set(b.appliedRow, b.caseCols[k]!, f(last < first ? "0" : `SUMPRODUCT(${span(loaded)},${magRange})+SUMIF(${span(kind)},"point",${magRange})`));
    const t = columnLetter(layout.total[i]!);
    const tFirst = terminals[0];
    const tLast = terminals[terminals.length - 1];
    grid.set(b.supportsRow, b.caseCols[k]!, f(tFirst && tLast ? `SUM(${t}$${tFirst.row + 1}:${t}$${tLast.row + tLast.rows})` : "0"));
  });
}

/** Whether live load must be carried in two parts: some live load on the members is not reducible. */
function needsSplitLive(model: TakedownModel, order: readonly number[], loads: readonly PlacedLoad[]): boolean {
  if (!model.cases.includes("L")) return false;
  const fixedLive = (z: Zone | null): boolean => z !== null && z.loadCells.L !== undefined && !z.reducible;
  const onMembers = order.some((i) => {
    const m = model.members[i]!;
    return m.extra.L !== undefined || (isFlexural(m.type) && fixedLive(m.zone));
  });
  return onMembers || loads.some((p) => p.load.loadCase === "L" || (p.load.kind === "area" && fixedLive(p.load.zone)));
}

function groupBy<T>(items: readonly T[], key: (t: T) => number): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const t of items) {
    const k = key(t);
    const list = out.get(k);
    if (list) list.push(t);
    else out.set(k, [t]);
  }
  return out;
}

/**
 * Plan the generated sheet.
 * @param input - model, order, checked deliveries and loads, sheet name and title
 * @returns every cell of the sheet and where each member's results are
 */
export function planSheet(input: PlanInput): SheetPlan {
  const { model, order } = input;
  const position = new Map(order.map((m, i) => [m, i]));
  const deliveries = input.deliveries.filter((d) => position.has(d.from) && position.has(d.to));
  const along = (d: Delivery): number => (d.end === "start" ? 0 : d.end === "interior" ? (d.interior ?? 0) : Number.MAX_SAFE_INTEGER);
  const into = groupBy([...deliveries].sort((a, b) => position.get(a.from)! - position.get(b.from)! || along(a) - along(b)), (d) => d.to);
  const loadsOn = groupBy(
    input.placedLoads.filter((p) => position.has(p.member)),
    (p) => p.member,
  );
  const splitLive = needsSplitLive(model, order, input.placedLoads.filter((p) => position.has(p.member)));
  const channels = channelsOf(model.cases, splitLive, model.units);
  const deflection = order.some((i) => {
    const m = model.members[i]!;
    return isFlexural(m.type) && m.deflection?.E != null;
  });
  const trapezoids = input.placedLoads.some((p) => position.has(p.member) && isTrapezoid(p.load));
  const layout = layoutOf(channels, model.units, deflection, trapezoids);
  const ctx: Context = {
    model,
    layout,
    writer: input.writer ?? ADD_IN_WRITER,
    grid: new Grid(),
    splitLive,
    channelIndex: new Map(channels.map((c, i) => [c.key, i])),
    places: new Map(),
    into,
    loadsOn,
    interiors: input.interiors ?? new Map(),
    valueOnly: [],
    baseOf: new Map(deliveries.filter((d) => model.members[d.from]!.type === "wall").map((d) => [d.from, d])),
    wallLengths: new Set(),
    reducibleLive: new Set(),
  };
  const balance = writeHeader(ctx, input.title);
  let row = balance.headerRow + 1;
  const first = row;
  const places: MemberPlace[] = [];
  for (const index of order) {
    const m = model.members[index]!;
    const place = isFlexural(m.type) ? writeFlexural(ctx, m, row) : isTerminal(m.type) ? writeTerminal(ctx, m, row) : writeColumn(ctx, m, row);
    ctx.places.set(index, place);
    places.push(place);
    row += place.rows;
  }
  writeBalance(
    ctx,
    balance,
    first,
    row - 1,
    places.filter((p) => endsPath(model.members[p.member]!)),
  );
  return { sheet: input.sheet, cells: ctx.grid.rows, layout, places, balance, headerRow: balance.headerRow, valueOnly: ctx.valueOnly };
}
