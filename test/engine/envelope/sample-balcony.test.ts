/**
 * The balcony joist J01 of the SI timber house, read from the sample generator's own tables
 * (sample-workbooks/make-buildings.ts), through the envelope engine (src/engine/envelope): pattern
 * live load on the back span and the balcony, checked against hand statics of a beam overhanging
 * one support. Combination factors 1.4D; 1.2D + 1.6L; 1.2D + 1.0L; 0.9D are ASCE/SEI 7-22
 * Sec. 2.3.1 as recalled from memory.
 */
import { describe, expect, it } from "vitest";
import type { BeamLoad } from "../../../src/engine/beam/types";
import { builtInCombinations, envelope } from "../../../src/engine/envelope";
import { timberHouse } from "../../../sample-workbooks/make-buildings";

type Row = readonly (string | number | null)[];

const [zones, members, loads] = timberHouse();
const col = (t: { headers: readonly string[] }, name: string): number => t.headers.findIndex((h) => h.replace(/\s*\(.*\)$/, "") === name);
const j01 = members!.rows.find((r) => r[0] === "J01")! as Row;
const num = (r: Row, t: { headers: readonly string[] }, name: string): number => Number(r[col(t, name)] ?? 0);
const l = num(j01, members!, "Span");
const a = num(j01, members!, "End overhang");
const wSelf = num(j01, members!, "wD");
const zone = (name: string): Row => zones!.rows.find((z) => z[0] === name)! as Row;
/** J01's area loads from the Loads table: zone x width over From..To, per case. */
const areas = (loads!.rows as Row[]).filter((r) => r[0] === "J01" && r[1] === "area").map((r) => ({ zone: zone(String(r[2])), width: num(r, loads!, "Width"), from: num(r, loads!, "From"), to: num(r, loads!, "To") }));
const line = (start: number, end: number, w: number): BeamLoad => ({ kind: "line", start, end, w1: w, w2: w });
const wOn = (c: "D" | "L", from: number): number => {
  const p = areas.find((x) => x.from === from)!;
  return num(p.zone, zones!, c) * p.width;
};

describe("sample timber house, balcony joist J01 (as generated): pattern live load against hand statics", () => {
  it("keeps its balcony: 4.2 m back span, 1.2 m overhang, FLOOR on the back span and BALCONY on the overhang", () => {
    expect([l, a]).toEqual([4.2, 1.2]);
    expect(areas.map((p) => [p.zone[0], p.from, p.to])).toEqual([
      ["FLOOR", 0, 4.2],
      ["BALCONY", 4.2, 5.4],
    ]);
  });

  const wDb = wSelf + wOn("D", 0);
  const wDo = wSelf + wOn("D", l);
  const wLb = wOn("L", 0);
  const wLo = wOn("L", l);
  const result = envelope(
    { span: l + a, supports: [{ x: 0, type: "pin" }, { x: l, type: "pin" }], loads: { D: [line(0, l + a, wSelf), line(0, l, wOn("D", 0)), line(l, l + a, wOn("D", l))], L: [line(0, l, wLb), line(l, l + a, wLo)] } },
    builtInCombinations({ method: "LRFD", halfLive: false }),
  );
  if (!result.ok) throw new Error(result.error.message);
  const env = result.value;

  it("back-span moment with the balcony's live load off: R1^2 / (2 w_b), R1 = w_b l / 2 - w_o a^2 / (2 l) (statics)", () => {
    const wb = 1.2 * wDb + 1.6 * wLb;
    const wo = 1.2 * wDo;
    const r1 = (wb * l) / 2 - (wo * a * a) / (2 * l);
    expect(env.momentMax.value).toBeCloseTo((r1 * r1) / (2 * wb), 10);
    expect(env.momentMax.pattern).toBe("L on span 1");
    // With live load on the balcony too, the same statics gives less: the pattern governs.
    const r1all = (wb * l) / 2 - ((wo + 1.6 * wLo) * a * a) / (2 * l);
    expect((r1all * r1all) / (2 * wb)).toBeLessThan(env.momentMax.value);
  });

  it("back support with only the balcony loaded: least reaction by statics of each combination; no uplift on this joist", () => {
    // Moments about the front support: R1 l = w_b l^2 / 2 - w_o a^2 / 2.
    const r1 = (wb: number, wo: number): number => (wb * l * l) / 2 / l - (wo * a * a) / 2 / l;
    const candidates = [r1(1.4 * wDb, 1.4 * wDo), r1(1.2 * wDb, 1.2 * wDo + 1.6 * wLo), r1(1.2 * wDb, 1.2 * wDo + wLo), r1(0.9 * wDb, 0.9 * wDo)];
    expect(env.reactionMin[0]!.value).toBeCloseTo(Math.min(...candidates), 10);
    expect(env.reactionMin[0]!.pattern).toBe("L on overhang right");
    // Uplift is checked and absent: the back span's dead load outweighs the balcony's live load here.
    expect(env.reactionMin[0]!.value).toBeGreaterThan(0);
    // The front support's largest reaction: everything loaded, 1.2D + 1.6L, R2 = w_b l / 2 + w_o a (l + a/2) / l.
    const r2 = (wb: number, wo: number): number => (wb * l) / 2 + (wo * a * (l + a / 2)) / l;
    expect(env.reactionMax[1]!.value).toBeCloseTo(r2(1.2 * wDb + 1.6 * wLb, 1.2 * wDo + 1.6 * wLo), 10);
  });
});
