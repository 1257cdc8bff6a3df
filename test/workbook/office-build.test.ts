/**
 * A whole takedown build (the real orchestrator, src/workbook/takedown-build.ts) through the
 * Office.js adapter on the office-addin-mock model of Excel, for invented frames of about 50 and
 * 5,000 members: the number of round trips does not follow the member count (only the megabytes
 * written and the rows read back, in blocks), and nothing lands outside the add-in's sheet.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { OfficeWorkbookPort } from "../../src/workbook/office";
import { buildTakedown, WRITE_BLOCK_ROWS } from "../../src/workbook/takedown-build";
import { FakeExcel } from "./office-fake";
import { frameOfSize, makeFrame } from "./takedown-fixtures";

afterEach(() => vi.unstubAllGlobals());

async function buildFrame(members: number): Promise<{ fake: FakeExcel; members: number; rows: number; writeSyncs: number; userBefore: string[] }> {
  const frame = makeFrame(members <= 60 ? { levels: 4, bays: 1, beamsPerBay: 6 } : frameOfSize(members));
  const sheets = Object.fromEntries(Object.entries(frame.sheets).map(([n, rows]) => [n, rows.map((r) => r.map((c) => (c === null ? "" : (c as string | number | boolean))))]));
  const fake = new FakeExcel(sheets);
  vi.stubGlobal("Excel", fake.excel());
  const userBefore = Object.keys(sheets).map((s) => fake.snapshot(s));
  const result = await buildTakedown(new OfficeWorkbookPort(), { zones: "Zones", members: "Members", units: "US" });
  expect(result.problems.filter((p) => p.code !== "badValue")).toEqual([]);
  expect(result.ok).toBe(true);
  const writeSyncs = new Set(fake.writes.filter((w) => w.kind === "formulas").map((w) => w.sync)).size;
  const rows = Math.max(...fake.writes.map((w) => w.top + w.rows));
  return { fake, members: frame.memberCount, rows, writeSyncs, userBefore };
}

describe("a build through the Office adapter", () => {
  it("takes a fixed number of round trips plus one per request of formulas and per 5,000 rows read back", async () => {
    const small = await buildFrame(50);
    const large = await buildFrame(5000);
    expect(small.members).toBeGreaterThanOrEqual(40);
    expect(large.members).toBeGreaterThanOrEqual(5000);
    // Fixed part: everything but the write requests and the blocks of rows read back.
    const fixed = (b: typeof small): number => b.fake.syncs - b.writeSyncs - Math.ceil(b.rows / 5000);
    expect(fixed(large)).toBe(fixed(small));
    console.log(
      `syncs per build: ${small.members} members -> ${small.fake.syncs} (${small.writeSyncs} write request(s)); ` +
        `${large.members} members -> ${large.fake.syncs} (${large.writeSyncs} write request(s), ${large.rows} rows, blocks of ${WRITE_BLOCK_ROWS} rows queued)`,
    );
    expect(small.fake.syncs).toBeLessThanOrEqual(15);
    expect(large.fake.syncs).toBeLessThanOrEqual(25);
    for (const b of [small, large]) {
      expect(new Set(b.fake.writes.map((w) => w.sheet))).toEqual(new Set(["Takedown"]));
      expect(["Zones", "Members"].map((s) => b.fake.snapshot(s))).toEqual(b.userBefore);
      expect(b.fake.writes.filter((w) => w.kind === "formulas").every((w) => !w.eventsOn && w.calcSuspended)).toBe(true);
      expect(Math.max(...b.fake.writes.map((w) => w.bytes))).toBeLessThan(4_000_000);
    }
  });
});
