/**
 * Comparing the results of two takedown builds (the add-in version and the hand-off version):
 * every number of the takedown JSON (docs/interface.md section 4), leaf by leaf. Test-only code.
 */

/** A mismatch between two JSON trees: path and both values. */
export interface Mismatch {
  readonly path: string;
  readonly want: unknown;
  readonly got: unknown;
}

/**
 * Walk two JSON values and list every leaf that differs: numbers beyond `rel` relative to the
 * larger magnitude (with `floor` as the smallest magnitude compared relatively), anything else
 * unless equal.
 */
export function compareJson(want: unknown, got: unknown, rel = 1e-9, floor = 1e-9, path = ""): Mismatch[] {
  if (typeof want === "number" && typeof got === "number") {
    const scale = Math.max(Math.abs(want), Math.abs(got), floor);
    return Math.abs(want - got) <= rel * scale ? [] : [{ path, want, got }];
  }
  if (Array.isArray(want) && Array.isArray(got)) {
    if (want.length !== got.length) return [{ path: `${path}.length`, want: want.length, got: got.length }];
    return want.flatMap((w, i) => compareJson(w, got[i], rel, floor, `${path}[${i}]`));
  }
  if (want !== null && got !== null && typeof want === "object" && typeof got === "object") {
    const keys = new Set([...Object.keys(want), ...Object.keys(got)]);
    return [...keys].flatMap((k) => compareJson((want as Record<string, unknown>)[k], (got as Record<string, unknown>)[k], rel, floor, `${path}.${k}`));
  }
  return Object.is(want, got) ? [] : [{ path, want, got }];
}

/** Count of numeric leaves of a JSON value (to show a comparison covered something). */
export function numericLeaves(value: unknown): number {
  if (typeof value === "number") return 1;
  if (Array.isArray(value)) return value.reduce((s: number, v) => s + numericLeaves(v), 0);
  if (value !== null && typeof value === "object") return Object.values(value).reduce((s: number, v) => s + numericLeaves(v), 0);
  return 0;
}
