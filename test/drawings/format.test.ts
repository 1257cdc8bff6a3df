import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatLength, formatValue, MINUS, parseDrawnNumber } from "../../src/drawings/format";

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
