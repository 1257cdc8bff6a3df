/**
 * The Office.js adapter's selection and picture members against the office-addin-mock model of
 * Excel (test/workbook/office-fake.ts): which event it registers on which host version (ExcelApi
 * 1.7 per worksheet, 1.9 on the worksheet collection, none below), how an event's sheet id and
 * address become the active cell, removing the handlers, reading the selected range, and placing
 * a picture only on the add-in's own sheet. Requirement sets and their members are those of the
 * Office.js reference (Excel JavaScript API requirement sets); what a real host does with the
 * events is not testable here (pitfalls.md, "Testing without Excel").
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { firstCellOf, OfficeWorkbookPort } from "../../src/workbook/office";
import { GENERATED_MARKER, type CellSelection } from "../../src/workbook/port";
import { FAKE_COL_PT, FAKE_ROW_PT, FakeExcel } from "./office-fake";

function fakeWorkbook(): FakeExcel {
  return new FakeExcel({
    Members: [["Mark", "Type"], ["B1", "beam"], ["G1", "girder"]],
    Takedown: [[`${GENERATED_MARKER}: load takedown (US)`], ["Mark"]],
    Notes: [["my notes"]],
  });
}

/** Stub Excel and, when `version` is given, an Office host supporting ExcelApi up to it. */
function install(fake: FakeExcel, version?: string): void {
  vi.stubGlobal("Excel", fake.excel());
  if (version !== undefined) {
    const [maj, min] = version.split(".").map(Number) as [number, number];
    const isSetSupported = (set: string, v: string): boolean => {
      const [a, b] = v.split(".").map(Number) as [number, number];
      return set === "ExcelApi" && (a < maj || (a === maj && b <= min));
    };
    vi.stubGlobal("Office", { context: { requirements: { isSetSupported } } });
  }
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("firstCellOf", () => {
  it("takes the top-left cell of what a selection event reports", () => {
    expect(firstCellOf("B3")).toBe("B3");
    expect(firstCellOf("$B$3:$D$9")).toBe("B3");
    expect(firstCellOf("'My sheet'!c4:e5")).toBe("C4");
    expect(firstCellOf("B3:C4,F7")).toBe("B3");
    expect(firstCellOf("D:D")).toBe("D1");
    expect(firstCellOf("7:9")).toBe("A7");
    expect(firstCellOf("")).toBeNull();
  });
});

describe("following the selection", () => {
  it("registers one handler on the worksheet collection (ExcelApi 1.9) and reports sheet name and first cell", async () => {
    const fake = fakeWorkbook();
    install(fake, "1.9");
    const port = new OfficeWorkbookPort();
    expect(port.followsSelection()).toBe(true);
    const seen: CellSelection[] = [];
    const stop = await port.onSelectionChanged((s) => seen.push(s));
    expect(fake.selectionHandlers.map((h) => h.sheet)).toEqual([null]);
    await fake.fireSelection("Takedown", "C12:F14");
    await fake.fireSelection("Members", "A3");
    expect(seen).toEqual([
      { sheet: "Takedown", address: "C12" },
      { sheet: "Members", address: "A3" },
    ]);
    stop();
    await vi.waitFor(() => expect(fake.selectionHandlers.every((h) => h.removed)).toBe(true));
    await fake.fireSelection("Members", "A2");
    expect(seen).toHaveLength(2);
  });

  it("registers on every worksheet where only ExcelApi 1.7 is there", async () => {
    const fake = fakeWorkbook();
    install(fake, "1.8");
    const port = new OfficeWorkbookPort();
    const seen: CellSelection[] = [];
    await port.onSelectionChanged((s) => seen.push(s));
    expect(fake.selectionHandlers.map((h) => h.sheet).sort()).toEqual(["Members", "Notes", "Takedown"]);
    await fake.fireSelection("Notes", "B2");
    expect(seen).toEqual([{ sheet: "Notes", address: "B2" }]);
  });

  it("says it cannot follow below ExcelApi 1.7 (the pane shows its button instead) and reads the selected range", async () => {
    const fake = fakeWorkbook();
    install(fake, "1.6");
    const port = new OfficeWorkbookPort();
    expect(port.followsSelection()).toBe(false);
    await expect(port.onSelectionChanged(() => undefined)).rejects.toThrow(/1\.7/);
    expect(fake.selectionHandlers).toHaveLength(0);
    await port.select("Members", "B3");
    expect(await port.activeCell()).toEqual({ sheet: "Members", address: "B3" });
  });
});

describe("inserting a picture", () => {
  const picture = { pngBase64: "iVBORw0KGgo=", name: "Loadpath G1", row: 5, col: 20, widthPt: 360, heightPt: 540 };

  it("places it on the add-in's sheet at the anchor cell, and replaces one of the same name", async () => {
    const fake = fakeWorkbook();
    install(fake, "1.14");
    const port = new OfficeWorkbookPort();
    expect(port.canInsertPicture()).toBe(true);
    await port.insertPicture("Takedown", picture);
    await port.insertPicture("Takedown", picture);
    const live = fake.shapes.filter((s) => !s.deleted);
    expect(live).toHaveLength(1);
    expect(live[0]).toMatchObject({ sheet: "Takedown", name: "Loadpath G1", image: picture.pngBase64, left: 20 * FAKE_COL_PT, top: 5 * FAKE_ROW_PT, width: 360, height: 540 });
  });

  it("refuses a sheet the add-in did not make, and hosts below ExcelApi 1.9", async () => {
    const fake = fakeWorkbook();
    install(fake, "1.14");
    const before = fake.snapshot("Notes");
    await expect(new OfficeWorkbookPort().insertPicture("Notes", picture)).rejects.toThrow(/only on sheets it made/);
    expect(fake.shapes).toHaveLength(0);
    expect(fake.snapshot("Notes")).toBe(before);
    const old = fakeWorkbook();
    install(old, "1.8");
    const port = new OfficeWorkbookPort();
    expect(port.canInsertPicture()).toBe(false);
    await expect(port.insertPicture("Takedown", picture)).rejects.toThrow(/1\.9/);
  });
});
