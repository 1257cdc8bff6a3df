/** Totals as the pane prints them: digits by size, and round-off never shown as "-0.00" (common practice). */
import { describe, expect, it } from "vitest";
import { formatTotal } from "../../src/taskpane/components/Results";

describe("formatTotal", () => {
  it("prints sensible digits and no negative zero", () => {
    expect(formatTotal(771.2345)).toBe("771.2");
    expect(formatTotal(1234.5)).toBe("1,235");
    expect(formatTotal(4.5678)).toBe("4.57");
    expect(formatTotal(-5.7e-14)).toBe("0.00");
    expect(formatTotal(-0.004)).toBe("0.00");
    expect(formatTotal(-0.006)).toBe("-0.01");
    expect(formatTotal(Number.NaN)).toBe("—");
  });
});
