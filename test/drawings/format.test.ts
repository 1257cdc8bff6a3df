import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DECIMALS, fixedDecimals, formatDifference, formatLength, formatQuantity, formatValue, MINUS, parseDrawnNumber } from "../../src/drawings/format";

describe("formatValue", () => {
  it("prints three significant figures with a true minus sign", () => {
    expect(formatValue(96.56667)).toBe("96.6");
    expect(formatValue(-10.58333)).toBe(`${MINUS}10.6`);
    expect(formatValue(0.5)).toBe("0.5");
    expect(formatValue(0.012345)).toBe("0.0123");
    expect(formatValue(1234.5)).toBe("1235");
    expect(formatValue(-0)).toBe("0");
    expect(formatValue(Number.NaN)).toBe("?");
  });

  it("reads back within half a unit of the third significant figure (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (v) => {
        const back = parseDrawnNumber(formatValue(v));
        expect(Number.isNaN(back)).toBe(false);
        expect(Math.abs(back - v)).toBeLessThanOrEqual(Math.max(5e-3 * Math.abs(v), 0.5e-6) + 1e-12);
      }),
      { numRuns: 500 },
    );
  });
});

describe("formatLength", () => {
  it("prints at most two decimals and drops trailing zeros", () => {
    expect(formatLength(12.5)).toBe("12.5");
    expect(formatLength(21.16535)).toBe("21.17");
    expect(formatLength(30)).toBe("30");
    expect(formatLength(-0.001)).toBe("0");
  });
});

/** A printed number read back (true minus accepted). */
const back = (s: string) => Number(s.replace(MINUS, "-"));

describe("fixedDecimals (tables of the report and the CLI)", () => {
  it("prints the symmetric corner columns of sample (a) alike: the exact values the takedown gives", () => {
    // Cumulative Lr on the four roof corner columns of sample-workbooks/steel-office-us.xlsx, as the
    // engine sums them (the same 3.75 kip with round-off of either sign). toFixed(1) printed 3.8 and 3.7.
    const corners = [3.750000000000001, 3.7499999999999996, 3.7500000000000018, 3.7500000000000004];
    expect(corners.map((v) => v.toFixed(1))).toContain("3.7"); // the defect this replaces
    for (const d of [0, 1, 2, 3]) expect(new Set(corners.map((v) => fixedDecimals(v, d))).size).toBe(1);
    expect(fixedDecimals(corners[1]!, 1)).toBe("3.8");
    // Their dead loads, 9.8575 kip, at three decimals (toFixed gives 9.858 and 9.857).
    expect([9.8575, 9.857499999999998, 9.857500000000002].map((v) => fixedDecimals(v, 3))).toEqual(["9.858", "9.858", "9.858"]);
  });

  it("rounds halves away from zero as the number is written, never in exponent notation, never −0", () => {
    // Common practice for hand calculation: a trailing 5 rounds away from zero.
    expect(fixedDecimals(1.005, 2)).toBe("1.01");
    expect(fixedDecimals(-2.5, 0)).toBe(`${MINUS}3`);
    expect(fixedDecimals(0.5, 0)).toBe("1");
    expect(fixedDecimals(-1e-13, 3)).toBe("0.000");
    expect(fixedDecimals(1.1e-13, 2)).toBe("0.00");
    expect(fixedDecimals(63, 1)).toBe("63.0");
    expect(fixedDecimals(1e21, 0)).toBe("1000000000000000000000");
    expect(fixedDecimals(-4.2, 2, "-")).toBe("-4.20");
    expect(fixedDecimals(Number.NaN, 2)).toBe("?");
  });

  it("is within half a unit of the last decimal of the value (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true }), fc.integer({ min: 0, max: 6 }), (x, d) => {
        const s = fixedDecimals(x, d);
        expect(s).toMatch(d === 0 ? new RegExp(`^${MINUS}?\\d+$`) : new RegExp(`^${MINUS}?\\d+\\.\\d{${d}}$`));
        expect(Math.abs(back(s) - x)).toBeLessThanOrEqual(0.5 * 10 ** -d + 1e-11 * Math.abs(x) + 1e-15);
        if (back(s) === 0) expect(s.startsWith(MINUS)).toBe(false);
      }),
    );
  });

  it("prints a decimal value and the same value off by round-off alike (fast-check)", () => {
    fc.assert(
      fc.property(fc.integer({ min: -10_000_000, max: 10_000_000 }), fc.integer({ min: 0, max: 4 }), fc.integer({ min: 0, max: 5 }), fc.integer({ min: -4, max: 4 }), (k, m, d, ulps) => {
        const x = k / 10 ** m; // a value as an engineer writes it, e.g. 3.75
        const noisy = x + ulps * Number.EPSILON * Math.abs(x); // as a sum of floating-point terms gives it
        expect(fixedDecimals(noisy, d)).toBe(fixedDecimals(x, d));
        const magnitude = fixedDecimals(Math.abs(x), d);
        expect(fixedDecimals(-Math.abs(x), d)).toBe(back(magnitude) === 0 ? magnitude : MINUS + magnitude);
      }),
    );
  });

  it("uses the decimals chosen per quantity", () => {
    expect(formatQuantity(12.3456, "force")).toBe("12.35");
    expect(formatQuantity(0.12345, "line")).toBe("0.123");
    expect(formatQuantity(187.5, "area")).toBe("187.5");
    expect(formatQuantity(0.7985, "factor")).toBe("0.799");
    expect(formatQuantity(2, "count")).toBe("2");
    expect(Object.keys(DECIMALS)).toEqual(["force", "moment", "line", "length", "area", "factor", "count"]);
  });
});

describe("formatDifference (the load balance)", () => {
  it("prints round-off as 0 at the quantity's precision: the balance of sample (a)", () => {
    // Case D of sample-workbooks/steel-office-us.xlsx: applied 771.2200000000001, supports 771.22;
    // the difference printed 1.1e-13 before.
    expect(formatDifference(771.2200000000001 - 771.22, [771.2200000000001, 771.22], 3, "-")).toBe("0.000");
    expect(formatDifference(410.6333333333334 - 410.63333333333344, [410.6333333333334], 3)).toBe("0.000");
    expect(formatDifference(0, [0, 0], 2)).toBe("0.00");
  });

  it("prints a real difference in full, without exponent (63 printed 6.3e+1 before)", () => {
    expect(formatDifference(63, [771.22, 708.22], 3, "-")).toBe("63.000");
    expect(formatDifference(-0.004, [60, 60.004], 3)).toBe(`${MINUS}0.004`);
    // At 1e-9 of the load a difference is round-off; ten times that is not hidden when it shows.
    expect(formatDifference(1e-6, [1000], 6)).toBe("0.000000");
    expect(formatDifference(1e-5, [1000], 6)).toBe("0.000010");
  });
});

describe("formatValue against the magnitude it is read with", () => {
  it("prints round-off as 0, never in exponent notation, and keeps real small values", () => {
    // A reaction of 1.2e-14 kip beside one of 30 kip is floating-point noise of an exact 0.
    expect(formatValue(1.2e-14, 3, 30)).toBe("0");
    expect(formatValue(-2.9e-8, 3, 30)).toBe("0");
    expect(formatValue(3.1e-8, 3, 30)).toBe("3.10e-8"); // above 1e-9 x 30: shown, it is not round-off
    expect(formatValue(0.0123, 3, 30)).toBe("0.0123");
    expect(formatValue(1.2e-14)).toBe("1.20e-14"); // without a reference nothing is hidden
  });
});
