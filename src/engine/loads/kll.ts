/**
 * Live load element factor K_LL, ASCE/SEI 7-22 Table 4.7-2 (values and wording recalled from
 * memory; verify against the standard), looked up by plain-words element keys.
 */
import { fail, ok, type Result } from "../errors";
import { normaliseKey } from "./checks";

/** One row of the table: the key users type and K_LL. */
export interface KllEntry {
  readonly key: string;
  readonly kll: number;
}

/** Table 4.7-2 rows in the standard's order; the last group are the "all other members" (recalled from memory). */
export const KLL_TABLE: readonly KllEntry[] = [
  { key: "interior column", kll: 4 },
  { key: "exterior column without cantilever slabs", kll: 4 },
  { key: "edge column with cantilever slabs", kll: 3 },
  { key: "corner column with cantilever slabs", kll: 2 },
  { key: "edge beam without cantilever slabs", kll: 2 },
  { key: "interior beam", kll: 2 },
  { key: "all other members", kll: 1 },
  { key: "edge beam with cantilever slabs", kll: 1 },
  { key: "cantilever beam", kll: 1 },
  { key: "one-way slab", kll: 1 },
  { key: "two-way slab", kll: 1 },
  { key: "member without provisions for continuous shear transfer normal to its span", kll: 1 },
];

/** Key form used for matching: normalised, and plural words made singular ("columns" -> "column"). */
function matchForm(text: string): string {
  return normaliseKey(text)
    .split(" ")
    .map((w) => (w.length > 3 && w.endsWith("s") && !w.endsWith("ss") ? w.slice(0, -1) : w))
    .join(" ")
    .replace(/\btheir\b/g, "its");
}

const BY_KEY = new Map(KLL_TABLE.map((e) => [matchForm(e.key), e.kll]));

/**
 * K_LL of an element, e.g. "interior column" -> 4. Matching ignores case, extra spaces, hyphens
 * and plurals.
 * @param element - the element key as typed
 */
export function kllOf(element: string | null | undefined): Result<number> {
  if (element === null || element === undefined || element.trim() === "")
    return fail("missing", `give the element, one of: ${KLL_TABLE.map((e) => e.key).join("; ")}.`, "element");
  const kll = BY_KEY.get(matchForm(element));
  return kll === undefined
    ? fail("unknownKey", `"${element}" is not an element of Table 4.7-2; use one of: ${KLL_TABLE.map((e) => e.key).join("; ")}.`, "element")
    : ok(kll);
}
