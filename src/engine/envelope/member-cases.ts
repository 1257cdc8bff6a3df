/**
 * One member with its loads by load case, cut into pattern units, and the factored models of a
 * combination under a pattern. Shared by the strength envelope (envelope.ts) and the deflection
 * check (deflection-limits.ts).
 */
import { MAX_LOADS, solveBeam } from "../beam";
import type { BeamLoad, BeamModel, BeamSolution, Support } from "../beam/types";
import { fail, ok, type EngineError, type Result } from "../errors";
import { LOAD_CASES, type LoadCase } from "../loads/combinations";
import { factorOf, type FactoredCombination } from "./combination-sets";
import type { PatternUnit } from "./patterns";
import { loadDirection, memberSegments, scaleLoad, splitBySegment, type MemberSegment } from "./segments";

/** One member and its unfactored loads by case (beam engine conventions, consistent units). */
export interface MemberCases {
  /** Member length (length > 0). */
  readonly span: number;
  /** Supports anywhere on the member, pins or fixed, in any order (reactions come back in this order). */
  readonly supports: readonly Support[];
  /** Loads of each case: line loads force/length, point loads force, couples force x length; a missing case has none. */
  readonly loads: Readonly<Partial<Record<LoadCase, readonly BeamLoad[]>>>;
}

/** Which cases are applied segment by segment. */
export const DEFAULT_PATTERNED: readonly LoadCase[] = ["L", "Lr"];

/** A member ready for pattern loading. */
export interface PreparedMember {
  readonly member: MemberCases;
  readonly segments: readonly MemberSegment[];
  /** Cases that carry at least one load, in LOAD_CASES order. */
  readonly present: readonly LoadCase[];
  /** One unit per patterned case and segment that carries load. */
  readonly units: readonly PatternUnit[];
  /** Vertical reactions of each unit alone (unfactored, up +), in support order. */
  readonly unitReactions: readonly (readonly number[])[];
  /** Cases applied everywhere (not patterned) that carry load. */
  readonly fixed: readonly LoadCase[];
  /** Vertical reactions of each fixed case alone (unfactored, up +), same order as `fixed`. */
  readonly fixedReactions: readonly (readonly number[])[];
}

/** The error of one case's loads, its argument and message prefixed with the case ("L loads, row 2: ..."). */
function relabel(error: EngineError, load: LoadCase): Result<never> {
  return { ok: false, error: { ...error, argument: `${load} ${error.argument ?? "loads"}`, message: `${load} ${error.message}` } };
}

function reactionsOf(span: number, supports: readonly Support[], loads: readonly BeamLoad[]): readonly number[] {
  const r = solveBeam({ span, supports, loads });
  // The member was checked whole before it was cut, so its pieces solve too.
  return r.ok ? r.value.reactions : supports.map(() => NaN);
}

/**
 * Checks a member (the beam engine's checks: span, supports, every load of every case; errors name
 * the case, e.g. "L loads, row 2: ...") and cuts the patterned cases into units. Also fails with
 * `tooManyRows` when all cases together, cut at the supports, hold more than MAX_LOADS loads
 * (a factored model holds them all).
 * @param member - span, supports and loads by case
 * @param patterned - cases applied segment by segment (default L and Lr)
 */
export function prepareMember(member: MemberCases, patterned: readonly LoadCase[] = DEFAULT_PATTERNED): Result<PreparedMember> {
  const bare = solveBeam({ span: member.span, supports: member.supports, loads: [] });
  if (!bare.ok) return bare;
  const present: LoadCase[] = [];
  for (const load of LOAD_CASES) {
    const list = member.loads[load] ?? [];
    if (list.length === 0) continue;
    const check = solveBeam({ span: member.span, supports: member.supports, loads: list });
    if (!check.ok) return relabel(check.error, load);
    present.push(load);
  }
  const segs = memberSegments(member.span, member.supports);
  if (!segs.ok) return segs;
  const segments = segs.value;
  const units: PatternUnit[] = [];
  const fixed: LoadCase[] = [];
  for (const load of present) {
    if (!patterned.includes(load)) {
      fixed.push(load);
      continue;
    }
    splitBySegment(member.loads[load] ?? [], segments).forEach((loads, segment) => {
      if (loads.length > 0) units.push({ load, segment, loads, direction: loadDirection(loads) });
    });
  }
  const total = units.reduce((n, u) => n + u.loads.length, 0) + fixed.reduce((n, load) => n + (member.loads[load] ?? []).length, 0);
  if (total > MAX_LOADS) {
    return fail("tooManyRows", `${total} loads in all cases together (after cutting line loads at the supports); at most ${MAX_LOADS} are allowed.`, "loads");
  }
  const unitReactions = units.map((u) => reactionsOf(member.span, member.supports, u.loads));
  const fixedReactions = fixed.map((load) => reactionsOf(member.span, member.supports, member.loads[load] ?? []));
  return ok({ member, segments, present, units, unitReactions, fixed, fixedReactions });
}

/** The units that carry load under a combination (their case's factor is not 0), as indices into `units`. */
export function activeUnits(prepared: PreparedMember, combination: FactoredCombination): number[] {
  const out: number[] = [];
  prepared.units.forEach((u, k) => {
    if (factorOf(combination, u.load) !== 0) out.push(k);
  });
  return out;
}

/**
 * The factored model of a combination under a pattern: fixed cases everywhere, each active unit
 * where `on` says so, every load times its case's factor.
 * @param prepared - from {@link prepareMember}
 * @param combination - the load factors
 * @param active - indices of the active units (see {@link activeUnits})
 * @param on - one flag per active unit
 */
export function patternModel(prepared: PreparedMember, combination: FactoredCombination, active: readonly number[], on: readonly boolean[]): BeamModel {
  const loads: BeamLoad[] = [];
  for (const load of prepared.fixed) {
    const f = factorOf(combination, load);
    if (f !== 0) for (const l of prepared.member.loads[load] ?? []) loads.push(scaleLoad(l, f));
  }
  active.forEach((k, i) => {
    if (!on[i]) return;
    const u = prepared.units[k]!;
    const f = factorOf(combination, u.load);
    for (const l of u.loads) loads.push(scaleLoad(l, f));
  });
  return { span: prepared.member.span, supports: prepared.member.supports, loads };
}

/** Solves a model already checked by {@link prepareMember} (its pieces cannot fail). */
export function solveChecked(model: BeamModel): BeamSolution {
  const r = solveBeam(model);
  if (!r.ok) throw new Error(`internal: a checked member failed to solve: ${r.error.message}`);
  return r.value;
}
