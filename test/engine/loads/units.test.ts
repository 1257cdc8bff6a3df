import { describe, expect, it } from "vitest";
import { ft2ToM2, kpaToPsf, KPA_PER_PSF, M2_PER_FT2, m2ToFt2, parseUnitSystem, psfToKpa } from "../../../src/engine/loads";

describe("units", () => {
  it("1 ft = 0.3048 m exactly (international foot, 1959), so 1 ft^2 = 0.09290304 m^2", () => {
    expect(M2_PER_FT2).toBe(0.3048 * 0.3048);
    expect(ft2ToM2(400)).toBeCloseTo(37.16, 2); // ASCE/SEI 7-22 Sec. 4.7.3 quotes 400 ft^2 = 37.16 m^2 (recalled from memory)
    expect(m2ToFt2(ft2ToM2(123.4))).toBeCloseTo(123.4, 10);
  });

  it("1 psf = 47.880 Pa (1 lbf = 4.4482216152605 N exactly, NIST SP 811)", () => {
    expect(KPA_PER_PSF * 1000).toBeCloseTo(47.880259, 5);
    expect(psfToKpa(100)).toBeCloseTo(4.79, 2); // ASCE/SEI 7-22 Sec. 4.7.4: 100 psf = 4.79 kN/m^2 (recalled from memory)
    expect(kpaToPsf(psfToKpa(55))).toBeCloseTo(55, 10);
  });

  it("parses units case-insensitively; blank is US; unknown is an error listing the keys", () => {
    expect(parseUnitSystem(" si ")).toEqual({ ok: true, value: "SI" });
    expect(parseUnitSystem(null)).toEqual({ ok: true, value: "US" });
    const bad = parseUnitSystem("metric");
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.error).toMatchObject({ code: "unknownUnits", argument: "units" });
      expect(bad.error.message).toContain("US, SI");
    }
  });
});
