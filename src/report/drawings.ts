/**
 * The drawings of a member in the report, filled from the member's loads as the takedown sheet
 * computed them (src/engine/takedown/member-loads.ts): the member sheet (free-body, shear and
 * moment diagrams) of one load case or factored combination, and the load-path tree of one case.
 * The SVG itself comes from the shared pure renderers (src/drawings), the same ones the pane uses.
 */
import type { AppliedLoad, MemberLoads, MemberSupport } from "../engine/takedown/member-loads";
import type { GoverningPiece } from "../engine/takedown/member-envelope";
import { isFlexural, type MemberType } from "../engine/takedown/model";
import type { LoadCase, UnitSystem } from "../engine/takedown/types";
import { formatLength } from "../drawings/format";
import type { LoadPathBranch, LoadPathTree } from "../drawings/load-path-types";
import { SI_UNITS, US_UNITS, type DrawingUnits, type DrawnLineLoad, type DrawnPointLoad, type MemberDrawing } from "../drawings/types";

/** Drawing units of a takedown's unit system. */
export function drawingUnits(units: UnitSystem): DrawingUnits {
  return units === "US" ? US_UNITS : SI_UNITS;
}

/** What holds a member up, as written under a support: "G-2 @ 12.5 ft" or "C-4". */
export function supportLabel(s: MemberSupport, lengthUnit: string): string {
  return s.at === null ? s.mark : `${s.mark} @ ${formatLength(s.at)} ${lengthUnit}`;
}

/** A short name of where a load comes from: the zone, "wD", "Loads row 7", the member's mark. */
export function originLabel(l: AppliedLoad): string {
  const o = l.origin;
  switch (o.kind) {
    case "zone":
      return o.zone ?? o.extras.map((c) => `w${c}`).join(" + ");
    case "loadsRow":
      return `${o.zone ?? o.loadCase ?? ""} row ${o.row}`.trim();
    case "member":
      return o.mark;
    case "selfWeight":
      return "self weight";
  }
}

/**
 * The member sheet input of a flexural member for given magnitudes of its loads.
 * @param member - a beam, girder or joist
 * @param units - the takedown's unit system
 * @param caseLabel - the case or combination shown ("D", "2.3.1 (2) 1.2D + 1.6L")
 * @param magnitudes - magnitude of each of the member's loads, in its order (kip/ft or kip)
 */
export function memberDrawing(member: MemberLoads, units: UnitSystem, caseLabel: string, magnitudes: readonly number[]): MemberDrawing {
  const lines: DrawnLineLoad[] = [];
  const points: DrawnPointLoad[] = [];
  member.loads.forEach((l, i) => {
    const w = magnitudes[i] ?? 0;
    if (w === 0 || l.start === null) return;
    if (l.kind === "line") lines.push({ start: l.start, end: l.end ?? l.start, w1: w, w2: w, label: originLabel(l) });
    else points.push({ x: l.start, p: w, from: originLabel(l) });
  });
  return drawingOf(member, units, caseLabel, lines, points);
}

/**
 * The member sheet input of a governing case: its factored pieces (src/engine/takedown/
 * member-envelope.ts), each labelled with where its load comes from and, where the pattern has a
 * live case off, that first ("L off: BALCONY row 3").
 * @param member - a beam, girder or joist
 * @param units - the takedown's unit system
 * @param caption - the governing case ("M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on span 1 (factored)")
 * @param pieces - the factored loads of that case
 */
export function governingDrawing(member: MemberLoads, units: UnitSystem, caption: string, pieces: readonly GoverningPiece[]): MemberDrawing {
  const lines: DrawnLineLoad[] = [];
  const points: DrawnPointLoad[] = [];
  for (const p of pieces) {
    // The pattern first, so that a shortened label still says which live load is off.
    const label = p.off.length > 0 ? `${p.off.join(", ")} off: ${originLabel(p.load)}` : originLabel(p.load);
    if (p.load.kind === "line") lines.push({ start: p.start, end: p.end, w1: p.value, w2: p.value, label });
    else points.push({ x: p.start, p: p.value, from: label });
  }
  return drawingOf(member, units, caption, lines, points);
}

function drawingOf(member: MemberLoads, units: UnitSystem, caseLabel: string, lines: DrawnLineLoad[], points: DrawnPointLoad[]): MemberDrawing {
  const u = drawingUnits(units);
  return {
    mark: member.mark,
    memberType: member.type,
    ...(member.level !== "" ? { level: member.level } : {}),
    span: member.length ?? Number.NaN,
    units: u,
    supports: member.supports.map((s) => ({ x: s.x ?? Number.NaN, type: "pin" as const, label: supportLabel(s, u.length) })),
    lines,
    points,
    moments: [],
    caseLabel,
  };
}

/** Magnitudes of one case on each of a member's loads. */
export function caseMagnitudes(member: MemberLoads, c: LoadCase): number[] {
  return member.loads.map((l) => l.magnitudes[c] ?? 0);
}

/** Most nodes built into one tree (the renderer shows at most 40 rows a side and summarises the rest). */
const NODE_BUDGET = 4000;
/** Deepest level followed (the renderer stops at 24). */
const DEPTH = 24;

interface Budget {
  left: number;
}

function leafOf(l: AppliedLoad, c: LoadCase, units: UnitSystem, memberLength: number | null): LoadPathBranch | null {
  const value = l.magnitudes[c] ?? 0;
  if (value === 0) return null;
  const u = drawingUnits(units);
  const memberType = l.origin.kind === "zone" && l.origin.zone !== null ? "zone" : l.origin.kind === "loadsRow" && l.origin.zone !== null ? "zone" : "load";
  const partial = l.kind === "line" && l.start !== null && l.end !== null && !(l.start === 0 && l.end === memberLength);
  const where = partial ? `${formatLength(l.start!)}-${formatLength(l.end!)} ${u.length}` : undefined;
  const width = l.width !== null ? `trib ${formatLength(l.width)} ${u.length}` : undefined;
  const note = [width, where].filter((s) => s !== undefined).join(", ");
  return {
    mark: originLabel(l),
    memberType,
    value,
    ...(l.kind === "line" ? { unit: u.lineLoad } : {}),
    ...(l.kind !== "line" && l.start !== null ? { at: l.start } : {}),
    ...(note !== "" ? { note } : {}),
    children: [],
  };
}

function upstream(all: ReadonlyMap<string, MemberLoads>, member: MemberLoads, c: LoadCase, units: UnitSystem, depth: number, budget: Budget): LoadPathBranch[] {
  if (depth > DEPTH) return [];
  const out: LoadPathBranch[] = [];
  for (const l of member.loads) {
    if (budget.left <= 0) break;
    if (l.origin.kind !== "member") {
      const leaf = leafOf(l, c, units, member.length);
      if (leaf) {
        budget.left--;
        out.push(leaf);
      }
      continue;
    }
    budget.left--;
    const from = all.get(l.origin.mark);
    out.push({
      mark: l.origin.mark,
      memberType: l.origin.type,
      value: l.magnitudes[c] ?? 0,
      ...(l.start !== null ? { at: l.start } : {}),
      note: l.origin.end,
      children: from ? upstream(all, from, c, units, depth + 1, budget) : [],
    });
  }
  return out;
}

function downstream(all: ReadonlyMap<string, MemberLoads>, member: MemberLoads, c: LoadCase, depth: number, budget: Budget): LoadPathBranch[] {
  if (depth > DEPTH) return [];
  const reactions = member.reactions[c] ?? [];
  return member.supports.flatMap((s, k) => {
    if (budget.left <= 0) return [];
    budget.left--;
    const target = all.get(s.mark);
    const type: MemberType | "support" = s.type ?? "support";
    return [
      {
        mark: s.mark,
        memberType: type,
        value: reactions[k] ?? 0,
        ...(s.at !== null ? { at: s.at } : {}),
        ...(isFlexural(member.type) ? { note: s.end } : {}),
        children: target ? downstream(all, target, c, depth + 1, budget) : [],
      },
    ];
  });
}

/**
 * The load path of a member under one case: what it carries (members, then zones and loads)
 * and where its reactions go, down to the foundations.
 * @param all - every member's loads (from loadsOfMembers)
 * @param mark - the member at the centre
 * @param c - the load case
 * @param units - the takedown's unit system
 */
export function loadPathTree(all: ReadonlyMap<string, MemberLoads>, mark: string, c: LoadCase, units: UnitSystem): LoadPathTree | null {
  const member = all.get(mark);
  if (member === undefined) return null;
  const u = drawingUnits(units);
  const budget: Budget = { left: NODE_BUDGET };
  return {
    mark,
    memberType: member.type,
    ...(member.level !== "" ? { level: member.level } : {}),
    caseLabel: c,
    units: { force: u.force, length: u.length },
    upstream: upstream(all, member, c, units, 1, budget),
    downstream: downstream(all, member, c, 1, budget),
  };
}
