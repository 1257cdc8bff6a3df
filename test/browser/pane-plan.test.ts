/**
 * The pane's plan section, in Debian's Chromium (playwright-core) on the demo page with the US
 * sample building (typed member tables, so the schematic key plan): it shows at 320 px; clicking
 * a member on the plan selects that member's row of the Members table (the demo page records the
 * cell the pane selects, as Excel would select it); selecting a row (through the page's stand-in
 * for Excel's selection) highlights that member and what it bears on; the level picker and the
 * zoom redraw it. Expected rows, levels and supports come from the sample's own Members table
 * (dist/samples, the data the workbook was made from), not from the pane. A screenshot at 320 px
 * goes to docs/images/pane-plan.png (shown in the README). Needs `npm run build`.
 */
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { DIST, launch, missingPrerequisite, serve } from "./harness";
import { SAMPLE_FILE, columnOf, membersTableOf, type SampleJson } from "../../src/taskpane-demo/sample-data";
import { cellAddress } from "../../src/workbook/a1";

const ROOT = resolve(__dirname, "..", "..");
const IMAGES = join(ROOT, "docs", "images");
const missing = missingPrerequisite();
if (missing && process.env.CI) throw new Error(`Browser tests cannot run: ${missing}`);

/** A beam and the girder that carries it: invented marks of the sample. */
const BEAM = "3-B01";
const GIRDER = "3-G1AB";

let server: Awaited<ReturnType<typeof serve>>;
let browser: Awaited<ReturnType<typeof launch>>;

const sample = (): SampleJson => JSON.parse(readFileSync(join(DIST, "samples", SAMPLE_FILE), "utf8")) as SampleJson;

/** The sample's Members table as rows of text by header. */
function memberRows(): { cell: string; get: (header: string) => string }[] {
  const t = membersTableOf(sample());
  const mark = columnOf(t, "Mark");
  return t.body.flatMap((r, i) =>
    r[mark] === null || r[mark] === undefined || r[mark] === ""
      ? []
      : [{ cell: `${t.sheet}!${cellAddress(t.top + 1 + i, t.left + mark)}`, get: (h: string) => String(r[columnOf(t, h)] ?? "") }],
  );
}

function rowOf(mark: string): { cell: string; get: (header: string) => string } {
  const row = memberRows().find((r) => r.get("Mark") === mark);
  expect(row).toBeDefined();
  return row!;
}

beforeAll(async () => {
  if (missing) return;
  server = await serve();
  browser = await launch(320, 900);
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function openBuilt(): Promise<{ page: Page; errors: string[] }> {
  const page = await browser.context.newPage();
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  await page.goto(`${server.url}pane-demo.html`);
  await page.waitForSelector('[data-testid="build"]:not([disabled])', { timeout: 60_000 });
  await page.click('[data-testid="build"]');
  await page.waitForSelector('[data-testid="plan-figure"] svg', { timeout: 120_000 });
  return { page, errors };
}

const chip = (mark: string): string => `[data-testid="plan-figure"] [data-role="key-member"][data-plan-mark="${mark}"]`;

describe.skipIf(missing !== null)("the plan in the pane", () => {
  it("shows at 320 px, selects a member's row from the plan, and highlights the selected row", async () => {
    const { page, errors } = await openBuilt();
    // At pane width: nothing wider than the viewport, the drawing as wide as the section.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
    const fig = await page.$eval('[data-testid="plan-figure"] svg', (e) => e.getBoundingClientRect().width);
    expect(fig).toBeGreaterThan(260);
    expect(fig).toBeLessThanOrEqual(320);

    // Every member of the sample's Members table is on the key plan, on its level.
    const rows = memberRows();
    const drawn = await page.$$eval('[data-testid="plan-figure"] [data-role="key-member"]', (els) => els.map((e) => [e.getAttribute("data-plan-mark"), e.getAttribute("data-plan-level")]));
    for (const r of rows) expect(drawn).toContainEqual([r.get("Mark"), r.get("Level")]);

    // Clicking the beam on the plan selects its row of the Members table (the Mark cell).
    await page.click(chip(BEAM));
    await page.waitForSelector(`[data-testid="demo-selected"][data-cell="${rowOf(BEAM).cell}"]`, { timeout: 30_000 });
    await page.waitForSelector(`${chip(BEAM)}[data-highlight="selected"]`);

    // Selecting the girder's row (Excel's selection, through the stand-in) highlights it on the
    // plan, and what it bears on (its Start and End supports in the table) as its load path.
    await page.selectOption('[data-testid="demo-member-row"]', rowOf(GIRDER).cell);
    await page.waitForSelector(`${chip(GIRDER)}[data-highlight="selected"]`, { timeout: 30_000 });
    expect(await page.locator(`${chip(BEAM)}[data-highlight]`).count()).toBe(0);
    for (const s of [rowOf(GIRDER).get("Start support"), rowOf(GIRDER).get("End support")]) {
      expect(s).not.toBe("");
      expect(await page.getAttribute(chip(s), "data-highlight")).toBe("path");
    }

    // The level picker: the girder's level alone, the girder still highlighted.
    const level = rowOf(GIRDER).get("Level");
    await page.selectOption('[data-testid="plan-level"]', level);
    await page.waitForSelector(`[data-testid="plan-figure"][data-level="${level}"]`);
    const levels = await page.$$eval('[data-testid="plan-figure"] [data-role="key-member"]:not([data-type="foundation"])', (els) => els.map((e) => e.getAttribute("data-plan-level")));
    expect(levels.length).toBe(rows.filter((r) => r.get("Level") === level).length);
    expect(new Set(levels)).toEqual(new Set([level]));
    expect(await page.getAttribute(chip(GIRDER), "data-highlight")).toBe("selected");

    // Screenshot of the section at 320 px for the README.
    mkdirSync(IMAGES, { recursive: true });
    await page.evaluate(() => window.scrollTo(0, 0));
    const box = await page.$eval('section[aria-labelledby="lp-plan"]', (e) => {
      const r = e.getBoundingClientRect();
      return { y: r.top + window.scrollY, height: r.height };
    });
    await page.screenshot({ path: join(IMAGES, "pane-plan.png"), fullPage: true, clip: { x: 0, y: Math.max(0, box.y - 8), width: 320, height: Math.min(box.height + 16, 900) } });
    expect(existsSync(join(IMAGES, "pane-plan.png"))).toBe(true);

    // Zoom: the drawing is redrawn wider and scrolls inside its box; the pane stays 320 px.
    await page.click('[data-testid="plan-zoom-in"]');
    await page.waitForSelector('[data-testid="plan-zoom"][data-zoom="1.5"]');
    const zoomed = await page.$eval('[data-testid="plan-figure"] svg', (e) => e.getBoundingClientRect().width);
    expect(zoomed).toBeGreaterThan(fig * 1.4);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
    // Still linked when zoomed: clicking the girder, then the beam, selects each one's row.
    await page.click(chip(GIRDER));
    await page.waitForSelector(`[data-testid="demo-selected"][data-cell="${rowOf(GIRDER).cell}"]`, { timeout: 30_000 });
    await page.click(chip(BEAM));
    await page.waitForSelector(`[data-testid="demo-selected"][data-cell="${rowOf(BEAM).cell}"]`, { timeout: 30_000 });
    expect(errors).toEqual([]);
    await page.close();
  });
});
