/**
 * The pane in a real browser: Debian's Chromium (playwright-core, no downloaded browser) on the
 * demo page (dist/pane-demo.html), which runs the same pane over the in-memory workbook with the
 * sample building. Totals are checked against sums computed here, independently of the engine,
 * from the sample's own input tables. Screenshots go to test-output/. Needs `npm run build`.
 */
import { mkdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { DIST, launch, missingPrerequisite, serve } from "./harness";
import { appliedTotals, findTable, memberRows, type SampleJson } from "./sample-totals";
import { SAMPLE_FILE, mistakesOf } from "../../src/taskpane-demo/sample-data";

const OUT = resolve(__dirname, "..", "..", "test-output");
const missing = missingPrerequisite();
if (missing && process.env.CI) throw new Error(`Browser tests cannot run: ${missing}`);

let server: Awaited<ReturnType<typeof serve>>;
let browser: Awaited<ReturnType<typeof launch>>;
let context: BrowserContext;
const sample = (): SampleJson => JSON.parse(readFileSync(join(DIST, "samples", SAMPLE_FILE), "utf8")) as SampleJson;

beforeAll(async () => {
  if (missing) return;
  mkdirSync(OUT, { recursive: true });
  server = await serve();
  browser = await launch(320, 900);
  context = browser.context;
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** A fresh page on the demo, with console errors collected; resolves when the pane is interactive. */
async function open(query = ""): Promise<{ page: Page; errors: string[]; readyMs: number }> {
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  await page.goto(`${server.url}pane-demo.html${query}`);
  await page.waitForSelector('[data-testid="build"]:not([disabled])', { timeout: 60_000 });
  const readyMs = await page.evaluate(() => performance.getEntriesByName("loadpath-pane-ready")[0]?.startTime ?? Number.NaN);
  return { page, errors, readyMs };
}

async function build(page: Page): Promise<void> {
  await page.click('[data-testid="build"]');
  await page.waitForSelector('[data-testid="result"]', { timeout: 120_000 });
}

describe.skipIf(missing !== null)("the pane on the demo page", () => {
  it("loads without console errors, says it is not connected to Excel, and carries the caution", async () => {
    const { page, errors, readyMs } = await open();
    console.log(`pane interactive ${readyMs.toFixed(0)} ms after navigation (demo page, Chromium, 320 px)`);
    expect(await page.textContent('[data-testid="connection"]')).toMatch(/Not connected to Excel/);
    expect(await page.textContent('[data-testid="caution"]')).toMatch(/qualified engineer/);
    // Readable at the narrowest pane width: nothing wider than the 320 px viewport.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
    await page.evaluate(() => window.scrollTo(0, 0)); // the demo's sticky stand-in at the top of a full-page shot
    await page.screenshot({ path: join(OUT, "pane-start.png"), fullPage: true });
    expect(errors).toEqual([]);
    await page.close();
  });

  it("finds the sample's tables by their headers", async () => {
    const { page } = await open();
    const s = sample();
    expect(await page.inputValue('[data-role="zones"]')).toBe(findTable(s, "zones").name);
    expect(await page.inputValue('[data-role="members"]')).toBe(findTable(s, "members").name);
    const loads = s.tables.find((t) => findTable(s, "loads", true)?.name === t.name);
    expect(await page.inputValue('[data-role="loads"]')).toBe(loads?.name ?? "");
    // The optional Bearings list (continuous members): the sample has no such table, so None.
    expect(await page.inputValue('[data-role="bearings"]')).toBe("");
    await page.close();
  });

  it("builds from the keyboard and shows member counts, levels and totals that match sums of the input tables", async () => {
    const { page, errors } = await open();
    // Keyboard only: Tab to the build button and press Enter.
    let onBuild = false;
    for (let i = 0; i < 80 && !onBuild; i++) {
      await page.keyboard.press("Tab");
      onBuild = await page.evaluate(() => document.activeElement?.getAttribute("data-testid") === "build");
    }
    expect(onBuild).toBe(true);
    await page.keyboard.press("Enter");
    await page.waitForSelector('[data-testid="summary"]', { timeout: 120_000 });
    const s = sample();
    const rows = memberRows(s);
    expect(Number(await page.textContent('[data-testid="member-total"]'))).toBe(rows.length);
    const levels = (await page.textContent('[data-testid="levels"]'))!.split(", ").filter((x) => x !== "");
    expect(new Set(levels)).toEqual(new Set(rows.map((r) => String(r.Level ?? "")).filter((x) => x !== "")));
    const expected = appliedTotals(s);
    for (const [loadCase, total] of Object.entries(expected)) {
      const row = page.locator(`tr[data-case="${loadCase}"]`);
      const applied = Number(await row.locator("[data-applied]").getAttribute("data-applied"));
      const supports = Number(await row.locator("[data-supports]").getAttribute("data-supports"));
      expect(applied).toBeCloseTo(total, 6);
      expect(supports).toBeCloseTo(total, 6); // load balance: everything applied reaches the ground
    }
    await page.evaluate(() => window.scrollTo(0, 0)); // the demo's sticky stand-in at the top of a full-page shot
    await page.screenshot({ path: join(OUT, "pane-built.png"), fullPage: true });
    expect(errors).toEqual([]);
    await page.close();
  });

  it("lists an unknown support and a cycle, and a click selects the right cell", async () => {
    const { page } = await open("?sample=mistakes");
    await build(page);
    const codes = await page.$$eval("[data-problem]", (els) => els.map((e) => e.getAttribute("data-problem")));
    expect(codes).toContain("unknownSupport");
    expect(codes).toContain("cycle");
    const planted = mistakesOf(sample());
    const unknown = page.locator('[data-problem="unknownSupport"]').first();
    expect(await unknown.getAttribute("data-cell")).toBe(planted.unknownSupportCell);
    await unknown.click();
    await page.waitForSelector(`[data-testid="demo-selected"][data-cell="${planted.unknownSupportCell}"]`);
    const cycle = page.locator('[data-problem="cycle"]').first();
    await cycle.click();
    const cycleCell = await cycle.getAttribute("data-cell");
    expect(planted.cycleCells).toContain(cycleCell);
    await page.waitForSelector(`[data-testid="demo-selected"][data-cell="${cycleCell}"]`);
    await page.evaluate(() => window.scrollTo(0, 0)); // the demo's sticky stand-in at the top of a full-page shot
    await page.screenshot({ path: join(OUT, "pane-problems.png"), fullPage: true });
    await page.close();
  });

  it("names each column's header cell, puts a column given twice first with both uses, and saves the matching without building", async () => {
    const { page } = await open();
    await page.getByRole("button", { name: /^Members:/ }).click();
    const endAt = '[data-column="members:End at"]';
    const startAt = '[data-column="members:Start at"]';
    expect(await page.getAttribute(endAt, "data-state")).toBe("found");
    // The hint under each column names the cell it is taken from.
    expect(await page.locator("text=/Taken from [A-Z]+[0-9]+: Start at/").count()).toBeGreaterThan(0);
    const ownEnd = await page.inputValue(endAt);
    // End at given the Start at column: one column for two is ambiguous, listed first, and blocks the build.
    await page.selectOption(endAt, await page.inputValue(startAt));
    await page.waitForSelector(`${endAt}[data-state="ambiguous"]`);
    const states = await page.$$eval('[data-column^="members:"]', (els) => els.map((e) => e.getAttribute("data-state")));
    expect(states[0]).toBe("ambiguous");
    expect(await page.locator("text=/is already taken for Start at/").count()).toBe(1);
    expect(await page.isDisabled('[data-testid="build"]')).toBe(true);
    await page.selectOption(endAt, ownEnd);
    await page.waitForSelector(`${endAt}[data-state="found"]`);
    expect(await page.textContent('[data-testid="matching-state"]')).toMatch(/Changed since it was saved|Not saved yet/);
    await page.click('[data-testid="save-matching"]');
    await page.waitForSelector('[data-testid="matching-state"]:has-text("Saved on the sheet")');
    expect(await page.locator('[data-testid="result"]').count()).toBe(0); // saving builds nothing
    await page.close();
  });

  it("keeps the column matching and the units across a reload", async () => {
    const { page } = await open();
    const s = sample();
    const headers = findTable(s, "members").headers;
    // Two columns swapped (KLL read from the wD column and wD from the KLL column): each column is
    // still given once, so the matching is not ambiguous and must come back as chosen.
    const wd = headers.find((h) => /^wD/i.test(h))!;
    const kll = headers.find((h) => /^KLL/i.test(h))!;
    await page.getByRole("button", { name: /^Members:/ }).click();
    await page.selectOption('[data-column="members:KLL"]', wd);
    await page.selectOption('[data-column="members:wD"]', kll);
    await page.getByRole("radio", { name: /^SI/ }).check();
    await page.reload();
    await page.waitForSelector('[data-testid="build"]');
    await page.getByRole("button", { name: /^Members:/ }).click();
    expect(await page.inputValue('[data-column="members:KLL"]')).toBe(wd);
    expect(await page.inputValue('[data-column="members:wD"]')).toBe(kll);
    expect(await page.getByRole("radio", { name: /^SI/ }).isChecked()).toBe(true);
    await page.evaluate(() => localStorage.clear());
    await page.close();
  });
});
