/**
 * Deflection check per segment (src/engine/envelope/deflection-limits.ts) against the deflection
 * formulas of AISC Steel Construction Manual Table 3-23 (recalled from memory; case numbers as
 * recalled) and the limit lengths of the issue (span between supports; twice an overhang).
 */
import { describe, expect, it } from "vitest";
import type { BeamLoad, Support } from "../../../src/engine/beam/types";
import { deflectionCheck } from "../../../src/engine/envelope";

const line = (start: number, end: number, w: number): BeamLoad => ({ kind: "line", start, end, w1: w, w2: w });
const pins = (...xs: number[]): Support[] => xs.map((x) => ({ x, type: "pin" }));
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe("overhanging beam, live load on the overhang (Table 3-23, case 25, recalled from memory)", () => {
  const l = 5;
  const a = 2;
  const w = 3;
  const EI = 12000;
  // Live load on the balcony only (a back span loaded on its own would deflect more, downward).
  const r = deflectionCheck({ span: l + a, supports: pins(0, l), loads: { L: [line(l, l + a, w)] } }, { flexuralRigidity: EI });
  if (!r.ok) throw new Error(r.error.message);
  const [span, overhang] = r.value.segments;

  it("tip deflection w a^3 (4l + 3a) / (24 EI); limit length 2a", () => {
    expect(rel(overhang!.live!.deflectionEI, (w * a ** 3 * (4 * l + 3 * a)) / 24)).toBeLessThan(1e-12);
    expect(overhang!.live!.pattern).toBe("L on overhang right");
    expect(overhang!.live!.limitLength).toBe(2 * a);
    expect(rel(overhang!.live!.allowable, (2 * a) / 360)).toBeLessThan(1e-15);
  });

  it("back span lifts by w a^2 l^2 / (18 sqrt(3) EI) = 0.03208 w a^2 l^2 / EI (magnitude checked against l/360)", () => {
    const up = span!.live!;
    expect(up.deflectionEI).toBeLessThan(0);
    expect(rel(-up.deflectionEI, (w * a * a * l * l) / (18 * Math.sqrt(3)))).toBeLessThan(1e-10);
    expect(rel(up.x, l / Math.sqrt(3))).toBeLessThan(1e-9);
    expect(up.pattern).toBe("L on overhang right");
    expect(up.limitLength).toBe(l);
    expect(rel(up.ratio!, -up.deflectionEI / EI / (l / 360))).toBeLessThan(1e-12);
  });

  it("required EI makes the governing segment's deflection equal its allowable", () => {
    const need = Math.max(...r.value.segments.flatMap((s) => [s.live, s.total]).map((d) => (d ? Math.abs(d.deflectionEI) / d.allowable : 0)));
    expect(rel(r.value.requiredEI, need)).toBeLessThan(1e-12);
  });
});

describe("two equal spans (Table 3-23, continuous beam cases, recalled from memory)", () => {
  const l = 6;
  const w = 2;
  const r = deflectionCheck({ span: 2 * l, supports: pins(0, l, 2 * l), loads: { D: [line(0, 2 * l, w)], L: [line(0, 2 * l, w)] } });
  if (!r.ok) throw new Error(r.error.message);

  it("live: one span loaded governs, 0.0092 w l^4 / EI (case 29, two-figure table value)", () => {
    const live = r.value.live!;
    expect(rel(live.deflectionEI, 0.0092 * w * l ** 4)).toBeLessThan(0.01);
    expect(live.pattern).toMatch(/^L on span [12]$/);
    expect(live.limitLength).toBe(l);
    expect(live.deflection).toBeNull();
  });

  it("total: D + L on both spans, w l^4 / (185 EI) (two equal spans, uniform load; recalled from memory)", () => {
    // With D on both spans the governing total pattern may still be L on one span; check the full-load value.
    const full = deflectionCheck({ span: 2 * l, supports: pins(0, l, 2 * l), loads: { D: [line(0, 2 * l, 2 * w)] } });
    if (!full.ok) throw new Error(full.error.message);
    expect(rel(full.value.total!.deflectionEI, (2 * w * l ** 4) / 185)).toBeLessThan(0.005);
    expect(Math.abs(r.value.total!.deflectionEI)).toBeGreaterThanOrEqual(Math.abs(full.value.total!.deflectionEI));
  });
});

describe("limit lengths", () => {
  it("a 28 ft member on supports at 0 and 22 ft: span limit on 22 ft, overhang limit on 2 x 6 ft", () => {
    const r = deflectionCheck({ span: 28, supports: pins(0, 22), loads: { L: [line(0, 28, 0.5)] } }, { limits: { live: 480, total: 240 } });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.segments[0]!.live!.limitLength).toBe(22);
    expect(r.value.segments[0]!.live!.allowable).toBeCloseTo(22 / 480, 15);
    expect(r.value.segments[1]!.live!.limitLength).toBe(12);
  });

  it("bad limits are values naming the argument", () => {
    const r = deflectionCheck({ span: 6, supports: pins(0, 6), loads: { L: [line(0, 6, 1)] } }, { limits: { live: 0, total: 240 } });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toMatch(/^live limit: /);
  });
});

describe("live load over the whole overhanging beam: each segment takes its own worst pattern", () => {
  it("back span: 5wl^4/384EI with the overhang off; tip: the larger of the two cantilever cases (Table 3-23 cases 25 and 27, recalled from memory)", () => {
    const l = 5;
    const a = 2;
    const w = 3;
    const r = deflectionCheck({ span: l + a, supports: pins(0, l), loads: { L: [line(0, l + a, w)] } });
    if (!r.ok) throw new Error(r.error.message);
    const [span, overhang] = r.value.segments;
    // Case 27-type (uniform load between supports only, recalled): midspan 5wl^4/384EI, tip rises w l^3 a / (24 EI).
    expect(rel(span!.live!.deflectionEI, (5 * w * l ** 4) / 384)).toBeLessThan(1e-12);
    expect(span!.live!.pattern).toBe("L on span 1");
    const tipDown = (w * a ** 3 * (4 * l + 3 * a)) / 24;
    const tipUp = (w * l ** 3 * a) / 24;
    expect(rel(Math.abs(overhang!.live!.deflectionEI), Math.max(tipDown, tipUp))).toBeLessThan(1e-12);
    expect(overhang!.live!.pattern).toBe(tipUp > tipDown ? "L on span 1" : "L on overhang right");
  });
});
