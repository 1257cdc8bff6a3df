/**
 * The cache of solved members: a hit only for arguments equal cell by cell (properties checked
 * with fast-check), the oldest entries dropped first, and the beam functions giving the same
 * values whether a member comes from the cache or is solved afresh (AISC Steel Construction
 * Manual, Table 3-23, case 1: simple beam, uniform load, R = wL/2, M max = wL^2/8).
 */
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import type { CellIn, Grid } from "../../src/functions/args";
import { reaction, momentMax, shearMax } from "../../src/functions/beam-functions";
import { MemberCache, memberHash, sameMember, type MemberArgs } from "../../src/functions/member-cache";
import { installCustomFunctionsGlobal } from "../../src/workbook/headless-shim";

beforeAll(() => {
  installCustomFunctionsGlobal();
});

const cell: fc.Arbitrary<CellIn> = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.constantFrom(0, -0, 1, 1.5, 0.1 + 0.2, 0.3),
  fc.constant(null),
  fc.constantFrom("line", "point", "moment", "pin", "fixed", "0", "1.5"),
  fc.boolean(),
  fc.constantFrom({ error: "#DIV/0!" }, { error: "#N/A" }),
);
const grid: fc.Arbitrary<Grid> = fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 4 });
const member: fc.Arbitrary<MemberArgs> = fc.record({
  span: fc.double({ min: 0.1, max: 100, noNaN: true }),
  loads: fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), grid),
  supports: fc.option(grid, { nil: undefined }),
});

/** A deep copy (fresh arrays and objects, as a host passes them on every call). */
function copy(m: MemberArgs): MemberArgs {
  const g = (x: Grid): Grid => x.map((r) => r.map((c) => (typeof c === "object" && c !== null ? { error: c.error } : c)));
  return { span: m.span, loads: typeof m.loads === "number" ? m.loads : g(m.loads), supports: m.supports === undefined ? undefined : g(m.supports) };
}

/** Cell-by-cell equality spelt out independently of the module: numbers by Object.is. */
function equalByJson(a: MemberArgs, b: MemberArgs): boolean {
  const spell = (m: MemberArgs): string =>
    JSON.stringify(m, (_k, v: unknown) => (typeof v === "number" ? (Object.is(v, -0) ? "-0" : `n${v}`) : v === undefined ? "undef" : v));
  return spell(a) === spell(b);
}

describe("member keys", () => {
  it("equal arguments are the same member with the same hash (property)", () => {
    fc.assert(
      fc.property(member, (m) => {
        const c = copy(m);
        expect(sameMember(m, c)).toBe(true);
        expect(memberHash(m)).toBe(memberHash(c));
      }),
    );
  });
  it("two members are the same exactly when every cell is equal (property)", () => {
    fc.assert(fc.property(member, member, (a, b) => sameMember(a, b) === equalByJson(a, b)));
  });
  it("-0 and 0, a number and its text, a uniform load and a one-cell range are told apart", () => {
    const base: MemberArgs = { span: 10, loads: [[0]], supports: undefined };
    expect(sameMember(base, { ...base, loads: [[-0]] })).toBe(false);
    expect(sameMember(base, { ...base, loads: [["0"]] })).toBe(false);
    expect(sameMember(base, { ...base, loads: 0 })).toBe(false);
    expect(sameMember(base, { ...base, supports: [[0], [10]] })).toBe(false);
    expect(sameMember({ ...base, loads: [[null, 1]] }, { ...base, loads: [[1, null]] })).toBe(false);
  });
});

describe("the cache", () => {
  it("computes a member once and returns that value for equal arguments", () => {
    const cache = new MemberCache<number>(8);
    let calls = 0;
    const m: MemberArgs = { span: 12, loads: [["line", 1.5, null, null]], supports: undefined };
    const first = cache.get(m, () => ++calls);
    const second = cache.get(copy(m), () => ++calls);
    expect([first, second, calls]).toEqual([1, 1, 1]);
    expect(cache.get({ ...m, span: 12.000000000000002 }, () => ++calls)).toBe(2);
  });
  it("keeps at most its capacity, dropping the oldest first", () => {
    const cache = new MemberCache<number>(3);
    const m = (span: number): MemberArgs => ({ span, loads: 1, supports: undefined });
    for (const span of [1, 2, 3, 4]) cache.get(m(span), () => span);
    expect(cache.size).toBe(3);
    let recomputed = 0;
    cache.get(m(1), () => ++recomputed); // dropped: computed again
    cache.get(m(4), () => ++recomputed); // kept
    expect(recomputed).toBe(1);
    for (let i = 0; i < 100; i++) cache.get(m(10 + i), () => i);
    expect(cache.size).toBe(3);
  });
});

describe("beam functions through the cache", () => {
  it("the four results of one member are those of the closed form, in any order of calls", () => {
    // AISC Steel Construction Manual, Table 3-23, case 1: R = V max = wL/2, M max = wL^2/8.
    const w = 1.75;
    const L = 23;
    const loads = (): unknown[][] => [["line", w, null, null]];
    const values = [momentMax(L, loads()), reaction(L, loads(), 2), shearMax(L, loads()), reaction(L, loads(), 1), momentMax(L, loads())];
    expect(values[0]).toBeCloseTo((w * L * L) / 8, 12);
    expect(values[1]).toBeCloseTo((w * L) / 2, 12);
    expect(values[2]).toBeCloseTo((w * L) / 2, 12);
    expect(values[3]).toBeCloseTo((w * L) / 2, 12);
    expect(values[4]).toBe(values[0]);
  });
  it("a member solved after many others gives the same values as the first time (property)", () => {
    const uniform = fc.record({ span: fc.double({ min: 1, max: 60, noNaN: true }), w: fc.double({ min: -5, max: 5, noNaN: true }) });
    fc.assert(
      fc.property(uniform, fc.array(uniform, { maxLength: 600 }), (m, others) => {
        const first = [reaction(m.span, [[m.w]], 1), momentMax(m.span, [[m.w]])];
        for (const o of others) reaction(o.span, [[o.w]], 1);
        expect([reaction(m.span, [[m.w]], 1), momentMax(m.span, [[m.w]])]).toEqual(first);
      }),
      { numRuns: 20 },
    );
  });
});

describe("further arguments (the other load cases, a combination set, ratios)", () => {
  const extraItem: fc.Arbitrary<number | string | Grid | undefined> = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom("LRFD", "ASD"), grid, fc.constant(undefined));
  const extra = fc.array(extraItem, { minLength: 1, maxLength: 6 });

  it("equal further arguments hash alike and match; any differing item (or its absence) does not match", () => {
    fc.assert(
      fc.property(member, extra, extra, (m, a, b) => {
        const x = { ...m, extra: a };
        const copy = { ...m, extra: a.map((e) => (Array.isArray(e) ? e.map((r) => [...r]) : e)) };
        expect(sameMember(x, copy)).toBe(true);
        expect(memberHash(x)).toBe(memberHash(copy));
        expect(sameMember(x, m)).toBe(false);
        const differs = a.length !== b.length || a.some((e, i) => !sameMember({ ...m, extra: [e] }, { ...m, extra: [b[i]] }));
        if (differs) expect(sameMember(x, { ...m, extra: b })).toBe(false);
      }),
    );
  });

  it("a member cached with one live load is not returned for another", () => {
    const cache = new MemberCache<number>(8);
    const base = { span: 6, loads: 2, supports: undefined };
    expect(cache.get({ ...base, extra: [3] }, () => 1)).toBe(1);
    expect(cache.get({ ...base, extra: [5] }, () => 2)).toBe(2);
    expect(cache.get({ ...base, extra: [3] }, () => 3)).toBe(1);
  });
});
