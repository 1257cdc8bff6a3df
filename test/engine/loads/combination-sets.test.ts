import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  builtInSet,
  COMBINATION_METHODS,
  evaluateCombinations,
  expandedRows,
  governingCombination,
  LOAD_CASES,
  parseCombinationMethod,
  parseCombinationTable,
  setOfMethod,
  type CombinationSet,
  type LoadCase,
  type LoadEffects,
} from "../../../src/engine/loads";
import type { Result } from "../../../src/engine/errors";
import { combinationsOfSet } from "../../../src/engine/envelope";

function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

function errorOf<T>(r: Result<T>): string {
  expect(r.ok).toBe(false);
  return r.ok ? "" : r.error.message;
}

const zero: LoadEffects = { D: 0, L: 0, Lr: 0, S: 0, R: 0, W: 0, E: 0 };
const HEADER = ["Combination", "Method", "D", "L", "Lr", "S", "R", "W", "E"];

/**
 * Factors read from a combination's text as the standard writes it, independently of the engine:
 * "1.2D - 1.0W + L + 0.5Lr" -> { D: 1.2, W: -1, L: 1, Lr: 0.5 }; "0.75(0.7S)" -> S 0.525.
 */
function factorsFromText(text: string): Partial<Record<LoadCase, number>> {
  const out: Partial<Record<LoadCase, number>> = {};
  for (const m of text.matchAll(/([+-])?\s*(?:(\d*\.?\d+)\((\d*\.?\d+)(Lr|L|S|R|W|E|D)\)|(\d*\.?\d+)?(Lr|L|S|R|W|E|D))/g)) {
    const sign = m[1] === "-" ? -1 : 1;
    const load = (m[4] ?? m[6]) as LoadCase;
    const f = m[4] !== undefined ? Number(m[2]) * Number(m[3]) : m[5] !== undefined ? Number(m[5]) : 1;
    out[load] = (out[load] ?? 0) + sign * f;
  }
  return out;
}

function expectFactors(got: Partial<Record<LoadCase, number>>, want: Partial<Record<LoadCase, number>>, label: string): void {
  for (const c of LOAD_CASES) expect(got[c] ?? 0, `${label}: ${c}`).toBeCloseTo(want[c] ?? 0, 12);
}

describe("built-in sets as data", () => {
  // The labels are the combinations of ASCE/SEI 7-22 as recalled from memory (verify against the
  // standard): LRFD Sec. 2.3.1 (1)-(5) and Sec. 2.3.6 (6)-(7), ASD Sec. 2.4.1 (1)-(7) and Sec. 2.4.5
  // (8)-(10); test/engine/loads/combinations.test.ts checks every label and value by hand. Here each
  // row's factor data must say what its text says, and the row must name its section.
  for (const [method, halfLive] of [["LRFD", false], ["LRFD", true], ["ASD", false]] as const) {
    it(`${method}${halfLive ? " with 0.5L" : ""}: every row's factors are those its label writes; source names the section, recalled from memory`, () => {
      const set = builtInSet(method, halfLive);
      expect(set.method).toBe(method);
      expect(set.rows.length).toBe(method === "LRFD" ? 25 : 24);
      for (const row of set.rows) {
        const [, section, number, text] = /^(\d\.\d\.\d) \((\d+)\) (.*)$/.exec(row.label)!;
        expectFactors(row.factors, factorsFromText(text!), row.label);
        expect(row.source).toBe(`ASCE/SEI 7-22 Sec. ${section}, combination ${number} (recalled from memory; verify against the standard)`);
      }
      // both signs of W and E are listed, so the evaluator adds no reversed row
      expect(expandedRows(set).map((r) => r.label)).toEqual(set.rows.map((r) => r.label));
    });
  }

  it("service (common practice: ASD gravity combinations 2.4.1 (1)-(4) at service level, recalled from memory): eight rows by hand", () => {
    const set = builtInSet("service");
    const x: LoadEffects = { D: 10.3, L: 8.7, Lr: 3.1, S: 5.9, R: 2.3, W: 6.7, E: 4.1 };
    const byHand: [string, number][] = [
      ["service (1) D", 10.3],
      ["service (2) D + L", 10.3 + 8.7],
      ["service (3) D + Lr", 10.3 + 3.1],
      ["service (3) D + 0.7S", 10.3 + 0.7 * 5.9],
      ["service (3) D + R", 10.3 + 2.3],
      ["service (4) D + 0.75L + 0.75Lr", 10.3 + 0.75 * 8.7 + 0.75 * 3.1],
      ["service (4) D + 0.75L + 0.75(0.7S)", 10.3 + 0.75 * 8.7 + 0.75 * 0.7 * 5.9],
      ["service (4) D + 0.75L + 0.75R", 10.3 + 0.75 * 8.7 + 0.75 * 2.3],
    ];
    const r = value(evaluateCombinations(set, x, "max"));
    expect(r.values.map((v) => v.label)).toEqual(byHand.map(([l]) => l));
    r.values.forEach((v, i) => expect(v.value, v.label).toBeCloseTo(byHand[i]![1], 12));
    // D + L = 19.0 < D + 0.75L + 0.75(0.7S) = 10.3 + 6.525 + 3.0975 = 19.9225
    expect(r.governing.label).toBe("service (4) D + 0.75L + 0.75(0.7S)");
    expect(r.governing.value).toBeCloseTo(19.9225, 12);
    for (const row of set.rows) expect(row.source).toMatch(/common practice/);
  });
});

describe("a firm's Combinations table", () => {
  const table = [
    ["Combination", "Method", "D", "L", "Lr", "S", "R", "W", "E"],
    ["F1", "LRFD", 1.4, null, null, null, null, null, null],
    ["F2", "lrfd", 1.2, 1.6, 0.5, null, null, null, null],
    ["F3 uplift", "LRFD", 0.9, null, null, null, null, 1.0, null],
    ["A2", "ASD", 1, 1, null, null, null, null, null],
    ["S-total", "Service", 1, 1, 1, null, null, null, null],
  ];

  it("parses one set per method and evaluates by hand: D 10, L 8, Lr 3, W 6", () => {
    const sets = value(parseCombinationTable(table));
    expect(sets.map((s) => s.method)).toEqual(["LRFD", "ASD", "service"]);
    const lrfd = value(setOfMethod(sets, "LRFD"));
    const x = { ...zero, D: 10, L: 8, Lr: 3, W: 6 };
    const max = value(evaluateCombinations(lrfd, x, "max"));
    // F1 1.4x10 = 14; F2 1.2x10 + 1.6x8 + 0.5x3 = 26.3; F3 0.9x10 + 6 = 15 and, reversed, 0.9x10 - 6 = 3
    expect(max.values.map((v) => [v.label, v.value])).toEqual([
      ["F1", 14],
      ["F2", expect.closeTo(26.3, 12)],
      ["F3 uplift", expect.closeTo(15, 12)],
      ["F3 uplift (-W)", expect.closeTo(3, 12)],
    ]);
    expect(max.governing).toMatchObject({ label: "F2", source: "Combinations table, row 3" });
    expect(max.governing.value).toBeCloseTo(26.3, 12);
    const min = value(evaluateCombinations(lrfd, x, "min"));
    expect(min.governing.label).toBe("F3 uplift (-W)");
    expect(min.governing.value).toBeCloseTo(3, 12);
    expect(value(evaluateCombinations(value(setOfMethod(sets, "ASD")), x, "max")).governing.value).toBe(18); // D + L
    expect(value(evaluateCombinations(value(setOfMethod(sets, "service")), x, "max")).governing.value).toBe(21); // D + L + Lr
  });

  it("headers in any order and case, units in parentheses ignored, case columns left out are 0, a Source column, text numbers", () => {
    const sets = value(
      parseCombinationTable([
        ["method", "D (-)", "combination", "l", "SOURCE", ""],
        ["ASD", " 1.0 ", "firm 2", "0.75", "local amendment 12", "note ignored"],
      ]),
    );
    expect(sets).toHaveLength(1);
    expect(sets[0]!.rows[0]).toEqual({ label: "firm 2", source: "local amendment 12", factors: { D: 1, L: 0.75 } });
  });

  it("blank rows (or rows of blanks and zeros) are skipped; the same label may serve two methods", () => {
    const sets = value(
      parseCombinationTable([HEADER, ["1", "LRFD", 1.4], [null, null, null], [0, 0, 0, 0], ["1", "ASD", 1]]),
    );
    expect(sets.map((s) => [s.method, s.rows[0]!.label, s.rows[0]!.source])).toEqual([
      ["LRFD", "1", "Combinations table, row 2"],
      ["ASD", "1", "Combinations table, row 5"],
    ]);
  });

  it("errors name the argument, the 1-based row of the range (header = row 1) and the column", () => {
    const t = (...rows: unknown[][]): string => errorOf(parseCombinationTable([HEADER, ...rows]));
    expect(t(["F1", "LRFD", "1,2"])).toBe('combinations, row 2: column D: "1,2" is not a number.');
    expect(t(["F1", "LRFD", 1.2], ["F2", "LRFD", 1.2, true])).toBe("combinations, row 3: column L: TRUE is not a number.");
    expect(t(["F1", "strength", 1.2])).toBe('combinations, row 2: column Method: "strength" is not a method; use one of LRFD, ASD, service.');
    expect(t(["F1", null, 1.2])).toBe("combinations, row 2: column Method: is blank; give LRFD, ASD or service.");
    expect(t(["F1", "LRFD", 1.2], ["f1", "LRFD", 0.9])).toBe('combinations, row 3: column Combination: "f1" is used twice for LRFD.');
    expect(t(["F1", "LRFD", null, 0, ""])).toBe('combinations, row 2: combination "F1" has no factor (every case column is blank or 0).');
    expect(t([null, "LRFD", 1.2])).toBe("combinations, row 2: column Combination: is blank; every combination needs a name.");
    expect(t(["F1", "LRFD", 1.2, 0, 0, 0, 0, 1, 1])).toMatch(/^combinations, row 2: combination "F1": columns W and E both hold a factor/);
    expect(t(["F1", "LRFD", { error: "#DIV/0!" }])).toBe("combinations, row 2: column D: the error #DIV/0! is not a number.");
    expect(errorOf(parseCombinationTable([["Combination", "Method", "Dead"]]))).toBe(
      'combinations, row 1: column 3: header "Dead" is not one of Combination, Method, D, L, Lr, S, R, W, E, Source.',
    );
    expect(errorOf(parseCombinationTable([["Combination", "D", "L"], ["F1", 1, 1]]))).toBe("combinations, row 1: no Method column in the header row.");
    expect(errorOf(parseCombinationTable([["Combination", "Method", "D", "d (kip)"]]))).toBe("combinations, row 1: column 4: the header D appears twice.");
    expect(errorOf(parseCombinationTable([HEADER]))).toBe("combinations: the table has a header row but no combination.");
    expect(errorOf(parseCombinationTable([]))).toMatch(/^combinations, row 1: the first row must hold the headers/);
    expect(errorOf(setOfMethod(value(parseCombinationTable([HEADER, ["F1", "LRFD", 1.4]])), "ASD"))).toBe(
      "combinations: the table has no ASD combination (it has LRFD).",
    );
  });

  it("a set without rows and a non-finite effect are errors, not exceptions", () => {
    const empty: CombinationSet = { name: "none", method: "LRFD", rows: [] };
    expect(errorOf(evaluateCombinations(empty, zero, "max"))).toBe('combinations: the set "none" has no combination.');
    expect(errorOf(evaluateCombinations(builtInSet("ASD"), { ...zero, L: Number.NaN }, "max"))).toMatch(/^L: /);
  });
});

describe("methods and the envelope's view of a set", () => {
  it("method keys: LRFD (blank), ASD, service, case-insensitive; others an error listing the three", () => {
    expect(parseCombinationMethod(null)).toEqual({ ok: true, value: "LRFD" });
    expect(parseCombinationMethod(" SERVICE ")).toEqual({ ok: true, value: "service" });
    expect(errorOf(parseCombinationMethod("USD"))).toBe('method: "USD" is not a method; use one of LRFD, ASD, service.');
  });

  it("the envelope takes a firm's set with its reversed rows", () => {
    const set = value(parseCombinationTable([HEADER, ["up", "LRFD", 0.9, null, null, null, null, null, 1]]))[0]!;
    expect(combinationsOfSet(set)).toEqual([
      { label: "up", factors: { D: 0.9, E: 1 } },
      { label: "up (-E)", factors: { D: 0.9, E: -1 } },
    ]);
  });
});

/** The cells of a Combinations table holding a set's rows (header first). */
function tableOf(set: CombinationSet, keep: (c: LoadCase, f: number) => boolean = () => true): unknown[][] {
  return [HEADER, ...set.rows.map((r) => [r.label, set.method, ...LOAD_CASES.map((c) => (keep(c, r.factors[c] ?? 0) ? (r.factors[c] ?? null) : null))])];
}

describe("properties (fast-check)", () => {
  const effect = fc.double({ min: -1e4, max: 1e4, noNaN: true, noDefaultInfinity: true });
  const effects = fc.record({ D: effect, L: effect, Lr: effect, S: effect, R: effect, W: effect, E: effect });
  const factor = fc.oneof(fc.constant(0), fc.double({ min: -2, max: 2, noNaN: true, noDefaultInfinity: true }));
  const row = fc.record({ D: factor, L: factor, Lr: factor, S: factor, R: factor, W: factor, E: factor }).map((f) => (f.W !== 0 ? { ...f, E: 0 } : f));
  const table = fc
    .tuple(fc.array(row, { minLength: 1, maxLength: 8 }), fc.constantFrom(...COMBINATION_METHODS))
    .map(([rows, method]) => [HEADER, ...rows.map((f, i) => [`C${i + 1}`, method, ...LOAD_CASES.map((c) => (c === "D" ? f.D || 1 : f[c]))])]);

  it("the governing value is the max (min) over the listed values, and W and E entered with either sign give the same", () => {
    fc.assert(
      fc.property(table, effects, (cells, x) => {
        const set = value(parseCombinationTable(cells))[0]!;
        for (const extreme of ["max", "min"] as const) {
          const r = value(evaluateCombinations(set, x, extreme));
          const all = r.values.map((v) => v.value);
          const want = extreme === "max" ? Math.max(...all) : Math.min(...all);
          if (r.governing.value !== want || !r.values.includes(r.governing)) return false;
          for (const flipped of [{ ...x, W: -x.W }, { ...x, E: -x.E }]) {
            if (value(evaluateCombinations(set, flipped, extreme)).governing.value !== want) return false;
          }
        }
        return true;
      }),
    );
  });

  it("a table that reproduces the built-in LRFD set (also with only the +W/+E rows) governs as the built-in combinations", () => {
    const lrfd = builtInSet("LRFD");
    const full = value(setOfMethod(value(parseCombinationTable(tableOf(lrfd))), "LRFD"));
    // the same rows without those whose W or E factor is negative: the evaluator reverses the others
    const plusOnly = tableOf(lrfd).filter((r, i) => i === 0 || LOAD_CASES.every((c, j) => !((c === "W" || c === "E") && typeof r[j + 2] === "number" && (r[j + 2] as number) < 0)));
    const half = value(setOfMethod(value(parseCombinationTable(plusOnly)), "LRFD"));
    expect(expandedRows(half)).toHaveLength(25);
    fc.assert(
      fc.property(effects, fc.constantFrom("max" as const, "min" as const), (x, extreme) => {
        const want = governingCombination(x, { method: "LRFD", halfLive: false }, extreme);
        const a = value(evaluateCombinations(full, x, extreme)).governing;
        const b = value(evaluateCombinations(half, x, extreme)).governing;
        return a.value === want.value && a.label === want.label && b.value === want.value;
      }),
    );
  });
});
