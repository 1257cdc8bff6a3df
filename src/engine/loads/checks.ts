/** Input checks shared by the load functions: each returns the number or an error naming the argument. */
import { fail, ok, type Result } from "../errors";

/** A finite number of either sign. */
export function finite(value: number, argument: string): Result<number> {
  return Number.isFinite(value) ? ok(value) : fail("notANumber", `expected a number, got ${String(value)}.`, argument);
}

/** A finite number >= 0. */
export function nonNegative(value: number, argument: string): Result<number> {
  const f = finite(value, argument);
  if (!f.ok) return f;
  return value >= 0 ? f : fail("negative", `must not be negative (got ${value}).`, argument);
}

/** A finite number > 0. */
export function positive(value: number, argument: string): Result<number> {
  const f = finite(value, argument);
  if (!f.ok) return f;
  return value > 0 ? f : fail("notPositive", `must be greater than 0 (got ${value}).`, argument);
}

/** A whole number >= 1 (a count such as the number of floors supported). */
export function count(value: number, argument: string): Result<number> {
  const f = finite(value, argument);
  if (!f.ok) return f;
  return Number.isInteger(value) && value >= 1
    ? f
    : fail("invalid", `must be a whole number of 1 or more (got ${value}).`, argument);
}

/** Normalise a typed key: lower case, hyphens and underscores as spaces, runs of spaces collapsed. */
export function normaliseKey(text: string): string {
  return text
    .toLowerCase()
    .replace(/[-_]+/g, " ")
    .replace(/\s+/g, " ")
    .trim();
}
