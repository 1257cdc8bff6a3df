/**
 * The beam worksheet functions called as a host calls them (raw values, ranges as 2-D arrays,
 * left-out arguments as null), checked against published closed forms:
 *   AISC Steel Construction Manual (15th ed.), Table 3-23 "Shears, Moments and Deflections"
 *   (case numbers recalled from memory; the formulas are the classical ones printed there),
 * the unit conversions worked by hand in inches or millimetres, statics for couples, and
 * properties (equilibrium, diagram consistent with the extremes) with fast-check.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { installCustomFunctionsGlobal, ShimError } from "../../src/workbook/headless-shim";
import { diagramRowBound } from "../../src/functions/spill";

type Fns = typeof import("../../src/functions/beam-functions");
let f: Fns;

beforeAll(async () => {
  installCustomFunctionsGlobal();
  f = await import("../../src/functions/beam-functions");
});

/** Relative closeness for values that come out of different arithmetic. */
function close(actual: unknown, expected: number, rel = 1e-9): void {
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

/** Excel passes a left-out optional argument as null (the declared type says undefined). */
const LEFT_OUT = null as unknown as undefined;

function errorOf(value: unknown): ShimError {
  expect(value).toBeInstanceOf(ShimError);
  return value as ShimError;
}

describe("simple beam, uniform load (AISC Table 3-23, case 1)", () => {
  const w = 1.5; // kip/ft
  const L = 24; // ft
  it("reactions wL/2, Mmax wL^2/8 at midspan, Vmax wL/2, no hogging", () => {
    expect(f.reactions(L, [[w]])).toEqual([[w * L / 2, w * L / 2]]);
    close(f.momentMax(L, [[w]]), (w * L * L) / 8);
    expect(f.momentMin(L, [[w]])).toBe(0);
    close(f.shearMax(L, [[w]]), (w * L) / 2);
    close(f.reaction(L, [[w]], 2), (w * L) / 2);
  });
  it("V and M at x: V = w(L/2 - x), M = wx(L - x)/2; at the right end the shear just inside", () => {
    close(f.shearAt(L, [[w]], 6), w * (L / 2 - 6));
    close(f.shearAt(L, [[w]], 0), (w * L) / 2);
    close(f.shearAt(L, [[w]], L), (-w * L) / 2);
    close(f.momentAt(L, [[w]], 6), (w * 6 * (L - 6)) / 2);
  });
  it("deflection, kip-ft: 5wL^4/384EI worked in inches (w/12 kip/in, 12L in, E ksi, I in^4)", () => {
    const E = 29000;
    const I = 500;
    const wIn = w / 12;
    const LIn = 12 * L;
    close(f.deflectionMax(L, [[w]], E, I, "kip-ft"), (5 * wIn * LIn ** 4) / (384 * E * I));
    // AISC case 1: deflection at x = wx(L^3 - 2Lx^2 + x^3)/24EI, x = 6 ft = 72 in
    const xIn = 72;
    close(f.deflectionAt(L, [[w]], E, I, "kip-ft", 6), (wIn * xIn * (LIn ** 3 - 2 * LIn * xIn ** 2 + xIn ** 3)) / (24 * E * I));
  });
  it("deflection, kN-m: 5wL^4/384EI worked in N and mm (kN/m = N/mm, MPa = N/mm^2)", () => {
    const wKnM = 20;
    const LM = 6;
    const eMpa = 200000;
    const iMm4 = 80e6;
    close(f.deflectionMax(LM, [[wKnM]], eMpa, iMm4, "kN-m"), (5 * wKnM * (LM * 1000) ** 4) / (384 * eMpa * iMm4));
    close(f.deflectionMax(LM, [[wKnM]], 3, 4, "consistent"), (5 * wKnM * LM ** 4) / (384 * 3 * 4));
  });
  it("required I gives exactly span/ratio (L/360 in inches = 12L/360)", () => {
    const E = 29000;
    const iReq = (5 * (w / 12) * (12 * L) ** 4) / (384 * E * ((12 * L) / 360));
    close(f.requiredI(L, [[w]], E, 360, "kip-ft"), iReq);
    close(f.deflectionMax(L, [[w]], E, iReq, "kip-ft"), (12 * L) / 360);
    const iReqSi = (5 * 20 * 6000 ** 4) / (384 * 200000 * (6000 / 250));
    close(f.requiredI(6, [[20]], 200000, 250, "KN-M"), iReqSi);
  });
  it("units also in the load functions' vocabulary: US = kip-ft (inches), SI = kN-m (mm), any case", () => {
    const E = 29000;
    const I = 500;
    close(f.deflectionMax(L, [[w]], E, I, "US"), (5 * (w / 12) * (12 * L) ** 4) / (384 * E * I));
    close(f.deflectionAt(L, [[w]], E, I, "us", 6), ((w / 12) * 72 * ((12 * L) ** 3 - 2 * (12 * L) * 72 ** 2 + 72 ** 3)) / (24 * E * I));
    close(f.deflectionMax(6, [[20]], 200000, 80e6, "SI"), (5 * 20 * 6000 ** 4) / (384 * 200000 * 80e6));
    close(f.requiredI(6, [[20]], 200000, 250, " si "), (5 * 20 * 6000 ** 4) / (384 * 200000 * (6000 / 250)));
  });
  it("required I holds each part to its own limit: the span between supports, twice the overhang at a tip", () => {
    // Beam overhanging one support, uniform load on the overhang only (AISC Steel Construction
    // Manual Table 3-23, beam overhanging one support; recalled from memory): tip deflection
    // w a^3 (4l + 3a) / (24 EI). Supports at 0 and l = 20 ft, overhang a = 8 ft, w = 1 kip/ft.
    const l = 20;
    const a = 8;
    const w = 1;
    const E = 29000;
    const tipEI = (w * a ** 3 * (4 * l + 3 * a)) / 24; // kip-ft^3
    // Back span: lifted by the overhang's moment M = w a^2/2; largest upward EI deflection of a
    // simple span under an end moment M is M l^2 / (9 sqrt 3) (Table 3-23, end moment; recalled from memory).
    const backEI = ((w * a * a) / 2) * l ** 2 / (9 * Math.sqrt(3));
    // I >= 1728 x EIdefl / (E x allowed in), allowed = 12 x (2a or l) / 360
    const want = Math.max((1728 * tipEI) / (E * ((12 * 2 * a) / 360)), (1728 * backEI) / (E * ((12 * l) / 360)));
    close(f.requiredI(l + a, [[w, l, l + a, null]], E, 360, "kip-ft", [[0], [l]]), want);
    // The tip governs here; against the whole 28 ft length it would have come out lower.
    expect(want).toBeCloseTo((1728 * tipEI) / (E * ((12 * 2 * a) / 360)), 9);
  });

  it("required I uses the largest deflection up or down (an uplift load deflects upward only)", () => {
    const E = 29000;
    expect(f.deflectionMax(L, [[-w]], E, 500, "kip-ft")).toBe(0);
    close(f.requiredI(L, [[-w]], E, 360, "kip-ft"), f.requiredI(L, [[w]], E, 360, "kip-ft") as number);
  });
});

describe("other closed forms of AISC Table 3-23", () => {
  it("case 2, load increasing uniformly to one end: R = W/3, 2W/3; Mmax = 2WL/(9 sqrt 3) at L/sqrt 3; deflection 0.01304 WL^3/EI", () => {
    const L = 18;
    const wEnd = 2.4;
    const W = (wEnd * L) / 2;
    const loads = [["line", 0, 0, L, wEnd]];
    const r = f.reactions(L, loads) as number[][];
    close(r[0]![0], W / 3);
    close(r[0]![1], (2 * W) / 3);
    close(f.momentMax(L, loads), (2 * W * L) / (9 * Math.sqrt(3)));
    // Published coefficient is rounded to 4 digits: compare at that precision.
    close(f.deflectionMax(L, loads, 1, 1, "consistent"), (0.01304 * W * L ** 3) / 1, 5e-4);
  });
  it("case 7, point load at center: Mmax = PL/4, deflection PL^3/48EI (4-column numeric format)", () => {
    const L = 20;
    const P = 12;
    close(f.momentMax(L, [[P, L / 2, null, null]]), (P * L) / 4);
    close(f.deflectionMax(L, [[P, L / 2, null, null]], 2, 3, "consistent"), (P * L ** 3) / (48 * 2 * 3));
  });
  it("case 8, point load at any point: R1 = Pb/L, Mmax = Pab/L, deflection at the load Pa^2b^2/3EIL", () => {
    const L = 25;
    const P = 9;
    const a = 7;
    const b = L - a;
    const loads = [["point", P, a, null, null]];
    const r = f.reactions(L, loads) as number[][];
    close(r[0]![0], (P * b) / L);
    close(r[0]![1], (P * a) / L);
    close(f.momentMax(L, loads), (P * a * b) / L);
    close(f.deflectionAt(L, loads, 1, 1, "consistent", a), (P * a * a * b * b) / (3 * L));
  });
  it("case 12, fixed at one end, supported at the other, uniform: R = 5wL/8 and 3wL/8, M = -wL^2/8 and 9wL^2/128, deflection at x = L(1+sqrt 33)/16", () => {
    const L = 16;
    const w = 2;
    const supports = [
      [0, "fixed"],
      [L, "pin"],
    ];
    const r = f.reactions(L, [[w]], supports) as number[][];
    close(r[0]![0], (5 * w * L) / 8);
    close(r[0]![1], (3 * w * L) / 8);
    close(f.momentMin(L, [[w]], supports), (-w * L * L) / 8);
    close(f.momentMax(L, [[w]], supports), (9 * w * L * L) / 128);
    // Table 3-23 gives the deflection measured from the supported end: wx(L^3 - 3Lx^2 + 2x^3)/48EI, largest at x = L(1 + sqrt 33)/16.
    const x = (L * (1 + Math.sqrt(33))) / 16;
    close(f.deflectionMax(L, [[w]], 1, 1, "consistent", supports), (w * x * (L ** 3 - 3 * L * x * x + 2 * x ** 3)) / 48, 1e-8);
  });
  it("case 15, fixed at both ends, uniform: end moments -wL^2/12, midspan wL^2/24, deflection wL^4/384EI", () => {
    const L = 12;
    const w = 3;
    const supports = [
      [0, "fixed"],
      [L, "fixed"],
    ];
    expect((f.reactions(L, [[w]], supports, "moment") as number[][])[0]!.map((m) => Number((m / ((-w * L * L) / 12)).toFixed(12)))).toEqual([1, 1]);
    close(f.momentMax(L, [[w]], supports), (w * L * L) / 24);
    close(f.deflectionMax(L, [[w]], 1, 1, "consistent", supports), (w * L ** 4) / 384);
  });
  it("case 19, cantilever, uniform: R = wL, M = -wL^2/2 at the root, deflection wL^4/8EI", () => {
    const L = 8;
    const w = 0.75;
    const supports = [[0, "fixed"]];
    expect(f.reactions(L, [[w]], supports)).toEqual([[w * L]]);
    close((f.reactions(L, [[w]], supports, "moment") as number[][])[0]![0], (-w * L * L) / 2);
    close(f.momentMin(L, [[w]], supports), (-w * L * L) / 2);
    expect(f.momentMax(L, [[w]], supports)).toBe(0);
    close(f.deflectionMax(L, [[w]], 1, 1, "consistent", supports), (w * L ** 4) / 8);
  });
  it("case 21, cantilever, point load at the free end: deflection PL^3/3EI", () => {
    close(f.deflectionMax(6, [["point", 5, 6, null, null]], 1, 1, "consistent", [[0, "fixed"]]), (5 * 6 ** 3) / 3);
  });
  it("case 24, beam overhanging one support, uniform: R1 = w(l^2 - a^2)/2l, R2 = w(l + a)^2/2l, M over the support -wa^2/2", () => {
    const l = 22;
    const a = 6;
    const w = 1;
    const supports = [
      [0, "pin"],
      [l, "roller"],
    ];
    const r = f.reactions(l + a, [[w]], supports) as number[][];
    close(r[0]![0], (w * (l * l - a * a)) / (2 * l));
    close(r[0]![1], (w * (l + a) ** 2) / (2 * l));
    close(f.momentMin(l + a, [[w]], supports), (-w * a * a) / 2);
  });
  it("two equal spans, uniform on both (continuous beam): R = 3wl/8, 10wl/8, 3wl/8; M over the middle support -wl^2/8; Mmax 9wl^2/128", () => {
    const l = 20;
    const w = 1.4;
    const supports = [[0], [l], [2 * l]];
    const r = f.reactions(2 * l, [[w]], supports) as number[][];
    [(3 * w * l) / 8, (10 * w * l) / 8, (3 * w * l) / 8].forEach((v, i) => close(r[0]![i], v));
    const m = f.reactions(2 * l, [[w]], supports, "moment") as number[][];
    close(m[0]![1], (-w * l * l) / 8);
    close(f.momentMax(2 * l, [[w]], supports), (9 * w * l * l) / 128);
  });
  it("an applied couple m (counter-clockwise +) at a: R = m/L and -m/L; the moment jumps by -m going right (statics of the free body)", () => {
    const L = 10;
    const m = 30;
    const a = 4;
    const loads = [["moment", m, a, null, null]];
    const r = f.reactions(L, loads) as number[][];
    close(r[0]![0], m / L);
    close(r[0]![1], -m / L);
    close(f.momentAt(L, loads, a), (-m * (L - a)) / L); // just right of the couple
    close(f.momentAt(L, loads, a - 1e-9), (m * (a - 1e-9)) / L, 1e-6);
  });
});

describe("spilled shapes", () => {
  it("REACTIONS: one cell per supports row, each reaction under its row, blank rows as \"\"; 2 cells when supports is left out", () => {
    expect(f.reactions(20, [[1]], [[0, "pin"], [null, null], [20, "pin"], [null, null]])).toEqual([[10, "", 10, ""]]);
    expect((f.reactions(20, [[1]]) as number[][])[0]).toHaveLength(2);
    expect((f.reactions(20, [[1]], [[null], [null], [null]]) as unknown[][])[0]).toEqual([10, 10, ""]);
  });
  it("REACTIONS with a blank one-row supports range cannot hold the default two reactions", () => {
    expect(errorOf(f.reactions(20, [[1]], [[null, null]])).message).toMatch(/^supports: the range is blank, so pins at 0 and span apply/);
  });
  it("DIAGRAM: x | V | M, both sides of a point load, the zero-shear point, the stations; padded to the predicted height", () => {
    const L = 10;
    const table = f.diagram(L, [["point", 8, 4, null, null]], LEFT_OUT, 5) as (number | string)[][];
    expect(table).toHaveLength(diagramRowBound(1, 2, 5));
    expect(table.every((r) => r.length === 3)).toBe(true);
    const rows = table.filter((r) => r[0] !== "") as number[][];
    expect(rows.map((r) => r[0])).toEqual([0, 2, 4, 4, 6, 8, 10]);
    // AISC case 8 values: V = Pb/L left of the load, -Pa/L right of it, M = Pab/L at the load
    close(rows[2]![1], (8 * 6) / L);
    close(rows[3]![1], (-8 * 4) / L);
    close(rows[2]![2], (8 * 4 * 6) / L);
    expect(table.slice(rows.length).every((r) => r.every((c) => c === ""))).toBe(true);
    const uniform = (f.diagram(L, [[2]], LEFT_OUT, 4) as (number | string)[][]).filter((r) => r[0] !== "") as number[][];
    expect(uniform.map((r) => r[0])).toEqual([0, 2.5, 5, 7.5, 10]);
    close(uniform[2]![2], (2 * L * L) / 8); // case 1 midspan moment, also the zero-shear point
  });
  it("DIAGRAM: default 20 intervals", () => {
    const rows = (f.diagram(20, [[1]]) as (number | string)[][]).filter((r) => r[0] !== "");
    expect(rows).toHaveLength(21);
  });
});

describe("every bad input is #VALUE! with a message naming the argument and row", () => {
  const cases: [string, () => unknown, string | RegExp][] = [
    ["text where a number belongs", () => f.momentMax("twenty", [[1]]), 'span: "twenty" is text where a number belongs.'],
    ["span <= 0", () => f.momentMax(0, [[1]]), "span: must be greater than 0 (got 0)."],
    ["load outside the member", () => f.momentMax(20, [["line", 1, null, null, null], ["point", 5, 24, null, null]]), "loads, row 2: start 24 is outside the member (0 to 20)."],
    ["unknown kind", () => f.shearMax(20, [["udl", 1, null, null, null]]), 'loads, row 1: kind "udl" is not line, point or moment.'],
    ["unknown support type", () => f.reactions(20, [[1]], [[0, "pin"], [20, "slider"]]), 'supports, row 2: type "slider" is not pin, roller or fixed.'],
    ["unstable supports", () => f.momentMax(20, [[1]], [[10, "pin"]]), /^supports: /],
    ["E not positive", () => f.deflectionMax(20, [[1]], 0, 100, "kip-ft"), "E: must be greater than 0 (got 0)."],
    ["I not positive", () => f.deflectionMax(20, [[1]], 29000, -5, "kip-ft"), "I: must be greater than 0 (got -5)."],
    ["unknown units", () => f.deflectionMax(20, [[1]], 29000, 100, "kip-in"), 'units: "kip-in" is not recognised; use one of "kip-ft" (or "US"), "kN-m" (or "SI"), "consistent".'],
    ["too many load rows", () => f.momentMax(20, Array.from({ length: 1001 }, () => [1, null, null, null])), "loads: 1001 rows; at most 1000 are accepted."],
    ["too many support rows", () => f.momentMax(20, [[1]], Array.from({ length: 101 }, (_, i) => [i / 10])), "supports: 101 rows; at most 100 are accepted."],
    ["blank kind with a magnitude", () => f.momentMax(20, [["line", 1, null, null, null], [null, 2, null, null, null]]), "loads, row 2: kind is blank but the row has values; give line, point or moment."],
    ["x outside the member", () => f.momentAt(20, [[1]], 21), "x: 21 is outside the member (0 to 20)."],
    ["index beyond the supports", () => f.reaction(20, [[1]], 3), "index: 3 is beyond the 2 supports of the member."],
    ["ratio not positive", () => f.requiredI(20, [[1]], 29000, 0, "kip-ft"), "ratio: must be greater than 0 (got 0)."],
    ["loads of the wrong width", () => f.momentMax(20, [[1, 2]]), /^loads: the range has 2 columns; expected 4 or 5/],
    ["unknown what", () => f.reactions(20, [[1]], LEFT_OUT, "rotation"), /^what: "rotation" is not recognised/],
    ["stations not whole", () => f.diagram(20, [[1]], LEFT_OUT, 2.5), "stations: must be a whole number (got 2.5)."],
  ];
  for (const [name, call, expected] of cases) {
    it(name, () => {
      const e = errorOf(call());
      expect(e.code).toBe("#VALUE!");
      if (typeof expected === "string") expect(e.message).toBe(expected);
      else expect(e.message).toMatch(expected);
    });
  }
});

describe("properties (fast-check)", () => {
  const member = fc
    .record({
      span: fc.double({ min: 2, max: 60, noNaN: true }),
      w: fc.double({ min: -3, max: 3, noNaN: true }),
      points: fc.array(fc.record({ at: fc.double({ min: 0, max: 1, noNaN: true }), p: fc.double({ min: -20, max: 20, noNaN: true }) }), { maxLength: 4 }),
      interior: fc.array(fc.double({ min: 0.05, max: 0.95, noNaN: true }), { maxLength: 2 }),
      fixedLeft: fc.boolean(),
    })
    .map((m) => {
      const interior = [...new Set(m.interior.map((t) => Math.round(t * 100) / 100))];
      const supports: (number | string)[][] = [[0, m.fixedLeft ? "fixed" : "pin"], ...interior.map((t) => [t * m.span, "pin"]), [m.span, "pin"]];
      const loads: (number | string | null)[][] = [["line", m.w, null, null, null], ...m.points.map((q) => ["point", q.p, q.at * m.span, null, null])];
      return { ...m, supports, loads };
    });

  it("equilibrium: the reactions carry the applied load", () => {
    fc.assert(
      fc.property(member, (m) => {
        const r = (f.reactions(m.span, m.loads, m.supports) as number[][])[0]!;
        const applied = m.w * m.span + m.points.reduce((s, q) => s + q.p, 0);
        const scale = Math.abs(m.w) * m.span + m.points.reduce((s, q) => s + Math.abs(q.p), 0) + 1;
        expect(Math.abs(r.reduce((s, v) => s + v, 0) - applied)).toBeLessThan(1e-9 * scale);
      }),
      { numRuns: 150 },
    );
  });

  it("DIAGRAM fits its predicted height, is sorted by x, and lies within MOMENT_MIN..MOMENT_MAX and SHEAR_MAX", () => {
    fc.assert(
      fc.property(member, fc.integer({ min: 1, max: 40 }), (m, stations) => {
        const table = f.diagram(m.span, m.loads, m.supports, stations);
        expect(Array.isArray(table)).toBe(true);
        const rows = (table as (number | string)[][]).filter((r) => r[0] !== "") as number[][];
        expect(table).toHaveLength(diagramRowBound(m.loads.length, m.supports.length, stations));
        for (let i = 1; i < rows.length; i++) expect(rows[i]![0]).toBeGreaterThanOrEqual(rows[i - 1]![0]!);
        const mMax = f.momentMax(m.span, m.loads, m.supports) as number;
        const mMin = f.momentMin(m.span, m.loads, m.supports) as number;
        const vMax = f.shearMax(m.span, m.loads, m.supports) as number;
        const tol = 1e-9 * (Math.abs(mMax) + Math.abs(mMin) + vMax * m.span + 1);
        for (const [, v, mo] of rows) {
          expect(mo!).toBeLessThanOrEqual(mMax + tol);
          expect(mo!).toBeGreaterThanOrEqual(mMin - tol);
          expect(Math.abs(v!)).toBeLessThanOrEqual(vMax + tol);
        }
      }),
      { numRuns: 150 },
    );
  });
});
