/**
 * Sample (c), the two-storey timber-frame house (sample-workbooks/make-buildings.ts), built from
 * the generator's own tables in the headless engine and checked against hand statics written out
 * here: the floor joists continuous over the middle wall (two equal spans), where their interior
 * reaction arrives, the upper wall standing on the beam over the garage opening, the beam's
 * reactions, the stacked walls' accumulation per unit length, the load balance, and the walls'
 * live load reduction (none with a blank KLL cell; ASCE/SEI 7-22 Eq. 4.7-1 with one given).
 * Needs `npm run build` (the sheet is evaluated with the add-in's functions).
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { TWO_STOREY, twoStoreyHouse } from "../../sample-workbooks/make-buildings";
import { readXlsx } from "../../src/workbook/xlsx";
import { builtInCombinations, envelope } from "../../src/engine/envelope";
import { buildOn, handReactions, resultOf, type Built } from "./takedown-helpers";

function close(actual: unknown, expected: number, rel = 1e-12): void {
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

type Sheets = Record<string, RawCellContent[][]>;

/** The sample's tables as sheets of values, header row first; `edit` changes a copy of the Members rows. */
function sheets(edit?: (rows: RawCellContent[][], col: (h: string) => number) => void): Sheets {
  const out: Sheets = {};
  for (const t of twoStoreyHouse()) out[t.sheet] = [[...t.headers], ...t.rows.map((r) => t.headers.map((_, i) => (r[i] ?? null) as RawCellContent))];
  if (edit) {
    const members = out.Members!;
    edit(members, (h) => (members[0] as string[]).findIndex((x) => x.replace(/\s*\(.*\)$/, "") === h));
  }
  return out;
}

async function build(s: Sheets, native = false): Promise<Built> {
  return buildOn(s, { zones: "Zones", members: "Members", bearings: "Bearings", units: "SI", ...(native ? { native } : {}) });
}

// The inputs as typed in make-buildings.ts, read here from the layout constants and restated.
const { spacing: s, bay: l, wallLength, opening, wallWeight: ww } = TWO_STOREY;
const joist = { D: 0.7 * s + 0.08, L: 1.9 * s }; // FLOOR 0.7 kPa D, 1.9 kPa L over 0.6 m, wD 0.08 kN/m
const truss = { D: 0.85 * s + 0.05, Lr: 0.96 * s, S: 1.0 * s }; // ROOF 0.85 / 0.96 / 1.0 kPa, wD 0.05 kN/m
const count = wallLength / s; // 10 joists and 10 trusses
const overOpening = opening / s; // 6 of each over the garage opening

describe("sample (c): two-storey timber-frame house", () => {
  it("is the committed workbook: the generator's tables are what sample-workbooks/two-storey-house-si.xlsx holds", async () => {
    const wb = await readXlsx(join(__dirname, "../../sample-workbooks/two-storey-house-si.xlsx"));
    expect(wb.tables.map((t) => t.name).sort()).toEqual(["Bearings", "Members", "Zones"]);
    expect(readFileSync(join(__dirname, "../../sample-workbooks/make-buildings.ts"), "utf8")).toMatch(/two-storey-house-si\.xlsx/);
    const members = wb.sheets.find((x) => x.name === "Members")!;
    expect(members.rows.length - 1).toBe(twoStoreyHouse()[1]!.rows.length);
  });

  it("builds without problems; every joist is continuous over three supports", async () => {
    const { result } = await build(sheets());
    expect(result.problems).toEqual([]);
    for (let i = 1; i <= count; i++) expect(result.json!.members[`FJ${i}`]!.reactions.D).toHaveLength(3);
  });

  it("floor joist: two equal spans under uniform load, AISC Steel Construction Manual Table 3-23, continuous beam, two equal spans, uniform load on both spans (recalled from memory): R = 3wl/8, 10wl/8, 3wl/8", async () => {
    const { result } = await build(sheets());
    for (const c of ["D", "L"] as const) {
      const w = joist[c];
      const r = result.json!.members.FJ1!.reactions[c]!;
      close(r[0]!, (3 * w * l) / 8);
      close(r[1]!, (10 * w * l) / 8);
      close(r[2]!, (3 * w * l) / 8);
      // The same case: largest moment -wl^2/8 over the middle support; the largest sagging moment 9wl^2/128 at 3l/8.
      close(result.json!.members.FJ1!.momentMax[c]!, (9 * w * l * l) / 128);
      close(result.json!.members.FJ1!.shearMax[c]!, (5 * w * l) / 8);
    }
  });

  it("pattern live load on the floor joist (envelope engine): Table 3-23, continuous beam, two equal spans, uniform load on one span (recalled from memory): R1 = 7wl/16, R3 = -wl/16, M+ = 49wl^2/512", () => {
    const line = (a: number, b: number, w: number) => ({ kind: "line" as const, start: a, end: b, w1: w, w2: w });
    const r = envelope(
      { span: 2 * l, supports: [0, l, 2 * l].map((x) => ({ x, type: "pin" as const })), loads: { D: [line(0, 2 * l, joist.D)], L: [line(0, 2 * l, joist.L)] } },
      builtInCombinations({ method: "LRFD", halfLive: false }),
    );
    if (!r.ok) throw new Error(r.error.message);
    // Largest end reaction: 1.2D everywhere (3wl/8) + 1.6L on the near span only (7wl/16), ASCE/SEI 7-22 Sec. 2.3.1 factors as recalled.
    close(r.value.reactionMax[0]!.value, 1.2 * ((3 * joist.D * l) / 8) + 1.6 * ((7 * joist.L * l) / 16), 1e-10);
    expect(r.value.reactionMax[0]!.pattern).toBe("L on span 1");
    // Least end reaction: live load on the far span only lifts the near end by wl/16.
    const least = Math.min(1.4 * ((3 * joist.D * l) / 8), 1.2 * ((3 * joist.D * l) / 8) - 1.6 * ((joist.L * l) / 16), 0.9 * ((3 * joist.D * l) / 8));
    close(r.value.reactionMin[0]!.value, least, 1e-10);
    // Largest interior reaction: both spans loaded, 10wl/8 of each case.
    close(r.value.reactionMax[1]!.value, 1.2 * ((10 * joist.D * l) / 8) + 1.6 * ((10 * joist.L * l) / 8), 1e-10);
  });

  it("the joists' interior reactions arrive at the middle wall W1-B, which spreads them over its 6 m, with its own weight", async () => {
    const { result, port } = await build(sheets());
    const d = count * ((10 * joist.D * l) / 8) + ww * wallLength;
    close(result.json!.foundations["W1-B"]!.D!, d);
    close(result.json!.perLength["W1-B"]!.loads.D!, d / wallLength);
    close(result.json!.perLength["W1-B"]!.loads.L!, (count * ((10 * joist.L * l) / 8)) / wallLength);
    // The Source column of W1-B's rows names each joist's second support.
    const v = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
    expect(v.flat().filter((x) => typeof x === "string" && /^FJ\d+ support 2$/.test(x))).toHaveLength(count);
    // Its footing takes the same per metre (no length of its own: the one wall's length).
    close(result.json!.perLength["SF-B"]!.loads.D!, d / wallLength);
    expect(resultOf(port, "W1-B", "LLR factor")).toBe(1);
  });

  it("the upper wall W2-C1 on beam B2-C: trusses + own weight per metre over Start at..End at; the beam's reactions by statics", async () => {
    const { result } = await build(sheets());
    const wallD = overOpening * ((truss.D * 2 * l) / 2) + ww * opening;
    const wD = wallD / opening;
    close(result.json!.perLength["W2-C1"]!.length, opening);
    close(result.json!.perLength["W2-C1"]!.loads.D!, wD);
    // B2-C: the wall's line load and wD 0.3 kN/m over 3.6 m, and the end reactions 3wl/8 of six joists at y = 0.3 ... 3.3 m.
    const points = Array.from({ length: overOpening }, (_, i) => ({ p: (3 * joist.D * l) / 8, x: s / 2 + s * i }));
    const hand = handReactions(opening, points, [{ w: wD + 0.3, a: 0, b: opening }]);
    close(result.json!.members["B2-C"]!.reactions.D![0]!, hand.left);
    close(result.json!.members["B2-C"]!.reactions.D![1]!, hand.right);
    // Snow reaches the beam only through the wall: half of six truss ends each.
    close(result.json!.members["B2-C"]!.reactions.S![0]!, (overOpening * ((truss.S * 2 * l) / 2)) / 2);
    // The post under each end adds its own weight (0.15 kN/m x 2.7 m) and hands it to its pad.
    close(result.json!.foundations.FC1!.D!, hand.left + 0.15 * 2.7);
  });

  it("stacked walls accumulate per metre level by level: W2-A on W1-A on footing SF-A", async () => {
    const { result } = await build(sheets());
    const w2 = { D: (count * ((truss.D * 2 * l) / 2) + ww * wallLength) / wallLength, Lr: (count * ((truss.Lr * 2 * l) / 2)) / wallLength };
    const pl = result.json!.perLength;
    close(pl["W2-A"]!.loads.D!, w2.D);
    close(pl["W2-A"]!.loads.Lr!, w2.Lr);
    const w1D = w2.D + (count * ((3 * joist.D * l) / 8) + ww * wallLength) / wallLength;
    close(pl["W1-A"]!.loads.D!, w1D);
    close(pl["W1-A"]!.loads.Lr!, w2.Lr);
    close(pl["W1-A"]!.loads.L!, (count * ((3 * joist.L * l) / 8)) / wallLength);
    close(pl["SF-A"]!.loads.D!, w1D);
    // Line C beyond the opening: W2-C2 (2.4 m) on W1-C on SF-C carries the same per metre as line A.
    close(pl["W1-C"]!.loads.D!, w1D);
  });

  it("load balance: the applied load, added up here from the tables, reaches the footings", async () => {
    const { result } = await build(sheets());
    const walls = ww * (wallLength + opening + (wallLength - opening) + 3 * wallLength - opening);
    const applied = {
      D: count * truss.D * 2 * l + count * joist.D * 2 * l + walls + 0.3 * opening + 2 * 0.15 * 2.7,
      L: count * joist.L * 2 * l,
      Lr: count * truss.Lr * 2 * l,
      S: count * truss.S * 2 * l,
    };
    for (const [c, v] of Object.entries(applied)) {
      close(result.json!.balance[c]!.applied, v, 1e-10);
      close(result.json!.balance[c]!.supports, v, 1e-10);
    }
  });

  it("a wall's live load is reduced only where its KLL is given (ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1 in SI, recalled from memory)", async () => {
    const { port, result } = await build(
      sheets((rows, col) => {
        rows.find((r) => r[0] === "W1-B")![col("KLL")] = 2;
      }),
    );
    expect(result.problems).toEqual([]);
    // A_T of W1-B: ten interior joist supports, each 10/8 of a 4.2 m x 0.6 m bay (the joists' reactions to a load of 1 per m2).
    const areaT = count * ((10 * s * l) / 8);
    close(resultOf(port, "W1-B", "A_T (m²)"), areaT);
    expect(resultOf(port, "W1-B", "Floors")).toBe(1);
    // L/Lo = 0.25 + 4.57/sqrt(K_LL A_T), not less than 0.50 for a member carrying one floor.
    const factor = Math.max(0.5, 0.25 + 4.57 / Math.sqrt(2 * areaT));
    close(resultOf(port, "W1-B", "LLR factor"), factor);
    const live = count * ((10 * joist.L * l) / 8);
    close(resultOf(port, "W1-B", "L reduced (kN)"), factor * live);
    // W1-A keeps its blank KLL: no reduction, said so in its KLL cell.
    expect(resultOf(port, "W1-A", "KLL")).toBe("no reduction (KLL blank)");
    expect(resultOf(port, "W1-A", "LLR factor")).toBe(1);
  });

  it("the hand-off version (classic functions) writes the same wall reduction", async () => {
    const { port, result } = await build(
      sheets((rows, col) => {
        rows.find((r) => r[0] === "W1-B")![col("KLL")] = 2;
      }),
      true,
    );
    expect(result.problems).toEqual([]);
    const areaT = count * ((10 * s * l) / 8);
    close(resultOf(port, "W1-B", "LLR factor"), Math.max(0.5, 0.25 + 4.57 / Math.sqrt(2 * areaT)));
    expect(resultOf(port, "W1-A", "LLR factor")).toBe(1);
  });
});

describe("sample (c) with bad input: a problem naming the cell, the rest still builds", () => {
  it("beam B2-C left out (no span): the wall standing on it is a problem at its Start support cell naming the beam", async () => {
    const { result } = await build(
      sheets((rows, col) => {
        rows.find((r) => r[0] === "B2-C")![col("Span")] = null;
      }),
    );
    const wall = result.problems.find((p) => p.mark === "W2-C1");
    expect(wall).toBeDefined();
    expect(wall!.sheet).toBe("Members");
    expect(wall!.message).toMatch(/W2-C1: stands on B2-C, which is left out/);
    const row = sheets().Members!.findIndex((r) => r[0] === "W2-C1") + 1;
    expect(wall!.cell).toBe(`G${row}`);
    expect(result.json!.members.FJ10).toBeDefined();
  });

  it("a Support at given for a wall support in the Bearings table, and Start at given for a wall on a wall: not used, so a problem", async () => {
    const s2 = sheets((rows, col) => {
      rows.find((r) => r[0] === "W2-A")![col("Start at")] = 1.5;
    });
    s2.Bearings![1]![3] = 3;
    const { result } = await build(s2);
    expect(result.problems.map((p) => [p.sheet, p.cell])).toEqual([
      ["Bearings", "D2"],
      ["Members", `H${s2.Members!.findIndex((r) => r[0] === "W2-A") + 1}`],
    ]);
    expect(result.problems[0]!.message).toMatch(/Support at 3 is not used: W1-B is a wall/);
    // Both still build as before.
    expect(result.json!.members.FJ1!.reactions.D).toHaveLength(3);
  });

  it("own weight of a wall without a length is a problem at its wD cell", async () => {
    const { result } = await build(
      sheets((rows, col) => {
        rows.find((r) => r[0] === "W2-C2")![col("Span")] = null;
      }),
    );
    const p = result.problems.filter((x) => x.mark === "W2-C2");
    expect(p.map((x) => x.code)).toEqual(["badSpan"]);
    expect(p[0]!.message).toMatch(/needs the wall's length/);
  });
});
