/**
 * `loadpath report` on .xlsx files: what it writes for the sample building and the invented
 * framing, the members chosen, usage errors and exit statuses, problems carried into the report,
 * the project name taken from the workbook, the demo's report part, and that the HTML holds no
 * element that loads anything. Runs the command in process with the built functions bundle
 * (needs `npm run build`).
 */
import { createHash } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { reportDemoPart } from "../../src/cli/commands/report";
import type { CliIO } from "../../src/cli/main";
import { readXlsx } from "../../src/workbook/xlsx";
import { projectName } from "../../src/cli/commands/report";
import { cli, writeSheets } from "./helpers";
import { framingSheets } from "./framing";

const ROOT = resolve(__dirname, "../..");
const SAMPLE_US = join(ROOT, "sample-workbooks", "steel-office-us.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-report-"));
const FRAMING = join(dir, "framing.xlsx");
const digest = (path: string) => createHash("sha256").update(readFileSync(path)).digest("hex");

/** Marks of the member sections of a report, in order. */
function sectionMarks(html: string): string[] {
  return [...html.matchAll(/<section class="member [^"]*" id="member-\d+" data-mark="([^"]*)"/g)].map((m) => m[1]!);
}

/** Elements and attributes that could make a page load something. */
function loaders(html: string): string[] {
  const found: string[] = [];
  for (const m of html.matchAll(/<(script|link|img|iframe|object|embed|video|audio|source|base|form|image|use|foreignObject)\b/gi)) found.push(m[0]);
  for (const m of html.matchAll(/\s(src|srcset|href|xlink:href|action|poster|data)\s*=\s*"([^"]*)"/gi)) if (!(m[1]!.toLowerCase() === "href" && m[2]!.startsWith("#"))) found.push(m[0]);
  if (/url\(/i.test(html)) found.push("url(");
  if (/@import/i.test(html)) found.push("@import");
  return found;
}

beforeAll(async () => {
  await writeSheets(FRAMING, framingSheets(), "Invented framing for the report tests");
});

describe("loadpath report", () => {
  it("writes the report of the chosen members of sample (a) and leaves the input as it was", async () => {
    const before = digest(SAMPLE_US);
    const out = join(dir, "office.html");
    const r = await cli("report", SAMPLE_US, "-o", out, "--only", "2-H1, C2B-2", "--only", "2-G2AB", "--date", "2025-01-15");
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    expect(r.out.join("\n")).toMatch(/Calculation report of 3 member\(s\) written to/);
    expect(digest(SAMPLE_US)).toBe(before);
    const html = readFileSync(out, "utf8");
    // Sections in takedown order (the header's girder after the header; the column after the level's girders).
    expect(sectionMarks(html)).toEqual(["2-H1", "2-G2AB", "C2B-2"]);
    expect(html).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`);
    expect(html.match(/qualified \(licensed\) engineer/g)).toHaveLength(2);
    expect(html).toContain("2025-01-15");
    expect(html).toContain("ASCE/SEI 7-22");
    expect(loaders(html)).toEqual([]);
  });

  it("prints numbers for people: no exponent in the load balance, symmetric corner columns alike", async () => {
    const out = join(dir, "office-numbers.html");
    const r = await cli("report", SAMPLE_US, "-o", out, "--only", "C1A-Roof");
    expect(r.status).toBe(0);
    const html = readFileSync(out, "utf8");
    /** The visible text of the cells of a row (full values in data-value attributes left aside). */
    const cells = (row: string) => [...row.matchAll(/<t[dh]\b[^>]*>([^<]*)<\/t[dh]>/g)].map((m) => m[1]!);
    const balance = [...html.matchAll(/<tr data-role="balance" data-case="([^"]+)">(.*?)<\/tr>/g)];
    expect(balance.map((m) => m[1])).toEqual(["D", "L", "Lr", "S"]);
    // Sample (a)'s D and L differences are round-off of 1.1e-13 and -5.7e-14 kip (printed 1.1e-13 before).
    for (const [, , row] of balance) {
      expect(cells(row!).join(" ")).not.toMatch(/e[-+\u2212]/);
      expect(cells(row!).at(-1)).toBe("0.00");
    }
    // The roof corner columns (sample-workbooks/make-buildings.ts: lines 1 and 3 by rows A and C)
    // carry the same loads by symmetry; their rows print alike but for the mark.
    const column = (mark: string) => cells(html.match(new RegExp(`<tr data-role="column" data-mark="${mark}">(.*?)</tr>`))![1]!).slice(1);
    const corners = ["C1A-Roof", "C3A-Roof", "C1C-Roof", "C3C-Roof"].map((m) => column(m).join(" | "));
    expect(corners[0]).toContain("3.75");
    expect(new Set(corners).size).toBe(1);
    expect(new Set(["C1A-3", "C3A-3", "C3C-3"].map((m) => column(m).join(" | "))).size).toBe(1);
  });

  it("details every beam, girder and column by default and with --all", async () => {
    const a = join(dir, "all.html");
    const b = join(dir, "default.html");
    expect((await cli("report", FRAMING, "-o", a, "--all", "--date", "d")).status).toBe(0);
    expect((await cli("report", FRAMING, "-o", b, "--date", "d")).status).toBe(0);
    const marks = sectionMarks(readFileSync(a, "utf8"));
    expect(new Set(marks)).toEqual(new Set(["B1", "B2", "G1", "G2", "C1", "C2", "C3", "C4"]));
    expect(sectionMarks(readFileSync(b, "utf8"))).toEqual(marks);
    // A foundation gets a section when it is named.
    const f = join(dir, "footing.html");
    expect((await cli("report", FRAMING, "-o", f, "--only", "F1")).status).toBe(0);
    expect(sectionMarks(readFileSync(f, "utf8"))).toEqual(["F1"]);
  });

  it("takes the project name from the workbook's title, its defined name Project, else the file name", async () => {
    expect(projectName(await readXlsx(FRAMING), FRAMING)).toBe("Invented framing for the report tests");
    const named = join(dir, "named.xlsx");
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("Cover");
    ws.getCell("B2").value = "Harbour Street annex";
    wb.definedNames.add("Cover!$B$2", "Project");
    await wb.xlsx.writeFile(named);
    expect(projectName(await readXlsx(named), named)).toBe("Harbour Street annex");
    expect(projectName(await readXlsx(SAMPLE_US), SAMPLE_US)).toBe("steel-office-us");
    const out = join(dir, "project.html");
    expect((await cli("report", FRAMING, "-o", out, "--project", "Given <name>")).status).toBe(0);
    expect(readFileSync(out, "utf8")).toContain('<span data-role="project">Given &lt;name&gt;</span>');
  });

  it("refuses bad usage with status 2 and writes nothing", async () => {
    const out = join(dir, "never.html");
    const cases: [string[], RegExp][] = [
      [[], /no input workbook given/],
      [[FRAMING, "-o", out, "--all", "--only", "B1"], /give --only or --all, not both/],
      [[FRAMING, "-o", out, "--only", " , "], /--only lists no mark/],
      [[FRAMING, "-o", out, "--summary", "--only", "B1"], /--summary leaves out the member sheets; give it without --only or --all/],
      [[FRAMING, "-o", out, "--summary", "--all"], /--summary leaves out the member sheets/],
      [[FRAMING, "-o", out, "--only", "B1,B9"], /not in the takedown: B9/],
      [[FRAMING, "-o", out, "--members-table", "Members"], /Unknown option '--members-table'/],
      [[FRAMING, "-o", out, "--units", "metric"], /--units is US or SI/],
      [[FRAMING, "-o", out, "--map", "nonsense"], /--map "nonsense"/],
      [[FRAMING, "-o", FRAMING], /is the input file/],
      [[join(dir, "missing.xlsx"), "-o", out], /loadpath report: /],
    ];
    for (const [args, message] of cases) {
      const r = await cli("report", ...args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.err.join("\n"), args.join(" ")).toMatch(message);
    }
    expect(existsSync(out)).toBe(false);
  });

  it("names the Members table with --members, as every verb does; the members detailed with --only", async () => {
    const renamed = join(dir, "renamed.xlsx");
    const sheets = framingSheets();
    await writeSheets(renamed, { Zones: sheets.Zones!, Framing: sheets.Members!, Loads: sheets.Loads! });
    const out = join(dir, "renamed.html");
    const missing = await cli("report", renamed, "-o", out);
    expect(missing.status).toBe(2);
    expect(missing.err.join("\n")).toMatch(/no Members table or sheet; name it with --members/);
    const r = await cli("report", renamed, "-o", out, "--members", "Framing", "--only", "G1");
    expect(r.status).toBe(0);
    expect(sectionMarks(readFileSync(out, "utf8"))).toEqual(["G1"]);
  });

  it("exits 1 on problems in the tables, lists them in the report and still details the rest", async () => {
    const broken = join(dir, "broken.xlsx");
    const sheets = framingSheets();
    const members = sheets.Members!.map((r) => [...r]);
    members.push(["B9", "beam", "2", 24, "OFF", 4, "G7", 5, "G2", 5, null, 40]);
    await writeSheets(broken, { ...sheets, Members: members });
    const out = join(dir, "broken.html");
    const r = await cli("report", broken, "-o", out, "--only", "G1");
    expect(r.status).toBe(1);
    expect(r.err.join("\n")).toMatch(/Members!G14: B9: Start support "G7" is not a mark in the Members table\./);
    const html = readFileSync(out, "utf8");
    expect(html).toContain("Problems found in the tables");
    expect(html).toContain("B9: Start support &quot;G7&quot; is not a mark in the Members table.");
    expect(sectionMarks(html)).toEqual(["G1"]);
  });

  it("stops with status 1 and no report when the tables cannot be read as meant", async () => {
    const out = join(dir, "none.html");
    const r = await cli("report", join(ROOT, "sample-workbooks", "timber-house-si.xlsx"), "-o", out, "--units", "US");
    expect(r.status).toBe(1);
    expect(r.err.join("\n")).toMatch(/Zones!B1: Zones column "D \(kPa\)" is in kPa, but a US takedown reads D in psf\./);
    expect(r.out.join("\n")).toMatch(/there is no report/);
    expect(existsSync(out)).toBe(false);
  });

  it("demo part: writes the report of sample building (a) and prints its path", async () => {
    const out: string[] = [];
    const err: string[] = [];
    const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
    const outDir = mkdtempSync(join(tmpdir(), "loadpath-report-demo-"));
    const status = await reportDemoPart.run(io, { root: ROOT, outDir });
    expect(err).toEqual([]);
    expect(status).toBe(0);
    const path = join(outDir, "steel-office-us-report.html");
    expect(out).toContain(`Report: ${path}`);
    const html = readFileSync(path, "utf8");
    // Every beam, girder and column of the sample: 44 + 18 + 27.
    expect(sectionMarks(html)).toHaveLength(89);
    expect(loaders(html)).toEqual([]);
  });
});
