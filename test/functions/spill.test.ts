/**
 * Spill sizes follow from argument sizes only (docs/interface.md section 1): REACTIONS one row per
 * supports row, DIAGRAM an upper bound from the load and support rows and the stations typed in
 * the formula. Padding fills with "" (a null inside a returned array would show as 0).
 */
import { describe, expect, it } from "vitest";
import { DEFAULT_STATIONS, diagramRowBound, diagramSize, maxBasePoints, padToSize, reactionsSize, shapeOfValue, spillSize } from "../../src/functions/spill";

describe("REACTIONS", () => {
  it("one row, one cell per supports row; 2 when left out", () => {
    expect(reactionsSize([{ rows: 1, cols: 1 }, { rows: 4, cols: 5 }, { rows: 3, cols: 2 }])).toEqual({ rows: 1, cols: 3 });
    expect(reactionsSize([{ rows: 1, cols: 1 }, { rows: 4, cols: 5 }, undefined, undefined])).toEqual({ rows: 1, cols: 2 });
  });
  it("a whole-column reference is capped at the most supports accepted", () => {
    expect(spillSize("REACTIONS", [undefined, undefined, { rows: 1048576, cols: 2 }])).toEqual({ rows: 1, cols: 100 });
  });
});

describe("DIAGRAM", () => {
  it("bound: two rows per base position, two zero-shear points per interval, stations + 1", () => {
    // 1 load row, supports left out: base positions <= 2 ends + 2 supports + 2 load ends = 6
    expect(maxBasePoints(1, 2)).toBe(6);
    expect(diagramRowBound(1, 2, 20)).toBe(2 * 6 + 2 * 5 + 21);
    expect(diagramSize([{ rows: 1, cols: 1, literal: 10 }, { rows: 1, cols: 1, literal: 1.5 }, undefined, undefined])).toEqual({ rows: diagramRowBound(1, 2, DEFAULT_STATIONS), cols: 3 });
  });
  it("stations typed in the formula size the spill; from a reference the default is used", () => {
    expect(diagramSize([undefined, { rows: 5, cols: 5 }, { rows: 3, cols: 2 }, { rows: 1, cols: 1, literal: 8 }]).rows).toBe(diagramRowBound(5, 3, 8));
    expect(diagramSize([undefined, { rows: 5, cols: 5 }, { rows: 3, cols: 2 }, { rows: 1, cols: 1 }]).rows).toBe(diagramRowBound(5, 3, DEFAULT_STATIONS));
  });
});

describe("helpers", () => {
  it("shapes of values as a function receives them", () => {
    expect(shapeOfValue(null)).toBeUndefined();
    expect(shapeOfValue(7)).toEqual({ rows: 1, cols: 1, literal: 7 });
    expect(shapeOfValue([[7]])).toEqual({ rows: 1, cols: 1, literal: 7 });
    expect(shapeOfValue([[1, 2, 3], [4, 5, 6]])).toEqual({ rows: 2, cols: 3 });
  });
  it("padding with \"\"; a result larger than its size does not fit", () => {
    expect(padToSize([[1, 2]], { rows: 2, cols: 3 })).toEqual([[1, 2, ""], ["", "", ""]]);
    expect(padToSize([[1, 2, 3, 4]], { rows: 1, cols: 3 })).toBeUndefined();
  });
  it("functions without a rule do not spill", () => {
    expect(spillSize("MOMENT_MAX", [])).toBeUndefined();
  });
});
