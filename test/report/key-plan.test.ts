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
