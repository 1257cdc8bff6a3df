/**
 * Checks of the load path: every support named exists, is not the member itself, and (for a beam
 * or girder) is given a position that lies on it; every column stands on something. What passes
 * becomes a delivery: the reaction of one end of a member handed to the member that holds it.
 * Loads-table rows are checked against the member they name.
 */
import { a1 } from "./a1";
import { formatNumber } from "./cells";
import { isFlexural, isTerminal, memberLength, type ExtraLoad, type Member, type NumberInput, type SupportInput, type TakedownModel } from "./model";
import type { CellRef, Problem } from "./types";

/** Which end of the carried member a delivery comes from: a beam's start or end, a column's base. */
export type DeliveryEnd = "start" | "end" | "base";

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

/**
 * Check the supports of every valid member and the Loads rows.
 * @param model - the takedown model
 * @returns deliveries that hold, Loads rows placed on members, and every problem (cells named)
 */
export function checkPath(model: TakedownModel): CheckedPath {
  const problems: Problem[] = [];
  const byMark = new Map<string, Member>();
  for (const m of model.members) if (m.firstOfMark) byMark.set(m.mark, m);
  const deliveries: Delivery[] = [];
  for (const m of model.members) {
    if (!m.valid || isTerminal(m.type)) continue;
    const ends: [DeliveryEnd, SupportInput][] = isFlexural(m.type) ? [["start", m.start], ["end", m.end]] : [["base", m.start]];
    const held: Delivery[] = [];
    for (const [which, s] of ends) {
      const d = checkSupport(m, which, s, byMark, problems);
      if (d) held.push(d);
    }
    const samePoint = held.length === 2 ? samePointProblem(m, held[0]!, held[1]!, model) : null;
    if (samePoint) problems.push(samePoint);
    else deliveries.push(...held);
  }
  const placedLoads: PlacedLoad[] = [];
  for (const load of model.loads) {
    if (!load.valid) continue;
    const p = placeLoad(load, byMark, problems);
    if (p) placedLoads.push(p);
  }
  return { deliveries, placedLoads, problems };
}
