/**
 * COMBINE and COMBOS with their optional last argument `combinations` (a firm's own
 * Combinations table, header row first) and the method "service": called the way a host calls
 * them, and headless through HyperFormula with the built bundle (run `npm run build` first).
 * Values are checked by hand arithmetic of the firm's table written out beside each check.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import type { HyperFormula } from "hyperformula";
import { installCustomFunctionsGlobal, ShimError } from "../../src/workbook/headless-shim";
import { createHeadless } from "../../src/workbook/headless";
import { builtInSet, COMBINATION_ROWS_MAX, LOAD_CASES } from "../../src/engine/loads";
import { combosSize } from "../../src/functions/spill";

type Fns = typeof import("../../src/functions/load-functions");
let f: Fns;
let hf: HyperFormula;

beforeAll(async () => {
  installCustomFunctionsGlobal();
  f = await import("../../src/functions/load-functions");
  ({ hf } = await createHeadless({ sheets: { Loads: [[]] } }));
});

function errorOf(value: unknown): ShimError {
  expect(value).toBeInstanceOf(ShimError);
  return value as ShimError;
}

const HEADER = ["Combination", "Method", "D", "L", "Lr", "S", "R", "W", "E"];

// A firm's own list (invented): two LRFD rows, an uplift row, an ASD and a service row.
const FIRM = [
  HEADER,
  ["F1", "LRFD", 1.4, null, null, null, null, null, null],
  ["F2", "LRFD", 1.2, 1.6, 0.5, null, null, null, null],
  ["F3 uplift", "LRFD", 0.9, null, null, null, null, 1.0, null],
  ["A2", "ASD", 1, 1, null, null, null, null, null],
  ["Sv", "service", 1, 0.5, null, null, null, null, null],
];

describe("COMBINE and COMBOS with a combinations range (host call)", () => {
  it("D 10, L 8, Lr 3, W 6 by hand: F2 = 1.2x10 + 1.6x8 + 0.5x3 = 26.3 (max); F3 reversed = 0.9x10 - 6 = 3 (min)", () => {
    expect(f.combine(10, 8, 3, null, null, 6, null, "LRFD", "max", null, FIRM)).toBeCloseTo(26.3, 12);
    expect(f.combine(10, 8, 3, null, null, 6, null, "LRFD", "min", null, FIRM)).toBeCloseTo(3, 12);
    expect(f.combine(10, 8, 3, null, null, -6, null, "LRFD", "min", null, FIRM)).toBeCloseTo(3, 12); // W entered negative
    expect(f.combine(10, 8, 3, null, null, 6, null, "asd", null, null, FIRM)).toBe(18); // A2: D + L
    expect(f.combine(10, 8, 3, null, null, 6, null, "Service", null, null, FIRM)).toBe(14); // Sv: D + 0.5L
    // half_live does not touch a firm's factors: still 26.3
    expect(f.combine(10, 8, 3, null, null, 6, null, "LRFD", "max", true, FIRM)).toBeCloseTo(26.3, 12);
  });

  it("a firm table changes the governing value: the built-in LRFD gives 1.2x10 + 1.6x8 + 0.5x3 = 26.3 too, but a 1.5D + 1.5L table gives 27", () => {
    const own = [HEADER, ["1.5(D+L)", "LRFD", 1.5, 1.5]];
    expect(f.combine(10, 8, 3)).toBeCloseTo(26.3, 12);
    expect(f.combine(10, 8, 3, null, null, null, null, null, null, null, own)).toBeCloseTo(27, 12);
  });

  it("method service without a range: the built-in service set (common practice), D 10, L 8, S 5 -> max(D + L = 18, D + 0.75L + 0.75(0.7S) = 18.625)", () => {
    expect(f.combine(10, 8, null, 5, null, null, null, "service")).toBeCloseTo(10 + 0.75 * 8 + 0.75 * 0.7 * 5, 12);
  });

  it("COMBOS spills max(25, 2 x table rows below the header) x 2: the firm's names, W reversed beside its row", () => {
    const out = f.combos(10, 8, 3, null, null, 6, null, "LRFD", null, null, FIRM);
    expect(out).toHaveLength(Math.max(COMBINATION_ROWS_MAX, 2 * (FIRM.length - 1)));
    expect(out.slice(0, 4)).toEqual([
      ["F1", 14],
      ["F2", expect.closeTo(26.3, 12)],
      ["F3 uplift", expect.closeTo(15, 12)],
      ["F3 uplift (-W)", expect.closeTo(3, 12)],
    ]);
    expect(out.slice(4).every((r) => r[0] === "" && r[1] === "")).toBe(true);
    // a long table: 20 rows below the header, each holding W -> 40 rows
    const long = [HEADER, ...Array.from({ length: 20 }, (_, i) => [`W${i + 1}`, "ASD", 1, null, null, null, null, 0.6 + i / 100, null])];
    const spilled = f.combos(10, 0, 0, 0, 0, 5, 0, "ASD", null, null, long);
    expect(spilled).toHaveLength(40);
    expect(spilled[39]).toEqual(["W20 (-W)", expect.closeTo(10 - 0.79 * 5, 12)]);
  });

  it("the spill size follows the range's height only", () => {
    expect(combosSize([])).toEqual({ rows: 25, cols: 2 });
    const shape = (rows: number) => [undefined, undefined, undefined, undefined, undefined, undefined, undefined, undefined, undefined, undefined, { rows, cols: 9 }];
    expect(combosSize(shape(6))).toEqual({ rows: 25, cols: 2 });
    expect(combosSize(shape(14))).toEqual({ rows: 26, cols: 2 });
    expect(combosSize(shape(1))).toEqual({ rows: 25, cols: 2 });
  });

  it("errors name the argument, the row of the range and the column", () => {
    const bad = [HEADER, ["F1", "LRFD", 1.4], ["F2", "LRFD", "1.2x"]];
    expect(errorOf(f.combine(10, 8, null, null, null, null, null, null, null, null, bad)).message).toBe('combinations, row 3: column D: "1.2x" is not a number.');
    expect(errorOf(f.combos(10, 8, null, null, null, null, null, null, null, null, bad)).message).toBe('combinations, row 3: column D: "1.2x" is not a number.');
    expect(errorOf(f.combine(10, 8, null, null, null, null, null, "ASD", null, null, [HEADER, ["F1", "LRFD", 1.4]])).message).toBe(
      "combinations: the table has no ASD combination (it has LRFD).",
    );
    expect(errorOf(f.combine(10, 8, null, null, null, null, null, "USD")).message).toBe('method: "USD" is not recognised; use one of "LRFD", "ASD", "service".');
  });
});

describe("headless (HyperFormula, built bundle)", () => {
  function evaluate(formula: string, row = 0, col = 12): unknown {
    hf.setCellContents({ sheet: 0, row, col }, [[formula]]);
    return hf.getCellValue({ sheet: 0, row, col });
  }

  it("COMBINE with a range of cells: the firm's table by hand, and its errors", () => {
    hf.setCellContents({ sheet: 0, row: 19, col: 0 }, FIRM);
    expect(evaluate('=LOADPATH.COMBINE(10, 8, 3, , , 6, , "LRFD", "max", , A20:I25)')).toBeCloseTo(26.3, 10);
    expect(evaluate('=LOADPATH.COMBINE(10, 8, 3, , , 6, , "LRFD", "min", , A20:I25)')).toBeCloseTo(3, 10);
    expect(evaluate('=LOADPATH.COMBINE(10, 8, 3, , , 6, , "service", , , A20:I25)')).toBe(14);
    hf.setCellContents({ sheet: 0, row: 21, col: 3 }, [["lots"]]);
    expect(evaluate('=LOADPATH.COMBINE(10, 8, 3, , , 6, , "LRFD", "max", , A20:I25)')).toMatchObject({
      value: "#VALUE!",
      message: 'combinations, row 3: column L: "lots" is not a number.',
    });
    hf.setCellContents({ sheet: 0, row: 21, col: 3 }, [[1.6]]);
  });

  it("COMBOS with a range spills max(25, 2 x rows below the header) rows; the cell below is not part of it", () => {
    const rows = [HEADER, ...Array.from({ length: 15 }, (_, i) => [`C${i + 1}`, "LRFD", 1 + i / 10, null, null, null, null, 1, null])];
    hf.setCellContents({ sheet: 0, row: 40, col: 0 }, rows);
    hf.setCellContents({ sheet: 0, row: 40, col: 12 }, [['=LOADPATH.COMBOS(10, , , , , 4, , "LRFD", , , A41:I56)']]);
    const spilled = hf.getRangeValues({ start: { sheet: 0, row: 40, col: 12 }, end: { sheet: 0, row: 69, col: 13 } });
    // row C15: D factor 2.4 -> 2.4x10 + 4 = 28 and, reversed, 24 - 4 = 20
    expect(spilled[28]).toEqual(["C15", 28]);
    expect(spilled[29]).toEqual(["C15 (-W)", 20]);
    expect(hf.getCellValue({ sheet: 0, row: 70, col: 12 })).toBeNull();
  });

  it("a table that reproduces the built-in LRFD set gives COMBINE results equal to the built-in ones (fast-check)", () => {
    const lrfd = builtInSet("LRFD");
    const table = [HEADER, ...lrfd.rows.map((r) => [r.label, "LRFD", ...LOAD_CASES.map((c) => r.factors[c] ?? null)])];
    hf.setCellContents({ sheet: 0, row: 80, col: 0 }, table);
    const end = 80 + table.length; // 1-based last row of the table
    const v = fc.double({ min: -1e3, max: 1e3, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(v, v, v, v, v, v, v), fc.constantFrom("max", "min"), (x, extreme) => {
        hf.setCellContents({ sheet: 0, row: 2, col: 0 }, [[...x, extreme]]);
        const builtIn = evaluate("=LOADPATH.COMBINE(A3, B3, C3, D3, E3, F3, G3, \"LRFD\", H3)", 2, 12);
        const own = evaluate(`=LOADPATH.COMBINE(A3, B3, C3, D3, E3, F3, G3, "LRFD", H3, , A81:I${end})`, 2, 13);
        return typeof builtIn === "number" && builtIn === own;
      }),
      { numRuns: 40 },
    );
  });
});
