/**
 * Bad input and unstable supports: every failure is a value (never an exception) whose code is
 * from the closed set in src/engine/errors.ts and whose message names the argument and, for the
 * loads and supports lists, the 1-based row (docs/interface.md section 1). Which layouts are unstable is
 * statics (common practice): a member needs a fixed support or pins at two different points.
 */
import { describe, expect, it } from "vitest";
import type { EngineError } from "../../../src/engine/errors";
import { MAX_LOADS, MAX_SUPPORTS, solveBeam, type BeamLoad, type BeamModel, type Support } from "../../../src/engine/beam";

const pin = (x: number): Support => ({ x, type: "pin" });
const fixed = (x: number): Support => ({ x, type: "fixed" });
const full: BeamLoad = { kind: "line", start: 0, end: 10, w1: 1, w2: 1 };
const simple = (loads: BeamLoad[], supports: Support[] = [pin(0), pin(10)]): BeamModel => ({ span: 10, supports, loads });

function failure(model: unknown): EngineError {
  const r = solveBeam(model as BeamModel);
  if (r.ok) throw new Error("expected a failure");
  return r.error;
}

describe("span", () => {
  it.each([
    [Number.NaN, "notANumber"],
    [Number.POSITIVE_INFINITY, "notANumber"],
    ["10", "notANumber"],
    [undefined, "notANumber"],
    [0, "notPositive"],
    [-4, "notPositive"],
  ])("span %s -> %s, naming the argument", (span, code) => {
    const e = failure({ span, supports: [pin(0)], loads: [] });
    expect(e.code).toBe(code);
    expect(e.argument).toBe("span");
    expect(e.row).toBeUndefined();
    expect(e.message).toMatch(/^span: /);
  });
});

describe("loads", () => {
  it("a start outside the member: outOfMember, row = index + 1", () => {
    const e = failure(simple([full, { kind: "line", start: 12, end: 13, w1: 1, w2: 1 }]));
    expect(e).toMatchObject({ code: "outOfMember", argument: "loads", row: 2 });
    expect(e.message).toBe("loads, row 2: start 12 is outside the member (0 to 10).");
  });
  it("an end outside, a point or a couple outside", () => {
    expect(failure(simple([{ kind: "line", start: 2, end: 10.5, w1: 1, w2: 1 }]))).toMatchObject({ code: "outOfMember", row: 1 });
    expect(failure(simple([full, full, { kind: "point", x: -1, p: 3 }]))).toMatchObject({ code: "outOfMember", row: 3 });
    expect(failure(simple([{ kind: "moment", x: 11, m: 3 }])).message).toBe("loads, row 1: position 11 is outside the member (0 to 10).");
  });
  it("end before start: invalid", () => {
    const e = failure(simple([full, full, full, { kind: "line", start: 5, end: 3, w1: 1, w2: 1 }]));
    expect(e).toMatchObject({ code: "invalid", argument: "loads", row: 4 });
    expect(e.message).toBe("loads, row 4: end 3 is before start 5.");
  });
  it("non-finite numbers anywhere: notANumber with the row", () => {
    expect(failure(simple([{ kind: "line", start: 0, end: 10, w1: Number.NaN, w2: 1 }]))).toMatchObject({ code: "notANumber", row: 1 });
    expect(failure(simple([full, { kind: "line", start: 0, end: 10, w1: 1, w2: Number.POSITIVE_INFINITY }])).message).toBe(
      "loads, row 2: end magnitude must be a finite number; got Infinity.",
    );
    expect(failure(simple([{ kind: "point", x: Number.NaN, p: 1 }]))).toMatchObject({ code: "notANumber", row: 1 });
    expect(failure(simple([{ kind: "point", x: 2, p: "5" } as unknown as BeamLoad]))).toMatchObject({ code: "notANumber", row: 1 });
    expect(failure(simple([{ kind: "moment", x: 2, m: Number.NEGATIVE_INFINITY }]))).toMatchObject({ code: "notANumber", row: 1 });
  });
  it("an unknown kind: unknownKind with the row", () => {
    const e = failure(simple([full, { kind: "distributed", x: 1 } as unknown as BeamLoad]));
    expect(e).toMatchObject({ code: "unknownKind", argument: "loads", row: 2 });
    expect(e.message).toBe('loads, row 2: kind "distributed" is not one of line, point, moment.');
    expect(failure(simple([null as unknown as BeamLoad]))).toMatchObject({ code: "unknownKind", row: 1 });
  });
  it(`more than ${MAX_LOADS} loads: tooManyRows; exactly ${MAX_LOADS} is fine`, () => {
    const many = Array.from({ length: MAX_LOADS + 1 }, (_, i): BeamLoad => ({ kind: "point", x: (i % 10) + 0.5, p: 1 }));
    const e = failure(simple(many));
    expect(e).toMatchObject({ code: "tooManyRows", argument: "loads" });
    expect(e.message).toBe(`loads: ${MAX_LOADS + 1} loads given; at most ${MAX_LOADS} are allowed.`);
    const r = solveBeam(simple(many.slice(1)));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.reactions[0] + r.value.reactions[1]).toBeCloseTo(MAX_LOADS, 8);
  });
  it("not a list: badShape", () => {
    expect(failure({ span: 10, supports: [pin(0), pin(10)], loads: 5 })).toMatchObject({ code: "badShape", argument: "loads" });
  });
  it("a position within rounding past an end is taken as the end", () => {
    const r = solveBeam(simple([{ kind: "line", start: 0, end: 10 * (1 + 1e-15), w1: 2, w2: 2 }, { kind: "point", x: -1e-14, p: 1 }]));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.model.loads[0]).toEqual({ kind: "line", start: 0, end: 10, w1: 2, w2: 2 });
    expect(r.value.model.loads[1]).toEqual({ kind: "point", x: 0, p: 1 });
    expect(r.value.reactions[0]).toBeCloseTo(11, 12);
  });
  it("no loads at all is a valid, unloaded member", () => {
    const r = solveBeam(simple([]));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.reactions).toEqual([0, 0]);
      expect(r.value.maxSagging()).toEqual({ value: 0, x: 0 });
      expect(r.value.maxDeflectionEI().value).toBe(0);
    }
  });
});

describe("supports", () => {
  it("a position outside: outOfMember with the row", () => {
    const e = failure(simple([full], [pin(0), pin(10), pin(10.5)]));
    expect(e).toMatchObject({ code: "outOfMember", argument: "supports", row: 3 });
    expect(e.message).toBe("supports, row 3: position 10.5 is outside the member (0 to 10).");
  });
  it("a type other than pin or fixed: unknownSupportType with the row", () => {
    const e = failure(simple([full], [pin(0), { x: 10, type: "roller" } as unknown as Support]));
    expect(e).toMatchObject({ code: "unknownSupportType", argument: "supports", row: 2 });
    expect(e.message).toBe('supports, row 2: type "roller" is not one of pin, fixed.');
  });
  it("a non-finite position: notANumber", () => {
    expect(failure(simple([full], [pin(Number.NaN), pin(10)]))).toMatchObject({ code: "notANumber", argument: "supports", row: 1 });
  });
  it(`more than ${MAX_SUPPORTS} supports: tooManyRows`, () => {
    const many = Array.from({ length: MAX_SUPPORTS + 1 }, (_, i) => pin((10 * i) / MAX_SUPPORTS));
    expect(failure(simple([full], many))).toMatchObject({ code: "tooManyRows", argument: "supports" });
    expect(solveBeam(simple([full], many.slice(1))).ok).toBe(true);
  });
  it("not a list: badShape; no model: missing", () => {
    expect(failure({ span: 10, supports: "0, 10", loads: [] })).toMatchObject({ code: "badShape", argument: "supports" });
    expect(failure(null)).toMatchObject({ code: "missing" });
  });
});

describe("unstable and degenerate supports", () => {
  it("no supports", () => {
    const e = failure(simple([full], []));
    expect(e).toMatchObject({ code: "unstable", argument: "supports" });
    expect(e.message).toMatch(/^supports: the member is unstable/);
  });
  it("a single pin, at an end or inside", () => {
    for (const x of [0, 4, 10]) {
      const e = failure(simple([full], [pin(x)]));
      expect(e.code).toBe("unstable");
      expect(e.message).toBe("supports: the member is unstable (a single pin cannot hold it); add a support or make one fixed.");
    }
  });
  it("several pins at one point", () => {
    const e = failure(simple([full], [pin(5), pin(5), pin(5)]));
    expect(e.code).toBe("unstable");
    expect(e.message).toContain("all 3 pins are at x = 5");
  });
  it("two supports at one point, one of them fixed: invalid, naming both rows", () => {
    const e = failure(simple([full], [fixed(5), pin(5)]));
    expect(e).toMatchObject({ code: "invalid", argument: "supports", row: 2 });
    expect(e.message).toContain("rows 1 and 2 are both at x = 5");
  });
  it("two pins at one point among others: invalid", () => {
    const e = failure(simple([full], [pin(0), pin(6), pin(10), pin(6)]));
    expect(e).toMatchObject({ code: "invalid", row: 4 });
    expect(e.message).toContain("rows 2 and 4 are both at x = 6");
  });
  it("supports too close to tell apart (singular equations): unstable", () => {
    const e = failure(simple([full], [fixed(0), pin(1e-9)]));
    expect(e.code).toBe("unstable");
    expect(e.message).toMatch(/too close together/);
  });
  it("stable layouts that are not the usual ones still solve", () => {
    for (const supports of [[fixed(3)], [fixed(0), fixed(10)], [fixed(4), fixed(6)], [pin(2), pin(3)], [fixed(0), pin(5), fixed(10)], [pin(0), pin(2), pin(7), fixed(10)]]) {
      const r = solveBeam(simple([full], supports));
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.value.reactions.reduce((a, b) => a + b, 0)).toBeCloseTo(10, 10);
    }
  });
});

describe("reading values", () => {
  const r = solveBeam(simple([full, { kind: "point", x: 4, p: 3 }, { kind: "moment", x: 7, m: 2 }]));
  if (!r.ok) throw new Error(r.error.message);
  const s = r.value;

  it("outside the member or not a number: NaN, never a value from beyond the ends", () => {
    for (const x of [-0.5, 10.5, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(s.shearAt(x)).toBeNaN();
      expect(s.momentAt(x)).toBeNaN();
      expect(s.slopeEIAt(x)).toBeNaN();
      expect(s.deflectionEIAt(x)).toBeNaN();
    }
  });
  it("at the ends both sides give the value inside the member", () => {
    expect(s.shearAt(0, "left")).toBe(s.shearAt(0, "right"));
    expect(s.shearAt(0)).toBe(s.reactions[0]);
    expect(s.shearAt(10, "right")).toBe(s.shearAt(10, "left"));
    expect(s.shearAt(10)).toBeCloseTo(-s.reactions[1], 12);
  });
  it("at a point load the shear differs by the load; at a couple the moment by the couple (ccw + lowers M)", () => {
    expect(s.shearAt(4, "left") - s.shearAt(4, "right")).toBeCloseTo(3, 12);
    expect(s.momentAt(4, "left")).toBeCloseTo(s.momentAt(4, "right"), 12);
    expect(s.momentAt(7, "left") - s.momentAt(7, "right")).toBeCloseTo(2, 12);
    expect(s.shearAt(7, "left")).toBeCloseTo(s.shearAt(7, "right"), 12);
  });
  it("extremes are cached and stable across calls", () => {
    expect(s.maxSagging()).toBe(s.maxSagging());
    expect(s.maxDeflectionEI()).toBe(s.maxDeflectionEI());
    expect(s.criticalPoints()).toEqual(s.criticalPoints());
  });
  it("at an interior support the right-side shear includes its reaction", () => {
    const c = solveBeam(simple([full], [pin(0), pin(6), pin(10)]));
    if (!c.ok) throw new Error(c.error.message);
    expect(c.value.shearAt(6, "right") - c.value.shearAt(6, "left")).toBeCloseTo(c.value.reactions[1], 12);
  });
});
