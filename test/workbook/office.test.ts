/**
 * The Office.js adapter against an office-addin-mock model of Excel (test/workbook/office-fake.ts):
 * what it reads, what it writes and where, how many round trips it takes, and how it chunks.
 * The request budget and the limits themselves are the host's (not testable here, see
 * pitfalls.md "Testing without Excel"); these tests check the adapter keeps to them.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { OfficeWorkbookPort, MARKER_CELL } from "../../src/workbook/office";
import { planChunks, toFormulaCell, parseRangeAddress } from "../../src/workbook/office-chunks";
import { ForeignSheetError, GENERATED_MARKER, type CellInput } from "../../src/workbook/port";
import { FakeExcel } from "./office-fake";

const ZONES = [
  ["Zone", "D (psf)", "L (psf)", "Reducible"],
  ["Office", 65, 50, "yes"],
  ["Roof", 25, "", "no"],
];
const MEMBERS = [
  ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at", "End support", "End at"],
  ["B1", "beam", "L2", 30, "Office", 10, "G1", 10, "G2", 10],
  ["G1", "girder", "L2", 30, "Office", 1, "C1", "", "C2", ""],
];

function fakeWorkbook(): FakeExcel {
  return new FakeExcel(
    { Notes: [["", "Checked by", "AB"], ["", "Date", "2026-01-05"]], Empty: [] },
    [
      { name: "Zones", sheet: "Loads input", rows: ZONES },
      { name: "Members", sheet: "Framing", rows: MEMBERS, at: "B3" },
    ],
  );
}

function install(fake: FakeExcel): void {
  vi.stubGlobal("Excel", fake.excel());
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("reading", () => {
  it("lists Excel tables with their headers and a plain range for a sheet without a table", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const tables = await new OfficeWorkbookPort().listTables();
    expect(tables).toEqual([
      { name: "Zones", sheet: "Loads input", kind: "table", headers: ZONES[0] },
      { name: "Members", sheet: "Framing", kind: "table", headers: MEMBERS[0] },
      { name: "Notes", sheet: "Notes", kind: "range", headers: ["Checked by", "AB"] },
    ]);
    expect(fake.syncs).toBe(3);
  });

  it("reads a table by name with its position; blanks come back as null", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const data = await new OfficeWorkbookPort().readTable("Members");
    expect(data.sheet).toBe("Framing");
    expect([data.top, data.left]).toEqual([2, 1]); // B3
    expect(data.values[0]).toEqual(MEMBERS[0]);
    expect(data.values[2]).toEqual(["G1", "girder", "L2", 30, "Office", 1, "C1", null, "C2", null]);
    expect(fake.syncs).toBe(2);
  });

  it("reads a sheet's used range by sheet name and a typed address with quotes", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const port = new OfficeWorkbookPort();
    const notes = await port.readTable("Notes");
    expect([notes.sheet, notes.top, notes.left]).toEqual(["Notes", 0, 1]);
    expect(notes.values).toEqual([["Checked by", "AB"], ["Date", "2026-01-05"]]);
    const typed = await port.readTable("'Loads input'!$A$2:B3");
    expect([typed.sheet, typed.top, typed.left]).toEqual(["Loads input", 1, 0]);
    expect(typed.values).toEqual([["Office", 65], ["Roof", 25]]);
  });

  it("rejects a name that is neither a table nor a sheet, naming it", async () => {
    install(fakeWorkbook());
    await expect(new OfficeWorkbookPort().readTable("Beams")).rejects.toThrow(/"Beams"/);
  });
});

describe("the add-in's own sheet", () => {
  it("creates the sheet with its marker, recognises it and clears it on a rebuild", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const port = new OfficeWorkbookPort();
    const marker = `${GENERATED_MARKER}: takedown`;
    expect(await port.sheetMarker("Takedown")).toBeNull();
    await port.prepareSheet("Takedown", marker);
    expect(fake.addedSheets).toEqual(["Takedown"]);
    expect(fake.cell("Takedown", MARKER_CELL)).toBe(marker);
    expect(await port.sheetMarker("Takedown")).toBe(marker);
    await port.writeBlock("Takedown", 5, 0, [["old"]]);
    await port.flush();
    await port.prepareSheet("Takedown", marker);
    expect(fake.cleared).toEqual(["Takedown"]);
    expect(fake.cell("Takedown", "A6")).toBeUndefined();
    expect(fake.cell("Takedown", MARKER_CELL)).toBe(marker);
  });

  it("refuses a same-named sheet it did not make, unless told to replace it", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const port = new OfficeWorkbookPort();
    const before = fake.snapshot("Notes");
    await expect(port.prepareSheet("Notes", GENERATED_MARKER)).rejects.toBeInstanceOf(ForeignSheetError);
    expect(fake.snapshot("Notes")).toBe(before);
    await expect(port.writeBlock("Notes", 0, 0, [[1]])).rejects.toThrow(/writes only to sheets it prepared/);
    await port.prepareSheet("Notes", GENERATED_MARKER, true);
    expect(fake.cleared).toEqual(["Notes"]);
    expect(fake.cell("Notes", "A1")).toBe(GENERATED_MARKER);
  });

  it("writes formulas with their '=', keeps number-like text as text, events off and calculation suspended", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const port = new OfficeWorkbookPort();
    await port.prepareSheet("Takedown", GENERATED_MARKER);
    const cells: CellInput[][] = [
      ["Mark", "wD (kip/ft)", "001", "=not a formula", null],
      ["B1", { formula: "Framing!G4*Zones!B2/1000" }, 2.5, true, Number.NaN],
    ];
    await port.writeBlock("Takedown", 2, 1, cells);
    await port.setNames({ LP_B1_wD: "Takedown!$C$4" });
    expect(fake.writes.filter((w) => w.kind === "formulas")).toEqual([]); // queued, nothing sent yet
    await port.flush();
    expect(fake.cell("Takedown", "C4")).toBe("=Framing!G4*Zones!B2/1000");
    expect(fake.cell("Takedown", "D3")).toBe("'001");
    expect(fake.cell("Takedown", "E3")).toBe("'=not a formula");
    expect(fake.cell("Takedown", "E4")).toBe(true);
    expect(fake.cell("Takedown", "F4")).toBeUndefined();
    expect(fake.names.get("LP_B1_wD")).toBe("=Takedown!$C$4");
    const sent = fake.writes.filter((w) => w.kind === "formulas");
    expect(sent.every((w) => !w.eventsOn && w.calcSuspended)).toBe(true);
    expect(fake.eventsOn).toBe(true);
  });

  it("replaces a name that exists", async () => {
    const fake = fakeWorkbook();
    fake.names.set("LP_TOTAL", "=Old!$A$1");
    install(fake);
    const port = new OfficeWorkbookPort();
    await port.prepareSheet("Takedown", GENERATED_MARKER);
    await port.setNames({ LP_TOTAL: "=Takedown!$B$9" });
    await port.flush();
    expect(fake.names.get("LP_TOTAL")).toBe("=Takedown!$B$9");
  });
});

describe("selection and settings", () => {
  it("activates the sheet and selects the cell", async () => {
    const fake = fakeWorkbook();
    install(fake);
    await new OfficeWorkbookPort().select("Framing", "F5");
    expect(fake.activeSheet).toBe("Framing");
    expect(fake.selection).toEqual({ sheet: "Framing", address: "F5" });
  });

  it("keeps settings in the workbook", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const port = new OfficeWorkbookPort();
    expect(await port.getSetting("loadpath.mapping")).toBeNull();
    await port.setSetting("loadpath.mapping", '{"members":{"Trib":"Trib width"}}');
    expect(fake.settings.get("loadpath.mapping")).toBe('{"members":{"Trib":"Trib width"}}');
    expect(await port.getSetting("loadpath.mapping")).toBe('{"members":{"Trib":"Trib width"}}');
  });
});

/** A member row as a takedown sheet carries it: text, numbers and formulas of realistic length. */
function memberRow(i: number): CellInput[] {
  const r = i + 6;
  return [
    `B${i + 1}`,
    "beam",
    `L${(i % 9) + 2}`,
    { formula: `INDEX(Members[Span (ft)],${i + 1})` },
    { formula: `INDEX(Members[Trib (ft)],${i + 1})*INDEX(Zones[D (psf)],MATCH(INDEX(Members[Zone],${i + 1}),Zones[Zone],0))/1000` },
    { formula: `LOADPATH.REACTION($D${r},$E${r},1)` },
    { formula: `LOADPATH.REACTION($D${r},$E${r},2)` },
    { formula: `LOADPATH.SHEAR_MAX($D${r},$E${r})` },
    { formula: `LOADPATH.MOMENT_MAX($D${r},$E${r})` },
    { formula: `$D${r}*$E${r}` },
  ];
}

/** What a build asks of the port: read three tables, prepare the sheet, one block and one name per member, flush. */
async function build(port: OfficeWorkbookPort, members: number, oneBlock: boolean): Promise<void> {
  await port.readTable("Zones");
  await port.readTable("Members");
  await port.sheetMarker("Takedown");
  await port.prepareSheet("Takedown", GENERATED_MARKER);
  const rows = Array.from({ length: members }, (_, i) => memberRow(i));
  if (oneBlock) await port.writeBlock("Takedown", 5, 0, rows);
  else for (let i = 0; i < members; i++) await port.writeBlock("Takedown", 5 + i, 0, [rows[i]!]);
  const names: Record<string, string> = {};
  for (let i = 0; i < members; i++) names[`LP_B${i + 1}_R1`] = `Takedown!$F$${i + 6}`;
  await port.setNames(names);
  await port.flush();
}

describe("round trips and chunking", () => {
  it("takes the same number of syncs for 50 and 5,000 members while the formulas fit in one request", async () => {
    const counts: number[] = [];
    for (const n of [50, 5000]) {
      for (const oneBlock of [false, true]) {
        const fake = fakeWorkbook();
        install(fake);
        await build(new OfficeWorkbookPort({ chunkBytes: 50_000_000 }), n, oneBlock);
        counts.push(fake.syncs);
        const user = ["Framing", "Loads input", "Notes"].map((s) => fake.snapshot(s));
        expect(user).toEqual(["Framing", "Loads input", "Notes"].map((s) => fakeWorkbook().snapshot(s)));
        expect(new Set(fake.writes.map((w) => w.sheet))).toEqual(new Set(["Takedown"]));
        expect(fake.cell("Takedown", `F${n + 5}`)).toBe(`=LOADPATH.REACTION($D${n + 5},$E${n + 5},1)`);
      }
    }
    // read Zones 2 + read Members 2 + marker of a missing sheet 1 + prepare a new sheet 2 + flush 2 (writes; names and events)
    expect(counts).toEqual([9, 9, 9, 9]);
  });

  it("with the default 4 MB budget, 5,000 members add only the syncs their megabytes need", async () => {
    const rows = Array.from({ length: 5000 }, (_, i) => memberRow(i));
    const chunks = planChunks([{ sheet: "Takedown", top: 5, left: 0, cells: rows }]);
    const bytes = JSON.stringify(rows.map((r) => r.map(toFormulaCell))).length;
    expect(chunks.length).toBe(Math.ceil(bytes / 4_000_000));
    for (const n of [50, 5000]) {
      const fake = fakeWorkbook();
      install(fake);
      await build(new OfficeWorkbookPort(), n, false);
      expect(fake.syncs).toBe(8 + (n === 50 ? 1 : chunks.length));
      expect(Math.max(...fake.writes.map((w) => w.bytes))).toBeLessThan(4_000_000);
    }
  });

  it("splits writes into requests under the budget, cutting a block between rows, every cell in place", async () => {
    const fake = fakeWorkbook();
    install(fake);
    const budget = 20_000;
    const port = new OfficeWorkbookPort({ chunkBytes: budget });
    await port.prepareSheet("Takedown", GENERATED_MARKER);
    const rows = Array.from({ length: 600 }, (_, i) => memberRow(i));
    await port.writeBlock("Takedown", 5, 0, rows.slice(0, 400));
    await port.writeBlock("Takedown", 405, 0, rows.slice(400));
    const before = fake.syncs;
    await port.flush();
    const perSync = new Map<number, number>();
    for (const w of fake.writes.filter((x) => x.kind === "formulas")) perSync.set(w.sync, (perSync.get(w.sync) ?? 0) + w.bytes);
    expect(perSync.size).toBeGreaterThan(3);
    expect(fake.syncs - before).toBe(perSync.size + 1);
    for (const bytes of perSync.values()) expect(bytes).toBeLessThanOrEqual(budget);
    rows.forEach((row, i) => row.forEach((cell, j) => expect(fake.cell("Takedown", `${"ABCDEFGHIJ"[j]}${i + 6}`)).toBe(toFormulaCell(cell))));
  });

  it("plans chunks that cover every row exactly once, in order (property over random blocks)", () => {
    for (let trial = 0; trial < 30; trial++) {
      const blocks = Array.from({ length: 1 + (trial % 7) }, (_, b) => ({
        sheet: "T",
        top: b * 1000,
        left: b % 3,
        cells: Array.from({ length: 1 + ((trial * 37 + b * 11) % 90) }, (_, r) => Array.from({ length: 1 + ((r + b) % 5) }, (_, c) => `${trial}-${b}-${r}-${c}`.repeat(1 + (c % 4)))),
      }));
      const budget = 400 + trial * 300;
      const flat = planChunks(blocks, budget).flat();
      const covered = flat.flatMap((w) => Array.from({ length: w.rows }, (_, i) => `${w.top + i}:${w.left}`));
      const expected = blocks.flatMap((b) => b.cells.map((_, i) => `${b.top + i}:${b.left}`));
      expect(covered).toEqual(expected);
    }
  });
});

describe("address helpers", () => {
  it("reads sheet and top-left from Excel addresses", () => {
    expect(parseRangeAddress("'It''s mine'!C7:D9")).toEqual({ sheet: "It's mine", top: 6, left: 2 });
    expect(parseRangeAddress("Framing!B3")).toEqual({ sheet: "Framing", top: 2, left: 1 });
  });
});
