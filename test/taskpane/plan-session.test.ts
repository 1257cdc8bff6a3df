/**
 * The pane's takedown from a framing plan (src/taskpane/plan-session.ts) over the in-memory
 * workbook: the plan tables found by their headers, the build from the plan, the counts of what
 * was derived (checked against the studio sample's plan, counted by hand from
 * sample-workbooks/make-plan-studio.ts), framing problems with a cell the pane can select, and
 * the notice that the plan changed since the last derivation. Needs `npm run build`.
 */
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { findPlanTables, planChanged, runPlan } from "../../src/taskpane/plan-session";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { engineSheets, readXlsx } from "../../src/workbook/xlsx";

const STUDIO = join(resolve(__dirname, "../.."), "sample-workbooks", "plan-studio-si.xlsx");

async function studioPort(): Promise<MemoryWorkbookPort> {
  const wb = await readXlsx(STUDIO);
  return MemoryWorkbookPort.create({ sheets: engineSheets(wb), tables: wb.tables.map(({ name, sheet, ref }) => ({ name, sheet, ref })) });
}

describe("pane: takedown from a framing plan", () => {
  it("finds the plan tables by their headers, builds, counts what was derived, and notices a changed plan", async () => {
    const port = await studioPort();
    const plan = findPlanTables(await port.listTables());
    expect(plan).toEqual({ framing: "Framing", decks: "Decks", grids: "Grids", levels: "Levels" });
    expect(await planChanged(port, plan!)).toBe(false); // never derived: nothing out of date
    const run = await runPlan(port, plan!, { zones: "Zones", units: "SI", sheetName: "Takedown" });
    expect(run.result.problems).toEqual([]);
    expect(run.result.ok).toBe(true);
    // make-plan-studio.ts: 9 level-2 and 5 roof columns, 6 + 2 girders, 6 + 3 beams, 2 joists, and a
    // foundation added under each of the 9 level-2 columns; one bearing (the roof beam over C4B-R)
    expect(run.counts).toEqual({ byType: { column: 14, girder: 8, beam: 9, joist: 2, foundation: 9 }, bearings: 1, pieces: expect.any(Number), addedFoundations: 9 });
    expect(port.generatedSheets()).toEqual(expect.arrayContaining(["Plan members", "Plan loads", "Plan bearings", "Takedown"]));
    expect(await planChanged(port, plan!)).toBe(false);
    // the user moves a joist: the plan is out of date until the next build
    const framing = await port.readTable("Framing");
    const row = framing.values.findIndex((r) => r[0] === "J2");
    await port.writeBlock(framing.sheet, framing.top + row, framing.left + 6, [["A+3"]]);
    await port.flush();
    expect(await planChanged(port, plan!)).toBe(true);
    await runPlan(port, plan!, { zones: "Zones", units: "SI", sheetName: "Takedown" });
    expect(await planChanged(port, plan!)).toBe(false);
  });

  it("a framing problem comes with the Framing sheet and cell to select", async () => {
    const port = await studioPort();
    const framing = await port.readTable("Framing");
    const row = framing.values.findIndex((r) => r[0] === "J1");
    // J1's end moved off the girder on line 3: it ends on nothing
    await port.writeBlock(framing.sheet, framing.top + row, framing.left + 5, [[15]]);
    await port.flush();
    const run = await runPlan(port, findPlanTables(await port.listTables())!, { zones: "Zones", units: "SI", sheetName: "Takedown" });
    const p = run.result.problems.find((x) => x.code === "endOnNothing");
    expect(p).toEqual(expect.objectContaining({ sheet: "Framing", cell: `F${framing.top + row + 1}`, mark: "J1" }));
  });
});
