/**
 * One saved matching for the pane and the command line (issue 15, items 3 to 5): the firm's
 * template (test/workbook/firm-template.ts) under its own sheet names, its columns matched once in
 * the pane's column step (each needed column with the header cell it is taken from; an ambiguous
 * one shows both cells and takes neither until picked), saved on the generated settings sheet,
 * then built by the pane adapter and by `loadpath takedown` reading that sheet: identical, and
 * checked by hand statics. `--save-mapping` writes what the command line was given; `--map`
 * overrides a saved entry; the sheet survives a save by Gnumeric and by LibreOffice.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import ExcelJS from "exceljs";
import type { RawCellContent } from "hyperformula";
import { beforeAll, describe, expect, it } from "vitest";
import { cli, writeSheets } from "../report/helpers";
import { checkByHand, MAP_ARGS, MAPPING, SHEETS } from "./firm-template";
import { hasGnumeric, hasLibreOffice, recalcWithLibreOffice, requireInCi } from "../handoff/programs";
import { PaneSession } from "../../src/taskpane/session";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";
import { GENERATED_MARKER } from "../../src/workbook/port";
import { parseSettings, readSavedMatching, SETTINGS_SHEET, settingsCells } from "../../src/workbook/saved-matching";
import type { TakedownJson } from "../../src/workbook/takedown-api";

/** The firm's own sheet names: nothing is found under the default names. */
const ZONES = "Load schedule";
const MEMBERS = "Framing";
const FIRM: Record<string, RawCellContent[][]> = { [ZONES]: SHEETS.Zones!, [MEMBERS]: SHEETS.Members! };
const TABLE_ARGS = ["--zones", ZONES, "--members", MEMBERS];

/** Every sheet of a port as plain values (what Excel would save), the generated takedown left out. */
function sheetsOf(port: MemoryWorkbookPort, leaveOut: readonly string[] = []): Record<string, RawCellContent[][]> {
  const out: Record<string, RawCellContent[][]> = {};
  for (const name of port.hf.getSheetNames()) if (!leaveOut.includes(name)) out[name] = port.hf.getSheetValues(port.hf.getSheetId(name)!) as RawCellContent[][];
  return out;
}

/** The settings sheet of a file as ExcelJS reads it: rows of cell texts. */
async function settingsRows(path: string): Promise<string[][]> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  const ws = wb.getWorksheet(SETTINGS_SHEET);
  if (!ws) throw new Error(`no sheet ${SETTINGS_SHEET} in ${path}`);
  const rows: string[][] = [];
  ws.eachRow((row, n) => {
    rows[n - 1] = [1, 2, 3, 4].map((c) => (row.getCell(c).value === null ? "" : String(row.getCell(c).value)));
  });
  return rows;
}

function reactionsOf(json: TakedownJson): unknown {
  return JSON.parse(JSON.stringify({ members: json.members, columns: json.columns, foundations: json.foundations, balance: json.balance }));
}

/**
 * `loadpath takedown <file> --json` with no table option at all: it must read the saved matching,
 * and its results must be the hand statics' and those of `expected` (the pane's build).
 */
async function expectSameFromSavedMatching(file: string, expected: TakedownJson): Promise<void> {
  const json = file.replace(/\.xlsx$/, ".json");
  const r = await cli("takedown", file, "--json", json);
  expect(r.err).toEqual([]);
  expect(r.status).toBe(0);
  expect(r.out.join("\n")).toContain(`Matching read from the sheet "${SETTINGS_SHEET}"`);
  const got = JSON.parse(readFileSync(json, "utf8")) as TakedownJson;
  checkByHand(got);
  expect(reactionsOf(got)).toEqual(reactionsOf(expected));
}

describe("one saved matching, read by the pane and the command line", () => {
  let dir: string;
  let input: string;
  let port: MemoryWorkbookPort;
  let session: PaneSession;
  let paneJson: TakedownJson;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "loadpath-saved-"));
    input = join(dir, "firm.xlsx");
    await writeSheets(input, FIRM);
    port = await MemoryWorkbookPort.create({ sheets: FIRM });
    session = new PaneSession(port, buildTakedown);
  });

  it("the pane's column step: ambiguous, then missing columns first, each with its header cell; a pick names exactly that cell", async () => {
    // Nothing mapped: the required columns without a default header come first, as missing.
    const bare = await session.columnReport("members", MEMBERS, {});
    expect(bare.headerRow).toBe(1); // no needed column under its default header: the first row (docs/interface.md section 2)
    const missing = bare.columns.filter((c) => c.state === "missing").map((c) => c.header);
    expect(missing).toEqual(["Mark", "Span", "Start support"]);
    expect(bare.columns.slice(0, 3).map((c) => c.state)).toEqual(["missing", "missing", "missing"]);

    // End at given as "Location": two cells fit, both shown, neither taken.
    const report = await session.columnReport("members", MEMBERS, { members: { ...MAPPING, "End at": "Location" } });
    expect(report.headerRow).toBe(5); // found below the title block and the group row
    const first = report.columns[0]!;
    expect(first.header).toBe("End at");
    expect(first.state).toBe("ambiguous");
    expect(first.cells.map((c) => [c.address, c.text, c.group])).toEqual([
      ["H5", "Location (ft)", "Start"],
      ["J5", "Location (ft)", "End"],
    ]);
    expect(first.note).toContain('H5 "Location (ft)" (under "Start") and J5 "Location (ft)" (under "End") both fit; none is taken');
    const startAt = report.columns.find((c) => c.header === "Start at")!;
    expect([startAt.state, startAt.cells[0]!.address]).toEqual(["found", "H5"]);
    expect(report.columns.find((c) => c.header === "Mark")!.cells[0]!.address).toBe("A5");
    expect(report.columns.find((c) => c.header === "End support")!.cells[0]!.text).toBe("Supported by (end)");

    // Picking J5: its reference is the group and header (the header alone fits two cells).
    const j5 = first.cells[1]!;
    expect(j5.ref).toBe("End/Location (ft)");
    expect(report.options.find((o) => o.address === "A5")!.ref).toBe("Beam Mark");
    const picked = await session.columnReport("members", MEMBERS, { members: { ...MAPPING, "End at": j5.ref } });
    const endAt = picked.columns.find((c) => c.header === "End at")!;
    expect([endAt.state, endAt.cells[0]!.address]).toEqual(["found", "J5"]);
    expect(picked.columns.every((c) => c.state === "found" || c.state === "absent")).toBe(true);
  });

  it("the pane saves the matching on a generated sheet only; a fresh session reads it back", async () => {
    const before = sheetsOf(port);
    await session.saveMatching({ tables: { zones: ZONES, members: MEMBERS, loads: "" }, mapping: { members: { ...MAPPING, "End at": "End/Location (ft)" } }, units: "US" });
    expect(await port.sheetMarker(SETTINGS_SHEET)).toMatch(new RegExp(`^${GENERATED_MARKER}`));
    const after = sheetsOf(port, [SETTINGS_SHEET]);
    expect(after).toEqual(before); // the user's sheets as they were
    const loaded = await new PaneSession(port, buildTakedown).loadSettings();
    expect(loaded).toEqual({ tables: { zones: ZONES, members: MEMBERS, loads: "" }, mapping: { members: { ...MAPPING, "End at": "End/Location (ft)" } }, units: "US", source: "sheet" });
    // The pane lists the settings sheet as no input table.
    expect((await session.scan(loaded.tables, loaded.mapping)).tables.map((t) => t.sheet)).not.toContain(SETTINGS_SHEET);
  });

  it("built by the pane adapter from the saved matching and by the command line reading the same sheet: identical, by hand", async () => {
    const settings = await session.loadSettings();
    const outcome = await session.run(settings.tables!, settings, () => {});
    expect(outcome.kind).toBe("done");
    if (outcome.kind !== "done") return;
    expect(outcome.result.problems).toEqual([]);
    paneJson = outcome.result.json!;
    checkByHand(paneJson);

    // The workbook as saved by the host: the firm's sheets and the settings sheet (the takedown is rebuilt).
    const saved = join(dir, "saved-by-pane.xlsx");
    await writeSheets(saved, sheetsOf(port, ["Takedown"]));
    await expectSameFromSavedMatching(saved, paneJson);
  });

  it("--save-mapping writes what the command line was given; a later run and the pane need no option; --map overrides a saved entry", async () => {
    const out = join(dir, "out.xlsx");
    const r = await cli("takedown", input, "-o", out, "--save-mapping", ...TABLE_ARGS, ...MAP_ARGS, "--header-row", "members=5");
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    const rows = await settingsRows(out);
    expect(rows[0]![0]).toMatch(new RegExp(`^${GENERATED_MARKER}`));
    expect(rows[3]).toEqual(["Setting", "Table", "Column", "Value"]);
    expect(rows).toContainEqual(["units", "", "", "US"]);
    expect(rows).toContainEqual(["table", "members", "", MEMBERS]);
    expect(rows).toContainEqual(["header row", "members", "", "5"]);
    expect(rows).toContainEqual(["column", "members", "End at", "J"]);
    expect(rows).toContainEqual(["column", "members", "Start support", "Supported by (start)"]);

    const json = join(dir, "again.json");
    const again = await cli("takedown", out, "--json", json);
    expect(again.status).toBe(0);
    checkByHand(JSON.parse(readFileSync(json, "utf8")) as TakedownJson);

    // The pane reads the same sheet from that file.
    const { takedownOfFile } = await import("../../src/cli/takedown-input");
    const file = await takedownOfFile(out, {});
    const fromFile = new PaneSession(file.port, buildTakedown);
    const settings = await fromFile.loadSettings();
    expect(settings.mapping.members?.["End at"]).toBe("J");
    expect(settings.headerRows).toEqual({ members: 5 });
    const outcome = await fromFile.run(settings.tables!, settings, () => {});
    expect(outcome.kind === "done" && reactionsOf(outcome.result.json!)).toEqual(reactionsOf(paneJson));

    // `loadpath export` rebuilds the takedown it finds by its title with the saved matching.
    const handoff = await cli("export", out, "-o", join(dir, "handoff.xlsx"));
    expect(handoff.err).toEqual([]);
    expect(handoff.status).toBe(0);
    // Built from the tables (a --map given): the tables not named come from the saved matching.
    const fromTables = await cli("export", out, "-o", join(dir, "handoff-tables.xlsx"), "--map", "members.End at=J");
    expect(fromTables.err).toEqual([]);
    expect(fromTables.status).toBe(0);

    // `loadpath report` reads the tables through the same matching (a check only: no -o).
    const report = await cli("report", out, "--summary");
    expect(report.err).toEqual([]);
    expect(report.status).toBe(0);

    // --map wins over the saved entry: "Location" fits two cells, a problem naming both.
    const over = await cli("takedown", out, "--map", "members.End at=Location");
    expect(over.status).toBe(1);
    expect(over.err.join("\n")).toMatch(/Framing!H5: The Members table's End at could be H5 "Location \(ft\)" and J5 "Location \(ft\)"; none is taken/);

    expect((await cli("takedown", input, "--save-mapping", ...MAP_ARGS)).status).toBe(2);
  });

  it("a saved reference that fits two columns is a problem naming both cells, never a guess; nothing is written", async () => {
    const sheets = { ...FIRM, [SETTINGS_SHEET]: settingsCells({ tables: { zones: ZONES, members: MEMBERS }, mapping: { members: { ...MAPPING, "End at": "Location (ft)" } } }) as RawCellContent[][] };
    const file = join(dir, "ambiguous.xlsx");
    await writeSheets(file, sheets);
    const out = join(dir, "ambiguous-out.xlsx");
    const r = await cli("takedown", file, "-o", out);
    expect(r.status).toBe(1);
    expect(r.err.join("\n")).toContain("--map members.End at=H or --map members.End at=J");
    expect(existsSync(out)).toBe(false);
  });

  it("a settings row that cannot be read is named by its cell; a user's sheet of that name is neither read nor replaced", async () => {
    const rows = settingsCells({ units: "US", tables: { members: MEMBERS } }) as (string | number | null)[][];
    expect(parseSettings(rows)).toEqual({ matching: { units: "US", tables: { members: MEMBERS } } });
    expect(parseSettings([...rows.slice(0, 4), ["units", null, null, "metric"]])).toEqual({ error: "'Loadpath settings'!D5: units are US or SI (got \"metric\")." });
    expect(parseSettings([...rows.slice(0, 4), ["column", "beams", "Mark", "Tag"]])).toHaveProperty("error", "'Loadpath settings'!B5: \"beams\" is not a table (zones, members, loads or bearings).");
    expect(parseSettings([...rows.slice(0, 4), ["header row", "members", null, 0]])).toHaveProperty("error");

    const own = { ...FIRM, [SETTINGS_SHEET]: [["My notes on the matching"], ["Setting", "Table", "Column", "Value"], ["units", null, null, "SI"]] as RawCellContent[][] };
    expect(await readSavedMatching(await MemoryWorkbookPort.create({ sheets: own }))).toBeNull();
    const file = join(dir, "own.xlsx");
    await writeSheets(file, own);
    const r = await cli("takedown", file, "-o", join(dir, "own-out.xlsx"), "--save-mapping", ...TABLE_ARGS, ...MAP_ARGS);
    expect(r.status).toBe(2);
    expect(r.err.join("\n")).toContain(`A sheet named "${SETTINGS_SHEET}" exists and was not made by Loadpath`);

    const bad = join(dir, "bad.xlsx");
    await writeSheets(bad, { ...FIRM, [SETTINGS_SHEET]: [[`${GENERATED_MARKER}: saved matching`], [null], [null], ["Setting", "Table", "Column", "Value"], ["units", null, null, "metric"]] });
    const badRun = await cli("takedown", bad, ...TABLE_ARGS, ...MAP_ARGS);
    expect(badRun.status).toBe(2);
    expect(badRun.err.join("\n")).toContain("'Loadpath settings'!D5: units are US or SI");
  });

  describe("the saved matching after another spreadsheet program saved the file", () => {
    const programs = [
      {
        name: "Gnumeric",
        present: hasGnumeric(),
        convert: (from: string, to: string): void => {
          const r = spawnSync("ssconvert", [from, to], { encoding: "utf8", timeout: 300_000 });
          if (r.status !== 0 || !existsSync(to)) throw new Error(`ssconvert failed (${r.status}): ${r.stderr}`);
        },
      },
      { name: "LibreOffice", present: hasLibreOffice(), convert: recalcWithLibreOffice },
    ];
    for (const p of programs) {
      it.skipIf(!p.present)(`${p.name}: open, save, reopen: the command line still reads the matching and builds the same`, async () => {
        const out = join(dir, "out.xlsx");
        if (!existsSync(out)) await cli("takedown", input, "-o", out, "--save-mapping", ...TABLE_ARGS, ...MAP_ARGS);
        const through = join(dir, `through-${p.name}.xlsx`);
        p.convert(out, through);
        await expectSameFromSavedMatching(through, paneJson);
      }, 600_000);
    }
    it("the programs are present (or the checks above are skipped loudly)", () => {
      for (const p of programs) requireInCi(p.name, p.present);
    });
  });
});
