/**
 * The command line of the hand-off version: `loadpath takedown --native` and `loadpath export`
 * on the sample workbooks, run through the dispatcher as a user runs them; what they print,
 * their exit statuses, and that the files they write call no add-in function.
 */
import { copyFileSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import { readXlsx } from "../../src/workbook/xlsx";
import { scratchDir } from "./programs";

const scratch = scratchDir("loadpath-handoff-cli-");
afterAll(() => scratch.remove());
const SAMPLES = join(__dirname, "..", "..", "sample-workbooks");

async function run(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
  const code = await main(argv, io);
  return { code, out: out.join("\n"), err: err.join("\n") };
}

async function addInCalls(path: string): Promise<string[]> {
  const wb = await readXlsx(path);
  return wb.formulas.filter((f) => /LOADPATH|_xldudf_/i.test(f.formula)).map((f) => `${f.sheet}!${f.col},${f.row}`);
}

describe("loadpath takedown --native", () => {
  it("builds the SI sample with classic functions only and lists the members whose governing values are written as values", async () => {
    const out = join(scratch.dir, "si-native.xlsx");
    const r = await run("takedown", join(SAMPLES, "timber-house-si.xlsx"), "-o", out, "--units", "SI", "--native");
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    // Reactions, shears and moments stay live formulas; the governing values over the live load patterns are add-in results.
    expect(r.out).toMatch(/every load, reaction, shear, moment, column load and the balance is a live formula in classic spreadsheet functions/);
    expect(r.out).toMatch(/the governing values over combinations and live load patterns and the deflection checks of \d+ member\(s\) are values computed by the add-in/);
    expect(await addInCalls(out)).toEqual([]);
    const wb = await readXlsx(out);
    expect(wb.sheets.map((s) => s.name)).toEqual(expect.arrayContaining(["Takedown", "Takedown extremes"]));
  });

  it("without --native the same build calls the add-in (the option is what changes it)", async () => {
    const out = join(scratch.dir, "si-addin.xlsx");
    const r = await run("takedown", join(SAMPLES, "timber-house-si.xlsx"), "-o", out, "--units", "SI");
    expect(r.code).toBe(0);
    expect(r.out).not.toMatch(/Hand-off version/);
    expect((await addInCalls(out)).length).toBeGreaterThan(10);
  });
});

describe("loadpath export", () => {
  it("hands off the US sample (tables only in the file): prints what it rebuilt, the governing values as value-only cells, the notice and the caution", async () => {
    const out = join(scratch.dir, "us-handoff.xlsx");
    const r = await run("export", join(SAMPLES, "steel-office-us.xlsx"), "-o", out);
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Hand-off workbook written to/);
    expect(r.out).toMatch(/Takedown: \d+ members rebuilt with classic spreadsheet functions/);
    // Only the governing values over the live load patterns (add-in only) are values.
    const listed = r.out.split("\n").filter((l) => /^ {4}Takedown!/.test(l));
    expect(listed.length).toBeGreaterThan(0);
    for (const l of listed) expect(l).toMatch(/governing values over the load combinations and live load patterns/);
    expect(r.out).toMatch(/Notice sheet: "Read me"/);
    expect(r.out).toMatch(/qualified engineer/);
    expect(await addInCalls(out)).toEqual([]);
  });

  it("lists every add-in result of the beam schedule as a value, by cell and mark", async () => {
    const out = join(scratch.dir, "schedule-handoff.xlsx");
    const input = join(SAMPLES, "beam-schedule.xlsx");
    const calls = (await readXlsx(input)).formulas.filter((f) => /LOADPATH/i.test(f.formula)).length;
    const r = await run("export", input, "-o", out);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/No takedown sheet/);
    expect(r.out).toMatch(new RegExp(`Written as values \\(not live; recompute with the add-in after a change\\): ${calls} cell\\(s\\)`));
    expect(r.out).toMatch(/Beams!\w+\d+ \([A-Z]+-\d+\)/);
    expect(await addInCalls(out)).toEqual([]);
  });

  it("without -o checks only and says so; refuses bad usage with status 2: the input as output, unknown units, a bad sheet name", async () => {
    const input = join(SAMPLES, "steel-office-us.xlsx");
    const check = await run("export", input);
    expect(check.code).toBe(0);
    expect(check.out).toMatch(/check only, nothing written/);
    expect((await run("export", input, "-o", input)).code).toBe(2);
    // The JSON named as the input would write over it too (a copy, so a failure cannot harm the sample).
    const copy = join(scratch.dir, "input-copy.xlsx");
    copyFileSync(input, copy);
    const before = readFileSync(copy);
    expect((await run("export", copy, "-o", join(scratch.dir, "w.xlsx"), "--json", copy)).code).toBe(2);
    expect(readFileSync(copy).equals(before)).toBe(true);
    expect((await run("export", input, "-o", join(scratch.dir, "x.xlsx"), "--units", "metric")).code).toBe(2);
    const badSheet = await run("export", input, "-o", join(scratch.dir, "y.xlsx"), "--sheet", "Loads/2");
    expect(badSheet.code).toBe(2);
    expect(badSheet.err).toMatch(/--sheet "Loads\/2": Excel does not allow "\/"/);
    expect((await run("export", join(scratch.dir, "missing.xlsx"), "-o", join(scratch.dir, "z.xlsx"))).code).toBe(2);
  });

  it("a takedown with problems writes nothing and exits 1", async () => {
    const out = join(scratch.dir, "bad.xlsx");
    const r = await run("export", join(SAMPLES, "steel-office-us.xlsx"), "-o", out, "--zones", "Zones", "--members", "Loads");
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/nothing written/);
    const { existsSync } = await import("node:fs");
    expect(existsSync(out)).toBe(false);
  });
});
