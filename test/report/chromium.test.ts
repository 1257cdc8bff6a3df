/**
 * The calculation report in a real browser (Debian's Chromium through playwright-core, no
 * download; test/browser/harness.ts): for the invented framing of ./framing.ts, the numbers of
 * each member's tables equal the takedown JSON (`loadpath takedown --json`) and the hand statics
 * written out in ./framing.ts; the column schedule, foundations and load balance likewise; marks
 * and zone names made of markup are shown as text and nothing is loaded (no request, no dialog,
 * no element that loads); in print layout nothing is wider than the page, every drawing fits on
 * a page and each beam starts a page; the PDF (page.pdf) has a page per beam at least.
 * Screenshots and PDFs go to test-output/report/ for review by eye. Needs `npm run build`.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TakedownJson } from "../../src/workbook/takedown-api";
import { CHROMIUM, DIST, launch } from "../browser/harness";
import { handReactions, handMaxMoment } from "../workbook/takedown-helpers";
import { framingSheets, handFraming, type Marks } from "./framing";
import { cli, writeSheets } from "./helpers";

const ROOT = resolve(__dirname, "..", "..");
const OUT = resolve(ROOT, "test-output", "report");
const dir = mkdtempSync(join(tmpdir(), "loadpath-report-browser-"));
const missing = !existsSync(CHROMIUM) ? `${CHROMIUM} is missing (apt-get install chromium)` : !existsSync(join(DIST, "functions.js")) ? "dist/functions.js is missing: run npm run build" : null;
if (missing && process.env.CI) throw new Error(`Report browser tests cannot run: ${missing}`);

/** Letter paper at 96 px per inch inside the report's @page margins (14 mm at the sides, 16 mm top and bottom): the width a printed page lays out in. */
const PAGE = { width: Math.floor(816 - (2 * 14 * 96) / 25.4), contentHeight: 1056 - (2 * 16 * 96) / 25.4 } as const;

const HOSTILE: Marks = {
  B1: "<img src=x onerror=alert(1)>",
  B2: 'B2"><script>alert(2)</script>',
  G1: "G1</td><iframe src=\"http://127.0.0.1:9/x\"></iframe>",
  G2: "G2' onmouseover='alert(3)",
};
const HOSTILE_ZONE = "<b>OFF</b>";

let browser: Awaited<ReturnType<typeof launch>>;
let page: Page;
const requests: string[] = [];
const dialogs: string[] = [];
let json: TakedownJson;
let html: string;
const hand = handFraming();

/** Open a report in print layout; requests and dialogs are recorded. */
async function open(content: string): Promise<void> {
  await page.setContent(content, { waitUntil: "load" });
  await page.emulateMedia({ media: "print" });
  await page.evaluate(() => document.fonts.ready);
}

/** Full value and printed text of the table cell `selector` inside the section of `mark`. */
async function cell(selector: string): Promise<{ value: number; text: string }> {
  const got = await page.locator(selector).first().evaluate((e) => ({ value: e.getAttribute("data-value"), text: e.textContent ?? "" }));
  expect(got.value, selector).not.toBeNull();
  return { value: Number(got.value), text: got.text };
}

const near = (actual: number, expected: number, what: string): void => {
  expect(Math.abs(actual - expected), `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
};

/** A printed number: the value with the report's decimals and a true minus sign. */
const printed = (v: number, decimals: number): string => v.toFixed(decimals).replace(/^-(?!0(\.0*)?$)/, "\u2212").replace(/^-/, "");

beforeAll(async () => {
  if (missing) return;
  mkdirSync(OUT, { recursive: true });
  const framing = join(dir, "framing.xlsx");
  await writeSheets(framing, framingSheets(), "Invented framing");
  const jsonPath = join(dir, "framing.json");
  expect((await cli("takedown", framing, "--json", jsonPath)).status).toBe(0);
  json = JSON.parse(readFileSync(jsonPath, "utf8")) as TakedownJson;
  const out = join(dir, "framing.html");
  expect((await cli("report", framing, "-o", out, "--only", "B1,B2,G1,C1", "--date", "2025-01-15")).status).toBe(0);
  html = readFileSync(out, "utf8");
  browser = await launch(PAGE.width, 1056);
  page = await browser.context.newPage();
  page.on("request", (r) => void (r.url().startsWith("data:") || r.url() === "about:blank" ? null : requests.push(r.url())));
  page.on("dialog", (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
});

afterAll(async () => {
  await browser?.close();
});

describe.skipIf(missing !== null)("calculation report in Chromium", () => {
  it("prints each beam's loads, reactions, shear and moment as the takedown JSON and the hand statics give them", async () => {
    await open(html);
    const b1 = '[data-mark="B1"]';
    for (const [c, handCase] of [["D", hand.B1.D], ["L", hand.B1.L]] as const) {
      const r = json.members.B1!;
      const checks: [string, number, number, number][] = [
        [`${b1} tr[data-role="reaction-1"] td[data-case="${c}"]`, r.reactions[c]![0]!, handCase.left, 2],
        [`${b1} tr[data-role="reaction-2"] td[data-case="${c}"]`, r.reactions[c]![1]!, handCase.right, 2],
        [`${b1} tr[data-role="shear-max"] td[data-case="${c}"]`, r.shearMax[c]!, handCase.vMax, 2],
        [`${b1} tr[data-role="moment-max"] td[data-case="${c}"]`, r.momentMax[c]!, handCase.mMax, 2],
      ];
      for (const [selector, fromJson, byHand, decimals] of checks) {
        const got = await cell(selector);
        expect(got.value, selector).toBe(fromJson);
        near(got.value, byHand, selector);
        expect(got.text, selector).toBe(printed(fromJson, decimals));
      }
    }
    // The loads: zone OFF x 10 ft + wD 40 plf over the length, and the storage strip from 0 to 12 ft.
    const rows = `${b1} table[data-role="loads"] tr[data-role="load"]`;
    expect(await page.locator(rows).count()).toBe(2);
    near((await cell(`${rows}:nth-child(1) td[data-case="D"]`)).value, hand.b1.wD, "B1 wD");
    near((await cell(`${rows}:nth-child(1) td[data-case="L"]`)).value, hand.b1.wL, "B1 wL");
    near((await cell(`${rows}:nth-child(2) td[data-case="L"]`)).value, hand.b1.strip, "B1 strip");
    expect(await page.locator(`${rows}:nth-child(2) td.source`).textContent()).toBe("Loads row 2: line L");
    // Live load reduction: A_T = 10 x 24 = 240 ft², K_LL = 2, L/Lo by Eq. 4.7-1.
    near((await cell(`${b1} tr[data-role="area"] td.num`)).value, hand.B1.areaT, "B1 A_T");
    expect((await cell(`${b1} tr[data-role="llr"] td.num`)).value).toBe(json.members.B1!.llrFactor);
    near(json.members.B1!.llrFactor, hand.B1.llr, "B1 L/Lo");
    // B2 carries the unit (3 kip at 8 ft): its dead load reactions.
    near((await cell('[data-mark="B2"] tr[data-role="reaction-1"] td[data-case="D"]')).value, hand.B2.D.left, "B2 R1 D");
    near((await cell('[data-mark="B2"] tr[data-role="moment-max"] td[data-case="D"]')).value, hand.B2.D.mMax, "B2 M D");
  });

  it("prints the governing values of a beam as solved by hand (ASCE/SEI 7-22 Sec. 2.3.1, reduced live load; one span, so L acts on all of it)", async () => {
    await open(html);
    const b1 = '[data-mark="B1"]';
    for (const role of ["governing-moment-max", "governing-shear-max", "governing-reaction-1-max", "governing-reaction-2-max"]) {
      expect(await page.locator(`${b1} tr[data-role="${role}"] td.combo`).textContent(), role).toBe("2.3.1 (2) 1.2D + 1.6L");
      expect(await page.locator(`${b1} tr[data-role="${role}"] td.pattern`).textContent(), role).toBe("L on all segments");
    }
    // 1.2D + 1.6L with the zone's live load (reducible) times L/Lo and the strip (not reducible) as is.
    const patches = [
      { w: 1.2 * hand.b1.wD + 1.6 * hand.b1.wL * hand.B1.llr, a: 0, b: 24 },
      { w: 1.6 * hand.b1.strip, a: 0, b: 12 },
    ];
    const r = handReactions(24, [], patches);
    near((await cell(`${b1} tr[data-role="governing-reaction-1-max"] td[data-case="governing"]`)).value, r.left, "B1 factored R1");
    near((await cell(`${b1} tr[data-role="governing-reaction-2-max"] td[data-case="governing"]`)).value, r.right, "B1 factored R2");
    near((await cell(`${b1} tr[data-role="governing-shear-max"] td[data-case="governing"]`)).value, Math.max(r.left, r.right), "B1 factored |V|");
    near((await cell(`${b1} tr[data-role="governing-moment-max"] td[data-case="governing"]`)).value, handMaxMoment(24, [], patches), "B1 factored M");
    // The least reactions: 0.9D (combination 5 with no wind load), D alone being on the whole span.
    expect(await page.locator(`${b1} tr[data-role="governing-reaction-1-min"] td.combo`).textContent()).toBe("2.3.1 (5) 0.9D");
    near((await cell(`${b1} tr[data-role="governing-reaction-1-min"] td[data-case="governing"]`)).value, 0.9 * hand.B1.D.left, "B1 least R1");
  });

  it("gives a girder the reactions it receives, with their marks and positions", async () => {
    await open(html);
    const rows = '[data-mark="G1"] table[data-role="loads"] tr[data-role="load"][data-kind="reaction"]';
    expect(await page.locator(rows).allTextContents()).toHaveLength(2);
    const first = page.locator(rows).nth(0);
    expect(await first.locator("td.source").textContent()).toBe("Reaction of B1 (beam) at its start");
    expect(await first.locator("td.num").nth(1).getAttribute("data-value")).toBe("10");
    near(Number(await first.locator('td[data-case="D"]').getAttribute("data-value")), hand.B1.D.left, "G1 load from B1");
    near((await cell('[data-mark="G1"] tr[data-role="reaction-1"] td[data-case="D"]')).value, hand.G1.D.left, "G1 R1 D");
    near((await cell('[data-mark="G1"] tr[data-role="reaction-2"] td[data-case="L"]')).value, hand.G1.L.right, "G1 R2 L");
    near((await cell('[data-mark="G1"] tr[data-role="moment-max"] td[data-case="D"]')).value, hand.G1.D.mMax, "G1 M D");
    expect(await page.locator('[data-mark="G1"] tr[data-role="reaction-1"] th').textContent()).toBe("R1 at 0 ft on C1");
  });

  it("prints the column schedule, the foundations and the load balance as the JSON and the hand takedown give them", async () => {
    await open(html);
    for (const mark of ["C1", "C2", "C3", "C4"] as const) {
      const row = `table[data-role="column-schedule"] tr[data-mark="${mark}"]`;
      const c = json.columns[mark]!;
      for (const k of ["D", "L"] as const) {
        const got = await cell(`${row} td[data-case="${k}"]`);
        expect(got.value).toBe(c.cumulative[k]);
        near(got.value, hand.columns[mark][k], `${mark} ${k}`);
      }
      for (const field of ["tributaryArea", "floors", "kllAt", "llrFactor", "reducedLive"] as const) expect((await cell(`${row} td[data-field="${field}"]`)).value, `${mark} ${field}`).toBe(c[field]);
      const h = hand.columns[mark];
      near((await cell(`${row} td[data-field="tributaryArea"]`)).value, h.areaT, `${mark} A_T`);
      near((await cell(`${row} td[data-field="kllAt"]`)).value, h.kllAt, `${mark} K_LL·A_T`);
      near((await cell(`${row} td[data-field="llrFactor"]`)).value, h.llr, `${mark} L/Lo`);
      near((await cell(`${row} td[data-field="reducedLive"]`)).value, h.reducedLive, `${mark} L reduced`);
      // 1.2D + 1.6L (reduced) governs over 1.4D (ASCE/SEI 7-22 Sec. 2.3.1, recalled from memory).
      near((await cell(`${row} td[data-field="governing"]`)).value, Math.max(1.4 * h.D, 1.2 * h.D + 1.6 * h.reducedLive), `${mark} factored`);
      expect(await page.locator(`${row} td.combo`).textContent()).toBe("2.3.1 (2) 1.2D + 1.6L");
    }
    // C1: K_LL·A_T = 4 x 88 = 352 ft² < 400, no reduction; C2: 4 x 104 = 416 ft², reduced (Sec. 4.7.3).
    near(hand.columns.C1.areaT, (120 * 14 + 72 * 6) / 24, "C1 A_T by hand");
    expect(hand.columns.C1.llr).toBe(1);
    expect(hand.columns.C2.llr).toBeLessThan(1);
    for (const [f, c] of [["F1", "C1"], ["F4", "C4"]] as const) near((await cell(`tr[data-role="foundation"][data-mark="${f}"] td[data-case="D"]`)).value, hand.columns[c].D, `${f} D`);
    for (const k of ["D", "L"] as const) {
      const applied = await cell(`tr[data-role="balance"][data-case="${k}"] td[data-field="applied"]`);
      expect(applied.value).toBe(json.balance[k]!.applied);
      near(applied.value, hand.applied[k], `applied ${k}`);
      near((await cell(`tr[data-role="balance"][data-case="${k}"] td[data-field="supports"]`)).value, hand.applied[k], `supports ${k}`);
    }
  });

  it("lays out for print: nothing wider than the page, every drawing fits a page, each beam starts a page", async () => {
    await open(html);
    const layout = await page.evaluate(() => {
      const body = document.body.getBoundingClientRect();
      const style = getComputedStyle(document.body);
      const right = body.right - parseFloat(style.paddingRight);
      const left = body.left + parseFloat(style.paddingLeft);
      const wide = Array.from(document.querySelectorAll("table, svg, figure, p, h1, h2, h3, ul, ol"))
        .filter((e) => {
          const b = e.getBoundingClientRect();
          return b.right > right + 0.5 || b.left < left - 0.5;
        })
        .map((e) => `${e.tagName} ${e.getAttribute("data-role") ?? ""}`);
      const svgs = Array.from(document.querySelectorAll("svg")).map((s) => s.getBoundingClientRect().height);
      const breaks = Array.from(document.querySelectorAll("section.member.flexural")).map((s) => getComputedStyle(s).breakBefore);
      const figures = Array.from(document.querySelectorAll("figure")).map((f) => getComputedStyle(f).breakInside);
      return { wide, svgs, breaks, figures, bodyWidth: right - left };
    });
    expect(layout.wide).toEqual([]);
    expect(layout.bodyWidth).toBeLessThanOrEqual(PAGE.width);
    expect(layout.svgs.length).toBeGreaterThanOrEqual(3 * 3 + 1);
    for (const h of layout.svgs) expect(h).toBeLessThan(PAGE.contentHeight);
    expect(layout.breaks).toEqual(["page", "page", "page"]);
    expect(new Set(layout.figures)).toEqual(new Set(["avoid"]));
    await page.screenshot({ path: join(OUT, "framing-first-page.png"), clip: { x: 0, y: 0, width: PAGE.width, height: 1056 } });
    await page.locator('[data-mark="B1"]').screenshot({ path: join(OUT, "framing-B1.png") });
    const pdf = await page.pdf({ format: "Letter", printBackground: true });
    writeFileSync(join(OUT, "framing-report.pdf"), pdf);
    const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    // Title page(s), then each of the three beams on a page of its own at least, the column and the schedules.
    expect(pages).toBeGreaterThanOrEqual(1 + 3 + 1);
    expect(requests).toEqual([]);
  });

  it("shows marks and zone names made of markup as text and loads nothing", async () => {
    const hostile = join(dir, "hostile.xlsx");
    await writeSheets(hostile, framingSheets(HOSTILE, HOSTILE_ZONE), "<script>alert('title')</script>");
    const out = join(dir, "hostile.html");
    const r = await cli("report", hostile, "-o", out, "--all");
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    const text = readFileSync(out, "utf8");
    expect(text).not.toMatch(/<(script|img|iframe|b)\b/i);
    await open(text);
    const dom = await page.evaluate(() => ({
      loaders: Array.from(document.querySelectorAll("script, img, iframe, object, embed, link, image, use, video, audio, source, base, form")).map((e) => e.tagName),
      attrs: Array.from(document.querySelectorAll("*")).flatMap((e) =>
        Array.from(e.attributes)
          .filter((a) => /^(src|srcset|href|xlink:href|action|poster|data|on\w+)$/i.test(a.name) && !(a.name === "href" && a.value.startsWith("#")))
          .map((a) => `${e.tagName} ${a.name}=${a.value}`),
      ),
      marks: Array.from(document.querySelectorAll('[data-role="mark"]')).map((e) => e.textContent),
      svgText: Array.from(document.querySelectorAll("svg text")).map((e) => e.textContent ?? ""),
      title: document.title,
      project: document.querySelector('[data-role="project"]')?.textContent,
      csp: document.querySelector('meta[http-equiv="Content-Security-Policy"]')?.getAttribute("content"),
    }));
    expect(dom.loaders).toEqual([]);
    expect(dom.attrs).toEqual([]);
    expect(dom.csp).toBe("default-src 'none'; style-src 'unsafe-inline'; img-src data:");
    for (const mark of Object.values(HOSTILE)) expect(dom.marks).toContain(mark);
    expect(dom.svgText.some((t) => t.includes("<img src=x"))).toBe(true);
    expect(dom.project).toBe("<script>alert('title')</script>");
    expect(dom.title).toBe("Calculation report: <script>alert('title')</script>");
    expect(await page.locator("td.source", { hasText: `Zone ${HOSTILE_ZONE} × trib` }).count()).toBeGreaterThan(0);
    await page.evaluate(() => {
      for (const e of Array.from(document.querySelectorAll("*"))) e.dispatchEvent(new MouseEvent("mouseover", { bubbles: true }));
    });
    await page.screenshot({ path: join(OUT, "hostile-marks.png"), clip: { x: 0, y: 0, width: PAGE.width, height: 1056 } });
    await page.locator('section.member.flexural').first().screenshot({ path: join(OUT, "hostile-first-member.png") });
    expect(dialogs).toEqual([]);
    expect(requests).toEqual([]);
  });

  it("renders a member of sample building (a) for review (the README's picture comes from here)", async () => {
    const out = join(dir, "office.html");
    expect((await cli("report", join(ROOT, "sample-workbooks", "steel-office-us.xlsx"), "-o", out, "--only", "2-H1", "--date", "2025-01-15")).status).toBe(0);
    await open(readFileSync(out, "utf8"));
    const top = await page.locator('[data-mark="2-H1"]').evaluate((e) => e.getBoundingClientRect().top + window.scrollY);
    await page.screenshot({ path: join(OUT, "sample-2-H1-page.png"), fullPage: true, clip: { x: 0, y: Math.max(0, top - 12), width: PAGE.width, height: 1120 } });
    const pdf = await page.pdf({ format: "Letter", printBackground: true });
    writeFileSync(join(OUT, "sample-2-H1.pdf"), pdf);
    if (pdftoppm()) execFileSync("pdftoppm", ["-png", "-r", "80", join(OUT, "sample-2-H1.pdf"), join(OUT, "sample-2-H1-pdf")]);
    expect(requests).toEqual([]);
  });
});

/** Whether poppler's pdftoppm is here (only to turn the PDFs into pictures for review). */
function pdftoppm(): boolean {
  try {
    execFileSync("pdftoppm", ["-v"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}
