/**
 * The report's key plan (building-wide part): the summary report of sample building (a) holds,
 * right after the load schedule, the schematic key plan of its typed tables with every member of
 * its Members sheet (read here with ExcelJS) and a line to each support the sheet names.
 * Needs `npm run build` (the takedown is built headless).
 */
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import { byRole, parseSvg } from "../drawings/svg-query";

const SAMPLE = resolve(__dirname, "../../sample-workbooks/steel-office-us.xlsx");

describe("report key plan", () => {
  it("sample (a): the summary report draws every member and each support named in the Members sheet", async () => {
    const out = join(mkdtempSync(join(tmpdir(), "loadpath-keyplan-")), "summary.html");
    const io: CliIO = { out: () => undefined, err: () => undefined };
    expect(await main(["report", SAMPLE, "-o", out, "--summary"], io)).toBe(0);
    const html = readFileSync(out, "utf8");
    const part = html.slice(html.indexOf('data-role="part-key-plan"'));
    expect(html.indexOf('data-role="part-key-plan"')).toBeGreaterThan(html.indexOf('data-role="part-load-schedule"'));
    const svg = parseSvg(part.slice(part.indexOf("<svg"), part.indexOf("</svg>") + 6));
    expect(svg.getAttribute("data-role")).toBe("key-plan");
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(SAMPLE);
    const ws = wb.getWorksheet("Members")!;
    const head = (ws.getRow(1).values as unknown[]).map((v) => String(v ?? "").toLowerCase());
    const col = (name: string) => head.indexOf(name);
    const rows: { mark: string; start: string; end: string }[] = [];
    ws.eachRow((row, i) => {
      const text = (c: number) => (c > 0 ? String(row.getCell(c).value ?? "").trim() : "");
      if (i > 1 && text(col("mark")) !== "") rows.push({ mark: text(col("mark")), start: text(col("start support")), end: text(col("end support")) });
    });
    expect(rows.length).toBeGreaterThan(50);
    const drawn = new Set(byRole(svg, "key-member").map((e) => e.getAttribute("data-plan-mark")));
    const links = new Set(byRole(svg, "key-bears-on").map((e) => `${e.getAttribute("data-from")}>${e.getAttribute("data-to")}`));
    for (const r of rows) {
      expect(drawn.has(r.mark), r.mark).toBe(true);
      for (const s of [r.start, r.end]) if (s !== "") expect(links.has(`${r.mark}>${s}`), `${r.mark} on ${s}`).toBe(true);
    }
  });
});

describe("report key plan from a framing plan", () => {
  it("a workbook holding a framing plan beside its member tables gets each level's framing plan", async () => {
    const { DECKS, FRAMING, GRIDS, LEVELS } = await import("../drawings/plan-fixture");
    const dir = mkdtempSync(join(tmpdir(), "loadpath-keyplan-"));
    const path = join(dir, "both.xlsx");
    const wb = new ExcelJS.Workbook();
    const sheets: Record<string, (string | number | null)[][]> = {
      Zones: [["Zone", "D", "L"], ["Office", 50, 50]],
      // one beam on two columns (the typed tables the takedown reads)
      Members: [["Mark", "Type", "Level", "Span", "Zone", "Trib", "Start support", "End support"], ["B1", "beam", "2", 24, "Office", 10, "C1", "C2"], ["C1", "column", "2", 12, null, null, "F1", null], ["C2", "column", "2", 12, null, null, "F2", null], ["F1", "foundation", null, null, null, null, null, null], ["F2", "foundation", null, null, null, null, null, null]],
      Grids: GRIDS as (string | number | null)[][],
      Levels: LEVELS as (string | number | null)[][],
      Framing: FRAMING as (string | number | null)[][],
      Decks: DECKS as (string | number | null)[][],
    };
    for (const [name, rows] of Object.entries(sheets)) {
      const ws = wb.addWorksheet(name);
      rows.forEach((r, i) => (ws.getRow(i + 1).values = r.map((v) => (v === null ? undefined : v)) as ExcelJS.CellValue[]));
    }
    await wb.xlsx.writeFile(path);
    const out = join(dir, "r.html");
    const err: string[] = [];
    const status = await main(["report", path, "-o", out, "--summary"], { out: () => undefined, err: (l) => void err.push(l) });
    expect(err).toEqual([]);
    expect(status).toBe(0);
    const html = readFileSync(out, "utf8");
    const levels = [...html.matchAll(/data-role="key-plan-level" data-plan-level="([^"]+)"/g)].map((m) => m[1]);
    expect(levels).toEqual(["Roof", "2"]);
    expect(html).toContain('data-role="framing-plan"');
    expect(html).not.toContain('data-role="key-plan"');
  });
});
