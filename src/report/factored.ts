/**
 * Combination helpers of the report: the gravity LRFD combinations of ASCE/SEI 7-22 Sec. 2.3.1
 * (those without wind or seismic terms, as the column schedule uses them), a member's loads as the
 * beam engine takes them, and a combination's label with only the terms that act. The governing
 * value of each factored quantity of a beam, with its own combination and live load pattern,
 * comes from src/engine/takedown/member-envelope.ts.
 */
import type { BeamLoad } from "../engine/beam/types";
import { combinationsOf, type Combination, type CombinationTerm } from "../engine/loads/combinations";
import type { MemberLoads } from "../engine/takedown/member-loads";
import { memberGoverning, type MemberGoverning } from "../engine/takedown/member-envelope";
import type { Result } from "../engine/errors";

const governed = new WeakMap<MemberLoads, Result<MemberGoverning> | null>();

/**
 * A member's governing values (src/engine/takedown/member-envelope.ts), computed once per member
 * for the whole report (its section, the reaction summary and the check for numbers it cannot print).
 * @param member - a member's loads from the computed sheet
 */
export function memberGoverningCached(member: MemberLoads): Result<MemberGoverning> | null {
  if (!governed.has(member)) governed.set(member, memberGoverning(member));
  return governed.get(member)!;
}

/** The gravity combinations of ASCE/SEI 7-22 Sec. 2.3.1 (LRFD, without the 0.5L option): no W or E term. */
export function gravityCombinations(): Combination[] {
  return combinationsOf({ method: "LRFD", halfLive: false }).filter((c) => c.terms.every((t) => t.load !== "W" && t.load !== "E"));
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
