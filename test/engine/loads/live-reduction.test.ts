import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  heavyLiveLoad,
  liveReductionFactor,
  LLR_COEFFICIENT,
  LLR_THRESHOLD_AREA,
  M2_PER_FT2,
  psfToKpa,
  reducedLiveLoad,
  type LiveReductionInput,
} from "../../../src/engine/loads";

// ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1 (recalled from memory; verify against the standard):
//   US: L = Lo (0.25 + 15 / sqrt(KLL AT)), AT in ft^2; SI: L = Lo (0.25 + 4.57 / sqrt(KLL AT)), AT in m^2
//   no reduction where KLL AT < 400 ft^2 (37.16 m^2); L >= 0.50 Lo (one floor), >= 0.40 Lo (two or more).
const US = (lo: number, kll: number, at: number, floors = 1): LiveReductionInput => ({ lo, kll, at, floors, units: "US" });
const SI = (lo: number, kll: number, at: number, floors = 1): LiveReductionInput => ({ lo, kll, at, floors, units: "SI" });

function value(r: ReturnType<typeof reducedLiveLoad>): number {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

describe("LL_REDUCE, US units (ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1, recalled from memory)", () => {
  it("threshold not reached: KLL AT = 2 x 150 = 300 < 400 ft^2 -> L = Lo = 50 psf", () => {
    expect(value(reducedLiveLoad(US(50, 2, 150)))).toBe(50);
  });

  it("equation governs: KLL AT = 4 x 400 = 1600 -> 50 (0.25 + 15/40) = 31.25 psf", () => {
    expect(value(reducedLiveLoad(US(50, 4, 400)))).toBeCloseTo(50 * (0.25 + 15 / Math.sqrt(4 * 400)), 12);
    expect(value(reducedLiveLoad(US(50, 4, 400)))).toBeCloseTo(31.25, 12);
  });

  it("just above the threshold the equation gives nearly Lo: KLL AT = 401 -> 50 (0.25 + 15/sqrt(401))", () => {
    expect(value(reducedLiveLoad(US(50, 1, 401)))).toBeCloseTo(50 * (0.25 + 15 / Math.sqrt(401)), 12);
  });

  it("0.50 limit governs for one floor: KLL AT = 4 x 2500 = 10000 -> 0.25 + 15/100 = 0.40 < 0.50 -> 25 psf", () => {
    expect(value(reducedLiveLoad(US(50, 4, 2500, 1)))).toBeCloseTo(0.5 * 50, 12);
  });

  it("0.40 limit for two or more floors: KLL AT = 10000 -> 0.40 Lo = 20 psf; KLL AT = 40000 -> 0.325 < 0.40 -> 20 psf", () => {
    expect(value(reducedLiveLoad(US(50, 4, 2500, 2)))).toBeCloseTo(50 * (0.25 + 15 / 100), 12);
    expect(value(reducedLiveLoad(US(50, 4, 10000, 3)))).toBeCloseTo(0.4 * 50, 12);
  });

  it("help-text example: 50 psf, KLL 4, AT 900 ft^2, 3 floors -> 50 (0.25 + 15/60) = 25 psf", () => {
    expect(value(reducedLiveLoad(US(50, 4, 900, 3)))).toBeCloseTo(50 * (0.25 + 15 / 60), 12);
  });

  it("Lo may be a column's accumulated live load in kip: the result is Lo times the same factor", () => {
    expect(value(reducedLiveLoad(US(86.4, 4, 1200, 4)))).toBeCloseTo(86.4 * (0.25 + 15 / Math.sqrt(4800)), 12);
  });
});

describe("LL_REDUCE, SI units (ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1 SI form, recalled from memory)", () => {
  it("threshold not reached: KLL AT = 2 x 18 = 36 < 37.16 m^2 -> L = Lo = 2.4 kN/m^2", () => {
    expect(value(reducedLiveLoad(SI(2.4, 2, 18)))).toBe(2.4);
  });

  it("equation governs: KLL AT = 4 x 40 = 160 m^2 -> 2.4 (0.25 + 4.57/sqrt(160))", () => {
    expect(value(reducedLiveLoad(SI(2.4, 4, 40)))).toBeCloseTo(2.4 * (0.25 + 4.57 / Math.sqrt(160)), 12);
  });

  it("0.50 limit for one floor: KLL AT = 1200 m^2 -> 0.25 + 4.57/34.64 = 0.382 < 0.50 -> 1.2 kN/m^2", () => {
    expect(value(reducedLiveLoad(SI(2.4, 4, 300, 1)))).toBeCloseTo(0.5 * 2.4, 12);
  });

  it("0.40 limit for two or more floors: KLL AT = 4 x 1000 -> 0.322 < 0.40 -> 0.96 kN/m^2", () => {
    expect(value(reducedLiveLoad(SI(2.4, 4, 1000, 2)))).toBeCloseTo(0.4 * 2.4, 12);
  });

  it("the SI constants are the US ones converted: 15 ft = 4.572 m, 400 ft^2 = 37.16 m^2 (1 ft = 0.3048 m)", () => {
    expect(LLR_COEFFICIENT.SI).toBeCloseTo(LLR_COEFFICIENT.US * 0.3048, 2);
    expect(LLR_THRESHOLD_AREA.SI).toBeCloseTo(LLR_THRESHOLD_AREA.US * M2_PER_FT2, 2);
  });

  it("same physical case in both systems agrees within the rounding of the SI coefficient (0.1 %)", () => {
    const us = value(reducedLiveLoad(US(50, 4, 700, 2)));
    const si = value(reducedLiveLoad(SI(psfToKpa(50), 4, 700 * M2_PER_FT2, 2)));
    expect(si / psfToKpa(us)).toBeCloseTo(1, 3);
  });
});

describe("LL_HEAVY: heavy live loads and garages (ASCE/SEI 7-22 Sec. 4.7.4 / 4.7.5, recalled from memory)", () => {
  it("no reduction for a member supporting one floor: 150 psf stays 150", () => {
    expect(value(heavyLiveLoad(US(150, 4, 2500, 1)))).toBe(150);
  });

  it("20 % reduction for two or more floors where Eq. 4.7-1 would reduce more: 0.80 x 150 = 120 psf", () => {
    expect(value(heavyLiveLoad(US(150, 4, 900, 3)))).toBeCloseTo(0.8 * 150, 12);
  });

  it("never below the Eq. 4.7-1 value: KLL AT = 600 -> 150 (0.25 + 15/sqrt(600)) = 129.4 > 120", () => {
    expect(value(heavyLiveLoad(US(150, 4, 150, 2)))).toBeCloseTo(150 * (0.25 + 15 / Math.sqrt(600)), 12);
  });

  it("SI, garage 2.4 kN/m^2 over 4 floors, large area -> 0.80 x 2.4 = 1.92 kN/m^2", () => {
    expect(value(heavyLiveLoad(SI(2.4, 4, 500, 4)))).toBeCloseTo(0.8 * 2.4, 12);
  });
});

describe("input errors name the argument", () => {
  it.each([
    [US(-50, 4, 400), "Lo", "negative"],
    [US(50, 0, 400), "KLL", "notPositive"],
    [US(50, 4, -1), "AT", "negative"],
    [US(50, 4, 400, 0), "floors", "invalid"],
    [US(50, 4, 400, 1.5), "floors", "invalid"],
    [US(Number.NaN, 4, 400), "Lo", "notANumber"],
  ])("%o -> %s", (input, argument, code) => {
    for (const f of [reducedLiveLoad, heavyLiveLoad]) {
      const r = f(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toMatchObject({ argument, code });
    }
  });
});

describe("properties (fast-check)", () => {
  const units = fc.constantFrom("US" as const, "SI" as const);
  const area = fc.double({ min: 0, max: 1e6, noNaN: true });

  it("L is non-increasing in AT, never above Lo, never below 0.50 Lo (one floor) / 0.40 Lo (two or more)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.constantFrom(1, 2, 3, 4),
        area,
        area,
        fc.integer({ min: 1, max: 60 }),
        units,
        (lo, kll, a1, a2, floors, u) => {
          const [small, large] = a1 <= a2 ? [a1, a2] : [a2, a1];
          const l1 = value(reducedLiveLoad({ lo, kll, at: small, floors, units: u }));
          const l2 = value(reducedLiveLoad({ lo, kll, at: large, floors, units: u }));
          const least = (floors >= 2 ? 0.4 : 0.5) * lo;
          return l2 <= l1 && l1 <= lo && l2 >= least - 1e-12 * lo;
        },
      ),
    );
  });

  it("LL_HEAVY >= LL_REDUCE and >= 0.80 Lo, <= Lo", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 500, noNaN: true }), fc.constantFrom(1, 2, 3, 4), area, fc.integer({ min: 1, max: 60 }), units, (lo, kll, at, floors, u) => {
        const input = { lo, kll, at, floors, units: u };
        const heavy = value(heavyLiveLoad(input));
        return heavy >= value(reducedLiveLoad(input)) && heavy >= 0.8 * lo - 1e-12 * lo && heavy <= lo;
      }),
    );
  });

  it("the factor is continuous at the threshold (Eq. 4.7-1 gives exactly 1 at KLL AT = 400 ft^2)", () => {
    expect(liveReductionFactor(400, 1, "US")).toBe(1);
    expect(0.25 + 15 / Math.sqrt(400)).toBe(1);
  });
});
