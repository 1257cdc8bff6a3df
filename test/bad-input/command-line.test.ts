/**
 * Bad-input corpus, command line (issue 10 class F and the control characters of class E): one
 * set of table options with one meaning in every verb, units read from the headers with a hint
 * naming the option that fits, exit 1 with the partial output written in every verb, checks
 * only without -o, sheet names checked before the build, control characters never printed, and
 * the verbs' shared pieces in one module they import. Each case checks the message, the exit
 * status and that the input is unchanged.
 */
import { readFileSync, readdirSync } from "node:fs";
import { mkdirSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { printable } from "../../src/cli/shared";
import { readXlsx } from "../../src/workbook/xlsx";
import { framingSheets } from "../report/framing";
import { cli, digest, listing, ROOT, SAMPLE_SI, writeSheets } from "./cli-helpers";

const dir = mkdtempSync(join(tmpdir(), "loadpath-bad-cli-"));
const VERBS = ["takedown", "report", "export"] as const;

/** The report tests' invented framing with renamed tables and one header that needs --map. */
async function renamedFraming(path: string, extraMember?: (string | number | null)[]): Promise<void> {
  const s = framingSheets();
  const members = s.Members!.map((r, i) => (i === 0 ? r.map((h) => (h === "Trib (ft)" ? "Trib width (ft)" : h)) : [...r]));
  if (extraMember) members.push(extraMember);
  await writeSheets(path, { "Load schedule": s.Zones!, Framing: members, "Extra loads": s.Loads! });
}

const ALL_TABLE_OPTIONS = ["--zones", "Load schedule", "--members", "Framing", "--loads", "Extra loads", "--map", "members.Trib=Trib width", "--units", "US", "--sheet", "Gravity takedown", "--replace"];

describe("the same table options with the same meaning in every verb", () => {
  it("takedown, report and export take --zones --members --loads --map --units --sheet --replace; without -o they check only, say so and write nothing", async () => {
    const folder = join(dir, "options");
    mkdirSync(folder);
    const input = join(folder, "framing.xlsx");
    await renamedFraming(input);
    const before = digest(input);
    for (const verb of VERBS) {
      const r = await cli(verb, input, ...ALL_TABLE_OPTIONS);
      expect(r.err, verb).toEqual([]);
      expect(r.status, verb).toBe(0);
      expect(r.out.join("\n"), verb).toMatch(/check only/i);
    }
    expect(listing(folder)).toEqual(["framing.xlsx"]);
    expect(digest(input)).toBe(before);
  });

  it("with -o every verb builds from the tables named and puts the takedown on the sheet named", async () => {
    const folder = join(dir, "options-written");
    mkdirSync(folder);
    const input = join(folder, "framing.xlsx");
    await renamedFraming(input);
    const before = digest(input);
    for (const verb of ["takedown", "export"] as const) {
      const out = join(folder, `${verb}.xlsx`);
      const r = await cli(verb, input, "-o", out, ...ALL_TABLE_OPTIONS);
      expect(r.status, verb).toBe(0);
      expect((await readXlsx(out)).sheets.map((s) => s.name), verb).toContain("Gravity takedown");
    }
    const html = join(folder, "report.html");
    expect((await cli("report", input, "-o", html, "--only", "G1", ...ALL_TABLE_OPTIONS)).status).toBe(0);
    expect(readFileSync(html, "utf8")).toContain("G1");
    expect(digest(input)).toBe(before);
  });

  it("--members names the Members table in every verb (report's old --members-table and member list are gone)", async () => {
    const folder = join(dir, "members-option");
    mkdirSync(folder);
    const input = join(folder, "framing.xlsx");
    await renamedFraming(input);
    for (const verb of VERBS) {
      const missing = await cli(verb, input, "--zones", "Load schedule", "--map", "members.Trib=Trib width");
      expect(missing.status, verb).toBe(2);
      expect(missing.err.join("\n"), verb).toMatch(/no Members table or sheet; name it with --members\./);
    }
    const old = await cli("report", input, "--members-table", "Framing");
    expect(old.status).toBe(2);
    expect(old.err.join("\n")).toMatch(/Unknown option '--members-table'/);
    // A mark given to --members is a table name now, not a member of the report.
    const asMark = await cli("report", input, "--zones", "Load schedule", "--members", "G1");
    expect(asMark.status).not.toBe(0);
  });
});

describe("--units", () => {
  it("left out, the headers' units choose the system; given against them, every verb names the option that fits", async () => {
    const before = digest(SAMPLE_SI);
    for (const verb of VERBS) {
      const fits = await cli(verb, SAMPLE_SI);
      expect(fits.status, verb).toBe(0);
      const wrong = await cli(verb, SAMPLE_SI, "--units", "US");
      expect(wrong.status, verb).toBe(1);
      expect(wrong.err.join("\n"), verb).toMatch(/kPa, but a US takedown reads D in psf/);
      expect(wrong.err, verb).toContain(`loadpath ${verb}: the table headers show SI units (m, kPa, kN/m, kN); run with --units SI.`);
    }
    expect(digest(SAMPLE_SI)).toBe(before);
  });

  it("anything but US or SI is a usage error in every verb", async () => {
    for (const verb of VERBS) {
      const r = await cli(verb, SAMPLE_SI, "--units", "metric");
      expect(r.status, verb).toBe(2);
      expect(r.err.join("\n"), verb).toMatch(/--units is US or SI \(got "metric"\)/);
    }
  });
});

describe("exit 1: problems found, what could be built is still written, in every verb", () => {
  it("a member with an unknown support: takedown, report and export all exit 1, write their file and list the problem; the hand-off notice names it", async () => {
    const folder = join(dir, "problems");
    mkdirSync(folder);
    const input = join(folder, "framing.xlsx");
    await renamedFraming(input, ["B9", "beam", "2", 24, "OFF", 4, "G7", 5, "G2", 5, null, 40]);
    const before = digest(input);
    const problem = `Framing!G14: B9: Start support "G7" is not a mark in the Members table.`;
    const options = ["--zones", "Load schedule", "--members", "Framing", "--loads", "Extra loads", "--map", "members.Trib=Trib width"];
    const outputs = { takedown: "t.xlsx", report: "r.html", export: "e.xlsx" } as const;
    for (const verb of VERBS) {
      const r = await cli(verb, input, "-o", join(folder, outputs[verb]), ...options);
      expect(r.status, verb).toBe(1);
      expect(r.err, verb).toContain(problem);
    }
    expect(listing(folder)).toEqual(["e.xlsx", "framing.xlsx", "r.html", "t.xlsx"]);
    const notice = (await readXlsx(join(folder, "e.xlsx"))).sheets.find((s) => s.name === "Read me")!;
    const text = notice.rows.flat().filter((v): v is string => typeof v === "string").join("\n");
    expect(text).toMatch(/Problems found \(1\): the members they concern are left out/);
    expect(text).toContain(problem);
    expect(digest(input)).toBe(before);
  });
});

describe("--sheet names are checked before the build (Excel's rules)", () => {
  const cases: [string, RegExp][] = [
    ["", /a sheet name cannot be empty/],
    ["x".repeat(32), /32 characters; Excel allows at most 31/],
    ["Loads: level 2", /does not allow ":"/],
    ["A/B", /does not allow "\/"/],
    ["What?", /does not allow "\?"/],
    ["[draft]", /does not allow "\["/],
    ["'quoted", /cannot begin or end with an apostrophe/],
    ["History", /"History" is reserved by Excel/],
  ];
  it("every verb refuses a name Excel would refuse, with status 2 and nothing written", async () => {
    const folder = join(dir, "sheet-names");
    mkdirSync(folder);
    const input = join(folder, "framing.xlsx");
    await writeSheets(input, framingSheets());
    const before = digest(input);
    for (const verb of VERBS) {
      for (const [name, message] of cases) {
        const r = await cli(verb, input, "-o", join(folder, verb === "report" ? "out.html" : "out.xlsx"), "--sheet", name);
        expect(r.status, `${verb} --sheet ${name}`).toBe(2);
        expect(r.err.join("\n"), `${verb} --sheet ${name}`).toMatch(message);
      }
    }
    expect(listing(folder)).toEqual(["framing.xlsx"]);
    expect(digest(input)).toBe(before);
    // 31 characters and an apostrophe inside are fine.
    expect((await cli("takedown", input, "--sheet", "O'Brien takedown level 2 and 3.")).status).toBe(0);
  });
});

describe("control characters never reach the terminal", () => {
  it("marks and file names holding escape codes are printed without them (takedown, report, export, recalc)", async () => {
    const folder = join(dir, "escapes");
    mkdirSync(folder);
    // Excel stores control characters in cell text as _xHHHH_; the reader turns them back into ESC, BEL, CSI.
    const input = join(folder, "framing.xlsx");
    const s = framingSheets();
    s.Members!.push(["B9_x001B_]0;owned_x0007__x001B_[31m", "beam", "2", 24, "OFF", 4, "G7_x001B_[2J", 5, "G2", 5, null, 40]);
    await writeSheets(input, s);
    expect(JSON.stringify((await readXlsx(input)).sheets.find((x) => x.name === "Members")!.rows[13]![0])).toContain("\\u001b");
    const before = digest(input);
    for (const verb of [...VERBS, "recalc"]) {
      const r = verb === "recalc" ? await cli(verb, input) : await cli(verb, input, "--map", "members.Trib=Trib");
      const printed = [...r.out, ...r.err].join("\n");
      expect(printed, verb).not.toMatch(/[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/);
      if (verb !== "recalc") expect(printed, verb).toContain(`B9]0;owned[31m: Start support "G7[2J" is not a mark in the Members table.`);
    }
    const bad = await cli("takedown", join(folder, "no\u001b[2Jsuch.xlsx"));
    expect(bad.status).toBe(2);
    expect(bad.err.join("\n")).toMatch(/no\[2Jsuch\.xlsx: no such file/);
    expect(digest(input)).toBe(before);
  });

  it("printable() removes C0 (but tab and line feed), DEL, C1 and the bidirectional overrides, and nothing else", () => {
    expect(printable("a\u001b[31mb\u0007c\u009b2Jd\re\u202Ef\u2066g\u007F")).toBe("a[31mbc2Jdefg");
    expect(printable("Mark\tLevel\nB-12 ½ kN·m ² é 中")).toBe("Mark\tLevel\nB-12 ½ kN·m ² é 中");
  });
});

describe("what the verbs share lives in one module they import", () => {
  it("no verb imports the entry point, and the shared module imports none of them", () => {
    const commands = join(ROOT, "src", "cli", "commands");
    for (const file of readdirSync(commands)) {
      const source = readFileSync(join(commands, file), "utf8");
      expect(source, file).not.toMatch(/from "\.\.\/main"/);
    }
    const shared = readFileSync(join(ROOT, "src", "cli", "shared.ts"), "utf8");
    expect(shared).not.toMatch(/from "\.\/(main|commands\/)/);
    expect(shared).toMatch(/export const EXIT = \{ ok: 0, failed: 1, usage: 2 \}/);
  });
});
