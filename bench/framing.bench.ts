/**
 * Framing-plan derivation throughput (issue 12): reading the Grids, Levels, Framing and Decks
 * tables of an invented plan and deriving supports, bearings, column stacks and the one-way
 * strip-rule loads, for 5, 10, 20 and 40 levels of 513 members each (10 x 6 bays of 30 ft x 24 ft:
 * 77 columns, 66 girders, 370 beams, one deck per bay). Target: 40 levels (20,520 members) under
 * 2 s, time growing linearly with the number of levels. Pure engine: no build needed. The process
 * CPU time is printed beside the wall time: on a machine shared with other work the wall time is
 * the larger (and the first size carries the warm-up of the JIT).
 */
import { derive, readPlan } from "../src/engine/framing";
import type { CellValue, TableData } from "../src/engine/takedown/types";
import { report, timeMs } from "./timing";

const BAYS_X = 10;
const BAYS_Y = 6;
const BAY_X = 30;
const BAY_Y = 24;
const INFILL = 5;

function tables(levels: number): { framing: TableData; decks: TableData; grids: TableData; levels: TableData } {
  const f: CellValue[][] = [["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2", "wD"]];
  const d: CellValue[][] = [["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2"]];
  const g: CellValue[][] = [["Grid", "X", "Y"]];
  for (let i = 0; i <= BAYS_X; i++) g.push([`X${i}`, i * BAY_X, null]);
  for (let j = 0; j <= BAYS_Y; j++) g.push([`Y${j}`, null, j * BAY_Y]);
  const lv: CellValue[][] = [["Level", "Elevation"]];
  for (let l = 1; l <= levels; l++) {
    const L = `L${l}`;
    lv.push([L, 13 * l]);
    for (let i = 0; i <= BAYS_X; i++) for (let j = 0; j <= BAYS_Y; j++) f.push([`${L}-C${i}.${j}`, "column", L, `X${i}`, `Y${j}`]);
    for (let i = 0; i <= BAYS_X; i++) for (let j = 0; j < BAYS_Y; j++) f.push([`${L}-G${i}.${j}`, "girder", L, `X${i}`, `Y${j}`, `X${i}`, `Y${j + 1}`, 50]);
    for (let i = 0; i < BAYS_X; i++) {
      for (let j = 0; j <= BAYS_Y; j++) f.push([`${L}-E${i}.${j}`, "beam", L, `X${i}`, `Y${j}`, `X${i + 1}`, `Y${j}`]);
      for (let j = 0; j < BAYS_Y; j++) {
        for (let k = 1; k <= INFILL; k++) f.push([`${L}-B${i}.${j}.${k}`, "beam", L, `X${i}`, `Y${j}+${(k * BAY_Y) / (INFILL + 1)}`, `X${i + 1}`, `Y${j}+${(k * BAY_Y) / (INFILL + 1)}`]);
        d.push([`${L}-D${i}.${j}`, L, "one-way", "Office", "y", `X${i}`, `Y${j}`, `X${i + 1}`, `Y${j + 1}`]);
      }
    }
  }
  const t = (sheet: string, values: CellValue[][]): TableData => ({ sheet, top: 0, left: 0, values });
  return { framing: t("Framing", f), decks: t("Decks", d), grids: t("Grids", g), levels: t("Levels", lv) };
}

/** Prints read and derive times per size. */
export async function run(): Promise<void> {
  for (const levels of [5, 10, 20, 40]) {
    const tb = tables(levels);
    const members = tb.framing.values.length - 1;
    let problems = 0;
    let reading: ReturnType<typeof readPlan> | null = null;
    const cpu0 = process.cpuUsage();
    const readMs = await timeMs(() => (reading = readPlan(tb)));
    const deriveMs = await timeMs(() => (problems = derive(reading!.plan).problems.length + reading!.problems.length));
    const cpu = process.cpuUsage(cpu0);
    report(`${levels} levels, ${members} members: process CPU time (read + derive)`, (cpu.user + cpu.system) / 1000, "ms");
    report(`${levels} levels, ${members} members: read tables`, readMs, "ms");
    report(`${levels} levels, ${members} members: derive (${problems} problems)`, deriveMs, "ms");
    report(`${levels} levels, ${members} members: total`, readMs + deriveMs, "ms", levels === 40 ? "< 2000 ms" : undefined);
    report(`${levels} levels: per 1,000 members`, ((readMs + deriveMs) * 1000) / members, "ms", "flat (linear growth)");
  }
}

if (process.argv[1]?.endsWith("framing.bench.ts")) void run();
