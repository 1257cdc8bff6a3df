/**
 * The building-wide part of the calculation report, the part a checker reads first, in Debian's
 * Chromium (test/browser/harness.ts) and in the PDF it prints (read back with pdftotext from
 * poppler-utils): the load schedule equals the Zones table as written in the workbook; the beam
 * end reactions summary equals the takedown JSON (`loadpath takedown --json`) for every member of
 * sample building (a) and the hand statics of ./framing.ts; the per-level load check equals the
 * hand arithmetic of the framing; every printed page carries "Page x of y" and the running header
 * with project and job; `--summary` is much shorter; a hostile project name and job stay text in
 * the page and in the running header. Needs `npm run build`.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TakedownJson } from "../../src/workbook/takedown-api";
import { CHROMIUM, DIST, launch } from "../browser/harness";
import { framingSheets, handFraming } from "./framing";
import { cli, writeSheets } from "./helpers";

const ROOT = resolve(__dirname, "..", "..");
const OUT = resolve(ROOT, "test-output", "report");
const SAMPLE_US = join(ROOT, "sample-workbooks", "steel-office-us.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-report-checker-"));

function has(program: string, arg: string): boolean {
  try {
    execFileSync(program, [arg], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}
const missing = !existsSync(CHROMIUM)
  ? `${CHROMIUM} is missing (apt-get install chromium)`
  : !existsSync(join(DIST, "functions.js"))
    ? "dist/functions.js is missing: run npm run build"
    : !has("pdftotext", "-v")
      ? "pdftotext is missing (apt-get install poppler-utils)"
      : null;
if (missing && process.env.CI) throw new Error(`Report checker tests cannot run: ${missing}`);
if (missing) console.warn(`SKIPPED report checker tests: ${missing}`);

let browser: Awaited<ReturnType<typeof launch>>;
let page: Page;
const requests: string[] = [];

beforeAll(async () => {
  if (missing) return;
  mkdirSync(OUT, { recursive: true });
  browser = await launch(816, 1056);
  page = await browser.context.newPage();
  page.on("request", (r) => void (r.url().startsWith("data:") || r.url() === "about:blank" ? null : requests.push(r.url())));
});

afterAll(async () => {
  await browser?.close();
});

async function open(html: string): Promise<void> {
  await page.setContent(html, { waitUntil: "load" });
  await page.emulateMedia({ media: "print" });
  await page.evaluate(() => document.fonts.ready);
}

/** Full values (data-value) of the cells matched by `selector`, in document order. */
async function values(selector: string): Promise<number[]> {
  return (await page.locator(selector).evaluateAll((es) => es.map((e) => e.getAttribute("data-value")))).map(Number);
}

async function value(selector: string): Promise<number> {
  const v = await page.locator(selector).evaluateAll((es) => es.map((e) => e.getAttribute("data-value")));
  expect(v, selector).toHaveLength(1);
  expect(v[0], selector).not.toBeNull();
  return Number(v[0]);
}

const near = (actual: number, expected: number, what: string): void => {
  expect(Math.abs(actual - expected), `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
};

/** The text of each page of a PDF, by pdftotext (poppler-utils), one call per page. */
function pdfPages(pdf: string): string[] {
  const info = execFileSync("pdfinfo", [pdf], { encoding: "utf8" });
  const n = Number(/^Pages:\s+(\d+)/m.exec(info)![1]);
  return Array.from({ length: n }, (_, i) => execFileSync("pdftotext", ["-layout", "-f", String(i + 1), "-l", String(i + 1), pdf, "-"], { encoding: "utf8" }));
}

/** Print the open page to a Letter PDF file (the report's own @page margins). */
async function printPdf(name: string): Promise<string> {
  const path = join(OUT, name);
  writeFileSync(path, await page.pdf({ format: "Letter", printBackground: true, preferCSSPageSize: true }));
  return path;
}

/** The Zones sheet of an .xlsx as written: name -> { case: load }, reducible (read with ExcelJS, not the project's reader). */
async function zonesSheet(path: string): Promise<Map<string, { loads: Record<string, number>; reducible: string }>> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  const ws = wb.getWorksheet("Zones")!;
  const head = (ws.getRow(1).values as unknown[]).slice(1).map((h) => String(h).replace(/\s*\(.*\)$/, ""));
  const out = new Map<string, { loads: Record<string, number>; reducible: string }>();
  for (let r = 2; r <= ws.rowCount; r++) {
    const row = (ws.getRow(r).values as unknown[]).slice(1);
    if (row.length === 0) continue;
    const loads: Record<string, number> = {};
    head.forEach((h, i) => {
      if (["D", "L", "Lr", "S", "R"].includes(h) && typeof row[i] === "number") loads[h] = row[i] as number;
    });
    out.set(String(row[0]), { loads, reducible: String(row[head.indexOf("Reducible")] ?? "no") });
  }
  return out;
}

describe.skipIf(missing !== null)("the report's building-wide tables and print furniture", () => {
  let sampleJson: TakedownJson;
  let sampleHtml: string;
  let summaryHtml: string;

  beforeAll(async () => {
    if (missing) return;
    const jsonPath = join(dir, "office.json");
    expect((await cli("takedown", SAMPLE_US, "--json", jsonPath)).status).toBe(0);
    sampleJson = JSON.parse(readFileSync(jsonPath, "utf8")) as TakedownJson;
    const full = join(dir, "office.html");
    expect((await cli("report", SAMPLE_US, "-o", full, "--date", "2026-12-04", "--job", "J-2607", "--project", "Steel office")).status).toBe(0);
    sampleHtml = readFileSync(full, "utf8");
    const summary = join(dir, "office-summary.html");
    const r = await cli("report", SAMPLE_US, "-o", summary, "--summary", "--date", "2026-12-04", "--job", "J-2607", "--project", "Steel office");
    expect(r.status).toBe(0);
    expect(r.out.join("\n")).toMatch(/Summary calculation report \(tables only, no member sheets\) written to/);
    summaryHtml = readFileSync(summary, "utf8");
  }, 120_000);

  it("prints every beam's end reactions per case of sample (a) exactly as the takedown JSON", async () => {
    await open(summaryHtml);
    const rows = await page.locator('table[data-role="reaction-summary"] tr[data-role="reactions"]').evaluateAll((trs) => trs.map((tr) => tr.getAttribute("data-member")!));
    const beams = Object.entries(sampleJson.members).filter(([, m]) => m.type !== "column").map(([mark]) => mark);
    expect(beams.length).toBeGreaterThan(50);
    expect(new Set(rows)).toEqual(new Set(beams));
    expect(rows).toHaveLength(beams.length);
    let checked = 0;
    for (const mark of beams) {
      const m = sampleJson.members[mark]!;
      for (const [c, pair] of Object.entries(m.reactions)) {
        const row = `table[data-role="reaction-summary"] tr[data-member="${mark}"]`;
        expect(await values(`${row} td[data-case="${c}"][data-end="start"]`)).toEqual([pair[0]]);
        expect(await values(`${row} td[data-case="${c}"][data-end="end"]`)).toEqual([pair[1]]);
        checked += 2;
      }
    }
    expect(checked).toBeGreaterThan(4 * beams.length);
  }, 120_000);

  it("prints the load schedule of sample (a) as its Zones sheet holds it", async () => {
    await open(summaryHtml);
    const zones = await zonesSheet(SAMPLE_US);
    const printed = await page.locator('table[data-role="load-schedule"] tr[data-role="zone"]').evaluateAll((trs) =>
      trs.map((tr) => ({
        name: tr.querySelector('[data-role="zone-name"]')!.textContent!,
        reducible: tr.querySelector('[data-role="reducible"]')!.textContent!,
        loads: Object.fromEntries(Array.from(tr.querySelectorAll("td[data-case]")).map((td) => [td.getAttribute("data-case")!, td.getAttribute("data-value")])),
      })),
    );
    expect(printed.map((z) => z.name)).toEqual([...zones.keys()]);
    for (const z of printed) {
      const sheet = zones.get(z.name)!;
      expect(z.reducible).toBe(sheet.reducible);
      const given = Object.fromEntries(Object.entries(z.loads).filter(([, v]) => v !== null).map(([c, v]) => [c, Number(v)]));
      expect(given, z.name).toEqual(sheet.loads);
    }
    // ROOF has no L: printed as a dash, not as 0 (a blank cell: the case does not act).
    expect(await page.locator('table[data-role="load-schedule"] tr[data-role="zone"]:first-child td[data-case="L"]').textContent()).toBe("—");
  });

  it("sums the per-level loads of both samples to the takedown JSON's applied load per case, and prints the SI sample's schedule as its Zones sheet", async () => {
    const SAMPLE_SI = join(ROOT, "sample-workbooks", "timber-house-si.xlsx");
    for (const [file, units] of [[SAMPLE_US, "US"], [SAMPLE_SI, "SI"]] as const) {
      const jsonPath = join(dir, `${units}.json`);
      expect((await cli("takedown", file, "--json", jsonPath, "--units", units)).status).toBe(0);
      const json = JSON.parse(readFileSync(jsonPath, "utf8")) as TakedownJson;
      const out = join(dir, `${units}-summary.html`);
      expect((await cli("report", file, "-o", out, "--summary", "--units", units)).status).toBe(0);
      await open(readFileSync(out, "utf8"));
      // Every load applied to the structure is applied on some level: the levels' direct loads add up to the balance's applied load (statics).
      for (const [c, b] of Object.entries(json.balance)) {
        const perLevel = await values(`tr[data-role="level-check"][data-case="${c}"] [data-field="applied"]`);
        near(perLevel.reduce((s, v) => s + v, 0), b.applied, `${units} Σ levels ${c}`);
        near(await value(`tr[data-role="level-total"][data-case="${c}"] [data-field="balance"]`), b.applied, `${units} balance ${c}`);
      }
      if (units === "SI") {
        const zones = await zonesSheet(file);
        const printed = await page.locator('table[data-role="load-schedule"] tr[data-role="zone"]').evaluateAll((trs) =>
          trs.map((tr) => [tr.querySelector('[data-role="zone-name"]')!.textContent!, Array.from(tr.querySelectorAll("td[data-value]")).map((td) => ({ c: td.getAttribute("data-case")!, v: Number(td.getAttribute("data-value")), text: td.textContent! }))] as const),
        );
        expect(printed.map(([n]) => n)).toEqual([...zones.keys()]);
        for (const [name, cells] of printed) {
          expect(Object.fromEntries(cells.map(({ c, v }) => [c, v])), name).toEqual(zones.get(name)!.loads);
          // kPa to 0.01 (0.96 kPa roof live load printed as entered).
          for (const { c, v, text } of cells) expect(text, `${name} ${c}`).toBe(v.toFixed(2));
        }
      }
    }
  });

  it("gives the framing's reactions, load schedule and per-level load check as the hand arithmetic does", async () => {
    const framing = join(dir, "framing.xlsx");
    await writeSheets(framing, framingSheets(), "Invented framing");
    const out = join(dir, "framing-summary.html");
    expect((await cli("report", framing, "-o", out, "--summary", "--date", "2026-12-04")).status).toBe(0);
    await open(readFileSync(out, "utf8"));
    const hand = handFraming();
    // End reactions by moments about one support (./framing.ts, common practice).
    const r = (mark: string, c: string, end: string) => value(`table[data-role="reaction-summary"] tr[data-member="${mark}"] td[data-case="${c}"][data-end="${end}"]`);
    near(await r("B1", "D", "start"), hand.B1.D.left, "B1 D start");
    near(await r("B1", "L", "end"), hand.B1.L.right, "B1 L end");
    near(await r("B2", "D", "start"), hand.B2.D.left, "B2 D start");
    near(await r("G1", "D", "end"), hand.G1.D.right, "G1 D end");
    near(await r("G1", "L", "start"), hand.G1.L.left, "G1 L start");
    expect(await page.locator('tr[data-member="G1"] [data-role="start-support"]').textContent()).toBe("C1");
    expect(await page.locator('tr[data-member="B1"] [data-role="end-support"]').textContent()).toBe("G2");
    // Level 2 by hand: loaded area = trib × span of the two beams = 10 × 24 + 6 × 24 = 384 ft².
    const area = 10 * 24 + 6 * 24;
    // D: (50 psf × 10 ft + 40 plf) × 24 ft + (50 × 6 + 40) × 24 + 3000 lb unit + 2 girders × 60 plf × 24 ft, in kip.
    const appliedD = ((50 * 10 + 40) * 24 + (50 * 6 + 40) * 24 + 3000 + 2 * 60 * 24) / 1000;
    // L: 80 psf × 384 ft² + storage strip 200 plf × 12 ft, in kip.
    const appliedL = (80 * area + 200 * 12) / 1000;
    const row = (c: string, field: string) => value(`tr[data-role="level-check"][data-level="2"][data-case="${c}"] [data-field="${field}"]`);
    near(await row("D", "area"), area, "area");
    near(await row("D", "applied"), appliedD, "applied D");
    near(await row("L", "applied"), appliedL, "applied L");
    near(await row("D", "pressure"), (appliedD * 1000) / area, "D / area");
    near(await row("L", "pressure"), (appliedL * 1000) / area, "L / area");
    near(await row("D", "from-zones"), (50 * area) / 1000, "zone D × area");
    near(await row("L", "from-zones"), (80 * area) / 1000, "zone L × area");
    near(await row("D", "other"), appliedD - (50 * area) / 1000, "D line and point loads");
    // Printed as people read them: 27000 / 384 = 70.3125 psf to 0.1; 86.25 rounds half away from zero.
    expect(await page.locator('tr[data-role="level-check"][data-case="D"] [data-field="pressure"]').textContent()).toBe("70.3");
    expect(await page.locator('tr[data-role="level-check"][data-case="L"] [data-field="pressure"]').textContent()).toBe("86.3");
    expect(await page.locator('tr[data-role="level-check"][data-case="D"] [data-field="zone-loads"]').textContent()).toBe("50.0");
    near(await value('tr[data-role="level-total"][data-case="L"] [data-field="applied"]'), appliedL, "all levels L");
    near(await value('tr[data-role="level-total"][data-case="L"] [data-field="balance"]'), appliedL, "balance L");
  });

  it("counts a load applied on a foundation (no level) so the levels still add up to the applied load", async () => {
    const sheets = framingSheets();
    sheets.Loads = [...sheets.Loads!, ["F1", "point", "D", 5000, null, null, null]];
    const file = join(dir, "framing-footing-load.xlsx");
    await writeSheets(file, sheets, "t");
    const out = join(dir, "framing-footing-load.html");
    expect((await cli("report", file, "-o", out, "--summary")).status).toBe(0);
    await open(readFileSync(out, "utf8"));
    // By hand: 5000 lb on F1; the level's own dead load as in the framing test, 27.0 kip.
    near(await value('tr[data-role="level-check"][data-level=""][data-case="D"] [data-field="applied"]'), 5, "no level D");
    expect(await page.locator('tr[data-role="level-check"][data-level=""][data-case="D"] td').first().textContent()).toBe("(no level)");
    near(await value('tr[data-role="level-total"][data-case="D"] [data-field="applied"]'), 27 + 5, "all levels D");
    near(await value('tr[data-role="level-total"][data-case="D"] [data-field="balance"]'), 27 + 5, "balance D");
  });

  it("numbers every printed page 'Page x of y' under a running header with project and job; --summary is much shorter", async () => {
    await open(sampleHtml);
    const fullPages = pdfPages(await printPdf("sample-full.pdf"));
    await open(summaryHtml);
    // Letter at 96 px per inch inside the report's 14 mm side margins: no table of the summary is wider.
    const width = Math.floor(816 - (2 * 14 * 96) / 25.4);
    await page.setViewportSize({ width, height: 1056 });
    const wide = await page.evaluate(() => {
      const right = document.body.getBoundingClientRect().right;
      return Array.from(document.querySelectorAll("table")).filter((t) => t.getBoundingClientRect().right > right + 0.5).map((t) => t.getAttribute("data-role"));
    });
    expect(wide).toEqual([]);
    const summaryPages = pdfPages(await printPdf("sample-summary.pdf"));
    console.log(`sample (a) report: ${fullPages.length} Letter pages with the member sheets, ${summaryPages.length} with --summary`);
    for (const pages of [fullPages, summaryPages]) {
      pages.forEach((text, i) => {
        expect(text, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
        const first = text.split("\n").find((l) => l.trim() !== "") ?? "";
        expect(first, `page ${i + 1} header`).toContain("Steel office · Job J-2607");
        expect(first, `page ${i + 1} header`).toContain("2026-12-04");
        expect(text, `page ${i + 1} caution`).toContain("qualified engineer");
      });
    }
    expect(summaryPages.length * 10).toBeLessThan(fullPages.length);
    // The title page: project, job and the contents.
    expect(fullPages[0]).toContain("Contents");
    expect(fullPages[0]).toMatch(/Job\s+J-2607/);
    expect(requests).toEqual([]);
  }, 300_000);

  it("keeps a hostile project name and job as text on the page and in the running header", async () => {
    const framing = join(dir, "framing-hostile.xlsx");
    await writeSheets(framing, framingSheets(), "t");
    // Short enough for the header's line: a quote, a brace and a backslash would end a CSS string or rule, </style> the style.
    const project = `"}</style><b>x</b>\\`;
    const job = `<img src=x>'`;
    const out = join(dir, "hostile.html");
    expect((await cli("report", framing, "-o", out, "--summary", "--project", project, "--job", job)).status).toBe(0);
    const html = readFileSync(out, "utf8");
    expect(html).not.toMatch(/<(script|img|b)\b/i);
    expect(html.match(/<\/style>/g)).toHaveLength(2);
    await open(html);
    expect(await page.locator('[data-role="project"]').textContent()).toBe(project);
    expect(await page.locator('[data-role="job"]').textContent()).toBe(job);
    expect(await page.locator("script, img, b").count()).toBe(0);
    const pages = pdfPages(await printPdf("hostile-summary.pdf"));
    for (const [i, text] of pages.entries()) expect(text.split("\n")[0], `page ${i + 1}`).toContain(`${project} · Job ${job}`);
    expect(requests).toEqual([]);
  });
});
