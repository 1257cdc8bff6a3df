import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { lineLoad, tributaryWidth } from "../../../src/engine/loads";

// Tributary width = half the spacing to each neighbour; an edge or opening side contributes its
// overhang only (common practice: the load of a strip of slab goes to the nearer support).
describe("tributaryWidth", () => {
  it("interior line: half of each adjacent spacing (common practice)", () => {
    const r = tributaryWidth(6, 7);
    expect(r).toEqual({ ok: true, value: 6 / 2 + 7 / 2 });
  });

  it("slab edge: blank spacing contributes only the overhang (common practice)", () => {
    expect(tributaryWidth(8, null, null, 1.5)).toEqual({ ok: true, value: 8 / 2 + 1.5 });
    expect(tributaryWidth(null, 8)).toEqual({ ok: true, value: 0 + 8 / 2 });
  });

  it("opening beside the member: zero spacing, no overhang (common practice)", () => {
    expect(tributaryWidth(0, 10)).toEqual({ ok: true, value: 10 / 2 });
  });

  it("negative values are errors naming the argument", () => {
    for (const [args, name] of [
      [[-1, 5], "spacing_a"],
      [[5, -1], "spacing_b"],
      [[0, 5, -2], "overhang_a"],
      [[5, 0, 0, -2], "overhang_b"],
    ] as const) {
      const r = tributaryWidth(...(args as unknown as [number, number, number?, number?]));
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.error.argument).toBe(name);
        expect(r.error.code).toBe("negative");
        expect(r.error.message.startsWith(`${name}: `)).toBe(true);
      }
    }
  });

  it("an overhang beside a spacing is refused (overhang applies only at an edge)", () => {
    const r = tributaryWidth(10, 8, 2);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.argument).toBe("overhang_a");
  });

  it("NaN is an error naming the argument", () => {
    const r = tributaryWidth(Number.NaN, 8);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatchObject({ code: "notANumber", argument: "spacing_a" });
  });

  it("property: swapping the sides gives the same width (common practice: symmetry)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }), (a, b) => {
        const ab = tributaryWidth(a, b);
        const ba = tributaryWidth(b, a);
        return ab.ok && ba.ok && ab.value === ba.value;
      }),
    );
  });
});

describe("lineLoad", () => {
  it("80 psf on a 7.5 ft width = 600 plf = 0.6 kip/ft (psf x ft = plf, common practice)", () => {
    const r = lineLoad(80 / 1000, 7.5);
    expect(r.ok && r.value).toBeCloseTo((80 * 7.5) / 1000, 12);
  });

  it("adds the extra line load (self weight)", () => {
    const r = lineLoad(80 / 1000, 7.5, 0.05);
    expect(r.ok && r.value).toBeCloseTo((80 * 7.5) / 1000 + 0.05, 12);
  });

  it("SI: 4.0 kPa x 2.5 m = 10 kN/m (kPa x m = kN/m)", () => {
    const r = lineLoad(4.0, 2.5, 1.2);
    expect(r.ok && r.value).toBeCloseTo(4.0 * 2.5 + 1.2, 12);
  });

  it("negative tributary width is an error naming trib_width", () => {
    const r = lineLoad(0.08, -2);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatchObject({ code: "negative", argument: "trib_width" });
  });
});
