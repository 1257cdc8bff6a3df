/**
 * The pane's session over the Office.js adapter and the office-addin-mock model of Excel: table
 * detection by the default headers of docs/interface.md section 2, settings kept in the workbook, the
 * question before replacing a sheet the add-in did not make, selection of a problem's cell, and
 * a progress callback that hands control back to the host.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { OfficeWorkbookPort } from "../../src/workbook/office";
import { GENERATED_MARKER } from "../../src/workbook/port";
import type { BuildTakedown, TakedownOptions } from "../../src/workbook/takedown-api";
import { PaneSession, breathingProgress } from "../../src/taskpane/session";
import { SETTINGS_SHEET } from "../../src/workbook/saved-matching";
import { FakeExcel } from "../workbook/office-fake";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";

const ZONES = [["Zone", "D (psf)", "L (psf)", "Reducible"], ["Office", 65, 50, "yes"]];
const MEMBERS = [
  ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"],
  ["B1", "beam", "L2", 30, "Office", 10, "G1", 10, "G2", 10],
];
const RENAMED = [["Member", "Kind", "Floor", "Length (ft)", "Zone", "Trib width", "Bears on", "At", "End support", "End at"], ["B1", "beam", "L2", 30, "Office", 10, "G1", 10, "G2", 10]];

function excel(extraSheets: Record<string, (string | number)[][]> = {}, members = MEMBERS): FakeExcel {
  const fake = new FakeExcel(extraSheets, [
    { name: "tblZones", sheet: "Input", rows: ZONES },
    { name: "tblFraming", sheet: "Input", rows: members, at: "H1" },
    { name: "tblNotes", sheet: "Notes", rows: [["Item", "Note"], ["1", "Checked"]] },
  ]);
  vi.stubGlobal("Excel", fake.excel());
  return fake;
}

afterEach(() => vi.unstubAllGlobals());

/** An orchestrator double that records what the pane asked for. */
function recordingBuild(calls: TakedownOptions[]): BuildTakedown {
  return async (_port, options, progress) => {
    calls.push(options);
    for (let i = 1; i <= 4; i++) await progress?.(i / 4, `step ${i}`);
    return { ok: true, problems: [], sheet: options.sheetName ?? "Takedown" };
  };
}

describe("finding the tables", () => {
  it("finds the zones and members tables by their default headers", async () => {
    excel();
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    const scan = await session.scan(null, {});
    expect(scan.choice).toEqual({ zones: "tblZones", members: "tblFraming", loads: "", bearings: "" });
    expect(scan.detected).toEqual(["zones", "members"]);
  });

  it("leaves a differently headed table unpicked until its columns are mapped", async () => {
    excel({}, RENAMED);
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    expect((await session.scan(null, {})).choice.members).toBe("");
    const mapping = { members: { Mark: "Member", Span: "Length (ft)", "Start support": "Bears on" } };
    expect((await session.scan(null, mapping)).choice.members).toBe("tblFraming");
  });

  it("keeps a saved choice over detection and leaves the add-in's own sheet out", async () => {
    const fake = excel({ Takedown: [[GENERATED_MARKER], ["Mark", "Type", "Level", "Span", "Start support"]] });
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    const scan = await session.scan({ zones: "tblZones", members: "tblNotes", loads: "gone" }, {});
    expect(scan.choice).toEqual({ zones: "tblZones", members: "tblNotes", loads: "", bearings: "" });
    expect(scan.tables.map((t) => t.name)).not.toContain("Takedown");
    expect(fake.syncs).toBe(3);
  });
});

describe("the Bearings table (continuous members)", () => {
  const BEARINGS = [["Mark", "Support", "At (ft)", "Support at (ft)"], ["B1", "G3", 15, 10]];

  it("is found by its headers and passed to the builder as the command line's --bearings", async () => {
    const fake = new FakeExcel({}, [
      { name: "tblZones", sheet: "Input", rows: ZONES },
      { name: "tblFraming", sheet: "Input", rows: MEMBERS, at: "H1" },
      { name: "tblInterior", sheet: "Input", rows: BEARINGS, at: "T1" },
    ]);
    vi.stubGlobal("Excel", fake.excel());
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    const scan = await session.scan(null, {});
    expect(scan.choice).toEqual({ zones: "tblZones", members: "tblFraming", loads: "", bearings: "tblInterior" });
    expect(scan.detected).toEqual(["zones", "members", "bearings"]);
    await session.run(scan.choice, { mapping: {}, units: "US" }, () => {});
    expect(calls[0]?.bearings).toBe("tblInterior");
  });

  it("a choice saved before the pane offered Bearings (no bearings key) builds without one", async () => {
    excel();
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    await session.run({ zones: "tblZones", members: "tblFraming", loads: "" }, { mapping: {}, units: "US" }, () => {});
    expect(calls[0]).not.toHaveProperty("bearings");
  });

  it("builds a continuous member as the command line does: a 2 x 15 ft beam over three supports takes 3wl/8, 10wl/8, 3wl/8 (AISC Manual Table 3-23, continuous beam, two equal spans, uniform load on both spans; recalled from memory)", async () => {
    const port = await MemoryWorkbookPort.create({
      sheets: {
        Zones: [["Zone", "D (psf)"], ["F", 100]],
        Members: [["Mark", "Type", "Span (ft)", "Zone", "Trib (ft)", "Start support", "End support"], ["B1", "beam", 30, "F", 10, "W1", "W2"], ["W1", "wall"], ["W2", "wall"], ["W3", "wall"]],
        Bearings: [["Mark", "Support", "At (ft)"], ["B1", "W3", 15]],
      },
      tables: [
        { name: "tblZones", sheet: "Zones", ref: "A1:B2" },
        { name: "tblMembers", sheet: "Members", ref: "A1:G5" },
        { name: "tblBearings", sheet: "Bearings", ref: "A1:C2" },
      ],
    });
    const session = new PaneSession(port, buildTakedown);
    const scan = await session.scan(null, {});
    expect(scan.choice.bearings).toBe("tblBearings");
    const outcome = await session.run(scan.choice, { mapping: {}, units: "US" }, () => {});
    if (outcome.kind !== "done") throw new Error(outcome.kind);
    expect(outcome.result.problems).toEqual([]);
    const w = (100 * 10) / 1000; // kip/ft
    const r = outcome.result.json!.members.B1!.reactions.D!;
    [(3 * w * 15) / 8, (10 * w * 15) / 8, (3 * w * 15) / 8].forEach((v, k) => expect(Math.abs(r[k]! - v)).toBeLessThan(1e-12));
    expect(outcome.result.json!.foundations.W3!.D!).toBeCloseTo((10 * w * 15) / 8, 12);
  });
});

describe("settings in the workbook", () => {
  it("round-trips tables, mapping and units through workbook settings", async () => {
    const fake = excel();
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    expect(await session.loadSettings()).toEqual({ tables: null, mapping: {}, units: "US" });
    const saved = { tables: { zones: "tblZones", members: "tblFraming", loads: "" }, mapping: { members: { Trib: "Trib width" } }, units: "SI" as const };
    await session.saveSettings(saved);
    expect(JSON.parse(String(fake.settings.get("loadpath.mapping")))).toEqual(saved.mapping);
    expect(await new PaneSession(new OfficeWorkbookPort(), recordingBuild([])).loadSettings()).toEqual(saved);
  });
});

describe("the saved matching on the settings sheet (Office.js adapter)", () => {
  it("is written on a generated sheet only, read back by a new session before the pane's own settings, and passed to the build", async () => {
    const fake = excel();
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    const matching = {
      tables: { zones: "tblZones", members: "tblFraming", loads: "" },
      mapping: { members: { Trib: "Trib width", "End at": "End/Location (ft)" } },
      units: "SI" as const,
      headerRows: { members: 1 },
    };
    await session.saveMatching(matching);
    expect([...fake.sheets.keys()]).toContain(SETTINGS_SHEET);
    expect(String(fake.cell(SETTINGS_SHEET, "A1"))).toMatch(new RegExp(`^${GENERATED_MARKER}`));
    expect(fake.cell(SETTINGS_SHEET, "A4")).toBe("Setting");
    // The pane's own settings say otherwise: the sheet wins (the command line reads the same sheet).
    fake.settings.set("loadpath.units", "US");
    const loaded = await new PaneSession(new OfficeWorkbookPort(), recordingBuild([])).loadSettings();
    expect(loaded).toEqual({ ...matching, source: "sheet" });
    await session.run(loaded.tables!, loaded, () => {});
    expect(calls[0]).toMatchObject({ units: "SI", mapping: matching.mapping, headerRows: { members: 1 } });
  });

  it("a user's sheet of that name is neither read nor replaced", async () => {
    excel({ [SETTINGS_SHEET]: [["My own notes"], ["Setting", "Table", "Column", "Value"], ["units", "", "", "SI"]] });
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    expect((await session.loadSettings()).source).toBeUndefined();
    await expect(session.saveMatching({ tables: null, mapping: {}, units: "US" })).rejects.toThrow(/was not made by Loadpath/);
  });
});

describe("building", () => {
  it("passes the choice, mapping and units to the builder and reports progress", async () => {
    excel();
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    const seen: number[] = [];
    const outcome = await session.run({ zones: "tblZones", members: "tblFraming", loads: "" }, { mapping: { members: { Trib: "Trib width" } }, units: "SI" }, (f) => seen.push(f));
    expect(outcome.kind).toBe("done");
    expect(calls).toEqual([{ zones: "tblZones", members: "tblFraming", units: "SI", mapping: { members: { Trib: "Trib width" } }, sheetName: "Takedown", replaceForeign: false }]);
    expect(seen).toEqual([0.25, 0.5, 0.75, 1]);
  });

  it("asks before replacing a same-named sheet it did not make, and builds only after a yes", async () => {
    excel({ Takedown: [["My own notes"]] });
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    const choice = { zones: "tblZones", members: "tblFraming", loads: "" };
    expect(await session.run(choice, { mapping: {}, units: "US" }, () => {})).toEqual({ kind: "askReplace", sheet: "Takedown" });
    expect(calls).toEqual([]);
    await session.run(choice, { mapping: {}, units: "US" }, () => {}, true);
    expect(calls[0]?.replaceForeign).toBe(true);
  });

  it("rebuilds its own sheet without asking", async () => {
    excel({ Takedown: [[`${GENERATED_MARKER}: takedown`]] });
    const calls: TakedownOptions[] = [];
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild(calls));
    const outcome = await session.run({ zones: "tblZones", members: "tblFraming", loads: "" }, { mapping: {}, units: "US" }, () => {});
    expect(outcome.kind).toBe("done");
    expect(calls).toHaveLength(1);
  });

  it("selects a problem's cell on its sheet", async () => {
    const fake = excel();
    const session = new PaneSession(new OfficeWorkbookPort(), recordingBuild([]));
    await session.show({ code: "unknownSupport", message: "B1: start support G9 is not a member.", sheet: "Input", cell: "N2" });
    expect(fake.activeSheet).toBe("Input");
    expect(fake.selection).toEqual({ sheet: "Input", address: "N2" });
  });
});

describe("yielding to the host", () => {
  it("lets a timer run between progress reports, so the page can paint and take input", async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 0);
    const progress = breathingProgress(() => {}, 0);
    const before = ticks;
    for (let i = 0; i < 5; i++) await progress(i / 5, "working");
    clearInterval(timer);
    expect(ticks - before).toBeGreaterThanOrEqual(4);
  });
});
