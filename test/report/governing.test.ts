/**
 * The report's governing values (each factored quantity with its own combination and live load
 * pattern, ASCE/SEI 7-22 Sec. 2.3.1 and 4.3.3, factors recalled from memory) against hand statics:
 * joist J01 of the SI sample (4.2 m back span, 1.2 m balcony, sample-workbooks/make-buildings.ts),
 * an invented joist with a long overhang whose back support lifts, and a joist continuous over two
 * equal spans against the published two-span cases. The drawing of the case
 * that governs M+ carries that case's caption and its moment. Runs `loadpath report` in process
 * (needs `npm run build` for the functions bundle).
 */
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { cli, writeSheets } from "./helpers";

const ROOT = resolve(__dirname, "../..");
const SAMPLE_SI = join(ROOT, "sample-workbooks", "timber-house-si.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-governing-"));
const missing = existsSync(join(ROOT, "dist", "functions.js")) ? null : "dist/functions.js is missing: run npm run build";
if (missing && process.env.CI) throw new Error(missing);

const close = (actual: number, expected: number, what: string): void => {
  expect(Math.abs(actual - expected), `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
};

/** The HTML of one member's section. */
function section(html: string, mark: string): string {
  const start = html.indexOf(`data-mark="${mark}"`);
  expect(start, `section of ${mark}`).toBeGreaterThan(0);
  const end = html.indexOf("</section>", start);
  return html.slice(start, end);
}

/** Value, combination and pattern of one row of the governing table. */
function row(part: string, role: string): { value: number; combination: string; pattern: string; uplift: boolean } {
  const m = new RegExp(`<tr data-role="${role}"([^>]*)>(.*?)</tr>`, "s").exec(part);
  expect(m, role).not.toBeNull();
  const body = m![2]!;
  return {
    value: Number(/data-value="([^"]+)"/.exec(body)![1]),
    combination: /<td class="combo">([^<]*)<\/td>/.exec(body)![1]!,
    pattern: /<td class="pattern">([^<]*)<\/td>/.exec(body)![1]!,
    uplift: m![1]!.includes('data-uplift="yes"'),
  };
}

let si = "";
let uplift = "";
let twoSpan = "";

beforeAll(async () => {
  if (missing) return;
  const out = join(dir, "si.html");
  const r = await cli("report", SAMPLE_SI, "-o", out, "--units", "SI", "--only", "J01", "--date", "2025-01-15");
  expect(r.status, r.err.join("\n")).toBe(0);
  si = readFileSync(out, "utf8");
  // An invented joist: 2.0 m back span on F1 and F2, 1.8 m overhang, D 0.5 and L 2.0 kPa over 1 m.
  const xlsx = join(dir, "overhang.xlsx");
  await writeSheets(xlsx, {
    Zones: [
      ["Zone", "D (kPa)", "L (kPa)", "Reducible"],
      ["DECK", 0.5, 2.0, "no"],
    ],
    Members: [
      ["Mark", "Type", "Level", "Span (m)", "Zone", "Trib (m)", "Start support", "Start at (m)", "End support", "End at (m)", "KLL", "wD (kN/m)", "Start overhang (m)", "End overhang (m)"],
      ["K1", "joist", "1", 2.0, "DECK", 1.0, "F1", null, "F2", null, null, null, 0, 1.8],
      ["F1", "foundation", null, null, null, null, null, null, null, null, null, null, null, null],
      ["F2", "foundation", null, null, null, null, null, null, null, null, null, null, null, null],
    ],
  });
  const out2 = join(dir, "overhang.html");
  const r2 = await cli("report", xlsx, "-o", out2, "--units", "SI", "--only", "K1", "--date", "2025-01-15");
  expect(r2.status, r2.err.join("\n")).toBe(0);
  uplift = readFileSync(out2, "utf8");
  // Joist J1, 40 ft, continuous over G2 at its middle (two equal 20 ft spans, Bearings table), ends
  // on walls; FLR D 50 psf, L 40 psf (not reducible) over 2 ft: w_D = 0.1, w_L = 0.08 kip/ft.
  const xlsx3 = join(dir, "two-span.xlsx");
  await writeSheets(xlsx3, {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["FLR", 50, 40, "no"],
    ],
    Members: [
      ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"],
      ["J1", "joist", "2", 40, "FLR", 2, "W1", null, "W3", null],
      ["G2", "girder", "2", 20, null, null, "C1", null, "C2", null],
      ["C1", "column", "2", 10, null, null, "F1", null, null, null],
      ["C2", "column", "2", 10, null, null, "F2", null, null, null],
      ["W1", "wall", "2", null, null, null, null, null, null, null],
      ["W3", "wall", "2", null, null, null, null, null, null, null],
      ["F1", "foundation", null, null, null, null, null, null, null, null],
      ["F2", "foundation", null, null, null, null, null, null, null, null],
    ],
    Bearings: [
      ["Mark", "Support", "At (ft)", "Support at (ft)"],
      ["J1", "G2", 20, 5],
    ],
  });
  const out3 = join(dir, "two-span.html");
  const r3 = await cli("report", xlsx3, "-o", out3, "--only", "J1", "--date", "2025-01-15");
  expect(r3.status, r3.err.join("\n")).toBe(0);
  twoSpan = readFileSync(out3, "utf8");
});

describe.skipIf(missing !== null)("governing values in the report", () => {
  // J01: joists at 0.6 m; FLOOR D 0.6, L 1.9 kPa on the back span, BALCONY D 0.6, L 2.9 kPa on the
  // overhang, wD 0.15 kN/m over the joist (make-buildings.ts). A_T = 0.6 x 4.2 = 2.52 m², far
  // below the reduction threshold: no live load reduction.
  const l = 4.2;
  const a = 1.2;
  const wD = 0.15 + 0.6 * 0.6;
  const wLback = 1.9 * 0.6;
  const wLover = 2.9 * 0.6;

  it("J01: M+ with the balcony's live load off (the issue's 1.2 x 0.95 + 1.6 x 2.51 = 5.16 kN·m)", () => {
    const part = section(si, "J01");
    const m = row(part, "governing-moment-max");
    // Statics of the overhanging joist: back span w_b, overhang w_o; R1 = w_b l / 2 - w_o a^2 / (2 l);
    // the largest sagging moment is R1^2 / (2 w_b) where V = 0.
    const wb = 1.2 * wD + 1.6 * wLback;
    const wo = 1.2 * wD;
    const r1 = (wb * l) / 2 - (wo * a * a) / (2 * l);
    close(m.value, (r1 * r1) / (2 * wb), "J01 M+");
    expect(m.value).toBeCloseTo(5.153, 3);
    expect(m.combination).toBe("2.3.1 (2) 1.2D + 1.6L");
    expect(m.pattern).toBe("L on span 1");
    // The printed number: 5.15 kN·m (the report's two decimals for moments).
    expect(part).toMatch(/<tr data-role="governing-moment-max">.*?>5\.15<\/td>/s);
  });

  it("J01: M- over the back support with the balcony alone loaded, and each reaction with its own case", () => {
    const part = section(si, "J01");
    const hog = row(part, "governing-moment-min");
    close(hog.value, (-(1.2 * wD + 1.6 * wLover) * a * a) / 2, "J01 M-");
    expect(hog.pattern).toBe("L on overhang right");
    // R1 least: L on the balcony only. R1(D) = wD (l^2 - a^2) / (2 l), R1(L on the overhang) = -wLover a^2 / (2 l).
    const r1D = (wD * (l * l - a * a)) / (2 * l);
    const r1Lover = (-wLover * a * a) / (2 * l);
    const r1Min = row(part, "governing-reaction-1-min");
    close(r1Min.value, Math.min(1.4 * r1D, 1.2 * r1D + 1.6 * r1Lover, 1.2 * r1D + r1Lover, 0.9 * r1D), "J01 R1 min");
    expect(r1Min.combination).toBe("2.3.1 (2) 1.2D + 1.6L");
    expect(r1Min.pattern).toBe("L on overhang right");
    expect(r1Min.uplift).toBe(false);
    // R2 largest: live load everywhere; moments about R1: R2 l = w_b l^2 / 2 + w_o a (l + a / 2).
    const r2 = row(part, "governing-reaction-2-max");
    close(r2.value, ((1.2 * wD + 1.6 * wLback) * l * l) / 2 / l + ((1.2 * wD + 1.6 * wLover) * a * (l + a / 2)) / l, "J01 R2 max");
    expect(r2.pattern).toBe("L on all segments");
  });

  it("J01: the factored drawing is the case that governs M+, captioned with it, its moment the governing one", () => {
    const part = section(si, "J01");
    const fig = /<figure class="drawing" data-role="sheet-governing">(.*?)<\/figure>/s.exec(part);
    expect(fig).not.toBeNull();
    expect(fig![1]).toContain("J01, case M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on span 1 (factored)");
    const extreme = /data-role="extreme" data-kind="max-sagging" data-value="([^"]+)"/g;
    const values = [...fig![1]!.matchAll(extreme)].map((x) => Number(x[1]));
    const expected = row(part, "governing-moment-max").value;
    expect(values.some((v) => Math.abs(v - expected) <= 1e-9 * expected), `${values.join(", ")} vs ${expected}`).toBe(true);
    // The drawn reactions are those of the same statics: R1 as above, R2 = total load - R1.
    const wb = 1.2 * wD + 1.6 * wLback;
    const wo = 1.2 * wD;
    const r1 = (wb * l) / 2 - (wo * a * a) / (2 * l);
    const reactions = [...fig![1]!.matchAll(/data-role="reaction" data-index="(\d)" data-x="[^"]*" data-value="([^"]+)"/g)].map((x) => Number(x[2]));
    expect(reactions).toHaveLength(2);
    close(reactions[0]!, r1, "J01 drawn R1");
    close(reactions[1]!, wb * l + wo * a - r1, "J01 drawn R2");
    // The balcony piece carries its dead load only, and says its live load is off.
    // BALCONY D alone: 1.2 x 0.6 kPa x 0.6 m = 0.432 kN/m (the joist's wD is a load of its own).
    expect(fig![1]).toContain(">L off: BALCONY …: 0.432 kN/m<");
  });

  it("states the patterned cases in the provisions", () => {
    expect(si).toContain("ASCE/SEI 7-22 Sec. 4.3.3");
    expect(si).toMatch(/L and Lr switched on and off span by span/);
  });

  it("an invented joist with a long overhang: uplift at the back support (hand statics)", () => {
    const part = section(uplift, "K1");
    // l = 2, a = 1.8, D 0.5 and L 2.0 kN/m over 3.8 m. Moments about the front support:
    // R1(D) = 0.5 (2^2 - 1.8^2) / (2 x 2) = 0.095 kN; R1(L on the overhang only) = -2 x 1.8^2 / 4 = -1.62 kN.
    const r1Min = row(part, "governing-reaction-1-min");
    close(r1Min.value, 1.2 * 0.095 + 1.6 * -1.62, "K1 R1 min");
    expect(r1Min.uplift).toBe(true);
    expect(r1Min.combination).toBe("2.3.1 (2) 1.2D + 1.6L");
    expect(r1Min.pattern).toBe("L on overhang right");
    expect(part).toContain("uplift: hold down");
    // The summary of beam end reactions carries the same least reaction at the start end.
    const summary = /<tr data-role="reactions" data-member="K1">(.*?)<\/tr>/s.exec(uplift);
    expect(summary).not.toBeNull();
    const min = /<td class="num" data-value="([^"]+)" data-case="min" data-end="start">/.exec(summary![1]!);
    expect(min).not.toBeNull();
    close(Number(min![1]), r1Min.value, "K1 summary min");
  });

  it("a joist continuous over two equal spans: each reaction and moment with its own live load pattern (AISC Steel Construction Manual Table 3-23, recalled from memory)", () => {
    const part = section(twoSpan, "J1");
    const l = 20;
    const d = 0.1;
    const lv = 0.08;
    // Table 3-23, two equal spans: load on both spans R1 = R3 = 3/8 wl, R2 = 10/8 wl, M over R2 = -wl^2/8;
    // load on span 1 only R1 = 7/16 wl, R2 = 10/16 wl, R3 = -1/16 wl.
    const r1Max = row(part, "governing-reaction-1-max");
    close(r1Max.value, 1.2 * d * (3 / 8) * l + 1.6 * lv * (7 / 16) * l, "J1 R1 max");
    expect(r1Max.pattern).toBe("L on span 1");
    const r2Max = row(part, "governing-reaction-2-max");
    close(r2Max.value, (10 / 8) * (1.2 * d + 1.6 * lv) * l, "J1 R2 max");
    expect(r2Max.pattern).toBe("L on all segments");
    // R3 least: 1.2D + 1.6L with L on span 1 gives 1.2 x 0.75 - 1.6 x 0.1 = 0.74 kip; 0.9D gives 0.675, less.
    const r3Min = row(part, "governing-reaction-3-min");
    close(r3Min.value, Math.min(0.9 * d * (3 / 8) * l, 1.2 * d * (3 / 8) * l - 1.6 * lv * (1 / 16) * l), "J1 R3 min");
    expect(r3Min.combination).toBe("2.3.1 (5) 0.9D");
    const hog = row(part, "governing-moment-min");
    close(hog.value, (-(1.2 * d + 1.6 * lv) * l * l) / 8, "J1 M-");
    expect(hog.pattern).toBe("L on all segments");
    // M+: one span loaded; in that span V = 0 at x = R1 / w, M = R1^2 / (2 w) with w = 1.2D + 1.6L.
    const r1 = 1.2 * d * (3 / 8) * l + 1.6 * lv * (7 / 16) * l;
    const sag = row(part, "governing-moment-max");
    close(sag.value, (r1 * r1) / (2 * (1.2 * d + 1.6 * lv)), "J1 M+");
    expect(sag.pattern).toMatch(/^L on span [12]$/);
  });
});
