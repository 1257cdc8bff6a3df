/**
 * Load combinations as data: each combination is a label and one factor per load case, so the
 * built-in ASCE/SEI 7-22 sets (src/engine/loads/combinations.ts) and a firm's own list (the
 * optional Combinations table) are passed to the envelope the same way.
 */
import { fail, ok, type Result } from "../errors";
import { builtInSet, LOAD_CASES, type CombinationOptions } from "../loads/combinations";
import { expandedRows, factorOf, type CombinationSet, type FactoredCombination } from "../loads/combination-sets";
import type { LoadCase } from "../loads/combination-sets";

export { factorOf, type FactoredCombination } from "../loads/combination-sets";

/**
 * The built-in ASCE/SEI 7-22 combinations of a method (Sec. 2.3.1/2.3.6 for LRFD, 2.4.1/2.4.5
 * for ASD; texts recalled from memory, see combinations.ts) as factor data, one row per
 * expanded alternative, in the standard's order.
 * @param options - method (LRFD or ASD) and the permitted 0.5L of LRFD combinations 3, 4 and 6
 */
export function builtInCombinations(options: CombinationOptions): FactoredCombination[] {
  return combinationsOfSet(builtInSet(options.method, options.halfLive));
}

/**
 * The combinations of any set (built-in, service, or a firm's Combinations table parsed by
 * parseCombinationTable) as the envelope takes them: every row, and each row holding W or E also
 * with it reversed unless the set lists that row already (expandedRows in loads/combination-sets.ts).
 * @param set - the combination set
 */
export function combinationsOfSet(set: CombinationSet): FactoredCombination[] {
  return expandedRows(set).map((r) => ({ label: r.label, factors: r.factors }));
}

/**
 * Checks a combination list: at least one row, a label on each, every factor a finite number
 * of a known case. Errors name the argument `combinations` and the 1-based row.
 */
export function checkCombinations(combinations: readonly FactoredCombination[]): Result<readonly FactoredCombination[]> {
  if (combinations.length === 0) return fail("missing", "at least one combination is needed.", "combinations");
  for (let i = 0; i < combinations.length; i++) {
    const c = combinations[i]!;
    if (typeof c.label !== "string" || c.label.trim() === "") return fail("missing", "the combination has no label.", "combinations", i + 1);
    for (const [key, value] of Object.entries(c.factors)) {
      if (!(LOAD_CASES as readonly string[]).includes(key)) return fail("unknownKey", `"${key}" is not a load case; use one of ${LOAD_CASES.join(", ")}.`, "combinations", i + 1);
      if (typeof value !== "number" || !Number.isFinite(value)) return fail("notANumber", `the factor of ${key} must be a finite number; got ${String(value)}.`, "combinations", i + 1);
    }
  }
  return ok(combinations);
}

/**
 * The combinations that differ on the cases present, first of equals kept (its label is the one
 * reported): with no wind or seismic load on a member, "0.9D + 1.0W" and "0.9D - 1.0W" are one
 * combination. Rows whose factors are all 0 on the present cases are dropped.
 * @param combinations - the full list
 * @param present - the load cases that carry load on the member
 */
export function distinctOn(combinations: readonly FactoredCombination[], present: readonly LoadCase[]): FactoredCombination[] {
  const seen = new Set<string>();
  const out: FactoredCombination[] = [];
  for (const c of combinations) {
    const key = present.map((p) => factorOf(c, p)).join(",");
    if (present.every((p) => factorOf(c, p) === 0) || seen.has(key)) continue;
    seen.add(key);
    out.push(c);
  }
  return out;
}
