/**
 * `loadpath plan`: a small plan workbook built here (the drawing fixture's tables), the sample
 * workbooks (typed tables: the schematic key plan), options, problems with their cells, exit
 * statuses and the input never written over. Runs the command in process (src/cli/main.ts).
 * Needs `npm run build` (tables are read through the headless engine, as in every verb).
 */
import { createHash } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import type { CellValue } from "../../src/engine/takedown/types";
import { byRole, numAttr, parseSvg } from "../drawings/svg-query";
import { DECKS, FRAMING, GRIDS, HOSTILE_MARK, LEVELS } from "../drawings/plan-fixture";

const ROOT = resolve(__dirname, "../..");
const dir = mkdtempSync(join(tmpdir(), "loadpath-plan-"));
const PLAN = join(dir, "plan.xlsx");
const BROKEN = join(dir, "broken.xlsx");

async function run(...args: string[]): Promise<{ status: number; out: string[]; err: string[] }> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
  const status = await main(["plan", ...args], io);
  return { status, out, err };
}

async function workbook(path: string, sheets: Record<string, CellValue[][]>): Promise<void> {
  const wb = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) {
    const ws = wb.addWorksheet(name);
    rows.forEach((r, i) => (ws.getRow(i + 1).values = r.map((v) => (v === null ? undefined : v)) as ExcelJS.CellValue[]));
  }
  await wb.xlsx.writeFile(path);
}

const digest = (path: string) => createHash("sha256").update(readFileSync(path)).digest("hex");

beforeAll(async () => {
  await workbook(PLAN, { Grids: GRIDS, Levels: LEVELS, Framing: FRAMING, Decks: DECKS });
  // B9 ends at (40, 12): on no column and no member of higher rank (Framing row 2, X2 cell F2)
  await workbook(BROKEN, { Grids: GRIDS, Levels: LEVELS, Framing: [FRAMING[0]!, ["B9", "beam", "2", 40, 0, 40, 12], ...FRAMING.slice(1)], Decks: DECKS });
});

describe("loadpath plan on a plan workbook", () => {
  it("writes every level on one HTML page, the input untouched", async () => {
    const before = digest(PLAN);
    const out = join(dir, "plan.html");
    const r = await run(PLAN, "-o", out);
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    expect(r.out.join("\n")).toMatch(/Framing plan of 2 level\(s\)/);
    const html = readFileSync(out, "utf8");
    expect(html.match(/<svg /g)).toHaveLength(2);
    expect(html).toContain("Level Roof framing plan");
    expect(html).not.toContain("<script");
    expect(html).toContain("&lt;script&gt;");
    expect(digest(PLAN)).toBe(before);
  });

  it("writes one level as SVG with --level, highlighting --select", async () => {
    const out = join(dir, "level2.svg");
    const r = await run(PLAN, "-o", out, "--level", "2", "--select", HOSTILE_MARK);
    expect(r.status).toBe(0);
    const root = parseSvg(readFileSync(out, "utf8"));
    expect(root.getAttribute("data-plan-level")).toBe("2");
    const b2 = byRole(root, "plan-member").find((e) => e.getAttribute("data-plan-mark") === HOSTILE_MARK)!;
    // 10 ft x 24 ft less the 3 ft x 6 ft of the opening on its side (hand statics)
    expect(numAttr(b2, "data-tributary-area")).toBeCloseTo(222, 9);
    expect(byRole(root, "plan-selection")).toHaveLength(1);
  });

  it("checks without -o and writes nothing", async () => {
    const r = await run(PLAN);
    expect(r.status).toBe(0);
    expect(r.out.join("\n")).toMatch(/check only, nothing written/);
  });

  it("refuses usage errors with status 2 and writes nothing", async () => {
    const svg = join(dir, "no-level.svg");
    expect((await run(PLAN, "-o", svg)).status).toBe(2);
    expect(existsSync(svg)).toBe(false);
    const badLevel = await run(PLAN, "-o", join(dir, "x.svg"), "--level", "9");
    expect(badLevel.status).toBe(2);
    expect(badLevel.err.join("\n")).toMatch(/--level "9" is not a level of the plan \(levels: 2, Roof\)/);
    expect((await run(PLAN, "-o", join(dir, "x.pdf"))).status).toBe(2);
    expect((await run(PLAN, "-o", PLAN)).status).toBe(2);
    expect((await run(PLAN, "--select", "NOPE")).status).toBe(2);
    expect((await run(PLAN, "--units", "metric")).status).toBe(2);
    expect((await run(PLAN, "--map", "framing")).status).toBe(2);
  });

  it("lists problems with their cells, exits 1 and still writes the drawing", async () => {
    const out = join(dir, "broken.html");
    const r = await run(BROKEN, "-o", out);
    expect(r.status).toBe(1);
    expect(r.err.some((l) => /^Framing!F2: The end of B9 \(40, 12\) is on no column/.test(l))).toBe(true);
    const html = readFileSync(out, "utf8");
    expect(html).toMatch(/Problems \(1\)/);
    expect(html).toContain("Framing!F2");
  });
});

describe("loadpath plan: headers of the user's own", () => {
  it("--map renames a plan column; units shown in the headers (m) make the drawing SI", async () => {
    const path = join(dir, "mapped.xlsx");
    const head = ["Mark", "Type", "Level", "Start x (m)", "Y1 (m)", "X2 (m)", "Y2 (m)"];
    await workbook(path, { Grids: GRIDS, Levels: LEVELS, Framing: [head, ...FRAMING.slice(1)], Decks: DECKS });
    const without = await run(path);
    expect(without.status).toBe(1);
    expect(without.err.join("\n")).toMatch(/X1/);
    const out = join(dir, "mapped.svg");
    const r = await run(path, "-o", out, "--level", "2", "--map", "framing.X1=Start x");
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    const root = parseSvg(readFileSync(out, "utf8"));
    expect(root.getElementsByTagName("text")[1]!.textContent).toMatch(/^Coordinates in m;/);
    const b2 = byRole(root, "plan-member").find((e) => e.getAttribute("data-plan-mark") === HOSTILE_MARK)!;
    expect(numAttr(b2, "data-tributary-area")).toBeCloseTo(222, 9);
  });
});

describe("loadpath plan on the sample workbooks (typed tables: key plan)", () => {
  for (const name of ["steel-office-us.xlsx", "timber-house-si.xlsx"]) {
    it(`${name}: a schematic key plan of every level and member`, async () => {
      const out = join(dir, `${name}.html`);
      const r = await run(join(ROOT, "sample-workbooks", name), "-o", out);
      expect(r.err).toEqual([]);
      expect(r.status).toBe(0);
      const html = readFileSync(out, "utf8");
      const svg = parseSvg(html.slice(html.indexOf("<svg"), html.indexOf("</svg>") + 6));
      expect(svg.getAttribute("data-role")).toBe("key-plan");
      // every member row of the sample's Members table is drawn (read here with ExcelJS)
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.readFile(join(ROOT, "sample-workbooks", name));
      const ws = wb.getWorksheet("Members")!;
      const marks: string[] = [];
      ws.eachRow((row, i) => {
        const v = row.getCell(1).value;
        if (i > 1 && typeof v === "string" && v.trim() !== "") marks.push(v.trim());
      });
      expect(marks.length).toBeGreaterThan(10);
      const drawn = new Set(byRole(svg, "key-member").map((e) => e.getAttribute("data-plan-mark")));
      for (const m of marks) expect(drawn.has(m), m).toBe(true);
      expect(html).toContain("Not to scale");
    });
  }
});
