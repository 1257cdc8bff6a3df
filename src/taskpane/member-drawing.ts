/**
 * From a member's loads as the takedown sheet computed them (src/engine/takedown/member-loads.ts)
 * to the drawing's input (src/drawings): one load case unfactored, or the factored case that
 * governs one quantity (its ASCE/SEI 7-22 Sec. 2.3.1 combination, its live load pattern per
 * Sec. 4.3.3 and the member's live load reduction). Pure: no DOM, no workbook.
 */
import { isFlexural } from "../engine/takedown/model";
import type { ChannelKey } from "../engine/takedown/layout";
import type { AppliedLoad, MemberLoads } from "../engine/takedown/member-loads";
import type { LoadCase, UnitSystem } from "../engine/takedown/types";
import { SI_UNITS, US_UNITS, type DrawingUnits, type DrawnLineLoad, type DrawnPointLoad, type DrawnSupport, type MemberDrawing } from "../drawings/types";
import { formatLength, formatQuantity } from "../drawings/format";
import { governingCaption, governingOf, governingPieces, labelOnMember, memberGoverning, quantityName, type GoverningQuantity } from "../engine/takedown/member-envelope";

/** A load case the pane draws unfactored (factored cases are drawn by {@link governingDrawingOf}). */
export interface CaseChoice {
  /** Stable key for the selector: the case ("D"). */
  readonly key: string;
  /** What the drawing's title shows: "D". */
  readonly label: string;
  /** Factor 1 on the case itself. */
  readonly factors: Readonly<Partial<Record<LoadCase, number>>>;
}

/** Drawing units of a takedown's unit system. */
export function drawingUnitsOf(units: UnitSystem): DrawingUnits {
  return units === "SI" ? SI_UNITS : US_UNITS;
}

/** The takedown's load cases as choices, in the takedown's order. */
export function caseChoicesOf(cases: readonly LoadCase[]): CaseChoice[] {
  return cases.map((c) => ({ key: c, label: c, factors: { [c]: 1 } }));
}

/** Sum of factor x magnitude over the channels (NaN when a needed channel is not a number). */
export function combine(magnitudes: Readonly<Partial<Record<ChannelKey, number>>>, factors: Readonly<Partial<Record<ChannelKey, number>>>): number {
  let total = 0;
  for (const [key, f] of Object.entries(factors) as [ChannelKey, number][]) {
    const v = magnitudes[key];
    if (f !== 0 && v !== undefined) total += f * v;
  }
  return total;
}

/** A length as the report prints it (the shared formatter): at most two decimals, no exponent. */
const fmt = formatLength;

/** A zone row's name: the zone, with the extra line loads it includes ("OFFICE + wD", or "wD" alone). */
export function zoneText(zone: string | null, extras: readonly LoadCase[]): string {
  return [...(zone ? [zone] : []), ...extras.map((c) => `w${c}`)].join(" + ");
}

/** A Loads-table row's name: "BALCONY (Loads row 3)" for an area load, "Loads row 4" otherwise. */
export function loadsRowText(zone: string | null, row: number): string {
  return zone ? `${zone} (Loads row ${row})` : `Loads row ${row}`;
}

/**
 * Few words for where a line or point load comes from; a zone row names only the extra line
 * loads of cases the choice counts ("OFFICE + wD" under D, "OFFICE" under L).
 */
export function originText(load: AppliedLoad, factors: Readonly<Partial<Record<ChannelKey, number>>>): string {
  const o = load.origin;
  if (o.kind === "zone") return zoneText(o.zone, o.extras.filter((c) => (factors[c] ?? 0) !== 0));
  if (o.kind === "loadsRow") return loadsRowText(o.zone, o.row);
  if (o.kind === "selfWeight") return "self weight";
  return o.mark;
}

function supportLabel(s: MemberLoads["supports"][number], units: DrawingUnits): string {
  return s.at !== null && Number.isFinite(s.at) ? `${s.mark} @ ${fmt(s.at)} ${units.length}` : s.mark;
}

/**
 * The drawing of a beam, girder or joist under one load case, unfactored: its supports (labelled
 * with what holds it up), its line loads over their intervals and the reactions and point loads
 * it receives, each magnitude the sheet's value of that case (live load not reduced).
 * @param member - the member's loads from the computed takedown sheet
 * @param choice - a load case
 * @param units - the takedown's unit system
 * @returns the drawing, or null for a member that does not bend (column, wall, foundation) or has no length
 */
export function memberDrawingOf(member: MemberLoads, choice: CaseChoice, units: UnitSystem): MemberDrawing | null {
  if (!isFlexural(member.type) || member.length === null || !(member.length > 0)) return null;
  const u = drawingUnitsOf(units);
  const factors: Readonly<Partial<Record<ChannelKey, number>>> = choice.factors;
  const supports: DrawnSupport[] = member.supports.map((s) => ({ x: s.x ?? 0, type: "pin" as const, label: supportLabel(s, u) }));
  const lines: DrawnLineLoad[] = [];
  const points: DrawnPointLoad[] = [];
  for (const load of member.loads) {
    const w = combine(load.magnitudes, factors);
    if (w === 0 || load.start === null) continue;
    if (load.kind === "line") lines.push({ start: load.start, end: load.end ?? member.length, w1: w, w2: w, label: originText(load, factors) });
    else points.push({ x: load.start, p: w, from: originText(load, factors) });
  }
  return {
    mark: member.mark,
    memberType: member.type,
    level: member.level,
    span: member.length,
    units: u,
    supports,
    lines,
    points,
    moments: [],
    caseLabel: choice.label,
  };
}


/**
 * What the diagrams show: a load case unfactored (live load as computed, not reduced), or the
 * factored case that governs one quantity of a beam (its combination, live load pattern and
 * reduced live load; src/engine/takedown/member-envelope.ts).
 */
export type DiagramPick = { readonly kind: "case"; readonly loadCase: LoadCase } | { readonly kind: "governing"; readonly quantity: GoverningQuantity };

/** Key of a pick in the selector: the case ("D") or "q:momentMax", "q:reactionMin:1". */
export function pickKey(p: DiagramPick): string {
  if (p.kind === "case") return p.loadCase;
  const q = p.quantity;
  return q.kind === "reactionMax" || q.kind === "reactionMin" ? `q:${q.kind}:${q.support}` : `q:${q.kind}`;
}

/** The pick of a selector key (null for a key that names nothing). */
export function pickOf(key: string, cases: readonly LoadCase[]): DiagramPick | null {
  if ((cases as readonly string[]).includes(key)) return { kind: "case", loadCase: key as LoadCase };
  const m = /^q:(momentMax|momentMin|shearMax)$/.exec(key);
  if (m) return { kind: "governing", quantity: { kind: m[1] as "momentMax" | "momentMin" | "shearMax" } };
  const r = /^q:(reactionMax|reactionMin):(\d+)$/.exec(key);
  if (r) return { kind: "governing", quantity: { kind: r[1] as "reactionMax" | "reactionMin", support: Number(r[2]) } };
  return null;
}

/** A governing case drawn: the drawing, its caption and the governing value. */
export interface GoverningShown {
  readonly drawing: MemberDrawing;
  /** "M+ 5.15 kN·m at 1.89 m: 2.3.1 (2) 1.2D + 1.6L; L on span 1. Factored loads and results (LRFD)." */
  readonly caption: string;
  readonly value: number;
}

/**
 * The drawing of the factored case that governs a quantity of a beam, girder or joist: its loads
 * times the combination's factors, the reducible live load times L/Lo, a live case only on the
 * segments where the pattern has it on (a load whose live part is off there says so, "L off").
 * @param member - the member's loads from the computed takedown sheet
 * @param quantity - M+, M-, |V| or a reaction's max or min
 * @param units - the takedown's unit system
 * @returns the drawing and caption; null for a member that does not bend; an error message when the engine refuses the member
 */
export function governingDrawingOf(member: MemberLoads, quantity: GoverningQuantity, units: UnitSystem): GoverningShown | string | null {
  const g = memberGoverning(member);
  if (g === null) return null;
  if (!g.ok) return g.error.message;
  const value = governingOf(g.value.envelope, quantity);
  if (value === undefined) return `${member.mark} has no support ${"support" in quantity ? quantity.support + 1 : ""}.`;
  const u = drawingUnitsOf(units);
  const combination = g.value.combinations[value.combinationIndex]!;
  const factors = combination.factors as Readonly<Partial<Record<ChannelKey, number>>>;
  const lines: DrawnLineLoad[] = [];
  const points: DrawnPointLoad[] = [];
  for (const p of governingPieces(member, g.value, value)) {
    const origin = originText(p.load, factors);
    // The pattern first, so that a shortened label still says which live load is off.
    const label = p.off.length > 0 ? `${p.off.join(", ")} off${origin !== "" ? `: ${origin}` : ""}` : origin;
    if (p.load.kind === "line") lines.push({ start: p.start, end: p.end, w1: p.value, w2: p.value, label });
    else points.push({ x: p.start, p: p.value, from: label });
  }
  const moment = quantity.kind === "momentMax" || quantity.kind === "momentMin";
  const llr = member.liveReduction?.llrFactor;
  const reduced = g.value.present.includes("L") && member.reducibleLive !== null && llr !== undefined && Number.isFinite(llr) && llr < 1 && (factors.L ?? 0) !== 0;
  const at = quantity.kind === "reactionMax" || quantity.kind === "reactionMin" ? "" : ` at ${fmt(value.x)} ${u.length}`;
  const pattern = value.pattern === "no pattern" ? "" : `; ${value.pattern}`;
  const caption =
    `${quantityName(quantity)} ${formatQuantity(value.value, moment ? "moment" : "force")} ${moment ? u.moment : u.force}${at}: ` +
    `${labelOnMember(value.combination, g.value.present)}${pattern}. Factored loads and results (LRFD)${reduced ? `, L \u00D7 ${llr.toFixed(2)}` : ""}.`;
  const drawing: MemberDrawing = {
    mark: member.mark,
    memberType: member.type,
    level: member.level,
    span: member.length ?? Number.NaN,
    units: u,
    supports: member.supports.map((s) => ({ x: s.x ?? 0, type: "pin" as const, label: supportLabel(s, u) })),
    lines,
    points,
    moments: [],
    caseLabel: `${governingCaption(g.value, quantity)}${reduced ? `, L \u00D7 ${llr.toFixed(2)}` : ""}`,
  };
  return { drawing, caption, value: value.value };
}
