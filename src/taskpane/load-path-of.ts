/**
 * The load-path drawing's input (src/drawings/load-path-types.ts) filled from a built
 * takedown: upstream from the member's loads as the sheet computed them (the reactions it
 * receives, with the members they come from, and its zone loads and Loads-table rows as leaves),
 * downstream from the takedown's results (each support's own reactions, a column's cumulative
 * load, down to the foundations), under one load case, unfactored (live load not reduced: each
 * member reduces its own). Pure.
 */
import type { Delivery, Member, TakedownModel } from "../engine/takedown";
import { isFlexural } from "../engine/takedown/model";
import type { AppliedLoad, MemberLoads } from "../engine/takedown/member-loads";
import type { LoadCase } from "../engine/takedown/types";
import type { LoadPathBranch, LoadPathTree } from "../drawings/load-path-types";
import { formatLength } from "../drawings/format";
import type { TakedownJson } from "../workbook/takedown-api";
import { combine, drawingUnitsOf, originText, type CaseChoice } from "./member-drawing";

/** Levels followed at most (the drawing stops at 24 whatever it is given). */
const MAX_DEPTH = 24;

/** What the load path is read from. */
export interface LoadPathSource {
  readonly model: TakedownModel;
  readonly deliveries: readonly Delivery[];
  readonly json: TakedownJson;
  /** A member's loads from the computed sheet, or null when they were not read. */
  readonly loadsOf: (mark: string) => MemberLoads | null;
}

/** A length as the report prints it (the shared formatter): at most two decimals, no exponent. */
const fmt = formatLength;

function byMark(model: TakedownModel): Map<string, Member> {
  const out = new Map<string, Member>();
  for (const m of model.members) if (m.firstOfMark) out.set(m.mark, m);
  return out;
}

/**
 * Marks of the members upstream of `mark` (what it carries, what those carry...), nearest
 * first, at most `limit`: the members whose loads the load path needs read from the sheet.
 */
export function upstreamMarks(model: TakedownModel, deliveries: readonly Delivery[], mark: string, limit: number): string[] {
  const into = new Map<number, number[]>();
  for (const d of deliveries) into.set(d.to, [...(into.get(d.to) ?? []), d.from]);
  const start = byMark(model).get(mark);
  if (!start) return [];
  const seen = new Set<number>([start.index]);
  const queue = [start.index];
  const out: string[] = [];
  while (queue.length > 0 && out.length < limit) {
    for (const from of into.get(queue.shift()!) ?? []) {
      if (seen.has(from) || out.length >= limit) continue;
      seen.add(from);
      out.push(model.members[from]!.mark);
      queue.push(from);
    }
  }
  return out;
}

function leafOf(load: AppliedLoad, value: number, factors: CaseChoice["factors"], units: ReturnType<typeof drawingUnitsOf>): LoadPathBranch {
  const mark = originText(load, factors) || "line loads";
  const note = load.width !== null && Number.isFinite(load.width) ? `trib ${fmt(load.width)} ${units.length}` : undefined;
  return {
    mark,
    memberType: "zone",
    value,
    ...(load.kind === "line" ? { unit: units.lineLoad } : {}),
    ...(load.kind === "point" && load.start !== null ? { at: load.start } : {}),
    ...(note ? { note } : {}),
    children: [],
  };
}

function upstreamOf(source: LoadPathSource, member: MemberLoads, factors: CaseChoice["factors"], depth: number, seen: ReadonlySet<string>, units: ReturnType<typeof drawingUnitsOf>): LoadPathBranch[] {
  const out: LoadPathBranch[] = [];
  for (const load of member.loads) {
    const value = combine(load.magnitudes, factors);
    if (load.origin.kind !== "member") {
      if (value !== 0) out.push(leafOf(load, value, factors, units));
      continue;
    }
    const from = load.origin;
    const next = depth < MAX_DEPTH && !seen.has(from.mark) ? source.loadsOf(from.mark) : null;
    out.push({
      mark: from.mark,
      memberType: from.type,
      value,
      ...(load.start !== null ? { at: load.start } : {}),
      ...(from.end !== "base" ? { note: from.end } : {}),
      children: next ? upstreamOf(source, next, factors, depth + 1, new Set([...seen, from.mark]), units) : [],
    });
  }
  return out;
}

function factored(values: Readonly<Record<string, number>> | undefined, factors: CaseChoice["factors"]): number | undefined {
  if (!values) return undefined;
  let total = 0;
  for (const [c, f] of Object.entries(factors) as [LoadCase, number][]) total += f * (values[c] ?? 0);
  return total;
}

/** Where a member's reactions go, with that member's whole reactions (or a column's cumulative load). */
function below(source: LoadPathSource, members: ReadonlyMap<string, Member>, mark: string, factors: CaseChoice["factors"], depth: number, seen: ReadonlySet<string>): LoadPathBranch[] {
  const m = members.get(mark);
  if (!m || depth >= MAX_DEPTH || seen.has(mark)) return [];
  const next = new Set([...seen, mark]);
  const branch = (supportMark: string, value: number | undefined, note: string | undefined, at: number | null | undefined): LoadPathBranch => ({
    mark: supportMark,
    memberType: members.get(supportMark)?.type ?? "support",
    ...(value !== undefined ? { value } : {}),
    ...(at !== null && at !== undefined ? { at } : {}),
    ...(note ? { note } : {}),
    children: below(source, members, supportMark, factors, depth + 1, next),
  });
  if (isFlexural(m.type)) {
    const r = source.json.members[mark]?.reactions;
    const perEnd = (k: number): number | undefined => (r ? factored(Object.fromEntries(Object.entries(r).map(([c, v]) => [c, v[k] ?? 0])), factors) : undefined);
    return [
      ...(m.start.mark ? [branch(m.start.mark, perEnd(0), "start", m.start.at?.value)] : []),
      ...(m.end.mark ? [branch(m.end.mark, perEnd(1), "end", m.end.at?.value)] : []),
    ];
  }
  if (m.type === "column" && m.start.mark) return [branch(m.start.mark, factored(source.json.columns[mark]?.cumulative, factors), undefined, null)];
  return [];
}

/**
 * The load path of a member under one load case.
 * @param source - model, checked path, results, and members' loads read from the sheet
 * @param member - the member's loads
 * @param choice - the load case (unfactored, live load not reduced)
 */
export function loadPathOf(source: LoadPathSource, member: MemberLoads, choice: CaseChoice): LoadPathTree {
  const units = drawingUnitsOf(source.json.units);
  const members = byMark(source.model);
  const seen = new Set([member.mark]);
  const downstream: LoadPathBranch[] = [];
  const ends = isFlexural(member.type) ? member.supports : member.supports.slice(0, 1);
  ends.forEach((s, k) => {
    const per: Record<string, number> = {};
    for (const [c, v] of Object.entries(member.reactions)) per[c] = (v as readonly number[])[k] ?? 0;
    downstream.push({
      mark: s.mark,
      memberType: s.type ?? "support",
      value: factored(per, choice.factors)!,
      ...(s.at !== null ? { at: s.at } : {}),
      ...(s.end !== "base" ? { note: s.end } : {}),
      children: below(source, members, s.mark, choice.factors, 1, seen),
    });
  });
  return {
    mark: member.mark,
    memberType: member.type,
    level: member.level,
    caseLabel: choice.label,
    units: { force: units.force, length: units.length },
    upstream: upstreamOf(source, member, choice.factors, 1, seen, units),
    downstream,
  };
}
