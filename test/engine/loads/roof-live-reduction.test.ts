import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { reducedRoofLiveLoad, roofR1, roofR2, type RoofReductionInput } from "../../../src/engine/loads";

// ASCE/SEI 7-22 Sec. 4.8.2, Eq. 4.8-1 (recalled from memory; verify against the standard):
//   Lr = Lo R1 R2, 12 <= Lr <= 20 psf (0.58 <= Lr <= 0.96 kN/m^2)
//   R1 = 1 (AT <= 200 ft^2), 1.2 - 0.001 AT (200 < AT < 600), 0.6 (AT >= 600); SI 18.58 / 55.74 m^2, 1.2 - 0.011 AT
//   R2 = 1 (F <= 4), 1.2 - 0.05 F (4 < F < 12), 0.6 (F >= 12); F = rise in in./ft (US), 0.12 x slope % (SI)
function value(input: RoofReductionInput): number {
  const r = reducedRoofLiveLoad(input);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

describe("ROOF_LL_REDUCE, US units", () => {
  it("small area, flat: AT 150 ft^2 -> R1 = R2 = 1 -> 20 psf", () => {
    expect(value({ lo: 20, at: 150, rise: 0, units: "US" })).toBe(20);
  });

  it("R1 between the breaks: AT 400 -> 20 (1.2 - 0.001 x 400) = 16 psf", () => {
    expect(value({ lo: 20, at: 400, rise: 0, units: "US" })).toBeCloseTo(20 * (1.2 - 0.001 * 400), 12);
  });

  it("R1 and R2 together: AT 300, rise 5 in./ft -> 20 x 0.9 x (1.2 - 0.05 x 5) = 17.1 psf", () => {
    expect(value({ lo: 20, at: 300, rise: 5, units: "US" })).toBeCloseTo(20 * (1.2 - 0.001 * 300) * (1.2 - 0.05 * 5), 12);
  });

  it("12 psf lower bound governs: AT 700, rise 6 -> 20 x 0.6 x 0.9 = 10.8 < 12 -> 12 psf", () => {
    expect(20 * 0.6 * (1.2 - 0.05 * 6)).toBeLessThan(12);
    expect(value({ lo: 20, at: 700, rise: 6, units: "US" })).toBe(12);
  });

  it("R2 at its steep limit: rise 12 in./ft -> R2 = 0.6; R1 at AT = 200 -> 1", () => {
    expect(roofR2(12)).toBe(0.6);
    expect(roofR2(4)).toBe(1);
    expect(roofR1(200, "US")).toBe(1);
    expect(roofR1(600, "US")).toBe(0.6);
  });

  it("Lo below 12 psf is never raised above Lo", () => {
    expect(value({ lo: 10, at: 100, rise: 0, units: "US" })).toBe(10);
  });

  it("Lo above 20 psf (special purpose roof, Sec. 4.8.3) is an error naming Lo", () => {
    const r = reducedRoofLiveLoad({ lo: 60, at: 400, rise: 0, units: "US" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.argument).toBe("Lo");
      expect(r.error.message).toContain("LL_REDUCE");
    }
  });

  it("negative AT or rise are errors naming the argument", () => {
    for (const [input, name] of [
      [{ lo: 20, at: -1, rise: 0, units: "US" }, "AT"],
      [{ lo: 20, at: 100, rise: -2, units: "US" }, "rise"],
      [{ lo: -20, at: 100, rise: 0, units: "US" }, "Lo"],
    ] as const) {
      const r = reducedRoofLiveLoad(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toMatchObject({ argument: name, code: "negative" });
    }
  });
});

describe("ROOF_LL_REDUCE, SI units", () => {
  it("R1 between the breaks and slope 50 % (F = 6): 0.96 (1.2 - 0.011 x 30)(1.2 - 0.05 x 6)", () => {
    expect(value({ lo: 0.96, at: 30, rise: 50, units: "SI" })).toBeCloseTo(0.96 * (1.2 - 0.011 * 30) * (1.2 - 0.05 * 0.12 * 50), 12);
  });

  it("lower bound 0.58 kN/m^2 governs: AT 60 m^2, slope 100 % -> 0.96 x 0.6 x 0.6 = 0.3456 -> 0.58", () => {
    expect(value({ lo: 0.96, at: 60, rise: 100, units: "SI" })).toBe(0.58);
  });

  it("small area: AT 18 m^2 -> 0.96", () => {
    expect(value({ lo: 0.96, at: 18, rise: 0, units: "SI" })).toBe(0.96);
  });

  it("the SI breaks are the US ones converted: 200 ft^2 = 18.58 m^2, 600 ft^2 = 55.74 m^2, 20 psf = 0.96 kPa", () => {
    expect(200 * 0.09290304).toBeCloseTo(18.58, 2);
    expect(600 * 0.09290304).toBeCloseTo(55.74, 2);
    expect(0.001 / 0.09290304).toBeCloseTo(0.011, 3);
    // 1 in./ft = 1/12 = 8.33 % slope, and F = 0.12 x 8.33 = 1
    expect(0.12 * (100 / 12)).toBeCloseTo(1, 12);
  });
});

describe("properties (fast-check)", () => {
  it("Lr is non-increasing in AT and rise and stays within [min(Lo, 12), Lo] psf", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 5000, noNaN: true }),
        fc.double({ min: 0, max: 5000, noNaN: true }),
        fc.double({ min: 0, max: 24, noNaN: true }),
        fc.double({ min: 0, max: 24, noNaN: true }),
        (lo, a1, a2, f1, f2) => {
          const at = [Math.min(a1, a2), Math.max(a1, a2)] as const;
          const rise = [Math.min(f1, f2), Math.max(f1, f2)] as const;
          const small = value({ lo, at: at[0], rise: rise[0], units: "US" });
          const large = value({ lo, at: at[1], rise: rise[1], units: "US" });
          return large <= small && small <= lo && large >= Math.min(lo, 12);
        },
      ),
    );
  });
});
