/**
 * Numbers on the drawings: two results equal but for floating-point round-off print alike (the
 * two reactions of a symmetric beam, 1.323333 kip/ft x 30 ft / 2 = 19.85 kip each, common
 * practice), so a drawing never shows 19.8 at one end and 19.9 at the other.
 */
import { describe, expect, it } from "vitest";
import { formatLength, formatValue } from "../../src/drawings/format";

describe("drawn numbers and round-off", () => {
  it("prints values equal to 12 significant figures alike", () => {
    const below = 19.849999999999998;
    const above = 19.850000000000001;
    expect(below).not.toBe(above);
    expect(formatValue(below)).toBe(formatValue(above));
    expect(formatValue(-below)).toBe(formatValue(-above));
    expect(formatLength(8.334999999999999)).toBe(formatLength(8.335000000000001));
  });

  it("keeps real differences", () => {
    expect(formatValue(19.84)).toBe("19.8");
    expect(formatValue(19.86)).toBe("19.9");
    expect(formatLength(8.331)).toBe("8.33");
  });
});
