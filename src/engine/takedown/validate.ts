/**
 * Checks of the load path: every support named exists, is not the member itself, and (for a beam
 * or girder) is given a position that lies on it; every column stands on something. What passes
 * becomes a delivery: the reaction of one end of a member handed to the member that holds it.
 * Loads-table rows are checked against the member they name.
 */
import { a1 } from "./a1";
import { formatNumber } from "./cells";
import { solveBeam } from "../beam";
import { isFlexural, isTerminal, memberLength, type Bearing, type ExtraLoad, type Member, type NumberInput, type SupportInput, type TakedownModel } from "./model";
import type { CellRef, Problem } from "./types";

/**
 * Which support of the carried member a delivery comes from: a beam's start or end, an interior
 * support of a continuous member (a Bearings row), a column's base.
 */
export type DeliveryEnd = "start" | "end" | "interior" | "base";

/** The reaction of one end of a member, handed to the member that supports it. */
export interface Delivery {
  /** Index of the carried member. */
  readonly from: number;
  readonly end: DeliveryEnd;
  /** Index of the supporting member. */
  readonly to: number;
  /** Position along a supporting beam or girder (null for columns, walls and foundations). */
  readonly at: NumberInput | null;
  /** The support cell of the carried member (where a cycle through this delivery is reported). */
  readonly supportCell: CellRef | null;
  /** An interior support: its number among the member's interior supports, 1-based, in order along the member. */
  readonly interior?: number;
  /** A wall standing on a beam, girder or joist: where it ends along it (End at); it starts at `at`. */
  readonly until?: NumberInput;
}

/** An interior support of a continuous member, accepted. */
export interface InteriorSupport {
  readonly bearing: Bearing;
  /** Position along the member (the Bearings At cell). */
  readonly at: NumberInput;
}

/**
 * Text naming the support a delivery comes from, as the generated sheet's Source column shows it:
 * "B1 start", "B1 end", "C1 base", and "B1 support 2" for the first interior support (supports
 * numbered from 1 at the start support, in order along the member).
 */
export function deliveryLabel(mark: string, d: Delivery): string {
  return d.end === "interior" ? `${mark} support ${(d.interior ?? 0) + 1}` : `${mark} ${d.end}`;
}

/** A Loads-table row accepted, with the member it loads. */
export interface PlacedLoad {
  readonly load: ExtraLoad;
  readonly member: number;
}

/** The checked load path. */
export interface CheckedPath {
  readonly deliveries: readonly Delivery[];
  readonly placedLoads: readonly PlacedLoad[];
  readonly problems: readonly Problem[];
  /** Interior supports of each continuous member (by member index), in order along it. */
  readonly interiors: ReadonlyMap<number, readonly InteriorSupport[]>;
  /** Members left out because a Bearings row of theirs cannot be used (analysing them without it would be wrong). */
  readonly excluded: ReadonlySet<number>;
}

function problemAtCell(cell: CellRef | null, fallback: CellRef, code: Problem["code"], message: string, mark: string): Problem {
  const c = cell ?? fallback;
  return { code, message, sheet: c.sheet, cell: a1(c.row, c.col), mark };
}

/** Check one end's support and turn it into a delivery when it holds. */
function checkSupport(m: Member, which: DeliveryEnd, s: SupportInput, byMark: ReadonlyMap<string, Member>, problems: Problem[]): Delivery | null {
  const endName = which === "end" ? "End" : "Start";
  if (s.mark === "") {
    if (which === "base") problems.push(problemAtCell(s.cell, m.markCell, "columnWithoutBase", `${m.mark}: a column needs a base: give the column below or the foundation in Start support.`, m.mark));
    else problems.push(problemAtCell(s.cell, m.markCell, "unknownSupport", `${m.mark}: ${endName} support is blank; a ${m.type} needs a support at each end.`, m.mark));
    return null;
  }
  if (s.mark === m.mark) {
    problems.push(problemAtCell(s.cell, m.markCell, "selfSupport", `${m.mark} names itself as its ${endName.toLowerCase()} support.`, m.mark));
    return null;
  }
  const target = byMark.get(s.mark);
  if (target === undefined) {
    problems.push(problemAtCell(s.cell, m.markCell, "unknownSupport", `${m.mark}: ${endName} support "${s.mark}" is not a mark in the Members table.`, m.mark));
    return null;
  }
  if (!target.valid) return null; // the target's own problem is reported on its row
  if (!isFlexural(target.type)) return { from: m.index, end: which, to: target.index, at: null, supportCell: s.cell };
  const atName = `${endName} at`;
  if (s.at === null || s.at.value === null) {
    problems.push(problemAtCell(s.at?.cell ?? s.cell, m.markCell, "missingPosition", `${m.mark}: ${atName} is blank; give the position along ${target.mark} (a ${target.type}) where ${m.mark} bears.`, m.mark));
    return null;
  }
  const length = memberLength(target);
  if (length !== null && (s.at.value < 0 || s.at.value > length)) {
    problems.push(
      problemAtCell(s.at.cell, m.markCell, "supportOutside", `${m.mark}: ${atName} ${formatNumber(s.at.value)} is outside ${target.mark}, which runs from 0 to ${formatNumber(length)}.`, m.mark),
    );
    return null;
  }
  return { from: m.index, end: which, to: target.index, at: s.at, supportCell: s.cell };
}

/**
 * What a wall bears on (its Start support): a wall below or a foundation take its total; a beam,
 * girder or joist takes it as a line load from Start at to End at; a column cannot carry a wall
 * (a wall's load is spread along its length). A blank Start support: the wall ends the path.
 */
function checkWallBase(m: Member, byMark: ReadonlyMap<string, Member>, problems: Problem[]): Delivery | null {
  const s = m.start;
  if (s.mark === "") return null;
  if (s.mark === m.mark) {
    problems.push(problemAtCell(s.cell, m.markCell, "selfSupport", `${m.mark} names itself as the member it bears on.`, m.mark));
    return null;
  }
  const target = byMark.get(s.mark);
  if (target === undefined) {
    problems.push(problemAtCell(s.cell, m.markCell, "unknownSupport", `${m.mark}: Start support "${s.mark}" (what the wall bears on) is not a mark in the Members table.`, m.mark));
    return null;
  }
  if (!target.valid) {
    // Left out for a problem of its own: without this the wall's load would vanish with no word but the balance's.
    problems.push(
      problemAtCell(s.cell, m.markCell, "unknownSupport", `${m.mark}: stands on ${target.mark}, which is left out of the takedown (see the problem naming it); ${m.mark}'s load reaches no foundation and is missing from the load balance until ${target.mark} is fixed.`, m.mark),
    );
    return null;
  }
  if (target.type === "column") {
    problems.push(
      problemAtCell(s.cell, m.markCell, "badValue", `${m.mark}: a wall cannot bear on column ${target.mark}; give the wall below, the beam, girder or joist under it (with Start at and End at), or its foundation.`, m.mark),
    );
    return null;
  }
  if (!isFlexural(target.type)) {
    // On a wall below or a foundation the load is spread along the length: a position has no meaning there.
    for (const [n, name] of [[s.at, "Start at"], [m.end.at, "End at"]] as const) {
      if (n !== null && n.value !== null) {
        problems.push(
          problemAtCell(n.cell, m.markCell, "badValue", `${m.mark}: ${name} ${formatNumber(n.value)} is not used: ${m.mark} bears on ${target.mark} (a ${target.type}), which takes its total spread along its length; Start at and End at place a wall on a beam, girder or joist. Leave ${name} blank.`, m.mark),
        );
      }
    }
    return { from: m.index, end: "base", to: target.index, at: null, supportCell: s.cell };
  }
  const a = s.at;
  const b = m.end.at;
  for (const [n, name] of [[a, "Start at"], [b, "End at"]] as const) {
    if (n === null || n.value === null) {
      problems.push(problemAtCell(n?.cell ?? s.cell, m.markCell, "missingPosition", `${m.mark}: ${name} is blank; a wall on ${target.mark} (a ${target.type}) needs Start at and End at, where it stands along ${target.mark}.`, m.mark));
      return null;
    }
  }
  const length = memberLength(target);
  for (const [n, name] of [[a!, "Start at"], [b!, "End at"]] as const) {
    if (length !== null && (n.value! < 0 || n.value! > length)) {
      problems.push(problemAtCell(n.cell, m.markCell, "supportOutside", `${m.mark}: ${name} ${formatNumber(n.value!)} is outside ${target.mark}, which runs from 0 to ${formatNumber(length)}.`, m.mark));
      return null;
    }
  }
  if (!(b!.value! > a!.value!)) {
    problems.push(problemAtCell(b!.cell, m.markCell, "badValue", `${m.mark}: End at ${formatNumber(b!.value!)} must be greater than Start at ${formatNumber(a!.value!)} (the wall stands from Start at to End at along ${target.mark}).`, m.mark));
    return null;
  }
  return { from: m.index, end: "base", to: target.index, at: a!, until: b!, supportCell: s.cell };
}

/**
 * Cells of a wall row that the takedown would otherwise pass over in silence: an End support (a
 * wall bears on one thing, its Start support), and an own weight wX with no length to multiply
 * (no Span and not standing on a beam between Start at and End at).
 */
function wallInputsUnused(m: Member, base: Delivery | null, problems: Problem[]): void {
  if (m.end.mark !== "") {
    problems.push(
      problemAtCell(m.end.cell, m.markCell, "badValue", `${m.mark}: End support "${m.end.mark}" is not used: a wall bears on one member, its Start support (the wall below, the beam under it, or its foundation). Leave End support blank.`, m.mark),
    );
  }
  const onBeam = base?.until !== undefined;
  const hasLength = onBeam || (m.span !== null && m.span.value !== null && m.span.value > 0);
  if (hasLength) return;
  for (const c of Object.keys(m.extra) as (keyof Member["extra"])[]) {
    problems.push(problemAtCell(m.extra[c]!, m.markCell, "badSpan", `${m.mark}: w${c} (own weight per unit length of wall) needs the wall's length: give it in Span, or stand the wall on a beam with Start at and End at.`, m.mark));
  }
}

/**
 * Both ends of a member on one point: the same column, or the same beam or girder at the same
 * position. (Both ends on one wall or foundation is a lintel or a grade beam, and holds.)
 */
function samePointProblem(m: Member, start: Delivery, end: Delivery, model: TakedownModel): Problem | null {
  if (start.to !== end.to) return null;
  const target = model.members[start.to]!;
  if (isTerminal(target.type)) return null;
  if (isFlexural(target.type) && start.at?.value !== end.at?.value) return null;
  const where = isFlexural(target.type) ? ` at ${formatNumber(start.at!.value!)}` : "";
  const cell = (isFlexural(target.type) ? end.at?.cell : null) ?? end.supportCell;
  return problemAtCell(
    cell,
    m.markCell,
    "badValue",
    `${m.mark}: Start support and End support are both ${target.mark}${where}: a member's two ends cannot bear on the same point (left out of the takedown's load path).`,
    m.mark,
  );
}

/** Check a Loads row against its member: the member exists, the kind suits it, the positions lie on it. */
function placeLoad(load: ExtraLoad, byMark: ReadonlyMap<string, Member>, problems: Problem[]): PlacedLoad | null {
  const label = `Loads row ${load.sheetRow} (${load.mark})`;
  const report = (cell: CellRef | null, message: string): null => {
    problems.push(problemAtCell(cell, load.markCell, "badValue", `${label}: ${message}`, load.mark));
    return null;
  };
  const m = byMark.get(load.mark);
  if (m === undefined) return report(load.markCell, `no member ${load.mark} in the Members table.`);
  if (!m.valid) return null;
  if (!isFlexural(m.type)) {
    return load.kind === "point" ? { load, member: m.index } : report(load.markCell, `a ${m.type} takes only point loads; put ${load.kind} loads on the beams it carries.`);
  }
  const length = memberLength(m);
  const outside = (n: NumberInput | null): boolean => n !== null && n.value !== null && length !== null && (n.value < 0 || n.value > length);
  if (load.kind === "point" && (load.from === null || load.from.value === null)) return report(load.from?.cell ?? load.markCell, `a point load needs From, its position along ${m.mark}.`);
  for (const n of [load.from, load.to]) {
    if (outside(n)) return report(n!.cell, `${formatNumber(n!.value!)} is outside ${m.mark}, which runs from 0 to ${formatNumber(length!)}.`);
  }
  return { load, member: m.index };
}

/** Start and end support positions of a flexural member at build time (overhangs included), or null. */
function endSupports(m: Member): [number, number] | null {
  const span = m.span?.value ?? null;
  if (span === null) return null;
  const s0 = m.startOverhang?.value ?? 0;
  return [s0, s0 + span];
}

/** The holder named by a Bearings row, checked like an end's support (exists, not the member, position on it). */
function bearingHolder(m: Member, b: Bearing, byMark: ReadonlyMap<string, Member>, excluded: ReadonlySet<number>, problems: Problem[]): { ok: true; target: Member } | { ok: false; blocking: boolean } {
  const label = `Bearings row ${b.sheetRow} (${m.mark})`;
  const s = b.support;
  if (s.mark === m.mark) {
    problems.push(problemAtCell(s.cell, b.markCell, "selfSupport", `${label}: ${m.mark} names itself as its support.`, m.mark));
    return { ok: false, blocking: true };
  }
  const target = byMark.get(s.mark);
  if (target === undefined) {
    problems.push(problemAtCell(s.cell, b.markCell, "unknownSupport", `${label}: Support "${s.mark}" is not a mark in the Members table.`, m.mark));
    return { ok: false, blocking: true };
  }
  if (!target.valid || excluded.has(target.index)) return { ok: false, blocking: true };
  if (!isFlexural(target.type)) {
    // A column takes the reaction at its top; a wall or footing spreads it along its length: a position along them has no effect.
    if (s.at !== null && s.at.value !== null) {
      const how = target.type === "column" ? "takes it at its top" : "spreads what it carries evenly along its length";
      problems.push(problemAtCell(s.at.cell, b.markCell, "badValue", `${label}: Support at ${formatNumber(s.at.value)} is not used: ${target.mark} is a ${target.type} and ${how}; leave Support at blank (it places a support along a beam, girder or joist).`, m.mark));
    }
    return { ok: true, target };
  }
  if (s.at === null || s.at.value === null) {
    problems.push(problemAtCell(s.at?.cell ?? s.cell, b.markCell, "missingPosition", `${label}: Support at is blank; give the position along ${target.mark} (a ${target.type}) where ${m.mark} bears.`, m.mark));
    return { ok: false, blocking: true };
  }
  const length = memberLength(target);
  if (length !== null && (s.at.value < 0 || s.at.value > length)) {
    problems.push(problemAtCell(s.at.cell, b.markCell, "supportOutside", `${label}: Support at ${formatNumber(s.at.value)} is outside ${target.mark}, which runs from 0 to ${formatNumber(length)}.`, m.mark));
    return { ok: false, blocking: true };
  }
  return { ok: true, target };
}

/**
 * The Bearings rows: each must name a beam, girder or joist of the Members table, lie strictly
 * between that member's end supports, bear on something that exists, and leave the member
 * solvable (the exact beam engine is asked, with the member's pins and a unit load). A member with
 * a Bearings row that cannot be used is left out of the takedown with the problem: analysing it
 * without a support the engineer placed would misstate every reaction.
 */
function checkBearings(model: TakedownModel, byMark: ReadonlyMap<string, Member>, problems: Problem[]): { interiors: Map<number, InteriorSupport[]>; holders: Map<Bearing, Member>; excluded: Set<number> } {
  const excluded = new Set<number>();
  const accepted = new Map<number, InteriorSupport[]>();
  const holders = new Map<Bearing, Member>();
  for (const b of model.bearings) {
    const m = byMark.get(b.mark);
    if (b.mark !== "" && m === undefined) {
      problems.push(problemAtCell(b.markCell, b.markCell, "unknownSupport", `Bearings row ${b.sheetRow}: no member ${b.mark} in the Members table.`, b.mark));
      continue;
    }
    if (m === undefined) continue;
    if (!b.valid) {
      excluded.add(m.index);
      continue;
    }
    if (!m.valid) continue;
    if (!isFlexural(m.type)) {
      problems.push(problemAtCell(b.markCell, b.markCell, "badValue", `Bearings row ${b.sheetRow}: ${m.mark} is a ${m.type}; only a beam, girder or joist is continuous over interior supports.`, m.mark));
      continue;
    }
    const ends = endSupports(m);
    const at = b.at!;
    const length = memberLength(m);
    if (ends === null || length === null) continue;
    if (at.value! <= ends[0] || at.value! >= ends[1]) {
      const where = at.value! < 0 || at.value! > length ? `outside ${m.mark}, which runs from 0 to ${formatNumber(length)}` : `not between ${m.mark}'s end supports (at ${formatNumber(ends[0])} and ${formatNumber(ends[1])})`;
      problems.push(problemAtCell(at.cell, b.markCell, "supportOutside", `Bearings row ${b.sheetRow}: At ${formatNumber(at.value!)} is ${where}; an interior support lies between the end supports (${m.mark} is left out).`, m.mark));
      excluded.add(m.index);
      continue;
    }
    const list = accepted.get(m.index) ?? [];
    list.push({ bearing: b, at });
    accepted.set(m.index, list);
  }
  for (const b of model.bearings) {
    const m = byMark.get(b.mark);
    if (m === undefined || !b.valid || !accepted.get(m.index)?.some((s) => s.bearing === b)) continue;
    const held = bearingHolder(m, b, byMark, excluded, problems);
    if (held.ok) holders.set(b, held.target);
    else if (held.blocking) excluded.add(m.index);
  }
  const interiors = new Map<number, InteriorSupport[]>();
  for (const [index, list] of accepted) {
    if (excluded.has(index)) continue;
    const m = model.members[index]!;
    const sorted = [...list].sort((a, b) => a.at.value! - b.at.value!);
    const ends = endSupports(m)!;
    const pins = [ends[0], ...sorted.map((s) => s.at.value!), ends[1]].map((x) => ({ x, type: "pin" as const }));
    const solved = solveBeam({ span: memberLength(m)!, supports: pins, loads: [{ kind: "line", start: 0, end: memberLength(m)!, w1: 1, w2: 1 }] });
    if (!solved.ok) {
      const clash = sorted.find((s, k) => s.at.value === (k === 0 ? ends[0] : sorted[k - 1]!.at.value) || s.at.value === ends[1]) ?? sorted[sorted.length - 1]!;
      problems.push(problemAtCell(clash.at.cell, clash.bearing.markCell, "unstable", `Bearings row ${clash.bearing.sheetRow}: ${m.mark}'s supports cannot hold it as one continuous member (${solved.error.message}); ${m.mark} is left out.`, m.mark));
      excluded.add(index);
      continue;
    }
    interiors.set(index, sorted);
  }
  return { interiors, holders, excluded };
}

/**
 * Check the supports of every valid member and the Loads rows.
 * @param model - the takedown model
 * @returns deliveries that hold, Loads rows placed on members, and every problem (cells named)
 */
export function checkPath(model: TakedownModel): CheckedPath {
  const problems: Problem[] = [];
  const byMark = new Map<string, Member>();
  for (const m of model.members) if (m.firstOfMark) byMark.set(m.mark, m);
  const bearings = checkBearings(model, byMark, problems);
  const { excluded, interiors } = bearings;
  const usable = new Map([...byMark].map(([k, m]) => [k, excluded.has(m.index) ? { ...m, valid: false } : m]));
  const deliveries: Delivery[] = [];
  for (const [index, list] of interiors) {
    list.forEach((s, k) => {
      const target = bearings.holders.get(s.bearing)!;
      deliveries.push({ from: index, end: "interior", to: target.index, at: isFlexural(target.type) ? s.bearing.support.at : null, supportCell: s.bearing.support.cell, interior: k + 1 });
    });
  }
  for (const m of model.members) {
    if (m.valid && m.type === "wall") {
      const d = checkWallBase(m, usable, problems);
      if (d) deliveries.push(d);
      wallInputsUnused(m, d, problems);
    }
    if (m.valid && m.type === "foundation") {
      for (const c of Object.keys(m.extra) as (keyof Member["extra"])[]) {
        problems.push(problemAtCell(m.extra[c]!, m.markCell, "badValue", `${m.mark}: w${c} is not used: a foundation's own weight bears on the soil and is not part of the takedown; leave w${c} blank (a load on the footing goes in the Loads table as a point load).`, m.mark));
      }
    }
    if (!m.valid || isTerminal(m.type) || excluded.has(m.index)) continue;
    const ends: [DeliveryEnd, SupportInput][] = isFlexural(m.type) ? [["start", m.start], ["end", m.end]] : [["base", m.start]];
    const held: Delivery[] = [];
    for (const [which, s] of ends) {
      const d = checkSupport(m, which, s, usable, problems);
      if (d) held.push(d);
    }
    const samePoint = held.length === 2 ? samePointProblem(m, held[0]!, held[1]!, model) : null;
    if (samePoint) problems.push(samePoint);
    else deliveries.push(...held);
  }
  const placedLoads: PlacedLoad[] = [];
  for (const load of model.loads) {
    if (!load.valid) continue;
    const p = placeLoad(load, usable, problems);
    if (p) placedLoads.push(p);
  }
  return { deliveries: deliveries.filter((d) => !excluded.has(d.to)), placedLoads, problems, interiors, excluded };
}
