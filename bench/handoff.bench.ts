/**
 * Hand-off version figures: `loadpath export` of each sample building, the recalculation of the
 * exported file in Gnumeric and LibreOffice Calc (program start-up included), and the hand-off
 * build of invented frames of about 1,000 and 5,000 members next to the add-in build, with the
 * number of formulas each writes. No target is set by the issue; the figures go in the README.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { exportHandoff } from "../src/cli/commands/export";
import { helperSheetName } from "../src/engine/native/takedown-writer";
import { MemoryWorkbookPort } from "../src/workbook/memory-port";
import { buildTakedown } from "../src/workbook/takedown-build";
import { hasGnumeric, hasLibreOffice, recalcWithGnumeric, recalcWithLibreOffice } from "../test/handoff/programs";
import { frameOfSize, makeFrame } from "../test/workbook/takedown-fixtures";
import { report, timeMs } from "./timing";

/** Formula cells of a sheet of the port. */
function formulaCount(port: MemoryWorkbookPort, sheet: string): number {
  const id = port.hf.getSheetId(sheet);
  if (id === undefined) return 0;
  return port.hf.getSheetSerialized(id).flat().filter((c) => typeof c === "string" && c.startsWith("=")).length;
}

async function frames(): Promise<void> {
  for (const size of [1000, 5000]) {
    const frame = makeFrame(frameOfSize(size));
    for (const native of [false, true]) {
      const port = await MemoryWorkbookPort.create({ sheets: frame.sheets });
      let ok = false;
      const ms = await timeMs(async () => {
        ok = (await buildTakedown(port, { zones: "Zones", members: "Members", units: "US", native })).ok;
      });
      if (!ok) throw new Error(`frame of ${frame.memberCount} members did not build`);
      const label = `${native ? "hand-off" : "add-in"} build, ${frame.memberCount} members`;
      report(label, ms, "ms");
      const helper = native ? formulaCount(port, helperSheetName("Takedown")) : 0;
      report(`  formulas on Takedown${native ? " / on the helper sheet" : ""}`, formulaCount(port, "Takedown"), native ? `/ ${helper.toLocaleString("en-US")}` : "");
    }
  }
}

async function samples(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "loadpath-handoff-bench-"));
  try {
    for (const name of ["steel-office-us", "timber-house-si"]) {
      const out = join(dir, `${name}.xlsx`);
      report(`export ${name}.xlsx`, await timeMs(() => exportHandoff(join(__dirname, "..", "sample-workbooks", `${name}.xlsx`), out)), "ms");
      if (hasGnumeric()) report(`  Gnumeric ssconvert --recalc`, await timeMs(() => recalcWithGnumeric(out, join(dir, `${name}.gn.xlsx`))), "ms");
      if (hasLibreOffice()) report(`  LibreOffice Calc headless convert`, await timeMs(() => recalcWithLibreOffice(out, join(dir, `${name}.lo.xlsx`))), "ms");
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Print the figures. */
export async function run(): Promise<void> {
  await samples();
  await frames();
}
