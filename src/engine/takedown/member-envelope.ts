/**
 * The governing factored values of one beam, girder or joist of a built takedown, from its loads
 * as the takedown sheet computed them (member-loads.ts): each case's loads, with the reducible
 * live load times the member's factor L/Lo (ASCE/SEI 7-22 Sec. 4.7), go to the envelope engine
 * (src/engine/envelope: every combination, L and Lr switched on and off span by span per
 * ASCE/SEI 7-22 Sec. 4.3.3), which gives M+, M-, |V| and each reaction's largest and smallest
 * value with its own combination and pattern. The factored loads of one governing case are then
 * cut into the pieces a drawing shows (a load whose live part is off on a segment is drawn
 * there with its other cases only). Pure; units those of the takedown (kip, ft or kN, m).
 */
import type { BeamLoad, BeamModel, Support } from "../beam/types";
import { builtInCombinations, DEFAULT_PATTERNED, envelope, factorOf, governingModel, memberSegments, type Envelope, type FactoredCombination, type Governing, type MemberCases, type MemberSegment } from "../envelope";
import { segmentAt } from "../envelope/segments";
import type { Result } from "../errors";
import type { LoadCase as CombinationCase } from "../loads/combinations";
import { isFlexural } from "./model";
import type { AppliedLoad, MemberLoads } from "./member-loads";
import { LOAD_CASES, type LoadCase } from "./types";

/** The combinations the takedown's governing values use: ASCE/SEI 7-22 Sec. 2.3.1 and 2.3.6 (LRFD), without the 0.5L option. */
export function takedownCombinations(): FactoredCombination[] {
  return builtInCombinations({ method: "LRFD", halfLive: false });
}

/** The cases applied span by span (ASCE/SEI 7-22 Sec. 4.3.3): L and Lr. */
export const PATTERNED_CASES: readonly LoadCase[] = DEFAULT_PATTERNED.filter((c): c is LoadCase => (LOAD_CASES as readonly string[]).includes(c));

/**
 * The magnitude of one case on a load as it enters a combination: the live load with its
 * reducible part times the member's L/Lo (ASCE/SEI 7-22 Sec. 4.7); other cases as computed.
 * @param load - one of the member's loads
 * @param c - the load case
 * @param member - the member (which channel carries reducible live load, and its factor)
 */
export function effectiveMagnitude(load: AppliedLoad, c: LoadCase, member: MemberLoads): number {
  const m = load.magnitudes[c] ?? 0;
  if (c !== "L" || member.reducibleLive === null) return m;
  const factor = member.liveReduction?.llrFactor ?? 1;
  const reducible = (member.reducibleLive === "Lred" ? load.magnitudes.Lred : load.magnitudes.L) ?? 0;
  return m - (1 - (Number.isFinite(factor) ? factor : 1)) * reducible;
}

function beamLoad(l: AppliedLoad, w: number): BeamLoad | null {
  if (w === 0 || l.start === null) return null;
  if (l.kind === "line") return { kind: "line", start: l.start, end: l.end ?? l.start, w1: w, w2: w };
  return { kind: "point", x: l.start, p: w };
}

/**
 * The member as the envelope takes it: length, pinned supports in order, each case's loads (live
 * load reduced). Null for a member that does not bend or whose length or a support position is
 * not a number.
 * @param member - a member's loads from the computed sheet
 */
export function memberCasesOf(member: MemberLoads): MemberCases | null {
  if (!isFlexural(member.type) || member.length === null || !(member.length > 0)) return null;
  const supports: Support[] = [];
  for (const s of member.supports) {
    if (s.x === null || !Number.isFinite(s.x)) return null;
    supports.push({ x: s.x, type: "pin" });
  }
  const loads: Partial<Record<CombinationCase, BeamLoad[]>> = {};
  for (const c of LOAD_CASES) {
    const list = member.loads.map((l) => beamLoad(l, effectiveMagnitude(l, c, member))).filter((l): l is BeamLoad => l !== null);
    if (list.length > 0) loads[c] = list;
  }
  return { span: member.length, supports, loads };
}

/** The governing values of a member and what they were found from. */
export interface MemberGoverning {
  readonly cases: MemberCases;
  readonly combinations: readonly FactoredCombination[];
  readonly envelope: Envelope;
  /** Cases that put load on the member. */
  readonly present: readonly LoadCase[];
}

/**
 * The governing values of a beam, girder or joist (see the module comment).
 * @param member - a member's loads from the computed sheet
 * @param combinations - the combination list (default {@link takedownCombinations})
 * @returns null for a member that does not bend or cannot be placed; the envelope's error for a
 *   member the beam engine refuses (its message names the case)
 */
export function memberGoverning(member: MemberLoads, combinations: readonly FactoredCombination[] = takedownCombinations()): Result<MemberGoverning> | null {
  const cases = memberCasesOf(member);
  if (cases === null) return null;
  const env = envelope(cases, combinations, { patterned: PATTERNED_CASES });
  if (!env.ok) return env;
  const present = LOAD_CASES.filter((c) => (cases.loads[c] ?? []).length > 0);
  return { ok: true, value: { cases, combinations, envelope: env.value, present } };
}

/** The factored member of one governing value (the engine's own model, for checks and solutions). */
export function governingBeamModel(g: MemberGoverning, governing: Governing): Result<BeamModel> {
  return governingModel(g.cases, g.combinations, governing, { patterned: PATTERNED_CASES });
}

/**
 * A combination's label with only the terms of cases that load the member:
 * "2.3.1 (2) 1.2D + 1.6L + 0.5Lr" reads "2.3.1 (2) 1.2D + 1.6L" on a floor joist, and
 * "2.3.1 (5) 0.9D + 1.0W" reads "2.3.1 (5) 0.9D" on a member without wind load. A label whose
 * terms cannot be read (a firm's own wording) is kept whole.
 * @param label - the combination's label
 * @param present - the cases that load the member
 */
export function labelOnMember(label: string, present: readonly LoadCase[]): string {
  const m = /^(\S+ \(\d+\)) (.+)$/.exec(label);
  if (!m) return label;
  const parts = m[2]!.split(/ (?=[+-] )/);
  const terms = parts.map((p, i) => {
    const sign = i === 0 ? "" : p.slice(0, 1);
    const body = i === 0 ? p : p.slice(2);
    const c = /(Lr|D|L|S|R|W|E)$/.exec(body)?.[1];
    return { sign, body, c };
  });
  if (terms.some((t) => t.c === undefined)) return label;
  const kept = terms.filter((t) => (present as readonly string[]).includes(t.c!));
  if (kept.length === 0) return label;
  const text = kept.map((t, i) => (i === 0 ? (t.sign === "-" ? `-${t.body}` : t.body) : ` ${t.sign} ${t.body}`)).join("");
  return `${m[1]} ${text}`;
}

/** One factored load of a governing case as a drawing shows it. */
export interface GoverningPiece {
  /** The member's load it is part of. */
  readonly load: AppliedLoad;
  /** Index of that load among the member's loads. */
  readonly index: number;
  /** Start of a line piece, position of a point load (length). */
  readonly start: number;
  /** End of a line piece (length); equal to start for a point load. */
  readonly end: number;
  /** Factored magnitude (force/length for line pieces, force for point loads). */
  readonly value: number;
  /** Patterned cases this load carries that are off on this piece (they are left out of its value). */
  readonly off: readonly LoadCase[];
}

/**
 * The factored loads of a governing case, load by load: each case's magnitude (live load
 * reduced) times the combination's factor, a patterned case only on the segments where the
 * pattern has it on. A line load is cut where the pattern changes along it; a piece that carries
 * nothing is left out. The pieces add up to the engine's {@link governingBeamModel}.
 * @param member - the member's loads
 * @param g - its governing values
 * @param governing - the value whose case is drawn
 */
export function governingPieces(member: MemberLoads, g: MemberGoverning, governing: Governing): GoverningPiece[] {
  const combination = g.combinations[governing.combinationIndex];
  const segs = memberSegments(g.cases.span, g.cases.supports);
  if (combination === undefined || !segs.ok) return [];
  const segments: readonly MemberSegment[] = segs.value;
  const isOn = (c: LoadCase, segment: number): boolean => !PATTERNED_CASES.includes(c) || (governing.on[c] ?? []).includes(segment);
  /** Value on one segment and the patterned cases off there. */
  const on = (l: AppliedLoad, segment: number): { value: number; off: LoadCase[] } => {
    let value = 0;
    const off: LoadCase[] = [];
    for (const c of LOAD_CASES) {
      const f = factorOf(combination, c);
      const w = effectiveMagnitude(l, c, member);
      if (f === 0 || w === 0) continue;
      if (isOn(c, segment)) value += f * w;
      else off.push(c);
    }
    return { value, off };
  };
  const out: GoverningPiece[] = [];
  member.loads.forEach((l, index) => {
    if (l.start === null) return;
    if (l.kind !== "line") {
      const v = on(l, segmentAt(segments, l.start));
      if (v.value !== 0) out.push({ load: l, index, start: l.start, end: l.start, value: v.value, off: v.off });
      return;
    }
    const end = l.end ?? l.start;
    let current: { start: number; end: number; value: number; off: LoadCase[] } | null = null;
    for (const s of segments) {
      const a = Math.max(l.start, s.start);
      const b = Math.min(end, s.end);
      if (!(b > a)) continue;
      const v = on(l, s.index);
      if (current !== null && current.value === v.value && current.off.join() === v.off.join()) current.end = b;
      else {
        if (current !== null && current.value !== 0) out.push({ load: l, index, ...current });
        current = { start: a, end: b, ...v };
      }
    }
    if (current !== null && current.value !== 0) out.push({ load: l, index, ...current });
  });
  return out;
}

/** A governing value's quantity, as keys of the pane's picker and the report's rows. */
export type GoverningQuantity = { readonly kind: "momentMax" | "momentMin" | "shearMax" } | { readonly kind: "reactionMax" | "reactionMin"; readonly support: number };

/** The value of a quantity in an envelope (undefined for a support the member does not have). */
export function governingOf(env: Envelope, q: GoverningQuantity): Governing | undefined {
  if (q.kind === "reactionMax" || q.kind === "reactionMin") return env[q.kind][q.support];
  return env[q.kind];
}

/** Short name of a quantity: "M+", "M−", "|V| max", "R2 max", "R1 min". */
export function quantityName(q: GoverningQuantity): string {
  switch (q.kind) {
    case "momentMax":
      return "M+";
    case "momentMin":
      return "M\u2212";
    case "shearMax":
      return "|V| max";
    case "reactionMax":
      return `R${q.support + 1} max`;
    case "reactionMin":
      return `R${q.support + 1} min`;
  }
}

/** Every quantity of a member with `supports` supports, in the report's order. */
export function quantitiesOf(supports: number): GoverningQuantity[] {
  const out: GoverningQuantity[] = [{ kind: "momentMax" }, { kind: "momentMin" }, { kind: "shearMax" }];
  for (let k = 0; k < supports; k++) out.push({ kind: "reactionMax", support: k }, { kind: "reactionMin", support: k });
  return out;
}

/**
 * The caption of a governing case: "M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on span 1 (factored)"
 * (no pattern named when the combination has no live case on the member: "R1 min governs: 2.3.1 (5) 0.9D (factored)").
 * @param g - the member's governing values
 * @param q - the quantity
 */
export function governingCaption(g: MemberGoverning, q: GoverningQuantity): string {
  const v = governingOf(g.envelope, q);
  if (v === undefined) return quantityName(q);
  const pattern = v.pattern === "no pattern" ? "" : `; ${v.pattern}`;
  return `${quantityName(q)} governs: ${labelOnMember(v.combination, g.present)}${pattern} (factored)`;
}
