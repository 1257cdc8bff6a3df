/**
 * The governing values of a takedown member (src/engine/takedown/member-envelope.ts) on members
 * written out by hand, checked against hand statics: a floor beam whose reducible live load is
 * reduced, a roof beam where roof live load governs, an overhang where hogging over the support
 * governs, uplift at the back support of a long overhang, the pattern-cut pieces a drawing shows
 * (their solution equals the engine's governing model at the critical points), and combination
 * labels kept to the member's cases. Combinations: ASCE/SEI 7-22 Sec. 2.3.1 (recalled from memory,
 * as in src/engine/loads/combinations.ts).
 */
import { describe, expect, it } from "vitest";
import { solveBeam } from "../../../src/engine/beam";
import type { BeamLoad } from "../../../src/engine/beam/types";
import type { AppliedLoad, MemberLoads } from "../../../src/engine/takedown/member-loads";
import {
  effectiveMagnitude,
  governingBeamModel,
  governingCaption,
  governingOf,
  governingPieces,
  labelOnMember,
  memberGoverning,
  quantitiesOf,
  type MemberGoverning,
} from "../../../src/engine/takedown/member-envelope";

function line(magnitudes: AppliedLoad["magnitudes"], start: number, end: number, zone = "Z"): AppliedLoad {
  return { kind: "line", source: "test", origin: { kind: "zone", zone, extras: [] }, width: null, start, end, magnitudes };
}

function point(magnitudes: AppliedLoad["magnitudes"], x: number): AppliedLoad {
  return { kind: "point", source: "test", origin: { kind: "loadsRow", sheet: "Loads", row: 2, zone: null, loadCase: "D" }, width: null, start: x, end: null, magnitudes };
}

function member(length: number, supports: number[], loads: AppliedLoad[], llr: number | null, reducibleLive: MemberLoads["reducibleLive"] = "Lred"): MemberLoads {
  return {
    mark: "X",
    type: "beam",
    level: "1",
    length,
    supports: supports.map((x, k) => ({ end: k === 0 ? "start" : k === supports.length - 1 ? "end" : "interior", mark: `S${k}`, type: "column", x, at: null })),
    loads,
    reactions: {},
    channels: [],
    reducibleLive,
    liveReduction: llr === null ? null : { areaT: 500, kll: 2, floors: null, llrFactor: llr },
  };
}

const close = (a: number, b: number): void => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));

function governing(m: MemberLoads): MemberGoverning {
  const g = memberGoverning(m);
  if (g === null || !g.ok) throw new Error("no governing values");
  return g.value;
}

describe("governing values of a takedown member", () => {
  it("reduces the reducible live load by the member's factor; 1.2D + 1.6L governs a floor beam", () => {
    // 20 ft simple span, D 1.0 kip/ft, L 2.0 kip/ft of which 1.5 reducible, L/Lo = 0.6.
    const m = member(20, [0, 20], [line({ D: 1, L: 2, Lred: 1.5 }, 0, 20)], 0.6);
    // Effective L = 2 - (1 - 0.6) x 1.5 = 1.4 kip/ft (ASCE/SEI 7-22 Sec. 4.7: only the reducible part is reduced).
    close(effectiveMagnitude(m.loads[0]!, "L", m), 1.4);
    const e = governing(m).envelope;
    expect(labelOnMember(e.momentMax.combination, ["D", "L"])).toBe("2.3.1 (2) 1.2D + 1.6L");
    // w = 1.2 x 1 + 1.6 x 1.4 = 3.44 kip/ft; R = wL/2 = 34.4 kip; M = wL^2/8 = 172 kip-ft (simple span, common practice).
    close(e.reactionMax[0]!.value, 34.4);
    close(e.reactionMax[1]!.value, 34.4);
    close(e.shearMax.value, 34.4);
    close(e.momentMax.value, 172);
    close(e.momentMax.x, 10);
    expect(e.momentMin.value).toBe(0);
    // Least reaction: 0.9D (combination 5 without wind) = 0.9 x 1 x 20 / 2 = 9 kip.
    close(e.reactionMin[0]!.value, 9);
    expect(labelOnMember(e.reactionMin[0]!.combination, ["D", "L"])).toBe("2.3.1 (5) 0.9D");
    expect(governingCaption(governing(m), { kind: "reactionMin", support: 0 })).toBe("R1 min governs: 2.3.1 (5) 0.9D (factored)");
  });

  it("with all live load reducible the whole L is reduced", () => {
    const m = member(20, [0, 20], [line({ D: 1, L: 2 }, 0, 20)], 0.5, "L");
    close(effectiveMagnitude(m.loads[0]!, "L", m), 1);
    close(effectiveMagnitude(m.loads[0]!, "D", m), 1);
  });

  it("picks 1.2D + 1.6Lr for a roof beam and names only the terms that load it", () => {
    // D 0.5, Lr 0.4, S 0.6 kip/ft over 10 ft: 1.4D = 0.70, 1.2D + 0.5Lr = 0.80, 1.2D + 0.3S = 0.78,
    // 1.2D + 1.6Lr = 1.24, 1.2D + 1.0S = 1.20 kip/ft: the largest is 1.24.
    const m = member(10, [0, 10], [line({ D: 0.5, Lr: 0.4, S: 0.6 }, 0, 10)], null, null);
    const g = governing(m);
    expect(g.present).toEqual(["D", "Lr", "S"]);
    expect(labelOnMember(g.envelope.momentMax.combination, g.present)).toBe("2.3.1 (3) 1.2D + 1.6Lr");
    close(g.envelope.momentMax.value, (1.24 * 10 ** 2) / 8);
    expect(governingCaption(g, { kind: "momentMax" })).toBe("M+ governs: 2.3.1 (3) 1.2D + 1.6Lr; Lr on all segments (factored)");
  });

  it("lets hogging over the support govern an overhang (1.4D), each reaction with its own combination", () => {
    // 12 ft member on pins at 0 and 10 ft: D 1 kip/ft over the length and 5 kip at the tip.
    // Over the support: M = -(5 x 2 + 1 x 2^2 / 2) = -12 kip-ft (cantilever statics, common practice); x 1.4 = -16.8.
    const m = member(12, [0, 10], [line({ D: 1 }, 0, 12), point({ D: 5 }, 12)], null, null);
    const e = governing(m).envelope;
    close(e.momentMin.value, -16.8);
    close(e.momentMin.x, 10);
    // Right reaction by moments about the left pin: (12 x 6 + 5 x 12) / 10 = 13.2; left = 17 - 13.2 = 3.8 kip.
    close(e.reactionMax[0]!.value, 1.4 * 3.8);
    close(e.reactionMax[1]!.value, 1.4 * 13.2);
    close(e.reactionMin[0]!.value, 0.9 * 3.8);
    // Largest sagging where V = 0 at x = 3.8 ft: 3.8^2 / 2 = 7.22 kip-ft, x 1.4.
    close(e.momentMax.value, 1.4 * 7.22);
  });

  it("finds uplift at the back support with live load on the overhang only (hand statics)", () => {
    // Back span l = 2 m, overhang a = 1.8 m; D 0.5 and L 2.0 kN/m over the whole member (L not reducible).
    // Moments about the front support (x = 2): R1 x l = w_back l^2 / 2 - w_over a^2 / 2, so
    // R1(D) = 0.5 (4 - 3.24) / 4 = 0.095 kN, R1(L on the overhang only) = -2 x 3.24 / 4 = -1.62 kN.
    const m = member(3.8, [0, 2], [line({ D: 0.5, L: 2 }, 0, 3.8)], null, null);
    const g = governing(m);
    const rMin = g.envelope.reactionMin[0]!;
    close(rMin.value, 1.2 * 0.095 + 1.6 * -1.62);
    expect(rMin.value).toBeLessThan(0);
    expect(labelOnMember(rMin.combination, g.present)).toBe("2.3.1 (2) 1.2D + 1.6L");
    expect(rMin.pattern).toBe("L on overhang right");
    // R1 max: L on the back span only, R1(L on span 1) = 2 x 2 / 2 = 2 kN.
    close(g.envelope.reactionMax[0]!.value, 1.2 * 0.095 + 1.6 * 2);
    expect(g.envelope.reactionMax[0]!.pattern).toBe("L on span 1");
    // The drawing of R1 min: the load is cut at the support, the back span carries 1.2D only and says L is off.
    const pieces = governingPieces(m, g, rMin);
    expect(pieces.map((p) => [p.start, p.end, p.off])).toEqual([
      [0, 2, ["L"]],
      [2, 3.8, []],
    ]);
    close(pieces[0]!.value, 1.2 * 0.5);
    close(pieces[1]!.value, 1.2 * 0.5 + 1.6 * 2);
  });
});

describe("the pieces drawn for a governing case equal the engine's governing model", () => {
  // Two spans and an overhang, L over the whole member, a point load on the overhang and one on span 2.
  const m = member(
    11,
    [0, 4, 9],
    [line({ D: 0.4, L: 1.5, Lred: 1.0 }, 0, 11), line({ L: 0.8 }, 2, 6, "STRIP"), point({ D: 2, L: 1 }, 10), point({ D: 1, L: 3 }, 6.5)],
    0.8,
  );
  const g = governing(m);
  const toBeam = (pieces: ReturnType<typeof governingPieces>): BeamLoad[] =>
    pieces.map((p) => (p.load.kind === "line" ? { kind: "line", start: p.start, end: p.end, w1: p.value, w2: p.value } : { kind: "point", x: p.start, p: p.value }));
  for (const q of quantitiesOf(3)) {
    it(`${q.kind}${"support" in q ? ` ${q.support + 1}` : ""}: reactions, V and M at the critical points`, () => {
      const v = governingOf(g.envelope, q)!;
      const model = governingBeamModel(g, v);
      if (!model.ok) throw new Error(model.error.message);
      const ref = solveBeam(model.value);
      const drawn = solveBeam({ span: 11, supports: model.value.supports, loads: toBeam(governingPieces(m, g, v)) });
      if (!ref.ok || !drawn.ok) throw new Error("not solved");
      ref.value.reactions.forEach((r, k) => close(drawn.value.reactions[k]!, r));
      for (const x of [0, 2, 4, 6, 6.5, 9, 10, 11, v.x]) {
        close(drawn.value.momentAt(x), ref.value.momentAt(x));
        close(drawn.value.shearAt(Math.min(11, x + 1e-7)), ref.value.shearAt(Math.min(11, x + 1e-7)));
      }
      // The governing value itself, read from the drawn member.
      if (q.kind === "momentMax") close(drawn.value.maxSagging().value, v.value);
      if (q.kind === "momentMin") close(drawn.value.maxHogging().value, v.value);
      if (q.kind === "shearMax") close(Math.abs(drawn.value.maxShear().value), v.value);
      if (q.kind === "reactionMax" || q.kind === "reactionMin") close(drawn.value.reactions[q.support]!, v.value);
    });
  }
});

describe("combination labels on a member", () => {
  it("keeps only the terms of cases that load it, signs included", () => {
    expect(labelOnMember("2.3.1 (2) 1.2D + 1.6L + 0.5Lr", ["D", "L"])).toBe("2.3.1 (2) 1.2D + 1.6L");
    expect(labelOnMember("2.3.1 (3) 1.2D + 1.6Lr - 0.5W", ["D", "Lr"])).toBe("2.3.1 (3) 1.2D + 1.6Lr");
    expect(labelOnMember("2.3.1 (5) 0.9D - 1.0W", ["D", "L"])).toBe("2.3.1 (5) 0.9D");
    expect(labelOnMember("Firm combo A", ["D"])).toBe("Firm combo A");
  });
});
