/**
 * A stand-in for the host's `CustomFunctions` global, enough to load the built functions bundle
 * outside Excel: `associate` records every id -> function pair, `Error` and `ErrorCode` behave
 * like the host's (DEVELOPERS.md, Layout: the headless evaluator loads the bundle the way Excel does).
 */

/** The host's error codes (the same strings as the custom functions runtime). */
export const ShimErrorCode = {
  invalidValue: "#VALUE!",
  notAvailable: "#N/A",
  divisionByZero: "#DIV/0!",
  invalidNumber: "#NUM!",
  nullReference: "#NULL!",
  invalidName: "#NAME?",
  invalidReference: "#REF!",
} as const;

/** An error value a function returns, as the host's `CustomFunctions.Error`. */
export class ShimError {
  readonly code: string;
  readonly message?: string;
  /**
   * @param code - one of {@link ShimErrorCode}'s values, e.g. "#VALUE!".
   * @param message - what is wrong, shown beside the error.
   */
  constructor(code: string, message?: string) {
    this.code = code;
    if (message !== undefined) this.message = message;
  }
}

/** The shim and what the bundle associated through it. */
export interface CustomFunctionsShim {
  /** The object to install as the global `CustomFunctions`. */
  readonly global: {
    readonly associate: (idOrMappings: string | Record<string, unknown>, fn?: unknown) => void;
    readonly Error: typeof ShimError;
    readonly ErrorCode: typeof ShimErrorCode;
  };
  /** Functions by id (upper case), in association order. */
  readonly associated: Map<string, (...args: unknown[]) => unknown>;
  /** Problems found while associating (an id given twice, a non-function). */
  readonly problems: string[];
}

/** A fresh shim; each loaded bundle gets its own so associations never leak between loads. */
export function createCustomFunctionsShim(): CustomFunctionsShim {
  const associated = new Map<string, (...args: unknown[]) => unknown>();
  const problems: string[] = [];
  const add = (id: string, fn: unknown): void => {
    const key = id.toUpperCase();
    if (typeof fn !== "function") problems.push(`CustomFunctions.associate("${id}") was given ${typeof fn}, not a function.`);
    else if (associated.has(key)) problems.push(`CustomFunctions.associate("${id}") was called twice.`);
    else associated.set(key, fn as (...args: unknown[]) => unknown);
  };
  const associate = (idOrMappings: string | Record<string, unknown>, fn?: unknown): void => {
    if (typeof idOrMappings === "string") add(idOrMappings, fn);
    else for (const [id, f] of Object.entries(idOrMappings)) add(id, f);
  };
  return { global: { associate, Error: ShimError, ErrorCode: ShimErrorCode }, associated, problems };
}

/** Install a shim as the global `CustomFunctions` of this realm (tests of the functions' sources). */
export function installCustomFunctionsGlobal(shim: CustomFunctionsShim = createCustomFunctionsShim()): CustomFunctionsShim {
  (globalThis as Record<string, unknown>).CustomFunctions = shim.global;
  return shim;
}
