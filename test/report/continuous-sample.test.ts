/**
 * `loadpath report` on the two-storey sample (continuous joists from a Bearings table, walls
 * stacked and standing on a beam): the report plans the takedown again with the Bearings table, so
 * the sheet read back agrees with the build (three reactions per joist, not two). Runs the command
 * in process with the built functions bundle (needs `npm run build`).
 */
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { expect, it } from "vitest";
import { cli } from "./helpers";

const ROOT = resolve(__dirname, "../..");

it("reports the two-storey sample: every joist with its interior support, the walls and the beam under a wall", async () => {
  const out = join(mkdtempSync(join(tmpdir(), "loadpath-report-two-storey-")), "house.html");
  const r = await cli("report", join(ROOT, "sample-workbooks", "two-storey-house-si.xlsx"), "-o", out, "--units", "SI", "--only", "FJ1,B2-C,W1-B");
  expect(r.err).toEqual([]);
  expect(r.status).toBe(0);
  expect(existsSync(out)).toBe(true);
  const html = readFileSync(out, "utf8");
  for (const mark of ["FJ1", "B2-C", "W1-B"]) expect(html).toContain(`data-mark="${mark}"`);
});
