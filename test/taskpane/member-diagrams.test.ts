/**
 * What the pane draws for a member, from a takedown built in the headless workbook: the invented
 * framing of test/report/framing.ts with its hand statics (written out there, never taken from
 * the engine). Checked: the drawing's reactions (solved by the exact beam engine from the loads
 * read back from the sheet) against the hand reactions per case and under a combination with
 * the member's live load reduction; the girder's received loads at their positions; the load
 * path's edges; the cells read lazily (only the rows a member needs, same loads as reading the
 * whole sheet); the combination list; which cell stands for which member.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { memberLoads } from "../../src/engine/takedown/member-loads";
import type { CellValue } from "../../src/engine/takedown";
import { renderLoadPath, renderMemberSheet } from "../../src/drawings";
import { solveDrawing } from "../../src/drawings/model";
import { allElements, parseSvg } from "../drawings/svg-query";
import { loadPathOf, upstreamMarks } from "../../src/taskpane/load-path-of";
import { caseChoicesOf, governingDrawingOf, memberDrawingOf, pickKey, pickOf, type CaseChoice } from "../../src/taskpane/member-drawing";
import { governingBeamModel, governingOf, memberGoverning, quantitiesOf } from "../../src/engine/takedown/member-envelope";
import { solveBeam } from "../../src/engine/beam";
import { memberAt, selectionIndexOf } from "../../src/taskpane/selection-map";
import { MAX_READS, readPlan, rowRuns, TakedownCells } from "../../src/taskpane/takedown-cells";
import type { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import type { BuiltTakedown, TakedownJson } from "../../src/workbook/takedown-api";
import { buildOn } from "../workbook/takedown-helpers";
import { framingSheets, handFraming } from "../report/framing";

const hand = handFraming();
let port: MemoryWorkbookPort;
let built: BuiltTakedown;
let json: TakedownJson;
let cells: TakedownCells;
const reads: string[] = [];

const near = (a: number | undefined, b: number): void => {
  expect(a).toBeTypeOf("number");
  expect(Math.abs(a! - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));
};

beforeAll(async () => {
  const b = await buildOn(framingSheets());
  expect(b.result.problems).toEqual([]);
  port = b.port;
  built = b.result.built!;
  json = b.result.json!;
  // Count the reads the drawings make through the port.
  const counting = Object.create(port) as MemoryWorkbookPort;
  counting.readTable = async (ref: string) => {
    reads.push(ref);
    return port.readTable(ref);
  };
  cells = new TakedownCells(counting, built);
});

const choice = (label: string): CaseChoice => caseChoicesOf(built.model.cases).find((c) => c.label === label)!;

function reactionsOf(mark: string, c: CaseChoice): number[] {
  const drawing = memberDrawingOf(cells.loadsOf(mark)!, c, "US")!;
  const solved = solveDrawing(drawing);
  if (!solved.ok) throw new Error(solved.error.message);
  return [...solved.value.reactions];
}

describe("the member drawing", () => {
  it("reads only the rows a member needs, and gives the same loads as the whole sheet", async () => {
    await cells.ensure(["B1"]);
    expect(reads).toHaveLength(1);
    const rows = built.rowsByMember.B1!;
    expect(reads[0]).toBe(`Takedown!A${rows.row + 1}:${reads[0]!.split(":")[1]}`);
    const whole = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
    const full = memberLoads({ ...cells.source(), read: (r, c) => whole[r]?.[c] as CellValue | undefined }, "B1");
    expect(cells.loadsOf("B1")).toEqual(full);
    await cells.ensure(["B1"]);
    expect(reads).toHaveLength(1); // kept once read
    expect(cells.loadsOf("G1")).toBeNull(); // not read yet
  });

  it("draws a beam's loads so that its reactions are the hand reactions, per case", async () => {
    await cells.ensure(["B1"]);
    const d = reactionsOf("B1", choice("D"));
    near(d[0], hand.B1.D.left);
    near(d[1], hand.B1.D.right);
    // Under L the zone row carries no wD, and the Loads-table strip is named by its row.
    expect(memberDrawingOf(cells.loadsOf("B1")!, choice("L"), "US")!.lines.map((x) => x.label)).toEqual(["OFF", "Loads row 2"]);
    const l = reactionsOf("B1", choice("L"));
    near(l[0], hand.B1.L.left);
    near(l[1], hand.B1.L.right);
    const drawing = memberDrawingOf(cells.loadsOf("B1")!, choice("D"), "US")!;
    expect(drawing.supports.map((s) => s.label)).toEqual(["G1 @ 10 ft", "G2 @ 10 ft"]);
    expect(drawing.lines.map((x) => x.label)).toEqual(["OFF + wD"]);
    const solved = solveDrawing(drawing);
    if (!solved.ok) throw new Error(solved.error.message);
    near(solved.value.maxSagging().value, hand.B1.D.mMax);
  });

  it("draws the case that governs M+ with the combination's factors and the member's live load reduction (ASCE/SEI 7-22 Sec. 2.3.1, 4.7)", async () => {
    await cells.ensure(["B1"]);
    const b1 = cells.loadsOf("B1")!;
    const shown = governingDrawingOf(b1, { kind: "momentMax" }, "US");
    if (shown === null || typeof shown === "string") throw new Error(String(shown));
    // One span: the live load pattern is the whole beam.
    expect(shown.drawing.caseLabel).toBe(`M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on all segments (factored), L \u00D7 ${hand.B1.llr.toFixed(2)}`);
    expect(shown.caption).toMatch(/^M\+ [\d.]+ kip-ft at [\d.]+ ft: 2\.3\.1 \(2\) 1\.2D \+ 1\.6L; L on all segments\. Factored loads and results \(LRFD\), L \u00D7 0\.\d\d\.$/);
    const solved = solveDrawing(shown.drawing);
    if (!solved.ok) throw new Error(solved.error.message);
    const r = solved.value.reactions;
    // The zone's live load is reducible; the Loads-table strip is not (framing.ts).
    const zoneL = (hand.b1.wL * hand.span) / 2;
    near(r[0], 1.2 * hand.B1.D.left + 1.6 * (hand.B1.L.left - (1 - hand.B1.llr) * zoneL));
    near(r[1], 1.2 * hand.B1.D.right + 1.6 * (hand.B1.L.right - (1 - hand.B1.llr) * zoneL));
    near(solved.value.maxSagging().value, shown.value);
  });

  it("draws the reactions a girder receives at their positions, from the members they come from", async () => {
    await cells.ensure(["G1"]);
    const drawing = memberDrawingOf(cells.loadsOf("G1")!, choice("D"), "US")!;
    expect(drawing.points.map((p) => [p.from, p.x])).toEqual([
      ["B1", 10],
      ["B2", 18],
    ]);
    near(drawing.points[0]!.p, hand.B1.D.left);
    near(drawing.points[1]!.p, hand.B2.D.left);
    const r = reactionsOf("G1", choice("D"));
    near(r[0], hand.G1.D.left);
    near(r[1], hand.G1.D.right);
  });

  it("has no bending drawing for a column; the picker's keys read back", async () => {
    await cells.ensure(["C1"]);
    expect(memberDrawingOf(cells.loadsOf("C1")!, choice("D"), "US")).toBeNull();
    expect(governingDrawingOf(cells.loadsOf("C1")!, { kind: "momentMax" }, "US")).toBeNull();
    for (const q of quantitiesOf(3)) expect(pickOf(pickKey({ kind: "governing", quantity: q }), ["D", "L"])).toEqual({ kind: "governing", quantity: q });
    expect(pickOf("L", ["D", "L"])).toEqual({ kind: "case", loadCase: "L" });
    expect(pickOf("S", ["D", "L"])).toBeNull();
  });

  it("draws every governing case of a girder and a beam so that V and M at the critical points are the engine's governing model's", async () => {
    await cells.ensure(["G1", "B1", "B2"]);
    for (const mark of ["G1", "B1", "B2"]) {
      const loads = cells.loadsOf(mark)!;
      const g = memberGoverning(loads);
      if (g === null || !g.ok) throw new Error(`no governing values for ${mark}`);
      for (const q of quantitiesOf(loads.supports.length)) {
        const shown = governingDrawingOf(loads, q, "US");
        if (shown === null || typeof shown === "string") throw new Error(String(shown));
        const v = governingOf(g.value.envelope, q)!;
        const model = governingBeamModel(g.value, v);
        if (!model.ok) throw new Error(model.error.message);
        const ref = solveBeam(model.value);
        const drawn = solveDrawing(shown.drawing);
        if (!ref.ok || !drawn.ok) throw new Error("not solved");
        ref.value.reactions.forEach((r, k) => near(drawn.value.reactions[k], r));
        // Critical points: the supports, the ends, where the loads act and where the governing value occurs.
        const xs = [0, 24, v.x, ...loads.loads.flatMap((l) => [l.start ?? 0, l.end ?? l.start ?? 0])];
        for (const x of xs) {
          near(drawn.value.momentAt(x), ref.value.momentAt(x));
          near(drawn.value.shearAt(x, "left"), ref.value.shearAt(x, "left"));
          near(drawn.value.shearAt(x, "right"), ref.value.shearAt(x, "right"));
        }
        near(shown.value, v.value);
      }
    }
  });
});

describe("the load path", () => {
  it("sends a beam's reactions to its girders and on to columns and footings, and shows what a girder carries", async () => {
    await cells.ensure(["B1", "G1", ...upstreamMarks(built.model, cells.path, "G1", 60)]);
    const source = { model: built.model, deliveries: cells.path, json, loadsOf: (m: string) => cells.loadsOf(m) };
    const tree = loadPathOf(source, cells.loadsOf("B1")!, choice("D"));
    expect(tree.downstream.map((b) => [b.mark, b.note, b.at])).toEqual([
      ["G1", "start", 10],
      ["G2", "end", 10],
    ]);
    near(tree.downstream[0]!.value, hand.B1.D.left);
    const g1 = tree.downstream[0]!;
    expect(g1.children.map((c) => c.mark)).toEqual(["C1", "C2"]);
    near(g1.children[0]!.value, hand.G1.D.left);
    expect(g1.children[0]!.children.map((c) => c.mark)).toEqual(["F1"]);
    near(g1.children[0]!.children[0]!.value, hand.columns.C1.D);
    const up = loadPathOf(source, cells.loadsOf("G1")!, choice("D")).upstream;
    const fromB1 = up.find((b) => b.mark === "B1")!;
    near(fromB1.value, hand.B1.D.left);
    expect(fromB1.at).toBe(10);
    // B1's own loads are leaves under it: its zone row over the trib width.
    expect(fromB1.children.map((c) => [c.mark, c.memberType, c.note])).toEqual([["OFF + wD", "zone", "trib 10 ft"]]);
    near(fromB1.children[0]!.value, hand.b1.wD);
  });

  it("reads the nearest upstream members first, up to the limit", () => {
    expect(upstreamMarks(built.model, cells.path, "C1", 10)).toEqual(["G1", "B1", "B2"]);
    expect(upstreamMarks(built.model, cells.path, "F1", 2)).toEqual(["C1", "G1"]);
  });
});

describe("which member a cell stands for", () => {
  it("maps a cell of a member's row in the Members table or of its block on the takedown sheet", () => {
    const index = selectionIndexOf(built);
    // Members sheet: header on row 1, B1 on row 2, G1 on row 4 (framing.ts).
    expect(memberAt(index, { sheet: "Members", address: "F2" })).toEqual({ mark: "B1", where: "members" });
    expect(memberAt(index, { sheet: "members", address: "$A$4" })).toEqual({ mark: "G1", where: "members" });
    expect(memberAt(index, { sheet: "Members", address: "A1" })).toBeNull();
    // The generated sheet as a user reads it: the row whose column A holds the mark, and the rows below it in its block.
    const values = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
    const g1 = values.findIndex((r) => r[0] === "G1");
    const rows = built.rowsByMember.G1!;
    expect(rows.row).toBe(g1);
    expect(rows.rows).toBeGreaterThan(1);
    expect(memberAt(index, { sheet: "Takedown", address: `Q${g1 + 1}` })).toEqual({ mark: "G1", where: "takedown" });
    expect(memberAt(index, { sheet: "Takedown", address: `B${g1 + rows.rows}` })).toEqual({ mark: "G1", where: "takedown" });
    expect(memberAt(index, { sheet: "Takedown", address: "A1" })).toBeNull();
    expect(memberAt(index, { sheet: "Zones", address: "A2" })).toBeNull();
  });

  it("merges needed rows into few reads", () => {
    expect(rowRuns([5, 6, 7, 30, 100, 101], 40, 2000)).toEqual([
      [5, 30],
      [100, 101],
    ]);
    expect(rowRuns([1, 3], 0, 2000)).toEqual([
      [1, 1],
      [3, 3],
    ]);
    expect(rowRuns([0, 10, 20], 40, 15)).toEqual([
      [0, 10],
      [20, 20],
    ]);
    // Rows scattered over a large sheet: gaps widen until the reads fit the request budget,
    // every needed row still covered.
    const scattered = Array.from({ length: 60 }, (_, i) => i * 150);
    const plan = readPlan(scattered);
    expect(plan.length).toBeLessThanOrEqual(MAX_READS);
    for (const r of scattered) expect(plan.some(([a, b]) => a <= r && r <= b)).toBe(true);
    for (const [a, b] of plan) expect(b - a + 1).toBeLessThanOrEqual(2000);
  });
});

describe("marks and zone names that look like markup", () => {
  it("reach the drawings as escaped text only", async () => {
    const hostile = { B1: "<img src=x onerror=alert(1)>", B2: "B2&<b>", G1: '"G1"<svg onload=1>', G2: "G2" };
    const b = await buildOn(framingSheets(hostile, "<script>x</script>"));
    expect(b.result.ok).toBe(true);
    const own = new TakedownCells(b.port, b.result.built!);
    const marks = [hostile.B1, hostile.G1, ...upstreamMarks(b.result.built!.model, own.path, hostile.G1, 60)];
    await own.ensure(marks);
    const source = { model: b.result.built!.model, deliveries: own.path, json: b.result.json!, loadsOf: (m: string) => own.loadsOf(m) };
    const d = caseChoicesOf(b.result.built!.model.cases)[0]!;
    for (const mark of [hostile.B1, hostile.G1]) {
      const loads = own.loadsOf(mark)!;
      for (const svg of [renderMemberSheet(memberDrawingOf(loads, d, "US")!), renderLoadPath(loadPathOf(source, loads, d))]) {
        const root = parseSvg(svg);
        const tags = allElements(root).map((e) => e.tagName.toLowerCase());
        expect(tags.filter((t) => ["img", "script", "b"].includes(t))).toEqual([]);
        expect(allElements(root).filter((e) => e.tagName.toLowerCase() === "svg")).toHaveLength(1);
        expect(allElements(root).some((e) => Array.from(e.attributes).some((a) => /^on/i.test(a.name)))).toBe(false);
      }
    }
  });
});
