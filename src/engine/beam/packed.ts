/**
 * The solver's private copy of a validated model: flat arrays of numbers, so that solving
 * allocates little and never keeps a reference to the caller's objects. (Plain arrays, not typed
 * arrays: a typed array of more than 64 bytes gets an off-heap buffer whose allocation and
 * collection cost more than the whole solve of a simple span.)
 */

/** A fresh array of n numbers, all 0, stored as doubles. */
export function doubles(n: number): number[] {
  const a = new Array<number>(n);
  for (let i = 0; i < n; i++) a[i] = 0;
  return a;
}

/** Numbers stored per load: kind code, start, end, first magnitude, second magnitude. */
export const LOAD_STRIDE = 5;
/** Numbers stored per support: position, type code. */
export const SUPPORT_STRIDE = 2;

/** Kind code of a linearly varying line load: [kind, start, end, w1, w2]. */
export const KIND_LINE = 0;
/** Kind code of a point load: [kind, x, x, p, 0]. */
export const KIND_POINT = 1;
/** Kind code of an applied couple: [kind, x, x, m, 0]. */
export const KIND_MOMENT = 2;

/**
 * A line load shorter than this fraction of the span is carried as its resultant at its start:
 * its intensity gradient (w2 - w1) / length could overflow, and the moment this moves is at most
 * the resultant times the length, below rounding of everything else.
 */
export const SHORT_LINE = 1e-12;

/** Type code of a pin (vertical restraint only). */
export const TYPE_PIN = 0;
/** Type code of a fixed support (vertical and rotational restraint). */
export const TYPE_FIXED = 1;

/** A validated model, copied into flat arrays (see the stride and code constants). */
export interface PackedModel {
  /** Length of the member (any consistent length unit). */
  readonly span: number;
  readonly loadCount: number;
  readonly supportCount: number;
  /** LOAD_STRIDE numbers per load (a plain array: small young objects are cheaper than buffers). */
  readonly loads: readonly number[];
  /** SUPPORT_STRIDE numbers per support, in the order given. */
  readonly supports: readonly number[];
}
