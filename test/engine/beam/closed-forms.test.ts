/**
 * Reference checks of the single-member solver against published closed-form beam formulas.
 *
 * Source: AISC Steel Construction Manual, Table 3-23 "Shears, Moments and Deflections" (beam
 * diagrams and formulas). The formulas and the case numbers below are recalled from memory of
 * the published table; every one of them is also standard Euler–Bernoulli beam theory, so a
 * misremembered case number does not change the formula. Where the table prints a rounded
 * coefficient (e.g. wl^4/185EI) the exact form is derived beside it and used for the check.
 *
 * All deflections are compared as EI x deflection (downward +), which is what the solver returns.
 */
import { describe, expect, it } from "vitest";
import { solveBeam, type BeamLoad, type BeamModel, type BeamSolution, type Support } from "../../../src/engine/beam";

const REL = 1e-9;

function solved(model: BeamModel): BeamSolution {
  const r = solveBeam(model);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

/** |actual - expected| <= REL * scale (scale defaults to |expected|, for zero pass the case's magnitude). */
function near(actual: number, expected: number, scale = Math.abs(expected)): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(REL * scale + 1e-300);
}

const pin = (x: number): Support => ({ x, type: "pin" });
const fixed = (x: number): Support => ({ x, type: "fixed" });
const uniform = (start: number, end: number, w: number): BeamLoad => ({ kind: "line", start, end, w1: w, w2: w });
const point = (x: number, p: number): BeamLoad => ({ kind: "point", x, p });

describe("AISC Manual Table 3-23, case 1: simple beam, uniformly distributed load", () => {
  // formula as published in AISC Manual Table 3-23, case 1 (recalled from memory; standard beam theory)
  const w = 1.7;
  const l = 23;
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [uniform(0, l, w)] });

  it("R = V = wl/2", () => {
    near(s.reactions[0], (w * l) / 2);
    near(s.reactions[1], (w * l) / 2);
    near(s.maxShear().value, (w * l) / 2);
  });
  it("Mmax = wl^2/8 at center; Mx = wx(l - x)/2; Vx = w(l/2 - x)", () => {
    near(s.maxSagging().value, (w * l * l) / 8);
    near(s.maxSagging().x, l / 2, l);
    for (const x of [0.7, 5, 13.3, 22]) {
      near(s.momentAt(x), (w * x * (l - x)) / 2, (w * l * l) / 8);
      near(s.shearAt(x), w * (l / 2 - x), (w * l) / 2);
    }
    expect(s.maxHogging().value).toBe(0);
  });
  it("Δmax = 5wl^4/384EI at center; Δx = wx(l^3 - 2lx^2 + x^3)/24EI", () => {
    near(s.maxDeflectionEI().value, (5 * w * l ** 4) / 384);
    near(s.maxDeflectionEI().x, l / 2, l);
    for (const x of [1, 6.4, 17]) near(s.deflectionEIAt(x), (w * x * (l ** 3 - 2 * l * x * x + x ** 3)) / 24, (5 * w * l ** 4) / 384);
  });
});

describe("AISC Manual Table 3-23, case 2: simple beam, load increasing uniformly to one end", () => {
  // formula as published in AISC Manual Table 3-23, case 2 (recalled from memory; standard beam theory)
  // W = total load; R1 = W/3, R2 = 2W/3; Vx = W/3 - Wx^2/l^2; Mx = Wx(l^2 - x^2)/(3 l^2);
  // Mmax = 2Wl/(9 sqrt 3) at x = l/sqrt 3; Δx = Wx(3x^4 - 10 l^2 x^2 + 7 l^4)/(180 EI l^2);
  // Δmax = 0.01304 Wl^3/EI at x = l sqrt(1 - sqrt(8/15)).
  const l = 18;
  const wMax = 2.4;
  const W = (wMax * l) / 2;
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [{ kind: "line", start: 0, end: l, w1: 0, w2: wMax }] });
  const dx = (x: number): number => (W * x * (3 * x ** 4 - 10 * l * l * x * x + 7 * l ** 4)) / (180 * l * l);

  it("R1 = W/3, R2 = Vmax = 2W/3", () => {
    near(s.reactions[0], W / 3);
    near(s.reactions[1], (2 * W) / 3);
    near(s.maxShear().value, (-2 * W) / 3);
  });
  it("Mmax = 2Wl/(9 sqrt 3) at x = l/sqrt 3, and Mx, Vx", () => {
    near(s.maxSagging().value, (2 * W * l) / (9 * Math.sqrt(3)));
    near(s.maxSagging().x, l / Math.sqrt(3), l);
    for (const x of [2, 9, 15.5]) {
      near(s.momentAt(x), (W * x * (l * l - x * x)) / (3 * l * l), W * l);
      near(s.shearAt(x), W / 3 - (W * x * x) / (l * l), W);
    }
  });
  it("Δmax at x = l sqrt(1 - sqrt(8/15)) (tabulated 0.01304 Wl^3/EI), and Δx", () => {
    const xm = l * Math.sqrt(1 - Math.sqrt(8 / 15));
    near(s.maxDeflectionEI().value, dx(xm));
    near(s.maxDeflectionEI().x, xm, l);
    expect(Math.abs(dx(xm) / (W * l ** 3) - 0.01304)).toBeLessThan(5e-6); // the table's rounding
    for (const x of [3, 11]) near(s.deflectionEIAt(x), dx(x), dx(xm));
  });
});

describe("AISC Manual Table 3-23, case 3: simple beam, load increasing uniformly to center", () => {
  // formula as published in AISC Manual Table 3-23, case 3 (recalled from memory; standard beam theory)
  // R = V = W/2; Mmax = Wl/6 at center; Mx (x < l/2) = Wx(1/2 - 2x^2/(3 l^2));
  // Δmax = Wl^3/60EI; Δx (x < l/2) = Wx(5 l^2 - 4x^2)^2/(480 EI l^2).
  const l = 14;
  const wPeak = 3.1;
  const W = (wPeak * l) / 2;
  const s = solved({
    span: l,
    supports: [pin(0), pin(l)],
    loads: [
      { kind: "line", start: 0, end: l / 2, w1: 0, w2: wPeak },
      { kind: "line", start: l / 2, end: l, w1: wPeak, w2: 0 },
    ],
  });

  it("R = W/2, Mmax = Wl/6 at center, Mx", () => {
    near(s.reactions[0], W / 2);
    near(s.reactions[1], W / 2);
    near(s.maxSagging().value, (W * l) / 6);
    near(s.maxSagging().x, l / 2, l);
    for (const x of [1.5, 4, 6.9]) near(s.momentAt(x), W * x * (0.5 - (2 * x * x) / (3 * l * l)), W * l);
  });
  it("Δmax = Wl^3/60EI, Δx", () => {
    near(s.maxDeflectionEI().value, (W * l ** 3) / 60);
    for (const x of [2, 5.5]) near(s.deflectionEIAt(x), (W * x * (5 * l * l - 4 * x * x) ** 2) / (480 * l * l), (W * l ** 3) / 60);
  });
});

describe("AISC Manual Table 3-23, case 4: simple beam, uniform load partially distributed", () => {
  // formula as published in AISC Manual Table 3-23, case 4 (recalled from memory; standard beam theory)
  // load w over length b starting a from the left support, c from the right: l = a + b + c;
  // R1 = wb(2c + b)/(2l), R2 = wb(2a + b)/(2l); Mmax = R1(a + R1/(2w)) at x = a + R1/w;
  // Mx = R1 x (x < a), R1 x - w(x - a)^2/2 (a < x < a + b).
  const [a, b, c, w] = [3.5, 8, 6.5, 2.2];
  const l = a + b + c;
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [uniform(a, a + b, w)] });
  const r1 = (w * b * (2 * c + b)) / (2 * l);
  const r2 = (w * b * (2 * a + b)) / (2 * l);

  it("R1, R2; Vmax = R1 when a < c", () => {
    near(s.reactions[0], r1);
    near(s.reactions[1], r2);
    near(s.maxShear().value, r1);
    near(s.maxShear().x, 0, l);
  });
  it("Mmax = R1(a + R1/2w) at x = a + R1/w, and Mx", () => {
    near(s.maxSagging().value, r1 * (a + r1 / (2 * w)));
    near(s.maxSagging().x, a + r1 / w, l);
    near(s.momentAt(2), r1 * 2, r1 * l);
    near(s.momentAt(9), r1 * 9 - (w * (9 - a) ** 2) / 2, r1 * l);
  });
});

describe("AISC Manual Table 3-23, case 7: simple beam, concentrated load at center", () => {
  // formula as published in AISC Manual Table 3-23, case 7 (recalled from memory; standard beam theory)
  // R = V = P/2; Mmax = Pl/4; Δmax = Pl^3/48EI; Δx (x < l/2) = Px(3 l^2 - 4x^2)/48EI.
  const [l, P] = [16, 9.5];
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [point(l / 2, P)] });

  it("R = P/2, V jumps by P at the load, Mmax = Pl/4", () => {
    near(s.reactions[0], P / 2);
    near(s.reactions[1], P / 2);
    near(s.shearAt(l / 2, "left"), P / 2);
    near(s.shearAt(l / 2, "right"), -P / 2);
    near(s.maxSagging().value, (P * l) / 4);
    near(s.maxSagging().x, l / 2, l);
  });
  it("Δmax = Pl^3/48EI, Δx", () => {
    near(s.maxDeflectionEI().value, (P * l ** 3) / 48);
    for (const x of [2, 6]) near(s.deflectionEIAt(x), (P * x * (3 * l * l - 4 * x * x)) / 48, (P * l ** 3) / 48);
  });
});

describe("AISC Manual Table 3-23, case 8: simple beam, concentrated load at any point", () => {
  // formula as published in AISC Manual Table 3-23, case 8 (recalled from memory; standard beam theory)
  // R1 = Pb/l, R2 = Pa/l; Mmax = Pab/l at the load; Δa = Pa^2b^2/(3EIl);
  // Δmax = Pab(a + 2b) sqrt(3a(a + 2b))/(27 EI l) at x = sqrt(a(a + 2b)/3) when a > b.
  const [a, b, P] = [13, 7, 6];
  const l = a + b;
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [point(a, P)] });

  it("R1 = Pb/l, R2 = Pa/l, Mmax = Pab/l", () => {
    near(s.reactions[0], (P * b) / l);
    near(s.reactions[1], (P * a) / l);
    near(s.maxSagging().value, (P * a * b) / l);
    near(s.maxSagging().x, a, l);
  });
  it("Δ at the load and Δmax", () => {
    near(s.deflectionEIAt(a), (P * a * a * b * b) / (3 * l));
    near(s.maxDeflectionEI().value, (P * a * b * (a + 2 * b) * Math.sqrt(3 * a * (a + 2 * b))) / (27 * l));
    near(s.maxDeflectionEI().x, Math.sqrt((a * (a + 2 * b)) / 3), l);
  });
});

describe("AISC Manual Table 3-23, case 9: simple beam, two equal concentrated loads symmetrically placed", () => {
  // formula as published in AISC Manual Table 3-23, case 9 (recalled from memory; standard beam theory)
  // R = V = P; Mmax = Pa between the loads; Δmax = Pa(3 l^2 - 4a^2)/24EI.
  const [l, a, P] = [30, 10, 4.5];
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [point(a, P), point(l - a, P)] });

  it("R = P, Mmax = Pa, M constant between the loads, V = 0 there", () => {
    near(s.reactions[0], P);
    near(s.reactions[1], P);
    near(s.maxSagging().value, P * a);
    near(s.momentAt(12), P * a);
    near(s.momentAt(19), P * a);
    near(s.shearAt(15), 0, P);
  });
  it("Δmax = Pa(3 l^2 - 4a^2)/24EI", () => {
    near(s.maxDeflectionEI().value, (P * a * (3 * l * l - 4 * a * a)) / 24);
    near(s.deflectionEIAt(l / 2), (P * a * (3 * l * l - 4 * a * a)) / 24);
  });
});

describe("AISC Manual Table 3-23, case 12: beam fixed at one end, supported at other, uniformly distributed load", () => {
  // formula as published in AISC Manual Table 3-23, case 12 (recalled from memory; standard beam theory)
  // R1 (supported end) = 3wl/8, R2 (fixed end) = 5wl/8; Mmax = wl^2/8 (hogging, fixed end);
  // M1 = 9wl^2/128 at x = 3l/8 from the supported end; Δx = wx(l^3 - 3lx^2 + 2x^3)/48EI;
  // Δmax = wl^4/185EI at x = l(1 + sqrt 33)/16 = 0.4215 l (185 is the table's rounding).
  const [l, w] = [21, 1.3];
  const dx = (x: number): number => (w * x * (l ** 3 - 3 * l * x * x + 2 * x ** 3)) / 48;
  const xm = (l * (1 + Math.sqrt(33))) / 16;

  it("pin at the left, fixed at the right", () => {
    const s = solved({ span: l, supports: [pin(0), fixed(l)], loads: [uniform(0, l, w)] });
    near(s.reactions[0], (3 * w * l) / 8);
    near(s.reactions[1], (5 * w * l) / 8);
    near(s.reactionMoments[1], (-w * l * l) / 8); // clockwise couple from the right wall
    near(s.supportMoments[1], (-w * l * l) / 8);
    near(s.maxHogging().value, (-w * l * l) / 8);
    near(s.maxHogging().x, l, l);
    near(s.maxSagging().value, (9 * w * l * l) / 128);
    near(s.maxSagging().x, (3 * l) / 8, l);
    near(s.maxDeflectionEI().value, dx(xm));
    near(s.maxDeflectionEI().x, xm, l);
    expect(Math.abs(dx(xm) - (w * l ** 4) / 185) / dx(xm)).toBeLessThan(2e-3); // the table's rounded divisor
    for (const x of [4, 12, 18]) near(s.deflectionEIAt(x), dx(x), dx(xm));
    near(s.slopeEIAt(l), 0, (w * l ** 3) / 48);
  });
  it("mirrored: fixed at the left, pin at the right", () => {
    const s = solved({ span: l, supports: [fixed(0), pin(l)], loads: [uniform(0, l, w)] });
    near(s.reactions[0], (5 * w * l) / 8);
    near(s.reactions[1], (3 * w * l) / 8);
    near(s.reactionMoments[0], (w * l * l) / 8);
    near(s.maxSagging().value, (9 * w * l * l) / 128);
    near(s.maxSagging().x, l - (3 * l) / 8, l);
    near(s.maxDeflectionEI().value, dx(xm));
  });
});

describe("AISC Manual Table 3-23, case 13: beam fixed at one end, supported at other, concentrated load at center", () => {
  // formula as published in AISC Manual Table 3-23, case 13 (recalled from memory; standard beam theory)
  // R1 = 5P/16, R2 = 11P/16; Mmax = 3Pl/16 (fixed end); M1 = 5Pl/32 at the load;
  // Δ at the load = 7Pl^3/768EI; Δmax = Pl^3/(48 sqrt 5 EI) at x = l/sqrt 5 from the supported end.
  const [l, P] = [12, 20];
  const s = solved({ span: l, supports: [pin(0), fixed(l)], loads: [point(l / 2, P)] });

  it("reactions and moments", () => {
    near(s.reactions[0], (5 * P) / 16);
    near(s.reactions[1], (11 * P) / 16);
    near(s.maxHogging().value, (-3 * P * l) / 16);
    near(s.maxSagging().value, (5 * P * l) / 32);
    near(s.maxSagging().x, l / 2, l);
  });
  it("deflections", () => {
    near(s.deflectionEIAt(l / 2), (7 * P * l ** 3) / 768);
    near(s.maxDeflectionEI().value, (P * l ** 3) / (48 * Math.sqrt(5)));
    near(s.maxDeflectionEI().x, l / Math.sqrt(5), l);
  });
});

describe("AISC Manual Table 3-23, case 15: beam fixed at both ends, uniformly distributed load", () => {
  // formula as published in AISC Manual Table 3-23, case 15 (recalled from memory; standard beam theory)
  // R = V = wl/2; Mmax = wl^2/12 at the ends (hogging); M1 = wl^2/24 at center; Δmax = wl^4/384EI;
  // Δx = wx^2(l - x)^2/24EI.
  const [l, w] = [17, 2.9];
  const s = solved({ span: l, supports: [fixed(0), fixed(l)], loads: [uniform(0, l, w)] });

  it("reactions, end moments, center moment", () => {
    near(s.reactions[0], (w * l) / 2);
    near(s.reactions[1], (w * l) / 2);
    near(s.reactionMoments[0], (w * l * l) / 12);
    near(s.reactionMoments[1], (-w * l * l) / 12);
    near(s.supportMoments[0], (-w * l * l) / 12);
    near(s.supportMoments[1], (-w * l * l) / 12);
    near(s.maxHogging().value, (-w * l * l) / 12);
    near(s.maxSagging().value, (w * l * l) / 24);
    near(s.maxSagging().x, l / 2, l);
  });
  it("Δmax = wl^4/384EI, Δx", () => {
    near(s.maxDeflectionEI().value, (w * l ** 4) / 384);
    for (const x of [3, 7.7]) near(s.deflectionEIAt(x), (w * x * x * (l - x) ** 2) / 24, (w * l ** 4) / 384);
  });
});

describe("AISC Manual Table 3-23, case 16: beam fixed at both ends, concentrated load at center", () => {
  // formula as published in AISC Manual Table 3-23, case 16 (recalled from memory; standard beam theory)
  // R = V = P/2; Mmax = Pl/8 at center and ends; Δmax = Pl^3/192EI; Δx (x < l/2) = Px^2(3l - 4x)/48EI.
  const [l, P] = [10, 7];
  const s = solved({ span: l, supports: [fixed(0), fixed(l)], loads: [point(l / 2, P)] });

  it("reactions and moments", () => {
    near(s.reactions[0], P / 2);
    near(s.reactions[1], P / 2);
    near(s.maxSagging().value, (P * l) / 8);
    near(s.maxHogging().value, (-P * l) / 8);
    near(s.reactionMoments[0], (P * l) / 8);
  });
  it("deflections", () => {
    near(s.maxDeflectionEI().value, (P * l ** 3) / 192);
    near(s.deflectionEIAt(2), (P * 4 * (3 * l - 8)) / 48, (P * l ** 3) / 192);
  });
});

describe("AISC Manual Table 3-23, case 19: cantilever beam, uniformly distributed load", () => {
  // formula as published in AISC Manual Table 3-23, case 19 (recalled from memory; standard beam theory)
  // R = V = wl; Mmax = wl^2/2 at the fixed end; Δmax = wl^4/8EI at the free end;
  // Δx = w(x^4 - 4 l^3 x + 3 l^4)/24EI with x from the free end; Mx = wx^2/2.
  const [l, w] = [6.5, 3.3];

  it("fixed at x = 0", () => {
    const s = solved({ span: l, supports: [fixed(0)], loads: [uniform(0, l, w)] });
    near(s.reactions[0], w * l);
    near(s.reactionMoments[0], (w * l * l) / 2);
    near(s.maxHogging().value, (-w * l * l) / 2);
    near(s.maxHogging().x, 0, l);
    expect(s.maxSagging().value).toBe(0);
    near(s.maxShear().value, w * l);
    near(s.maxDeflectionEI().value, (w * l ** 4) / 8);
    near(s.maxDeflectionEI().x, l, l);
    for (const xf of [1, 3, 5]) {
      near(s.deflectionEIAt(l - xf), (w * (xf ** 4 - 4 * l ** 3 * xf + 3 * l ** 4)) / 24, (w * l ** 4) / 8);
      near(s.momentAt(l - xf), (-w * xf * xf) / 2, (w * l * l) / 2);
    }
  });
  it("fixed at x = span (couple clockwise)", () => {
    const s = solved({ span: l, supports: [fixed(l)], loads: [uniform(0, l, w)] });
    near(s.reactions[0], w * l);
    near(s.reactionMoments[0], (-w * l * l) / 2);
    near(s.supportMoments[0], (-w * l * l) / 2);
    near(s.maxDeflectionEI().value, (w * l ** 4) / 8);
    near(s.maxDeflectionEI().x, 0, l);
    near(s.shearAt(l), -w * l); // just left of the wall, inside the member
  });
  it("one fixed support inside the span: two cantilevers back to back", () => {
    const [a, b] = [2.5, 4]; // left and right arms
    const s = solved({ span: a + b, supports: [fixed(a)], loads: [uniform(0, a + b, w)] });
    near(s.reactions[0], w * (a + b));
    near(s.reactionMoments[0], (w * b * b) / 2 - (w * a * a) / 2);
    near(s.momentAt(a, "left"), (-w * a * a) / 2);
    near(s.momentAt(a, "right"), (-w * b * b) / 2);
    near(s.supportMoments[0], (-w * b * b) / 2);
    near(s.deflectionEIAt(0), (w * a ** 4) / 8);
    near(s.deflectionEIAt(a + b), (w * b ** 4) / 8);
  });
});

describe("AISC Manual Table 3-23, case 22: cantilever beam, concentrated load at free end", () => {
  // formula as published in AISC Manual Table 3-23, case 22 (recalled from memory; standard beam theory)
  // R = V = P; Mmax = Pl at the fixed end; Δmax = Pl^3/3EI; Δx = P(2l^3 - 3l^2x + x^3)/6EI, x from the free end.
  const [l, P] = [8, 5.5];
  const s = solved({ span: l, supports: [fixed(0)], loads: [point(l, P)] });

  it("R = P, M = Pl, Δmax = Pl^3/3EI", () => {
    near(s.reactions[0], P);
    near(s.reactionMoments[0], P * l);
    near(s.maxHogging().value, -P * l);
    near(s.shearAt(l), P); // inside the member, just left of the load
    near(s.shearAt(l, "left"), P);
    near(s.maxDeflectionEI().value, (P * l ** 3) / 3);
    for (const xf of [2, 6]) near(s.deflectionEIAt(l - xf), (P * (2 * l ** 3 - 3 * l * l * xf + xf ** 3)) / 6, (P * l ** 3) / 3);
  });
});

describe("AISC Manual Table 3-23, case 24: beam overhanging one support, uniformly distributed load", () => {
  // formula as published in AISC Manual Table 3-23, case 24 (recalled from memory; standard beam theory)
  // supports l apart, overhang a: R1 = w(l^2 - a^2)/2l, R2 = w(l + a)^2/2l;
  // V2 = wa (right of R2), V2' = w(l^2 + a^2)/2l (left of R2); M1 = w(l + a)^2(l - a)^2/8l^2 at
  // x = l(1 - a^2/l^2)/2; M2 = wa^2/2 (hogging);
  // Δx (between supports) = wx(l^4 - 2l^2x^2 + lx^3 - 2a^2l^2 + 2a^2x^2)/24EIl (down +);
  // Δx1 (overhang, x1 from R2) = wx1(4a^2 l - l^3 + 6a^2 x1 - 4a x1^2 + x1^3)/24EI.
  const [l, a, w] = [20, 6, 1.25];
  const s = solved({ span: l + a, supports: [pin(0), pin(l)], loads: [uniform(0, l + a, w)] });

  it("reactions and shears beside R2", () => {
    near(s.reactions[0], (w * (l * l - a * a)) / (2 * l));
    near(s.reactions[1], (w * (l + a) ** 2) / (2 * l));
    near(s.shearAt(l, "right"), w * a);
    near(s.shearAt(l, "left"), (-w * (l * l + a * a)) / (2 * l));
  });
  it("M1 between supports, M2 over R2", () => {
    near(s.maxSagging().value, (w * (l + a) ** 2 * (l - a) ** 2) / (8 * l * l));
    near(s.maxSagging().x, (l * (1 - (a * a) / (l * l))) / 2, l);
    near(s.maxHogging().value, (-w * a * a) / 2);
    near(s.supportMoments[1], (-w * a * a) / 2);
  });
  it("deflection between supports and on the overhang", () => {
    const scale = (w * l ** 4) / 24;
    for (const x of [5, 9, 15]) near(s.deflectionEIAt(x), (w * x * (l ** 4 - 2 * l * l * x * x + l * x ** 3 - 2 * a * a * l * l + 2 * a * a * x * x)) / (24 * l), scale);
    for (const x1 of [2, 6]) near(s.deflectionEIAt(l + x1), (w * x1 * (4 * a * a * l - l ** 3 + 6 * a * a * x1 - 4 * a * x1 * x1 + x1 ** 3)) / 24, scale);
  });
});

describe("AISC Manual Table 3-23, case 26: beam overhanging one support, concentrated load at end of overhang", () => {
  // formula as published in AISC Manual Table 3-23, case 26 (recalled from memory; standard beam theory)
  // R1 = Pa/l (downward), R2 = P(l + a)/l; M2 = Pa; Δc (free end) = Pa^2(l + a)/3EI;
  // Δmax between supports (upward) = Pal^2/(9 sqrt 3 EI) = 0.06415 Pal^2/EI at x = l/sqrt 3.
  const [l, a, P] = [15, 4, 3];
  const s = solved({ span: l + a, supports: [pin(0), pin(l)], loads: [point(l + a, P)] });

  it("reactions, support moment, deflections", () => {
    near(s.reactions[0], (-P * a) / l);
    near(s.reactions[1], (P * (l + a)) / l);
    near(s.maxHogging().value, -P * a);
    near(s.maxHogging().x, l, l);
    near(s.maxDeflectionEI().value, (P * a * a * (l + a)) / 3);
    near(s.maxDeflectionEI().x, l + a, l);
    near(s.minDeflectionEI().value, (-P * a * l * l) / (9 * Math.sqrt(3)));
    near(s.minDeflectionEI().x, l / Math.sqrt(3), l);
  });
});

describe("Continuous beam, two equal spans, uniform load on both spans", () => {
  // AISC Steel Construction Manual, continuous-beam coefficients for two equal spans under uniform
  // load (Table 3-22c, recalled from memory): end reactions 0.375wl, center reaction 1.25wl,
  // support moment -0.125wl^2, span moment 0.070wl^2 at 0.375l, deflection 0.0054wl^4/EI at 0.4215l.
  // Exact forms (each span is the case-12 propped cantilever by symmetry): 3wl/8, 10wl/8, -wl^2/8,
  // 9wl^2/128, and Δmax = wl^4/185EI at l(1 + sqrt 33)/16 with Δx = wx(l^3 - 3lx^2 + 2x^3)/48EI.
  const [l, w] = [11, 2];
  const s = solved({ span: 2 * l, supports: [pin(0), pin(l), pin(2 * l)], loads: [uniform(0, 2 * l, w)] });
  const xm = (l * (1 + Math.sqrt(33))) / 16;
  const dmax = (w * xm * (l ** 3 - 3 * l * xm * xm + 2 * xm ** 3)) / 48;

  it("reactions 0.375wl, 1.25wl, 0.375wl", () => {
    near(s.reactions[0], 0.375 * w * l);
    near(s.reactions[1], 1.25 * w * l);
    near(s.reactions[2], 0.375 * w * l);
  });
  it("support moment -wl^2/8, span moment 9wl^2/128 (~0.070wl^2) at 0.375l", () => {
    near(s.supportMoments[1], -0.125 * w * l * l);
    near(s.maxHogging().value, -0.125 * w * l * l);
    near(s.maxHogging().x, l, l);
    near(s.maxSagging().value, (9 / 128) * w * l * l);
    near(s.maxSagging().x, 0.375 * l, l);
    near(s.maxShear().value, -0.625 * w * l);
  });
  it("Δmax exact at l(1 + sqrt 33)/16 (tabulated 0.0054wl^4/EI at 0.4215l)", () => {
    near(s.maxDeflectionEI().value, dmax);
    near(s.maxDeflectionEI().x, xm, l);
    expect(Math.abs(dmax / (w * l ** 4) - 0.0054)).toBeLessThan(5e-5);
    expect(Math.abs(xm / l - 0.4215)).toBeLessThan(5e-5);
  });
});

describe("Continuous beam, three equal spans, uniform load on all spans", () => {
  // AISC Steel Construction Manual, continuous-beam coefficients for three equal spans, all spans
  // loaded (Table 3-23 case 36 / Table 3-22c, recalled from memory): reactions 0.4wl, 1.1wl;
  // support moments -0.1wl^2; end-span moment 0.08wl^2 at 0.4l; center-span moment 0.025wl^2;
  // deflection 0.0069wl^4/EI in the end spans.
  // Exact by hand (three-moment equation, equal spans): support moments -wl^2/10, so R1 = 0.4wl and
  // in the end span EIy = -(wl x^3/15 - wx^4/24 - wl^3 x/40) (down +). Slope zero: with ξ = x/l,
  // 20ξ^3 - 24ξ^2 + 3 = 0, solved below by bisection; Δmax = wl^4(ξ/40 - ξ^3/15 + ξ^4/24).
  const [l, w] = [9, 1.5];
  const s = solved({ span: 3 * l, supports: [pin(0), pin(l), pin(2 * l), pin(3 * l)], loads: [uniform(0, 3 * l, w)] });

  function endSpanXi(): number {
    let lo = 0.3;
    let hi = 0.6; // f(0.3) = 1.38 > 0, f(0.6) = -1.32 < 0: one root between
    const f = (xi: number): number => 20 * xi ** 3 - 24 * xi ** 2 + 3;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (f(mid) > 0) lo = mid;
      else hi = mid;
    }
    return (lo + hi) / 2;
  }

  it("reactions 0.4wl, 1.1wl, 1.1wl, 0.4wl", () => {
    near(s.reactions[0], 0.4 * w * l);
    near(s.reactions[1], 1.1 * w * l);
    near(s.reactions[2], 1.1 * w * l);
    near(s.reactions[3], 0.4 * w * l);
  });
  it("moments -0.1wl^2, 0.08wl^2 at 0.4l, 0.025wl^2 at center", () => {
    near(s.supportMoments[1], -0.1 * w * l * l);
    near(s.supportMoments[2], -0.1 * w * l * l);
    near(s.maxSagging().value, 0.08 * w * l * l);
    near(s.maxSagging().x, 0.4 * l, l);
    near(s.momentAt(1.5 * l), 0.025 * w * l * l);
    near(s.maxHogging().value, -0.1 * w * l * l);
  });
  it("Δmax in the end span, exact from the cubic (tabulated 0.0069wl^4/EI)", () => {
    const xi = endSpanXi();
    const dmax = w * l ** 4 * (xi / 40 - xi ** 3 / 15 + xi ** 4 / 24);
    near(s.maxDeflectionEI().value, dmax);
    near(s.maxDeflectionEI().x, xi * l, l);
    expect(Math.abs(dmax / (w * l ** 4) - 0.0069)).toBeLessThan(5e-5);
  });
});

describe("Simple beam with a couple at one end", () => {
  // Standard beam theory (e.g. the end-moment case of AISC Manual Table 3-23, case 32, with w = 0
  // and one end moment; recalled from memory): couple M0 at the left end of a simple span l.
  // R = M0/l (a couple pair); M(x) = -M0(1 - x/l) for a counter-clockwise M0 (hogging);
  // end rotations M0 l/3EI (loaded end) and M0 l/6EI; the beam rises by at most
  // M0 l^2/(9 sqrt 3 EI) at x = l(1 - 1/sqrt 3).
  const [l, M0] = [12, 30];
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [{ kind: "moment", x: 0, m: M0 }] });

  it("reactions, moment line, rotations and largest rise", () => {
    near(s.reactions[0], M0 / l);
    near(s.reactions[1], -M0 / l);
    near(s.momentAt(0), -M0);
    near(s.momentAt(4), -M0 * (1 - 4 / l), M0);
    near(s.maxHogging().value, -M0);
    expect(s.maxSagging().value).toBe(0);
    near(s.slopeEIAt(0), (M0 * l) / 3);
    near(s.slopeEIAt(l), (-M0 * l) / 6);
    near(s.minDeflectionEI().value, (-M0 * l * l) / (9 * Math.sqrt(3)));
    near(s.minDeflectionEI().x, l * (1 - 1 / Math.sqrt(3)), l);
    expect(s.maxDeflectionEI().value).toBe(0);
  });
});

describe("Simple beam, trapezoidal load (superposition of cases 1 and 2)", () => {
  // AISC Manual Table 3-23 cases 1 and 2 (recalled from memory; standard beam theory), superposed:
  // w1 at the left rising to w2 at the right = uniform w1 + triangular (w2 - w1) increasing to the right.
  const [l, w1, w2] = [15, 0.8, 2.6];
  const W = ((w2 - w1) * l) / 2; // the triangular part's total load
  const s = solved({ span: l, supports: [pin(0), pin(l)], loads: [{ kind: "line", start: 0, end: l, w1, w2 }] });
  const r1 = (w1 * l) / 2 + W / 3;
  const mx = (x: number): number => (w1 * x * (l - x)) / 2 + (W * x * (l * l - x * x)) / (3 * l * l);
  const dx = (x: number): number => (w1 * x * (l ** 3 - 2 * l * x * x + x ** 3)) / 24 + (W * x * (3 * x ** 4 - 10 * l * l * x * x + 7 * l ** 4)) / (180 * l * l);

  it("reactions", () => {
    near(s.reactions[0], r1);
    near(s.reactions[1], (w1 * l) / 2 + (2 * W) / 3);
  });
  it("Mmax where the superposed shear r1 - w1 x - W x^2/l^2 vanishes", () => {
    // quadratic (W/l^2) x^2 + w1 x - r1 = 0, positive root
    const A = W / (l * l);
    const x0 = (-w1 + Math.sqrt(w1 * w1 + 4 * A * r1)) / (2 * A);
    near(s.maxSagging().value, mx(x0));
    near(s.maxSagging().x, x0, l);
    for (const x of [2, 7.5, 12]) near(s.momentAt(x), mx(x), mx(x0));
  });
  it("deflection", () => {
    for (const x of [3, 7.5, 11]) near(s.deflectionEIAt(x), dx(x), dx(7.5));
  });
});
