/**
 * `--tolerance`: the framing plan's snapping tolerance on the command line. One beam end of the
 * plan office (sample-workbooks/make-plan-office.ts) is moved 0.01 ft off the girder it bears on
 * (grid offset "1+0.01"): with the default tolerance (1/16 in = 0.0052 ft) that end stands on
 * nothing, a problem at its cell; with --tolerance 0.02 it is on the girder again and the
 * takedown builds with no problem. A tolerance that is not a positive length is refused (exit 2).
 */
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import { planOffice, writePlanWorkbook } from "../../sample-workbooks/make-plan-office";

const dir = mkdtempSync(join(tmpdir(), "loadpath-tolerance-"));

async function run(...args: string[]): Promise<{ status: number; text: string }> {
  const lines: string[] = [];
  const io: CliIO = { out: (l) => void lines.push(l), err: (l) => void lines.push(l) };
  const status = await main(args, io);
  return { status, text: lines.join("\n") };
}

describe("loadpath takedown --tolerance", () => {
  it("snaps an end 0.01 ft off its girder only when the tolerance exceeds 0.01 ft", async () => {
    const tables = planOffice();
    const framing = tables.find((t) => t.name === "Framing")!;
    // a beam whose start is on grid line 1 away from any grid intersection (it bears on the girder there)
    const index = framing.rows.findIndex((r) => r[1] === "beam" && r[3] === "1" && typeof r[4] === "number");
    expect(index).toBeGreaterThanOrEqual(0);
    const row = framing.rows[index]!;
    const moved = { ...framing, rows: framing.rows.map((r, i) => (i === index ? [r[0]!, r[1]!, r[2]!, "1+0.01", ...r.slice(4)] : r)) };
    const path = join(dir, "moved.xlsx");
    await writePlanWorkbook(path, tables.map((t) => (t === framing ? moved : t)), "one end moved 0.01 ft");
    const cell = `D${index + 2}`; // Framing!D: X1; row 1 holds the headers

    const strict = await run("takedown", path, "--json", join(dir, "strict.json"));
    expect(strict.status, strict.text).toBe(1);
    expect(strict.text).toContain(String(row[0]));
    expect(strict.text).toMatch(new RegExp(`Framing!\\$?${cell.replace(/\d+/, "")}\\$?${index + 2}`));

    const loose = await run("takedown", path, "--tolerance", "0.02", "--json", join(dir, "loose.json"));
    expect(loose.status, loose.text).toBe(0);
  });

  it("refuses a tolerance that is not a positive length (exit 2, naming the option)", async () => {
    for (const bad of ["0", "-1", "abc", ""]) {
      const r = await run("takedown", join(dir, "moved.xlsx"), "--tolerance", bad);
      expect(r.status, bad).toBe(2);
      expect(r.text).toContain("--tolerance");
    }
    const e = await run("export", join(dir, "moved.xlsx"), "--tolerance", "0.02", "-o", join(dir, "x.xlsx"));
    expect(e.status).toBe(2);
    expect(e.text).toContain("--tolerance");
  });
});
