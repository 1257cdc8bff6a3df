/**
 * The pane's session passing selection and pictures through to the workbook: over the in-memory
 * workbook (the demo page's; it follows the selection, has no pictures), over the Office.js
 * adapter on the office-addin-mock model of Excel (test/workbook/office-fake.ts) with and without
 * the requirement sets (ExcelApi 1.7 for selection events, 1.9 for shapes), and over a port that
 * has neither member (a file).
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { OfficeWorkbookPort } from "../../src/workbook/office";
import { GENERATED_MARKER, type CellSelection, type WorkbookPort } from "../../src/workbook/port";
import type { BuildTakedown } from "../../src/workbook/takedown-api";
import { PaneSession } from "../../src/taskpane/session";
import { FakeExcel } from "../workbook/office-fake";

const noBuild: BuildTakedown = async () => ({ ok: false, problems: [] });

afterEach(() => vi.unstubAllGlobals());

describe("selection through the session", () => {
  it("follows the in-memory workbook's active cell (moved by a user or by select) until stopped", async () => {
    const port = await MemoryWorkbookPort.create({ sheets: { Members: [["Mark"], ["B1"]] } });
    const session = new PaneSession(port, noBuild);
    expect(session.followsSelection()).toBe(true);
    expect(session.canInsertPicture()).toBe(false);
    const seen: CellSelection[] = [];
    const stop = await session.watchSelection((s) => seen.push(s));
    port.setActiveCell("Members", "$b$2:C4");
    await port.select("Members", "A1");
    expect(seen).toEqual([
      { sheet: "Members", address: "B2" },
      { sheet: "Members", address: "A1" },
    ]);
    expect(await session.activeCell()).toEqual({ sheet: "Members", address: "A1" });
    stop();
    port.setActiveCell("Members", "A2");
    expect(seen).toHaveLength(2);
  });

  it("on a workbook without selection or pictures, says so instead of failing later", async () => {
    const bare = { flush: async () => undefined } as unknown as WorkbookPort;
    const session = new PaneSession(bare, noBuild);
    expect(session.followsSelection()).toBe(false);
    expect(session.canInsertPicture()).toBe(false);
    expect(await session.activeCell()).toBeNull();
    await expect(session.watchSelection(() => undefined)).rejects.toThrow(/selection/);
    await expect(session.insertPicture({ pngBase64: "", name: "x", row: 0, col: 0, widthPt: 1, heightPt: 1 })).rejects.toThrow(/pictures/);
  });

  it("inserts a picture only on the generated sheet, through Excel's shapes where the host has them", async () => {
    const fake = new FakeExcel({ Takedown: [[`${GENERATED_MARKER}: load takedown (US)`]] });
    vi.stubGlobal("Excel", fake.excel());
    vi.stubGlobal("Office", { context: { requirements: { isSetSupported: (_set: string, v: string) => Number(v.split(".")[1]) <= 9 } } });
    const session = new PaneSession(new OfficeWorkbookPort(), noBuild);
    expect(session.followsSelection()).toBe(true);
    expect(session.canInsertPicture()).toBe(true);
    await session.insertPicture({ pngBase64: "iVBORw0KGgo=", name: "Loadpath B1", row: 3, col: 40, widthPt: 360, heightPt: 500 });
    expect(fake.shapes.map((s) => [s.sheet, s.name])).toEqual([["Takedown", "Loadpath B1"]]);
  });
});
