/**
 * Member diagrams in the pane, in Debian's Chromium (playwright-core) on the demo page with the
 * US sample building (sample-workbooks/steel-office-us.xlsx): after a build, selecting a member's
 * row (through the page's stand-in for Excel's selection) shows that member's free-body, shear
 * and moment diagrams and its load path; the diagram follows the selection and the load case.
 *
 * Reference values come from outside the page: the same sample built by the `loadpath takedown`
 * command in Node (its results JSON, docs/interface.md section 4), and the rows of each member read from
 * the workbook that command wrote (ExcelJS). A hand check of one beam (common practice: a simple
 * span under a uniform load w has reactions wL/2) ties both to the input tables.
 * Screenshots at 320 px go to test-output/. Needs `npm run build`.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { DIST, launch, missingPrerequisite, serve } from "./harness";
import { SAMPLE_FILE, SAMPLE_FILE_SI, columnOf, membersTableOf, type SampleJson } from "../../src/taskpane-demo/sample-data";
import { appliedTotals } from "./sample-totals";
import { cellAddress } from "../../src/workbook/a1";
import type { TakedownJson } from "../../src/workbook/takedown-api";

const ROOT = resolve(__dirname, "..", "..");
const OUT = join(ROOT, "test-output");
const SAMPLE_XLSX = join(ROOT, process.env.LOADPATH_DEMO_SAMPLE ?? "sample-workbooks/steel-office-us.xlsx");
const SAMPLE_SI_XLSX = join(ROOT, "sample-workbooks/timber-house-si.xlsx");
const missing = missingPrerequisite() ?? (existsSync(join(ROOT, "dist", "cli.js")) ? null : "dist/cli.js is missing: run \"npm run build\" first.");
if (missing && process.env.CI) throw new Error(`Browser tests cannot run: ${missing}`);

/** A beam, a girder that carries it, and a column, all invented marks of the sample. */
const BEAM = "3-B01";
const GIRDER = "3-G1AB";

let server: Awaited<ReturnType<typeof serve>>;
let browser: Awaited<ReturnType<typeof launch>>;
let reference: TakedownJson;
let referenceSI: TakedownJson;
/** Mark -> 1-based rows of its block on the Takedown sheet the command wrote. */
const takedownRows = new Map<string, number[]>();
const sample = (file = SAMPLE_FILE): SampleJson => JSON.parse(readFileSync(join(DIST, "samples", file), "utf8")) as SampleJson;

/** Run `loadpath takedown` on a workbook; its results JSON. */
function takedownJson(xlsx: string, dir: string, units: "US" | "SI", out = join(dir, `${units}.xlsx`)): TakedownJson {
  const json = join(dir, `${units}.json`);
  try {
    execFileSync(process.execPath, [join(ROOT, "bin", "loadpath.js"), "takedown", xlsx, "-o", out, "--json", json, "--units", units], { stdio: "pipe" });
  } catch (e) {
    // Exit status 1 means "built, with problems"; the JSON is still written.
    if ((e as { status?: number }).status !== 1) throw e;
  }
  return JSON.parse(readFileSync(json, "utf8")) as TakedownJson;
}

beforeAll(async () => {
  if (missing) return;
  mkdirSync(OUT, { recursive: true });
  const dir = mkdtempSync(join(tmpdir(), "loadpath-diagrams-"));
  try {
    const xlsx = join(dir, "out.xlsx");
    reference = takedownJson(SAMPLE_XLSX, dir, "US", xlsx);
    referenceSI = takedownJson(SAMPLE_SI_XLSX, dir, "SI");
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(xlsx);
    const ws = wb.getWorksheet("Takedown")!;
    let current: string | null = null;
    ws.eachRow({ includeEmpty: true }, (row, r) => {
      const mark = row.getCell(1).value;
      const kind = row.getCell(6).value;
      if (typeof mark === "string" && mark !== "" && reference.members[mark] !== undefined) current = mark;
      else if (typeof mark === "string" && mark !== "") current = null;
      else if (kind === null || kind === undefined) current = null;
      if (current !== null) takedownRows.set(current, [...(takedownRows.get(current) ?? []), r]);
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  server = await serve();
  browser = await launch(320, 900);
  await browser.context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: server.url.replace(/\/$/, "") });
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function openBuilt(query = ""): Promise<{ page: Page; errors: string[] }> {
  const page = await browser.context.newPage();
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  await page.goto(`${server.url}pane-demo.html${query}`);
  await page.waitForSelector('[data-testid="build"]:not([disabled])', { timeout: 60_000 });
  await page.click('[data-testid="build"]');
  await page.waitForSelector('[data-testid="diagrams"]', { timeout: 120_000 });
  return { page, errors };
}

/** The Members-table cell of a mark ("Members!A23"), from the sample's own table. */
function memberCell(mark: string, file = SAMPLE_FILE): string {
  const t = membersTableOf(sample(file));
  const col = columnOf(t, "Mark");
  const i = t.body.findIndex((r) => r[col] === mark);
  expect(i).toBeGreaterThanOrEqual(0);
  return `${t.sheet}!${cellAddress(t.top + 1 + i, t.left + col)}`;
}

/** Reactions drawn in the shown member sheet, in support order. */
async function drawnReactions(page: Page): Promise<number[]> {
  return page.$$eval('[data-testid="member-sheet"] [data-role="reaction"]', (els) => els.map((e) => Number(e.getAttribute("data-value"))));
}

/** Screenshot of the diagrams section across the whole 320 px pane width. */
async function shoot(page: Page, file: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0)); // the demo's sticky stand-in stays at the top, off the section
  const box = await page.$eval('section[aria-labelledby="lp-diagrams"]', (e) => {
    const r = e.getBoundingClientRect();
    return { y: r.top + window.scrollY, height: r.height };
  });
  await page.screenshot({ path: join(OUT, file), fullPage: true, clip: { x: 0, y: Math.max(0, box.y - 8), width: 320, height: box.height + 16 } });
}

async function waitFor(page: Page, mark: string, caseLabel: string): Promise<void> {
  await page.waitForSelector(`[data-testid="member-sheet"][data-mark="${mark}"][data-case="${caseLabel}"]`, { timeout: 30_000 });
}

const near = (a: number, b: number): void => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));

describe.skipIf(missing !== null)("member diagrams in the pane", () => {
  it("shows the selected member's diagrams, follows the selection and the load case, and reads at 320 px", async () => {
    const { page, errors } = await openBuilt();
    // Hand check of the reference (common practice, simple span, uniform load: R = wL/2):
    // 3-B01 spans 30 ft with trib 8.333 ft of OFFICE (70 psf D, 65 psf L) and wD 35 plf.
    near(reference.members[BEAM]!.reactions.D![0]!, ((70 * (25 / 3) + 35) / 1000) * 30 / 2);
    near(reference.members[BEAM]!.reactions.L![1]!, ((65 * (25 / 3)) / 1000) * 30 / 2);

    // A row of the Members table, through the demo's stand-in for Excel's selection.
    await page.selectOption('[data-testid="demo-member-row"]', memberCell(BEAM));
    await page.selectOption('[data-testid="case-picker"]', "D");
    await waitFor(page, BEAM, "D");
    expect(await page.textContent('[data-testid="member-sheet"] [data-role="mark"]')).toBe(BEAM);
    const beamD = await drawnReactions(page);
    expect(beamD).toHaveLength(2);
    beamD.forEach((r, k) => near(r, reference.members[BEAM]!.reactions.D![k]!));
    // The load path delivers the same reactions to the two girders.
    const down = await page.$$eval('[data-testid="load-path"] [data-side="down"][data-depth="1"] [data-role="edge-value"]', (els) => els.map((e) => Number(e.getAttribute("data-value"))));
    expect(down).toHaveLength(2);
    down.forEach((v, k) => near(v, reference.members[BEAM]!.reactions.D![k]!));

    // A row inside the girder's block on the generated sheet: the diagrams follow.
    const rows = takedownRows.get(GIRDER)!;
    expect(rows.length).toBeGreaterThan(1);
    await page.fill('[data-testid="demo-cell"]', `Takedown!C${rows[rows.length - 1]}`);
    await page.click('[data-testid="demo-select-cell"]');
    await waitFor(page, GIRDER, "D");
    expect(await page.textContent('[data-testid="member-sheet"] [data-role="mark"]')).toBe(GIRDER);
    const girderD = await drawnReactions(page);
    girderD.forEach((r, k) => near(r, reference.members[GIRDER]!.reactions.D![k]!));
    // It carries the beams that name it as a support, each at its "Start at" position.
    const carried = await page.$$eval('[data-testid="member-sheet"] [data-role="point-load"]', (els) => els.map((e) => Number(e.getAttribute("data-x"))));
    expect(carried.length).toBeGreaterThan(0);

    // Another case: the values change, and still equal the reference.
    await page.selectOption('[data-testid="case-picker"]', "L");
    await waitFor(page, GIRDER, "L");
    const girderL = await drawnReactions(page);
    girderL.forEach((r, k) => near(r, reference.members[GIRDER]!.reactions.L![k]!));
    expect(girderL[0]).not.toBeCloseTo(girderD[0]!, 3);

    // The case that governs M+: factored per-case loads, the girder's live load reduction on L
    // (its OFFICE live load is reducible; ASCE/SEI 7-22 Sec. 2.3.1 combination 2, Sec. 4.7); one
    // span, so the live load pattern is the whole girder. No load path beside it (that is unfactored, per case).
    const llr = reference.members[GIRDER]!.llrFactor;
    expect(llr).toBeLessThan(1);
    await page.selectOption('[data-testid="case-picker"]', "q:momentMax");
    const label = `M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on all segments (factored), L \u00D7 ${llr.toFixed(2)}`;
    await waitFor(page, GIRDER, label);
    const girderU = await drawnReactions(page);
    girderU.forEach((r, k) => near(r, 1.2 * reference.members[GIRDER]!.reactions.D![k]! + 1.6 * llr * reference.members[GIRDER]!.reactions.L![k]!));
    expect(await page.locator('[data-testid="load-path"]').count()).toBe(0);
    expect(await page.textContent('[data-testid="diagram-caption"]')).toMatch(/^M\+ [\d.]+ kip-ft at [\d.]+ ft: 2\.3\.1 \(2\) 1\.2D \+ 1\.6L; L on all segments\. Factored loads and results \(LRFD\), L \u00D7 0\.\d\d\.$/);

    // Readable at 320 px: nothing wider than the viewport, drawings scaled to the pane.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
    const widths = await page.$$eval('[data-testid="diagrams"] figure svg', (els) => els.map((e) => e.getBoundingClientRect().width));
    for (const w of widths) expect(w).toBeGreaterThan(260);
    await shoot(page, "pane-diagrams.png");
    await page.selectOption('[data-testid="case-picker"]', "D");
    await page.selectOption('[data-testid="demo-member-row"]', memberCell(BEAM));
    await waitFor(page, BEAM, "D");
    await shoot(page, "pane-diagrams-beam.png");
    expect(errors).toEqual([]);
    await page.close();
  });

  it("picks a member from the keyboard, and copies the picture", async () => {
    const { page, errors } = await openBuilt();
    await page.focus('[data-testid="member-picker"]');
    await page.keyboard.press("ArrowDown");
    const first = await page.inputValue('[data-testid="member-picker"]');
    expect(first).not.toBe("");
    await page.waitForSelector(`[data-testid="diagram-caption"][data-mark="${first}"]`, { timeout: 30_000 });
    await page.click('[data-testid="copy-picture"]');
    await page.waitForSelector('[data-testid="diagram-status"]:has-text("copied")');
    const copied = await page.evaluate(async () => {
      const items = await navigator.clipboard.read();
      return items.flatMap((i) => [...i.types]);
    });
    expect(copied).toContain("image/png");
    // No picture insertion on the demo page (the in-memory workbook has no shapes).
    expect(await page.locator('[data-testid="insert-picture"]').count()).toBe(0);
    expect(errors).toEqual([]);
    await page.close();
  });

  it("draws a column's load path (no bending diagram) with its cumulative load at the base", async () => {
    const { page } = await openBuilt();
    const column = Object.entries(reference.columns).find(([, c]) => c.level === "2")![0];
    await page.selectOption('[data-testid="case-picker"]', "D");
    await page.selectOption('[data-testid="member-picker"]', column);
    await page.waitForSelector(`[data-testid="load-path"][data-mark="${column}"]`, { timeout: 30_000 });
    expect(await page.locator('[data-testid="no-bending"]').count()).toBe(1);
    const base = await page.$$eval('[data-testid="load-path"] [data-side="down"][data-depth="1"] [data-role="edge-value"]', (els) => els.map((e) => Number(e.getAttribute("data-value"))));
    expect(base).toHaveLength(1);
    near(base[0]!, reference.columns[column]!.cumulative.D!);
    await page.close();
  });

  it("opens the SI sample (?sample=timber) in SI units and draws a joist with its balcony overhang", async () => {
    const { page, errors } = await openBuilt("?sample=timber");
    expect(await page.getByRole("radio", { name: /^SI/ }).isChecked()).toBe(true);
    for (const [loadCase, total] of Object.entries(appliedTotals(sample(SAMPLE_FILE_SI)))) {
      const applied = Number(await page.locator(`tr[data-case="${loadCase}"] [data-applied]`).getAttribute("data-applied"));
      expect(applied).toBeCloseTo(total, 6);
    }
    // J01: 4.2 m between its beams and a 1.2 m overhang; 0.6 m of FLOOR (0.6 kPa D) inside, of
    // BALCONY (0.6 kPa D) on the overhang, wD 0.15 kN/m: w = 0.51 kN/m over 5.4 m. Statics of a
    // beam with an overhang (common practice): R1 = w (a^2 - c^2) / (2a), a = 4.2, c = 1.2.
    near(referenceSI.members.J01!.reactions.D![0]!, (0.51 * (4.2 ** 2 - 1.2 ** 2)) / (2 * 4.2));
    await page.selectOption('[data-testid="case-picker"]', "D");
    await page.selectOption('[data-testid="demo-member-row"]', memberCell("J01", SAMPLE_FILE_SI));
    await waitFor(page, "J01", "D");
    const r = await drawnReactions(page);
    r.forEach((v, k) => near(v, referenceSI.members.J01!.reactions.D![k]!));
    const supports = await page.$$eval('[data-testid="member-sheet"] [data-role="support"]', (els) => els.map((e) => Number(e.getAttribute("data-x"))));
    expect(supports).toEqual([0, 4.2]);
    expect(await page.textContent('[data-testid="member-sheet"] [data-role="case"]')).toMatch(/span 5\.4 m/);
    await shoot(page, "pane-diagrams-si.png");
    expect(errors).toEqual([]);
    await page.close();
  });
  it("draws the case that governs the quantity picked: J01's M+ with the balcony's live load off, and its least back reaction", async () => {
    const { page, errors } = await openBuilt("?sample=timber");
    // J01 (make-buildings.ts): joists at 0.6 m, FLOOR D 0.6 / L 1.9 kPa on the 4.2 m back span,
    // BALCONY D 0.6 / L 2.9 kPa on the 1.2 m overhang, wD 0.15 kN/m; A_T = 2.52 m², no reduction.
    expect(referenceSI.members.J01!.llrFactor).toBe(1);
    const l = 4.2;
    const a = 1.2;
    const wD = 0.15 + 0.6 * 0.6;
    const wb = 1.2 * wD + 1.6 * 1.9 * 0.6;
    const wo = 1.2 * wD;
    // Statics of the overhanging joist with the balcony's live load off: R1 = w_b l / 2 - w_o a^2 / (2 l),
    // largest sagging moment R1^2 / (2 w_b) where V = 0 (the 1.2 x 0.95 + 1.6 x 2.51 = 5.16 kN·m).
    const r1 = (wb * l) / 2 - (wo * a * a) / (2 * l);
    await page.selectOption('[data-testid="case-picker"]', "q:momentMax");
    await page.selectOption('[data-testid="demo-member-row"]', memberCell("J01", SAMPLE_FILE_SI));
    await waitFor(page, "J01", "M+ governs: 2.3.1 (2) 1.2D + 1.6L; L on span 1 (factored)");
    expect(await page.textContent('[data-testid="diagram-caption"]')).toBe("M+ 5.15 kN\u00B7m at 2.06 m: 2.3.1 (2) 1.2D + 1.6L; L on span 1. Factored loads and results (LRFD).");
    const sagging = await page.$$eval('[data-testid="member-sheet"] [data-role="extreme"][data-kind="max-sagging"]', (els) => els.map((e) => Number(e.getAttribute("data-value"))));
    expect(sagging).toHaveLength(1);
    near(sagging[0]!, (r1 * r1) / (2 * wb));
    near((await drawnReactions(page))[0]!, r1);
    await shoot(page, "pane-diagrams-governing.png");
    // R1 min: the balcony alone carries live load. R1(D) = wD (l^2 - a^2) / (2 l), R1(L on the balcony) = -wL a^2 / (2 l).
    await page.selectOption('[data-testid="case-picker"]', "q:reactionMin:0");
    await waitFor(page, "J01", "R1 min governs: 2.3.1 (2) 1.2D + 1.6L; L on overhang right (factored)");
    const r1Min = 1.2 * ((wD * (l * l - a * a)) / (2 * l)) + 1.6 * ((-2.9 * 0.6 * a * a) / (2 * l));
    near((await drawnReactions(page))[0]!, r1Min);
    expect(await page.textContent('[data-testid="diagram-caption"]')).toBe(`R1 min ${r1Min.toFixed(2)} kN: 2.3.1 (2) 1.2D + 1.6L; L on overhang right. Factored loads and results (LRFD).`);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
    await shoot(page, "pane-diagrams-uplift.png");
    expect(errors).toEqual([]);
    await page.close();
  });
});
