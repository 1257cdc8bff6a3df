/**
 * The shared argument runner: coercion of what hosts pass (blanks as null, undefined or "",
 * single-cell ranges, error objects) and one message per broken rule, each naming the argument.
 * Expected messages are the documented ones (README, beam functions reference).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { fail, ok } from "../../src/engine/errors";
import { arg, coerceArg, defineArgs, normalizeCell, runFunction, toGrid } from "../../src/functions/args";
import { installCustomFunctionsGlobal, ShimError } from "../../src/workbook/headless-shim";

beforeAll(() => {
  installCustomFunctionsGlobal();
});

function coerced(spec: Parameters<typeof coerceArg>[0], raw: unknown): unknown {
  const r = coerceArg(spec, raw);
  if (!r.ok) throw new Error(`expected ok, got ${r.error.message}`);
  return r.value;
}

function message(spec: Parameters<typeof coerceArg>[0], raw: unknown): string {
  const r = coerceArg(spec, raw);
  if (r.ok) throw new Error(`expected an error for ${JSON.stringify(raw)}`);
  return r.error.message;
}

describe("cells as hosts pass them", () => {
  it("blank is null whether it comes as null, undefined, empty or blank text", () => {
    expect([null, undefined, "", "   "].map(normalizeCell)).toEqual([null, null, null, null]);
  });
  it("text is trimmed, numbers and booleans kept, errors become error cells", () => {
    expect(normalizeCell("  pin ")).toBe("pin");
    expect(normalizeCell(2.5)).toBe(2.5);
    expect(normalizeCell(false)).toBe(false);
    expect(normalizeCell(new ShimError("#DIV/0!", "x"))).toEqual({ error: "#DIV/0!" });
    expect(normalizeCell(Number.NaN)).toEqual({ error: "#NUM!" });
  });
  it("ranges lose trailing blank rows only; a scalar is a 1 x 1 grid", () => {
    expect(toGrid([[1, 2], [null, ""], [3, null], [null, null], ["", " "]])).toEqual([[1, 2], [null, null], [3, null]]);
    expect(toGrid(7)).toEqual([[7]]);
  });
});

describe("numbers", () => {
  const span = arg.number("span", { greaterThan: 0 });
  it("accepts a number or a single-cell range", () => {
    expect(coerced(span, 12)).toBe(12);
    expect(coerced(span, [[12]])).toBe(12);
  });
  it("names the argument in every message", () => {
    expect(message(span, "abc")).toBe('span: "abc" is text where a number belongs.');
    expect(message(span, true)).toBe("span: TRUE is not a number.");
    expect(message(span, null)).toBe("span: is blank; a number is required.");
    expect(message(span, 0)).toBe("span: must be greater than 0 (got 0).");
    expect(message(span, -2.5)).toBe("span: must be greater than 0 (got -2.5).");
    expect(message(span, new ShimError("#N/A"))).toBe("span: the cell holds the error #N/A.");
    expect(message(span, [[1, 2]])).toBe("span: expected a single value, got a range of 1 x 2 cells.");
  });
  it("other bounds", () => {
    expect(message(arg.number("w", { atLeast: 0 }), -1)).toBe("w: must not be negative (got -1).");
    expect(message(arg.number("index", { atLeast: 1, integer: true }), 1.5)).toBe("index: must be a whole number (got 1.5).");
    expect(message(arg.number("index", { atLeast: 1 }), 0)).toBe("index: must be at least 1 (got 0).");
    expect(message(arg.number("n", { atMost: 10 }), 11)).toBe("n: must be at most 10 (got 11).");
  });
  it("optional numbers take their default when left out or blank, and are checked otherwise", () => {
    const stations = arg.optionalNumber("stations", 20, { atLeast: 1, integer: true });
    expect(coerced(stations, null)).toBe(20);
    expect(coerced(stations, undefined)).toBe(20);
    expect(coerced(stations, "")).toBe(20);
    expect(coerced(stations, 8)).toBe(8);
    expect(message(stations, 2.5)).toBe("stations: must be a whole number (got 2.5).");
    expect(coerced(arg.optionalNumber("x", undefined), null)).toBeUndefined();
  });
});

describe("text keys", () => {
  const units = arg.text("units", { "kip-ft": "kip-ft", "kN-m": "kN-m" }, "unknownUnits");
  it("match case-insensitively and return the canonical spelling", () => {
    expect(coerced(units, "KN-M")).toBe("kN-m");
    expect(coerced(units, " kip-ft ")).toBe("kip-ft");
  });
  it("unknown keys list the accepted ones", () => {
    const r = coerceArg(units, "kip-in");
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe("unknownUnits");
      expect(r.error.message).toBe('units: "kip-in" is not recognised; use one of "kip-ft", "kN-m".');
    }
    expect(message(units, null)).toBe("units: is blank; text is required.");
  });
  it("optional text defaults", () => {
    expect(coerced(arg.optionalText("what", "reaction", { reaction: "reaction", moment: "moment" }), null)).toBe("reaction");
  });
});

describe("ranges", () => {
  const supports = arg.optionalRange("supports", { maxRows: 3, widths: [1, 2], columns: "position | type" });
  const loads = arg.numberOrRange("loads", { maxRows: 4, widths: [4, 5] });
  it("optional ranges left out or all blank are undefined", () => {
    expect(coerced(supports, null)).toBeUndefined();
    expect(coerced(supports, [[null, null], ["", null]])).toBeUndefined();
  });
  it("row and width limits", () => {
    expect(message(supports, [[0], [1], [2], [3]])).toBe("supports: 4 rows; at most 3 are accepted.");
    expect(coerced(supports, [[0], [1], [2], [null], [null]])).toEqual([[0], [1], [2]]); // trailing blank rows do not count
    expect(message(supports, [[0, "pin", 1]])).toBe("supports: the range has 3 columns; expected 1 or 2 (position | type).");
  });
  it("a number, or a single cell holding one, is the number; a single blank cell is no rows", () => {
    expect(coerced(loads, 1.5)).toBe(1.5);
    expect(coerced(loads, [[1.5]])).toBe(1.5);
    expect(coerced(loads, [[null]])).toEqual([]);
    expect(message(loads, "heavy")).toBe('loads: "heavy" is not a number; give a number or a range of rows.');
    expect(message(loads, null)).toBe("loads: is required.");
  });
});

describe("the runner", () => {
  const ARGS = defineArgs(arg.number("span", { greaterThan: 0 }), arg.optionalNumber("k", 2));
  it("passes coerced arguments by name and returns the body's value", () => {
    expect(runFunction(ARGS, [10, null], (a) => ok(a.span * a.k))).toBe(20);
  });
  it("returns the first argument error as #VALUE! with its message", () => {
    const e = runFunction(ARGS, [-1, null], () => ok(0)) as ShimError;
    expect(e).toBeInstanceOf(ShimError);
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe("span: must be greater than 0 (got -1).");
  });
  it("turns a body's error value into the host's error", () => {
    const e = runFunction(ARGS, [1, null], () => fail("unstable", "a single pin cannot hold the member.", "supports")) as ShimError;
    expect(e.message).toBe("supports: a single pin cannot hold the member.");
  });
  it("never throws: an exception becomes an error value naming it", () => {
    const e = runFunction(ARGS, [1, null], () => {
      throw new Error("boom");
    }) as ShimError;
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toMatch(/Internal error in Loadpath: boom/);
  });
  it("NaN and infinity become #NUM!; -0 goes out as 0", () => {
    expect((runFunction(ARGS, [1, null], () => ok(Number.POSITIVE_INFINITY)) as ShimError).code).toBe("#NUM!");
    expect((runFunction(ARGS, [1, null], () => ok([[1, Number.NaN]])) as ShimError).code).toBe("#NUM!");
    expect(Object.is(runFunction(ARGS, [1, null], () => ok(-0)), 0)).toBe(true);
  });
  it("does not mutate the arguments it is given", () => {
    const grid = [[1, 2, null, null], [null, null, null, null]];
    const copy = JSON.parse(JSON.stringify(grid));
    runFunction(defineArgs(arg.numberOrRange("loads", { maxRows: 5 })), [grid], () => ok(0));
    expect(grid).toEqual(copy);
  });
});
