/**
 * The governing factored combination of a member (src/report/factored.ts) on members written out
 * by hand, checked against hand statics: a floor beam whose reducible live load is reduced, a
 * roof beam where roof live load governs, an overhang where hogging over the support governs.
 * Combinations: ASCE/SEI 7-22 Sec. 2.3.1 (recalled from memory, as in src/engine/loads/combinations.ts).
 */
import { describe, expect, it } from "vitest";
import type { AppliedLoad, MemberLoads } from "../../src/engine/takedown/member-loads";
import { caseMagnitude, factoredMember, governingCombination, gravityCombinations } from "../../src/report/factored";

function line(magnitudes: AppliedLoad["magnitudes"], start: number, end: number): AppliedLoad {
  return { kind: "line", source: "test", origin: { kind: "zone", zone: "Z", extras: [] }, width: null, start, end, magnitudes };
}

function point(magnitudes: AppliedLoad["magnitudes"], x: number): AppliedLoad {
  return { kind: "point", source: "test", origin: { kind: "loadsRow", sheet: "Loads", row: 2, zone: null, loadCase: "D" }, width: null, start: x, end: null, magnitudes };
}

function member(lengthFt: number, supports: [number, number], loads: AppliedLoad[], llr: number | null, reducibleLive: MemberLoads["reducibleLive"] = "Lred"): MemberLoads {
  return {
    mark: "X",
    type: "beam",
    level: "1",
    length: lengthFt,
    supports: supports.map((x, k) => ({ end: k === 0 ? "start" : "end", mark: `S${k}`, type: "column", x, at: null })),
    loads,
    reactions: {},
    channels: [],
    reducibleLive,
    liveReduction: llr === null ? null : { areaT: 500, kll: 2, floors: null, llrFactor: llr },
  };
}

const close = (a: number, b: number): void => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));

describe("governing factored combination", () => {
  it("reduces the reducible live load by the member's factor; 1.2D + 1.6L governs a floor beam", () => {
    // 20 ft simple span, D 1.0 kip/ft, L 2.0 kip/ft of which 1.5 reducible, L/Lo = 0.6.
    const m = member(20, [0, 20], [line({ D: 1, L: 2, Lred: 1.5 }, 0, 20)], 0.6);
    // Effective L = 2 - (1 - 0.6) x 1.5 = 1.4 kip/ft (ASCE/SEI 7-22 Sec. 4.7: only the reducible part is reduced).
    close(caseMagnitude(m.loads[0]!, "L", m), 1.4);
    const g = governingCombination(m)!;
    expect(g.label).toBe("2.3.1 (2) 1.2D + 1.6L");
    // w = 1.2 x 1 + 1.6 x 1.4 = 3.44 kip/ft; R = wL/2 = 34.4 kip; M = wL^2/8 = 172 kip-ft (simple span, common practice).
    close(g.magnitudes[0]!, 3.44);
    close(g.reactions[0]!, 34.4);
    close(g.reactions[1]!, 34.4);
    close(g.shearMax, 34.4);
    close(g.momentMax, 172);
    expect(g.momentMin).toBe(0);
  });

  it("with all live load reducible the whole L is reduced", () => {
    const m = member(20, [0, 20], [line({ D: 1, L: 2 }, 0, 20)], 0.5, "L");
    close(caseMagnitude(m.loads[0]!, "L", m), 1);
    close(caseMagnitude(m.loads[0]!, "D", m), 1);
  });

  it("picks 1.2D + 1.6Lr for a roof beam and names only the terms that load it", () => {
    // D 0.5, Lr 0.4, S 0.6 kip/ft over 10 ft: 1.4D = 0.70, 1.2D + 0.5Lr = 0.80, 1.2D + 0.3S = 0.78,
    // 1.2D + 1.6Lr = 1.24, 1.2D + 1.0S = 1.20 kip/ft: the largest is 1.24.
    const m = member(10, [0, 10], [line({ D: 0.5, Lr: 0.4, S: 0.6 }, 0, 10)], null, null);
    const g = governingCombination(m)!;
    expect(g.label).toBe("2.3.1 (3) 1.2D + 1.6Lr");
    close(g.momentMax, (1.24 * 10 ** 2) / 8);
    const all = gravityCombinations().map((c) => factoredMember(m, c)!.magnitudes[0]!);
    close(Math.max(...all), 1.24);
  });

  it("lets hogging over the support govern an overhang (1.4D)", () => {
    // 12 ft member on pins at 0 and 10 ft: D 1 kip/ft over the length and 5 kip at the tip.
    // Over the support: M = -(5 x 2 + 1 x 2^2 / 2) = -12 kip-ft (cantilever statics, common practice); x 1.4 = -16.8.
    const m = member(12, [0, 10], [line({ D: 1 }, 0, 12), point({ D: 5 }, 12)], null, null);
    const g = governingCombination(m)!;
    expect(g.label).toBe("2.3.1 (1) 1.4D");
    close(g.momentMin, -16.8);
    // Right reaction by moments about the left pin: (12 x 6 + 5 x 12) / 10 = 13.2; left = 17 - 13.2 = 3.8 kip;
    // largest sagging where V = 0 at x = 3.8 ft: 3.8^2 / 2 = 7.22 kip-ft, x 1.4.
    close(g.reactions[0]!, 1.4 * 3.8);
    close(g.reactions[1]!, 1.4 * 13.2);
    close(g.momentMax, 1.4 * 7.22);
  });

  it("cannot solve a member without a length", () => {
    const m = { ...member(10, [0, 10], [line({ D: 1 }, 0, 10)], null, null), length: null };
    expect(governingCombination(m)).toBeNull();
  });
});
