import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  COMBINATION_ROWS_MAX,
  combinationValues,
  governingCombination,
  parseExtreme,
  parseMethod,
  type LoadEffects,
} from "../../../src/engine/loads";

type Hand = readonly (readonly [string, (x: LoadEffects) => number])[];

// The hand computations below write out each combination of ASCE/SEI 7-22 as recalled from memory
// (verify against the standard): strength design Sec. 2.3.1 combinations 1-5 and Sec. 2.3.6
// combinations 6-7; allowable stress design Sec. 2.4.1 combinations 1-7 and Sec. 2.4.5
// combinations 8-10. "(Lr or S or R)" gives one row per alternative; W and E act in either
// direction, so each appears with + and -. E stands for the combined seismic effect (Ev + Eh).
// S is the strength-level snow load of ASCE/SEI 7-22, factored 1.0 / 0.3 / 0.15 (strength) and
// 0.7 (allowable stress), as recalled from memory.
const LRFD_BY_HAND: Hand = [
  ["2.3.1 (1) 1.4D", (x) => 1.4 * x.D],
  ["2.3.1 (2) 1.2D + 1.6L + 0.5Lr", (x) => 1.2 * x.D + 1.6 * x.L + 0.5 * x.Lr],
  ["2.3.1 (2) 1.2D + 1.6L + 0.3S", (x) => 1.2 * x.D + 1.6 * x.L + 0.3 * x.S],
  ["2.3.1 (2) 1.2D + 1.6L + 0.5R", (x) => 1.2 * x.D + 1.6 * x.L + 0.5 * x.R],
  ["2.3.1 (3) 1.2D + 1.6Lr + L", (x) => 1.2 * x.D + 1.6 * x.Lr + x.L],
  ["2.3.1 (3) 1.2D + 1.6Lr + 0.5W", (x) => 1.2 * x.D + 1.6 * x.Lr + 0.5 * x.W],
  ["2.3.1 (3) 1.2D + 1.6Lr - 0.5W", (x) => 1.2 * x.D + 1.6 * x.Lr - 0.5 * x.W],
  ["2.3.1 (3) 1.2D + 1.0S + L", (x) => 1.2 * x.D + 1.0 * x.S + x.L],
  ["2.3.1 (3) 1.2D + 1.0S + 0.5W", (x) => 1.2 * x.D + 1.0 * x.S + 0.5 * x.W],
  ["2.3.1 (3) 1.2D + 1.0S - 0.5W", (x) => 1.2 * x.D + 1.0 * x.S - 0.5 * x.W],
  ["2.3.1 (3) 1.2D + 1.6R + L", (x) => 1.2 * x.D + 1.6 * x.R + x.L],
  ["2.3.1 (3) 1.2D + 1.6R + 0.5W", (x) => 1.2 * x.D + 1.6 * x.R + 0.5 * x.W],
  ["2.3.1 (3) 1.2D + 1.6R - 0.5W", (x) => 1.2 * x.D + 1.6 * x.R - 0.5 * x.W],
  ["2.3.1 (4) 1.2D + 1.0W + L + 0.5Lr", (x) => 1.2 * x.D + 1.0 * x.W + x.L + 0.5 * x.Lr],
  ["2.3.1 (4) 1.2D + 1.0W + L + 0.3S", (x) => 1.2 * x.D + 1.0 * x.W + x.L + 0.3 * x.S],
  ["2.3.1 (4) 1.2D + 1.0W + L + 0.5R", (x) => 1.2 * x.D + 1.0 * x.W + x.L + 0.5 * x.R],
  ["2.3.1 (4) 1.2D - 1.0W + L + 0.5Lr", (x) => 1.2 * x.D - 1.0 * x.W + x.L + 0.5 * x.Lr],
  ["2.3.1 (4) 1.2D - 1.0W + L + 0.3S", (x) => 1.2 * x.D - 1.0 * x.W + x.L + 0.3 * x.S],
  ["2.3.1 (4) 1.2D - 1.0W + L + 0.5R", (x) => 1.2 * x.D - 1.0 * x.W + x.L + 0.5 * x.R],
  ["2.3.1 (5) 0.9D + 1.0W", (x) => 0.9 * x.D + 1.0 * x.W],
  ["2.3.1 (5) 0.9D - 1.0W", (x) => 0.9 * x.D - 1.0 * x.W],
  ["2.3.6 (6) 1.2D + E + L + 0.15S", (x) => 1.2 * x.D + x.E + x.L + 0.15 * x.S],
  ["2.3.6 (6) 1.2D - E + L + 0.15S", (x) => 1.2 * x.D - x.E + x.L + 0.15 * x.S],
  ["2.3.6 (7) 0.9D + E", (x) => 0.9 * x.D + x.E],
  ["2.3.6 (7) 0.9D - E", (x) => 0.9 * x.D - x.E],
];

// Same with the 0.5 factor on L permitted in Sec. 2.3.1 combinations 3, 4 and 6 (exception for
// Lo <= 100 psf other than garages and public assembly; recalled from memory).
const LRFD_HALF_LIVE_BY_HAND: Hand = LRFD_BY_HAND.map(([label, f]) => {
  const n = Number(/\((\d+)\)/.exec(label)![1]);
  if (n !== 3 && n !== 4 && n !== 6) return [label, f] as const;
  if (n === 3 && !label.endsWith(" + L")) return [label, f] as const;
  const halfLabel = label.replace(/ \+ L\b(?!r)/, " + 0.5L");
  return [halfLabel, (x: LoadEffects) => f({ ...x, L: 0.5 * x.L })] as const;
});

const ASD_BY_HAND: Hand = [
  ["2.4.1 (1) D", (x) => x.D],
  ["2.4.1 (2) D + L", (x) => x.D + x.L],
  ["2.4.1 (3) D + Lr", (x) => x.D + x.Lr],
  ["2.4.1 (3) D + 0.7S", (x) => x.D + 0.7 * x.S],
  ["2.4.1 (3) D + R", (x) => x.D + x.R],
  ["2.4.1 (4) D + 0.75L + 0.75Lr", (x) => x.D + 0.75 * x.L + 0.75 * x.Lr],
  ["2.4.1 (4) D + 0.75L + 0.75(0.7S)", (x) => x.D + 0.75 * x.L + 0.75 * (0.7 * x.S)],
  ["2.4.1 (4) D + 0.75L + 0.75R", (x) => x.D + 0.75 * x.L + 0.75 * x.R],
  ["2.4.1 (5) D + 0.6W", (x) => x.D + 0.6 * x.W],
  ["2.4.1 (5) D - 0.6W", (x) => x.D - 0.6 * x.W],
  ["2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75Lr", (x) => x.D + 0.75 * x.L + 0.75 * (0.6 * x.W) + 0.75 * x.Lr],
  ["2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75(0.7S)", (x) => x.D + 0.75 * x.L + 0.75 * (0.6 * x.W) + 0.75 * (0.7 * x.S)],
  ["2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75R", (x) => x.D + 0.75 * x.L + 0.75 * (0.6 * x.W) + 0.75 * x.R],
  ["2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75Lr", (x) => x.D + 0.75 * x.L - 0.75 * (0.6 * x.W) + 0.75 * x.Lr],
  ["2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75(0.7S)", (x) => x.D + 0.75 * x.L - 0.75 * (0.6 * x.W) + 0.75 * (0.7 * x.S)],
  ["2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75R", (x) => x.D + 0.75 * x.L - 0.75 * (0.6 * x.W) + 0.75 * x.R],
  ["2.4.1 (7) 0.6D + 0.6W", (x) => 0.6 * x.D + 0.6 * x.W],
  ["2.4.1 (7) 0.6D - 0.6W", (x) => 0.6 * x.D - 0.6 * x.W],
  ["2.4.5 (8) 1.0D + 0.7E", (x) => 1.0 * x.D + 0.7 * x.E],
  ["2.4.5 (8) 1.0D - 0.7E", (x) => 1.0 * x.D - 0.7 * x.E],
  ["2.4.5 (9) 1.0D + 0.525E + 0.75L + 0.75(0.7S)", (x) => 1.0 * x.D + 0.525 * x.E + 0.75 * x.L + 0.75 * (0.7 * x.S)],
  ["2.4.5 (9) 1.0D - 0.525E + 0.75L + 0.75(0.7S)", (x) => 1.0 * x.D - 0.525 * x.E + 0.75 * x.L + 0.75 * (0.7 * x.S)],
  ["2.4.5 (10) 0.6D + 0.7E", (x) => 0.6 * x.D + 0.7 * x.E],
  ["2.4.5 (10) 0.6D - 0.7E", (x) => 0.6 * x.D - 0.7 * x.E],
];

// Distinct values so that no two combinations coincide by accident.
const EFFECTS: LoadEffects = { D: 10.3, L: 8.7, Lr: 3.1, S: 5.9, R: 2.3, W: 6.7, E: 4.1 };

function checkAgainstHand(hand: Hand, method: "LRFD" | "ASD", halfLive: boolean): void {
  const rows = combinationValues(EFFECTS, { method, halfLive });
  expect(rows.map((r) => r.label)).toEqual(hand.map(([label]) => label));
  rows.forEach((row, i) => expect(row.value, row.label).toBeCloseTo(hand[i]![1](EFFECTS), 12));
}

describe("ASCE/SEI 7-22 basic combinations, each against a hand computation", () => {
  it("LRFD: Sec. 2.3.1 combinations 1-5 and Sec. 2.3.6 combinations 6-7, 25 rows", () => {
    checkAgainstHand(LRFD_BY_HAND, "LRFD", false);
  });

  it("LRFD with half_live: 0.5L in combinations 3, 4 and 6 only (Sec. 2.3.1 exception)", () => {
    checkAgainstHand(LRFD_HALF_LIVE_BY_HAND, "LRFD", true);
    // Combination 2 keeps 1.6L: 1.2 x 10.3 + 1.6 x 8.7 + 0.5 x 3.1
    const c2 = combinationValues(EFFECTS, { method: "LRFD", halfLive: true })[1]!;
    expect(c2.value).toBeCloseTo(1.2 * 10.3 + 1.6 * 8.7 + 0.5 * 3.1, 12);
  });

  it("ASD: Sec. 2.4.1 combinations 1-7 and Sec. 2.4.5 combinations 8-10, 24 rows; half_live ignored", () => {
    checkAgainstHand(ASD_BY_HAND, "ASD", false);
    checkAgainstHand(ASD_BY_HAND, "ASD", true);
  });

  it("the spill height is the larger method's row count (25, LRFD)", () => {
    expect(COMBINATION_ROWS_MAX).toBe(Math.max(LRFD_BY_HAND.length, ASD_BY_HAND.length));
  });
});

describe("governing combination (max / min) with reversing wind and seismic effects", () => {
  const zero: LoadEffects = { D: 0, L: 0, Lr: 0, S: 0, R: 0, W: 0, E: 0 };

  it("gravity: D 12, L 9, Lr 3 -> LRFD max 1.2x12 + 1.6x9 + 0.5x3 = 30.3 (Sec. 2.3.1 (2))", () => {
    const g = governingCombination({ ...zero, D: 12, L: 9, Lr: 3 }, { method: "LRFD", halfLive: false }, "max");
    expect(g.value).toBeCloseTo(1.2 * 12 + 1.6 * 9 + 0.5 * 3, 12);
    expect(g.label).toBe("2.3.1 (2) 1.2D + 1.6L + 0.5Lr");
  });

  it("roof uplift: D 5, Lr 10, W entered as -12 or +12 -> LRFD min 0.9x5 - 12 = -7.5, ASD min 0.6x5 - 0.6x12 = -4.2", () => {
    for (const w of [-12, 12]) {
      const x = { ...zero, D: 5, Lr: 10, W: w };
      expect(governingCombination(x, { method: "LRFD", halfLive: false }, "min").value).toBeCloseTo(0.9 * 5 - 12, 12);
      expect(governingCombination(x, { method: "ASD", halfLive: false }, "min").value).toBeCloseTo(0.6 * 5 - 0.6 * 12, 12);
    }
  });

  it("roof max with wind: D 5, Lr 10, W 12 -> LRFD max of 1.2x5 + 1.6x10 + 0.5x12 = 28 and 1.2x5 + 12 + 0.5x10 = 23 is 28", () => {
    const g = governingCombination({ ...zero, D: 5, Lr: 10, W: 12 }, { method: "LRFD", halfLive: false }, "max");
    expect(g.value).toBeCloseTo(Math.max(1.2 * 5 + 1.6 * 10 + 0.5 * 12, 1.2 * 5 + 12 + 0.5 * 10, 1.4 * 5), 12);
  });

  it("seismic column: D 100, L 40, E 60 -> LRFD max 1.2x100 + 60 + 40 = 220, min 0.9x100 - 60 = 30", () => {
    const x = { ...zero, D: 100, L: 40, E: 60 };
    const lrfd = { method: "LRFD", halfLive: false } as const;
    expect(governingCombination(x, lrfd, "max").value).toBeCloseTo(1.2 * 100 + 60 + 40, 12);
    expect(governingCombination(x, lrfd, "min").value).toBeCloseTo(0.9 * 100 - 60, 12);
    // E entered negative (the effect's own sign): same pair by reversal
    expect(governingCombination({ ...x, E: -60 }, lrfd, "max").value).toBeCloseTo(1.2 * 100 + 60 + 40, 12);
    expect(governingCombination({ ...x, E: -60 }, lrfd, "min").value).toBeCloseTo(0.9 * 100 - 60, 12);
  });

  it("seismic column ASD: max 100 + 0.525x60 + 0.75x40 = 161.5 (Sec. 2.4.5 (9)), min 0.6x100 - 0.7x60 = 18 (Sec. 2.4.5 (10))", () => {
    const x = { ...zero, D: 100, L: 40, E: 60 };
    const asd = { method: "ASD", halfLive: false } as const;
    expect(governingCombination(x, asd, "max").value).toBeCloseTo(100 + 0.525 * 60 + 0.75 * 40, 12);
    expect(governingCombination(x, asd, "max").label).toBe("2.4.5 (9) 1.0D + 0.525E + 0.75L + 0.75(0.7S)");
    expect(governingCombination(x, asd, "min").value).toBeCloseTo(0.6 * 100 - 0.7 * 60, 12);
  });

  it("half_live: D 10, L 20, W 30 -> combination 4 is 1.2x10 + 30 + 20 = 62, with 0.5L 1.2x10 + 30 + 0.5x20 = 52", () => {
    const x = { ...zero, D: 10, L: 20, W: 30 };
    expect(governingCombination(x, { method: "LRFD", halfLive: false }, "max").value).toBeCloseTo(1.2 * 10 + 30 + 20, 12);
    expect(governingCombination(x, { method: "LRFD", halfLive: true }, "max").value).toBeCloseTo(1.2 * 10 + 30 + 0.5 * 20, 12);
  });
});

describe("inputs", () => {
  it("are never mutated", () => {
    const frozen = Object.freeze({ ...EFFECTS });
    const before = JSON.stringify(frozen);
    combinationValues(frozen, { method: "LRFD", halfLive: true });
    governingCombination(frozen, { method: "ASD", halfLive: false }, "min");
    expect(JSON.stringify(frozen)).toBe(before);
  });
});

describe("keys", () => {
  it("method and extreme are case-insensitive; blank takes the default", () => {
    expect(parseMethod(" asd ")).toEqual({ ok: true, value: "ASD" });
    expect(parseMethod(null)).toEqual({ ok: true, value: "LRFD" });
    expect(parseExtreme("MIN")).toEqual({ ok: true, value: "min" });
    expect(parseExtreme("")).toEqual({ ok: true, value: "max" });
  });

  it("unknown method / extreme are errors listing the valid values", () => {
    const m = parseMethod("USD");
    expect(m.ok).toBe(false);
    if (!m.ok) {
      expect(m.error).toMatchObject({ code: "unknownKey", argument: "method" });
      expect(m.error.message).toContain("LRFD, ASD");
    }
    const e = parseExtreme("largest");
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.message).toContain("max, min");
  });
});

describe("properties (fast-check)", () => {
  const effect = fc.double({ min: -1e4, max: 1e4, noNaN: true, noDefaultInfinity: true });
  const effects = fc.record({ D: effect, L: effect, Lr: effect, S: effect, R: effect, W: effect, E: effect });
  const options = fc.record({ method: fc.constantFrom("LRFD" as const, "ASD" as const), halfLive: fc.boolean() });

  it("max >= every combination value >= min", () => {
    fc.assert(
      fc.property(effects, options, (x, o) => {
        const all = combinationValues(x, o).map((r) => r.value);
        const max = governingCombination(x, o, "max").value;
        const min = governingCombination(x, o, "min").value;
        return all.every((v) => v <= max && v >= min) && all.includes(max) && all.includes(min);
      }),
    );
  });

  it("reversal: entering W or E with the opposite sign changes neither max nor min", () => {
    fc.assert(
      fc.property(effects, options, (x, o) => {
        for (const flipped of [{ ...x, W: -x.W }, { ...x, E: -x.E }]) {
          for (const ext of ["max", "min"] as const) {
            if (governingCombination(flipped, o, ext).value !== governingCombination(x, o, ext).value) return false;
          }
        }
        return true;
      }),
    );
  });

  it("linearity: scaling every effect by k > 0 scales the governing value by k", () => {
    fc.assert(
      fc.property(effects, options, fc.double({ min: 0.01, max: 100, noNaN: true }), (x, o, k) => {
        const scaled = Object.fromEntries(Object.entries(x).map(([key, v]) => [key, k * v])) as unknown as LoadEffects;
        const a = governingCombination(scaled, o, "max").value;
        const b = k * governingCombination(x, o, "max").value;
        return Math.abs(a - b) <= 1e-9 * (1 + Math.abs(b));
      }),
    );
  });
});
