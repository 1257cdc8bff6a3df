/**
 * The load functions in the headless recalculation: HyperFormula with the LOADPATH functions
 * registered from the built bundle (dist/functions.js + functions.json, loaded the way Excel loads
 * them). Every formula must give what the engine gives (the engine's own tests check it against
 * hand computations of ASCE/SEI 7-22, recalled from memory) and what the README shows.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import type { HyperFormula } from "hyperformula";
import { createHeadless } from "../../src/workbook/headless";
import {
  COMBINATION_ROWS_MAX,
  combinationValues,
  governingCombination,
  heavyLiveLoad,
  kllOf,
  lineLoad,
  reducedLiveLoad,
  reducedRoofLiveLoad,
  tributaryWidth,
  type LoadEffects,
} from "../../src/engine/loads";
import type { Result } from "../../src/engine/errors";

let hf: HyperFormula;

beforeAll(async () => {
  ({ hf } = await createHeadless({ sheets: { Loads: [[]] } }));
});

/** Evaluate one formula in a scratch cell and return its value. */
function evaluate(formula: string, sheet = 0, row = 0, col = 10): unknown {
  hf.setCellContents({ sheet, row, col }, [[formula]]);
  return hf.getCellValue({ sheet, row, col });
}

function engineValue(r: Result<number>): number {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

/**
 * The headless engine exports numbers rounded to 10 decimal places (HyperFormula's
 * precisionRounding default; values inside the engine keep full precision), so "the same value"
 * means equal after that rounding.
 */
function same(got: unknown, want: number): boolean {
  return typeof got === "number" && Math.abs(got - want) <= 1e-10 * Math.max(1, Math.abs(want));
}

function expectSame(got: unknown, want: number): void {
  expect(same(got, want), `${String(got)} vs ${want}`).toBe(true);
}

/** The message of an error cell, or fail. */
function errorMessage(value: unknown): string {
  expect(value).toMatchObject({ value: "#VALUE!" });
  return (value as { message: string }).message;
}

describe("TRIB_WIDTH, LINE_LOAD", () => {
  it("interior line, slab edge (blank cell and empty argument), opening", () => {
    hf.setCellContents({ sheet: 0, row: 0, col: 0 }, [[8, null, 1.5]]);
    expectSame(evaluate("=LOADPATH.TRIB_WIDTH(6, 7)"), engineValue(tributaryWidth(6, 7)));
    expectSame(evaluate("=LOADPATH.TRIB_WIDTH(A1, B1, , C1)"), engineValue(tributaryWidth(8, null, null, 1.5)));
    expect(evaluate('=LOADPATH.TRIB_WIDTH(8, "", , 1.5)')).toBe(5.5); // README example
    expectSame(evaluate("=LOADPATH.TRIB_WIDTH(0, 10)"), engineValue(tributaryWidth(0, 10)));
    expect(errorMessage(evaluate("=LOADPATH.TRIB_WIDTH(-6, 7)"))).toMatch(/^spacing_a: must not be negative/);
  });

  it("LINE_LOAD with the conversion in the cell: =LOADPATH.LINE_LOAD(80/1000, 7.5) (README example)", () => {
    expectSame(evaluate("=LOADPATH.LINE_LOAD(80/1000, 7.5)"), engineValue(lineLoad(80 / 1000, 7.5)));
    expect(evaluate("=LOADPATH.LINE_LOAD(80/1000, 7.5, 0.05)")).toBeCloseTo(0.65, 12);
    expect(evaluate("=LOADPATH.LINE_LOAD(4, 2.5)")).toBe(10);
    expect(errorMessage(evaluate('=LOADPATH.LINE_LOAD("eighty", 7.5)'))).toMatch(/^area_load: "eighty" is text/);
  });
});

describe("COMBINE and COMBOS", () => {
  const zero: LoadEffects = { D: 0, L: 0, Lr: 0, S: 0, R: 0, W: 0, E: 0 };
  const lrfd = { method: "LRFD", halfLive: false } as const;

  it("README examples give the engine's values", () => {
    expectSame(evaluate("=LOADPATH.COMBINE(12, 9, 3)"), governingCombination({ ...zero, D: 12, L: 9, Lr: 3 }, lrfd, "max").value);
    expect(evaluate("=LOADPATH.COMBINE(12, 9, 3)")).toBeCloseTo(30.3, 12);
    expectSame(evaluate('=LOADPATH.COMBINE(5, , 10, , , -12, , "LRFD", "min")'), governingCombination({ ...zero, D: 5, Lr: 10, W: -12 }, lrfd, "min").value);
    expect(evaluate('=LOADPATH.COMBINE(5, , 10, , , -12, , "LRFD", "min")')).toBeCloseTo(-7.5, 12);
    expect(evaluate('=LOADPATH.COMBINE(100, 40, , , , , 60, "ASD")')).toBeCloseTo(161.5, 12);
  });

  it("half_live as a bare TRUE: 1.2x10 + 30 + 0.5x20 = 52 (ASCE/SEI 7-22 Sec. 2.3.1 (4) with the 0.5L exception, recalled)", () => {
    expectSame(
      evaluate('=LOADPATH.COMBINE(10, 20, 0, 0, 0, 30, 0, "LRFD", "max", TRUE)'),
      governingCombination({ ...zero, D: 10, L: 20, W: 30 }, { method: "LRFD", halfLive: true }, "max").value,
    );
    expect(evaluate('=LOADPATH.COMBINE(10, 20, 0, 0, 0, 30, 0, "LRFD", "max", TRUE)')).toBeCloseTo(52, 12);
    expect(evaluate('=LOADPATH.COMBINE(10, 20, 0, 0, 0, 30, 0, "LRFD", "max", FALSE)')).toBeCloseTo(62, 12);
  });

  it("load effects from cells give the engine's governing value, for both methods and extremes (fast-check)", () => {
    const v = fc.double({ min: -1e3, max: 1e3, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(v, v, v, v, v, v, v), fc.constantFrom("LRFD", "ASD"), fc.constantFrom("max", "min"), fc.boolean(), ([D, L, Lr, S, R, W, E], method, extreme, half) => {
        hf.setCellContents({ sheet: 0, row: 2, col: 0 }, [[D, L, Lr, S, R, W, E, method, extreme, half]]);
        const got = evaluate("=LOADPATH.COMBINE(A3, B3, C3, D3, E3, F3, G3, H3, I3, J3)", 0, 2, 12);
        const want = governingCombination({ D, L, Lr, S, R, W, E }, { method: method as "LRFD" | "ASD", halfLive: half }, extreme as "max" | "min").value;
        return same(got, want);
      }),
      { numRuns: 60 },
    );
  });

  it("COMBOS spills 25 x 2, labels and values as the engine, ASD padded with a blank row", () => {
    const x: LoadEffects = { D: 10.3, L: 8.7, Lr: 3.1, S: 5.9, R: 2.3, W: 6.7, E: 4.1 };
    hf.setCellContents({ sheet: 0, row: 4, col: 0 }, [[x.D, x.L, x.Lr, x.S, x.R, x.W, x.E]]);
    for (const [method, col] of [["LRFD", 14], ["ASD", 17]] as const) {
      hf.setCellContents({ sheet: 0, row: 4, col }, [[`=LOADPATH.COMBOS(A5, B5, C5, D5, E5, F5, G5, "${method}")`]]);
      const spilled = hf.getRangeValues({ start: { sheet: 0, row: 4, col }, end: { sheet: 0, row: 4 + COMBINATION_ROWS_MAX - 1, col: col + 1 } });
      const want = combinationValues(x, { method, halfLive: false });
      expect(spilled.slice(0, want.length).map((r) => r[0])).toEqual(want.map((c) => c.label));
      want.forEach((c, i) => expectSame(spilled[i]![1], c.value));
      if (method === "ASD") expect(spilled[COMBINATION_ROWS_MAX - 1]!.every((c) => c === "" || c === null)).toBe(true);
      // the row below the spill is not part of it
      expect(hf.getCellValue({ sheet: 0, row: 4 + COMBINATION_ROWS_MAX, col })).toBeNull();
    }
  });

  it("unknown method is an error naming the argument and listing the valid values", () => {
    expect(errorMessage(evaluate('=LOADPATH.COMBINE(10, 5, , , , , , "USD")'))).toMatch(/^method: "USD" is not recognised; use one of "LRFD", "ASD"/);
  });
});

describe("LL_REDUCE, LL_HEAVY, KLL, ROOF_LL_REDUCE", () => {
  const us = (lo: number, kll: number, at: number, floors = 1) => ({ lo, kll, at, floors, units: "US" as const });

  it("README examples give the engine's values (ASCE/SEI 7-22 Sec. 4.7.3, 4.7.4, 4.8.2, Table 4.7-2, recalled)", () => {
    expectSame(evaluate('=LOADPATH.KLL("interior column")'), engineValue(kllOf("interior column")));
    expectSame(evaluate('=LOADPATH.LL_REDUCE(50, LOADPATH.KLL("interior column"), 900, 3)'), engineValue(reducedLiveLoad(us(50, 4, 900, 3))));
    expect(evaluate('=LOADPATH.LL_REDUCE(50, LOADPATH.KLL("interior column"), 900, 3)')).toBeCloseTo(25, 12);
    expect(evaluate("=LOADPATH.LL_REDUCE(50, 2, 150)")).toBe(50);
    expectSame(evaluate('=LOADPATH.LL_REDUCE(2.4, 4, 40, 1, "SI")'), engineValue(reducedLiveLoad({ lo: 2.4, kll: 4, at: 40, floors: 1, units: "SI" })));
    expect(evaluate('=LOADPATH.LL_REDUCE(2.4, 4, 40, 1, "SI")')).toBeCloseTo(1.467, 3);
    expectSame(evaluate("=LOADPATH.LL_HEAVY(150, 4, 900, 3)"), engineValue(heavyLiveLoad(us(150, 4, 900, 3))));
    expect(evaluate("=LOADPATH.LL_HEAVY(150, 4, 900, 3)")).toBeCloseTo(120, 12);
    expect(evaluate("=LOADPATH.ROOF_LL_REDUCE(20, 400)")).toBeCloseTo(16, 12);
    expect(evaluate("=LOADPATH.ROOF_LL_REDUCE(20, 700, 6)")).toBe(12);
    expectSame(evaluate('=LOADPATH.ROOF_LL_REDUCE(0.96, 30, 50, "SI")'), engineValue(reducedRoofLiveLoad({ lo: 0.96, at: 30, rise: 50, units: "SI" })));
    expect(evaluate('=LOADPATH.ROOF_LL_REDUCE(0.96, 30, 50, "SI")')).toBeCloseTo(0.752, 3);
  });

  it("a column stack: cumulative live load reduced floor by floor as the engine does", () => {
    // floors supported 1..4, tributary area 625 ft^2 per floor, 50 psf, interior column
    const rows: (number | string)[][] = [1, 2, 3, 4].map((n) => [n, 625 * n, `=LOADPATH.LL_REDUCE(50, LOADPATH.KLL("interior column"), B${20 + n}, A${20 + n})`]);
    hf.setCellContents({ sheet: 0, row: 20, col: 0 }, rows);
    for (const n of [1, 2, 3, 4]) {
      expectSame(hf.getCellValue({ sheet: 0, row: 19 + n, col: 2 }), engineValue(reducedLiveLoad(us(50, 4, 625 * n, n))));
    }
  });

  it("errors name the argument: unknown units, unknown element, text where a number belongs", () => {
    expect(errorMessage(evaluate('=LOADPATH.LL_REDUCE(50, 4, 900, 1, "metric")'))).toMatch(/^units: "metric" is not recognised/);
    expect(errorMessage(evaluate('=LOADPATH.KLL("girder")'))).toMatch(/^element: "girder" is not an element of Table 4.7-2/);
    expect(errorMessage(evaluate('=LOADPATH.LL_REDUCE(50, "four", 900)'))).toMatch(/^KLL: "four" is text/);
    expect(errorMessage(evaluate("=LOADPATH.ROOF_LL_REDUCE(20, -1)"))).toMatch(/^AT: must not be negative/);
  });
});
