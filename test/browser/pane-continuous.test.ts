/**
 * The pane on the demo page with the two-storey SI sample (pane-demo.html?sample=two-storey): the
 * table step finds its Bearings table, and the build makes each floor joist one continuous member
 * over three supports, as `loadpath takedown --bearings` does. The joist's reactions drawn in the
 * member sheet are checked against AISC Steel Construction Manual Table 3-23 (continuous beam,
 * two equal spans, uniform load on both: 3wl/8, 10wl/8, 3wl/8; recalled from memory). Needs
 * `npm run build` and Chromium.
 */
import { mkdirSync, readFileSync } from "node:fs";
import { resolve, join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { cellAddress } from "../../src/workbook/a1";
import { DIST, launch, missingPrerequisite, serve } from "./harness";
import { appliedTotals, type SampleJson } from "./sample-totals";
import { SAMPLE_FILE_TWO_STOREY, columnOf, membersTableOf } from "../../src/taskpane-demo/sample-data";

const OUT = resolve(__dirname, "..", "..", "test-output");
const missing = missingPrerequisite();
if (missing && process.env.CI) throw new Error(`Browser tests cannot run: ${missing}`);

let server: Awaited<ReturnType<typeof serve>>;
let browser: Awaited<ReturnType<typeof launch>>;
let context: BrowserContext;
const sample = (): SampleJson => JSON.parse(readFileSync(join(DIST, "samples", SAMPLE_FILE_TWO_STOREY), "utf8")) as SampleJson;

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

describe.skipIf(missing !== null)("the pane with a Bearings table (two-storey sample)", () => {
  it("finds the Bearings table, builds the joists continuous, and the load balance closes", async () => {
    const page = await context.newPage();
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(String(e)));
    await page.goto(`${server.url}pane-demo.html?sample=two-storey`);
    await page.waitForSelector('[data-testid="build"]:not([disabled])', { timeout: 60_000 });
    expect(await page.inputValue('[data-role="bearings"]')).toBe("Bearings");
    await page.click('[data-testid="build"]');
    await page.waitForSelector('[data-testid="summary"]', { timeout: 120_000 });
    // Applied load added up by hand from sample-workbooks/make-buildings.ts (kN): 10 trusses and 10
    // joists over 8.4 m, the walls' own weight 1.35 kN/m over 6 + 3.6 + 2.4 + 6 + 6 + 2.4 m (W2-C1's
    // 3.6 m is End at - Start at on the beam), the beam 0.3 kN/m x 3.6 m, two posts 0.15 kN/m x 2.7 m.
    const hand = {
      D: 10 * (0.85 * 0.6 + 0.05) * 8.4 + 10 * (0.7 * 0.6 + 0.08) * 8.4 + 1.35 * (6 + 3.6 + 2.4 + 6 + 6 + 2.4) + 0.3 * 3.6 + 2 * 0.15 * 2.7,
      L: 10 * 1.9 * 0.6 * 8.4,
      Lr: 10 * 0.96 * 0.6 * 8.4,
      S: 10 * 1.0 * 0.6 * 8.4,
    };
    // The table sums of the other pane tests count wD x Span only; here they miss W2-C1's own weight alone.
    expect(hand.D - appliedTotals(sample()).D!).toBeCloseTo(1.35 * 3.6, 9);
    for (const [loadCase, total] of Object.entries(hand)) {
      const row = page.locator(`tr[data-case="${loadCase}"]`);
      expect(Number(await row.locator("[data-applied]").getAttribute("data-applied"))).toBeCloseTo(total, 6);
      expect(Number(await row.locator("[data-supports]").getAttribute("data-supports"))).toBeCloseTo(total, 6);
    }
    // Joist FJ1's member sheet: three supports, reactions of two equal 4.2 m spans under w = 0.7 kPa x 0.6 m + 0.08 kN/m (D).
    const t = membersTableOf(sample());
    const i = t.body.findIndex((r) => r[columnOf(t, "Mark")] === "FJ1");
    await page.waitForSelector('[data-testid="diagrams"]', { timeout: 120_000 });
    await page.selectOption('[data-testid="case-picker"]', "D");
    await page.selectOption('[data-testid="demo-member-row"]', `${t.sheet}!${cellAddress(t.top + 1 + i, t.left + columnOf(t, "Mark"))}`);
    await page.waitForSelector('[data-testid="member-sheet"][data-mark="FJ1"][data-case="D"]', { timeout: 30_000 });
    const w = 0.7 * 0.6 + 0.08;
    const l = 4.2;
    const drawn = await page.$$eval('[data-testid="member-sheet"] [data-role="reaction"]', (els) => els.map((e) => Number(e.getAttribute("data-value"))));
    expect(drawn).toHaveLength(3);
    [(3 * w * l) / 8, (10 * w * l) / 8, (3 * w * l) / 8].forEach((v, k) => expect(Math.abs(drawn[k]! - v)).toBeLessThanOrEqual(1e-9));
    expect(errors).toEqual([]);
    await page.close();
  });
});
