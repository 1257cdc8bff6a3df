/**
 * The pane's hand-off option: the session passes it to the build, and a build through the
 * in-memory workbook with it writes classic formulas only (the same session code runs in Excel).
 */
import { describe, expect, it } from "vitest";
import { PaneSession } from "../../src/taskpane/session";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";
import type { BuildTakedown, TakedownOptions } from "../../src/workbook/takedown-api";
import { handoffBuilding } from "./building";

const choice = { zones: "Zones", members: "Members", loads: "Loads" };

describe("pane option: hand-off version", () => {
  it("is passed to the build only when ticked", async () => {
    const calls: TakedownOptions[] = [];
    const build: BuildTakedown = async (_port, options) => {
      calls.push(options);
      return { ok: true, problems: [] };
    };
    const session = new PaneSession(await MemoryWorkbookPort.create({ sheets: handoffBuilding() }), build);
    await session.run(choice, { mapping: {}, units: "US", native: true }, () => {});
    await session.run(choice, { mapping: {}, units: "US" }, () => {});
    expect(calls.map((c) => c.native === true)).toEqual([true, false]);
  });

  it("a ticked build writes the takedown without add-in calls; only governing values are value-only", async () => {
    const port = await MemoryWorkbookPort.create({ sheets: handoffBuilding() });
    const session = new PaneSession(port, buildTakedown);
    const outcome = await session.run(choice, { mapping: {}, units: "US", native: true }, () => {});
    expect(outcome.kind).toBe("done");
    if (outcome.kind !== "done") return;
    expect(outcome.result.ok).toBe(true);
    for (const v of outcome.result.valueOnly ?? []) expect(v.reason).toMatch(/governing values over the load combinations and live load patterns/);
    const id = port.hf.getSheetId(outcome.result.sheet!)!;
    const formulas = port.hf.getSheetSerialized(id).flat().filter((c): c is string => typeof c === "string" && c.startsWith("="));
    expect(formulas.length).toBeGreaterThan(100);
    expect(formulas.filter((f) => /LOADPATH/i.test(f))).toEqual([]);
  });
});
