/**
 * The load worksheet functions called the way a host calls them (raw cell values, blanks as null,
 * ranges as 2-D arrays), with the CustomFunctions shim installed as the global. Values are checked
 * against the engine (whose own tests check them against hand computations of ASCE/SEI 7-22) and
 * against hand arithmetic where the example is the one shown in the help text.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { installCustomFunctionsGlobal, ShimError } from "../../src/workbook/headless-shim";
import { COMBINATION_ROWS_MAX, combinationValues, governingCombination } from "../../src/engine/loads";

type Fns = typeof import("../../src/functions/load-functions");
let f: Fns;

beforeAll(async () => {
  installCustomFunctionsGlobal();
  f = await import("../../src/functions/load-functions");
});

/** The error a function returned, or fail the test. */
function errorOf(value: unknown): ShimError {
  expect(value).toBeInstanceOf(ShimError);
  return value as ShimError;
}

describe("TRIB_WIDTH and LINE_LOAD (common practice)", () => {
  it("interior line, slab edge and opening", () => {
    expect(f.tribWidth(6, 7)).toBe(6 / 2 + 7 / 2);
    expect(f.tribWidth(8, "", null, 1.5)).toBe(8 / 2 + 1.5); // help-text example with "" for the edge
    expect(f.tribWidth(8, null, undefined, 1.5)).toBe(8 / 2 + 1.5);
    expect(f.tribWidth(0, 10)).toBe(10 / 2);
    expect(f.tribWidth([[6]], [[7]])).toBe(6.5); // single-cell ranges read as numbers
  });

  it("negative and non-numeric values are #VALUE! naming the argument", () => {
    const neg = errorOf(f.tribWidth(-6, 7));
    expect(neg.code).toBe("#VALUE!");
    expect(neg.message).toMatch(/^spacing_a: must not be negative/);
    expect(errorOf(f.tribWidth(6, "seven")).message).toMatch(/^spacing_b: "seven" is text/);
    expect(errorOf(f.tribWidth(6, 7, 1)).message).toMatch(/^overhang_a: an overhang applies only/);
  });

  it("LINE_LOAD: 80 psf x 7.5 ft / 1000 = 0.6 kip/ft; + 0.05 self weight", () => {
    expect(f.lineLoadFn(80 / 1000, 7.5)).toBeCloseTo(0.6, 12);
    expect(f.lineLoadFn(80 / 1000, 7.5, 0.05)).toBeCloseTo(0.65, 12);
    expect(errorOf(f.lineLoadFn(0.08, -1)).message).toMatch(/^trib_width: /);
    expect(errorOf(f.lineLoadFn({ code: "#DIV/0!" }, 7.5)).message).toMatch(/^area_load: .*#DIV\/0!/);
  });
});

describe("COMBINE and COMBOS", () => {
  it("help-text example: D 12, L 9, Lr 3 -> 1.2x12 + 1.6x9 + 0.5x3 = 30.3 (ASCE/SEI 7-22 Sec. 2.3.1 (2), recalled)", () => {
    expect(f.combine(12, 9, 3)).toBeCloseTo(1.2 * 12 + 1.6 * 9 + 0.5 * 3, 12);
  });

  it("method, extreme and half_live keys: case-insensitive, blank = default", () => {
    // roof uplift: 0.6D - 0.6W (ASCE/SEI 7-22 Sec. 2.4.1 (7), recalled)
    expect(f.combine(5, null, 10, null, null, -12, null, "asd", "MIN")).toBeCloseTo(0.6 * 5 - 0.6 * 12, 12);
    expect(f.combine(5, "", 10, "", "", -12, "", "", "min")).toBeCloseTo(0.9 * 5 - 12, 12);
    // 1.2D + 1.0W + 0.5L (Sec. 2.3.1 (4) with the 0.5L exception)
    for (const yes of [true, "TRUE", "yes", 1]) expect(f.combine(10, 20, 0, 0, 0, 30, 0, null, null, yes)).toBeCloseTo(12 + 30 + 10, 12);
    for (const no of [false, null, "no", 0]) expect(f.combine(10, 20, 0, 0, 0, 30, 0, null, null, no)).toBeCloseTo(12 + 30 + 20, 12);
  });

  it("unknown keys and non-numeric cells are errors naming the argument and listing the valid values", () => {
    const m = errorOf(f.combine(10, 5, 0, 0, 0, 0, 0, "USD"));
    expect(m.code).toBe("#VALUE!");
    expect(m.message).toMatch(/^method: "USD" is not recognised; use one of "LRFD", "ASD"/);
    expect(errorOf(f.combine(10, 5, 0, 0, 0, 0, 0, "LRFD", "largest")).message).toMatch(/^extreme: .*"max", "min"/);
    expect(errorOf(f.combine(10, 5, 0, 0, 0, 0, 0, "LRFD", "max", "perhaps")).message).toMatch(/^half_live: /);
    expect(errorOf(f.combine("ten", 5)).message).toMatch(/^D: "ten" is text/);
    expect(errorOf(f.combine(10, 5, "x")).message).toMatch(/^Lr: /);
    expect(errorOf(f.combine(null, 5)).message).toMatch(/^D: is blank/);
  });

  it("COMBINE equals the engine's governing combination for any inputs (fast-check)", () => {
    const v = fc.double({ min: -1e3, max: 1e3, noNaN: true });
    fc.assert(
      fc.property(v, v, v, v, v, v, v, fc.constantFrom("LRFD", "ASD"), fc.constantFrom("max", "min"), fc.boolean(), (D, L, Lr, S, R, W, E, method, extreme, half) => {
        const engine = governingCombination({ D, L, Lr, S, R, W, E }, { method: method as "LRFD" | "ASD", halfLive: half }, extreme as "max" | "min").value;
        return f.combine(D, L, Lr, S, R, W, E, method, extreme, half) === engine;
      }),
    );
  });

  it("COMBOS spills 25 x 2 for either method; ASD's 24 rows are padded with a blank row", () => {
    const lrfd = f.combos(10.3, 8.7, 3.1, 5.9, 2.3, 6.7, 4.1);
    const asd = f.combos(10.3, 8.7, 3.1, 5.9, 2.3, 6.7, 4.1, "ASD");
    expect(lrfd).toHaveLength(COMBINATION_ROWS_MAX);
    expect(asd).toHaveLength(COMBINATION_ROWS_MAX);
    const x = { D: 10.3, L: 8.7, Lr: 3.1, S: 5.9, R: 2.3, W: 6.7, E: 4.1 };
    expect(lrfd).toEqual(combinationValues(x, { method: "LRFD", halfLive: false }).map((c) => [c.label, c.value]));
    expect(asd.slice(0, 24)).toEqual(combinationValues(x, { method: "ASD", halfLive: false }).map((c) => [c.label, c.value]));
    expect(asd[24]).toEqual(["", ""]);
    expect(lrfd[1]).toEqual(["2.3.1 (2) 1.2D + 1.6L + 0.5Lr", 1.2 * 10.3 + 1.6 * 8.7 + 0.5 * 3.1]);
  });

  it("COMBINE max >= every COMBOS value and min <= every value (fast-check)", () => {
    const v = fc.double({ min: -1e3, max: 1e3, noNaN: true });
    fc.assert(
      fc.property(v, v, v, v, fc.constantFrom("LRFD", "ASD"), (D, L, W, E, method) => {
        const values = (f.combos(D, L, 0, 0, 0, W, E, method) as (number | string)[][]).map((r) => r[1]).filter((c): c is number => typeof c === "number");
        const max = f.combine(D, L, 0, 0, 0, W, E, method, "max");
        const min = f.combine(D, L, 0, 0, 0, W, E, method, "min");
        return values.every((c) => c <= max && c >= min);
      }),
    );
  });
});

describe("LL_REDUCE, LL_HEAVY, KLL, ROOF_LL_REDUCE", () => {
  it("help-text examples (ASCE/SEI 7-22 Sec. 4.7.3, 4.7.4, 4.8.2 and Table 4.7-2, recalled from memory)", () => {
    expect(f.llReduce(50, 4, 900, 3)).toBeCloseTo(50 * (0.25 + 15 / Math.sqrt(4 * 900)), 12);
    expect(f.llHeavy(150, 4, 900, 3)).toBeCloseTo(0.8 * 150, 12);
    expect(f.kll("interior column")).toBe(4);
    expect(f.kll(" Corner-Column with cantilever slabs ")).toBe(2);
    expect(f.roofLlReduce(20, 400)).toBeCloseTo(20 * (1.2 - 0.001 * 400), 12);
  });

  it("units: SI selects the SI coefficient; case-insensitive; blank floors = 1", () => {
    expect(f.llReduce(2.4, 4, 40, null, "si")).toBeCloseTo(2.4 * (0.25 + 4.57 / Math.sqrt(160)), 12);
    expect(f.llReduce(2.4, 4, 300, "", "SI")).toBeCloseTo(0.5 * 2.4, 12);
    expect(f.roofLlReduce(0.96, 60, 100, "SI")).toBe(0.58);
  });

  it("units also in the beam functions' vocabulary: kip-ft = US, kN-m = SI, any case", () => {
    expect(f.llReduce(50, 4, 900, 3, "kip-ft")).toBeCloseTo(50 * (0.25 + 15 / Math.sqrt(4 * 900)), 12);
    expect(f.llReduce(2.4, 4, 40, null, "KN-M")).toBeCloseTo(2.4 * (0.25 + 4.57 / Math.sqrt(160)), 12);
    expect(f.llHeavy(150, 4, 900, 3, "kip-ft")).toBeCloseTo(0.8 * 150, 12);
    expect(f.roofLlReduce(0.96, 60, 100, "kn-m")).toBe(0.58);
    expect(f.roofLlReduce(20, 400, 0, "Kip-Ft")).toBeCloseTo(20 * (1.2 - 0.001 * 400), 12);
  });

  it("errors name the argument: unknown units, KLL as text, fractional floors, negative area, unknown element", () => {
    const u = errorOf(f.llReduce(50, 4, 900, 1, "metric"));
    expect(u.message).toMatch(/^units: "metric" is not recognised; use one of "US" \(or "kip-ft"\), "SI" \(or "kN-m"\)/);
    expect(errorOf(f.llReduce(50, "interior column", 900)).message).toMatch(/^KLL: "interior column" is text/);
    expect(errorOf(f.llReduce(50, 4, 900, 1.5)).message).toMatch(/^floors: must be a whole number/);
    expect(errorOf(f.llReduce(50, 4, -900)).message).toMatch(/^AT: must not be negative/);
    expect(errorOf(f.llHeavy(50, 0, 900)).message).toMatch(/^KLL: must be greater than 0/);
    expect(errorOf(f.roofLlReduce(20, -5)).message).toMatch(/^AT: /);
    expect(errorOf(f.roofLlReduce(100, 500)).message).toMatch(/^Lo: .*LL_REDUCE/);
    const k = errorOf(f.kll("girder"));
    expect(k.message).toMatch(/^element: "girder" is not an element of Table 4.7-2; use one of: interior column;/);
    expect(errorOf(f.kll(null)).message).toMatch(/^element: /);
  });
});
