/**
 * Factored loads of a beam, girder or joist under the gravity LRFD combinations of ASCE/SEI 7-22
 * Sec. 2.3.1 (those without wind or seismic terms), and the governing one. Each combination's
 * loads are the member's own loads, row by row, with each case's magnitude times its factor; the
 * reducible part of the live load is first multiplied by the member's live load reduction factor
 * (ASCE/SEI 7-22 Sec. 4.7). The factored member is then solved by the exact beam engine (loads
 * combine linearly, but the largest moment of the sum is not the sum of the largest moments, so
 * each combination is solved as a whole). The governing combination gives the largest bending
 * moment, sagging or hogging.
 */
import { solveBeam } from "../engine/beam/index";
import type { BeamLoad } from "../engine/beam/types";
import { combinationsOf, type Combination, type CombinationTerm } from "../engine/loads/combinations";
import type { AppliedLoad, MemberLoads } from "../engine/takedown/member-loads";
import type { LoadCase } from "../engine/takedown/types";

/** A member's factored results under one combination. */
export interface FactoredMember {
  /** "2.3.1 (2) 1.2D + 1.6L": the combination with only the terms that load this member. */
  readonly label: string;
  readonly combination: Combination;
  /** Terms acting on this member. */
  readonly terms: readonly CombinationTerm[];
  /** Factored magnitude of each of the member's loads (same order as its loads; kip/ft, kip). */
  readonly magnitudes: readonly number[];
  /** Reactions at the two supports (kip or kN, up +). */
  readonly reactions: readonly number[];
  /** Largest absolute shear. */
  readonly shearMax: number;
  /** Largest sagging moment (>= 0). */
  readonly momentMax: number;
  /** Most hogging moment (<= 0). */
  readonly momentMin: number;
}

/** The gravity combinations of ASCE/SEI 7-22 Sec. 2.3.1 (LRFD, without the 0.5L option): no W or E term. */
export function gravityCombinations(): Combination[] {
  return combinationsOf({ method: "LRFD", halfLive: false }).filter((c) => c.terms.every((t) => t.load !== "W" && t.load !== "E"));
}

/**
 * The effective magnitude of one case on a load: live load with its reducible part reduced.
 * @param load - one of the member's loads
 * @param c - the load case
 * @param member - the member (which channel carries reducible live load, and its factor)
 */
export function caseMagnitude(load: AppliedLoad, c: LoadCase, member: MemberLoads): number {
  const m = load.magnitudes[c] ?? 0;
  if (c !== "L" || member.reducibleLive === null) return m;
  const factor = member.liveReduction?.llrFactor ?? 1;
  const reducible = (member.reducibleLive === "Lred" ? load.magnitudes.Lred : load.magnitudes.L) ?? 0;
  return m - (1 - (Number.isFinite(factor) ? factor : 1)) * reducible;
}

/** The beam engine's loads of a member for given magnitudes (zero loads left out). */
export function beamLoadsOf(member: MemberLoads, magnitudes: readonly number[]): BeamLoad[] {
  const out: BeamLoad[] = [];
  member.loads.forEach((l, i) => {
    const w = magnitudes[i] ?? 0;
    if (w === 0 || l.start === null) return;
    if (l.kind === "line") out.push({ kind: "line", start: l.start, end: l.end ?? l.start, w1: w, w2: w });
    else out.push({ kind: "point", x: l.start, p: w });
  });
  return out;
}

/**
 * A combination's label with only some of its terms: "2.3.1 (2) 1.2D + 1.6L".
 * @param c - the combination
 * @param terms - the terms kept (those of cases that act)
 */
export function shortLabel(c: Combination, terms: readonly CombinationTerm[]): string {
  const body = terms.map((t, i) => (i === 0 ? t.text : ` + ${t.text}`)).join("");
  return `${c.section} (${c.number}) ${body === "" ? "no load" : body}`;
}

/**
 * One combination of a flexural member, solved exactly.
 * @param member - a beam, girder or joist with its length and two supports
 * @param combination - the combination
 * @returns the factored results, or null when the member cannot be solved (no length or supports)
 */
export function factoredMember(member: MemberLoads, combination: Combination): FactoredMember | null {
  const xs = member.supports.map((s) => s.x);
  if (member.length === null || !(member.length > 0) || xs.some((x) => x === null)) return null;
  const acting = (t: CombinationTerm): boolean => member.loads.some((l) => (l.magnitudes[t.load as LoadCase] ?? 0) !== 0);
  const terms = combination.terms.filter(acting);
  const magnitudes = member.loads.map((l) => combination.terms.reduce((s, t) => s + t.factor * caseMagnitude(l, t.load as LoadCase, member), 0));
  const solved = solveBeam({ span: member.length, supports: xs.map((x) => ({ x: x!, type: "pin" })), loads: beamLoadsOf(member, magnitudes) });
  if (!solved.ok) return null;
  const s = solved.value;
  return {
    label: shortLabel(combination, terms),
    combination,
    terms,
    magnitudes,
    reactions: s.reactions,
    shearMax: Math.abs(s.maxShear().value),
    momentMax: s.maxSagging().value,
    momentMin: s.maxHogging().value,
  };
}

/**
 * The governing gravity combination of a flexural member: the largest bending moment (sagging
 * or hogging); ties go to the first combination in the standard's order.
 * @param member - a beam, girder or joist
 * @returns the governing combination's results, or null when the member cannot be solved
 */
export function governingCombination(member: MemberLoads): FactoredMember | null {
  let best: FactoredMember | null = null;
  let bestMoment = -1;
  for (const c of gravityCombinations()) {
    const f = factoredMember(member, c);
    if (f === null) return null;
    const moment = Math.max(f.momentMax, -f.momentMin);
    if (moment > bestMoment * (1 + 1e-12)) {
      best = f;
      bestMoment = moment;
    }
  }
  return best;
}
