/**
 * Writes src/taskpane-demo/demo-building.json, the invented building the demo page opens when
 * no sample workbook is configured (see DEMO_SAMPLE in webpack.config.js): three levels of a
 * regular steel frame, two bays each way, as two Excel-style tables (Zones, Members).
 * Run: npx tsx src/taskpane-demo/make-demo-building.ts
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { makeFrame } from "../../test/workbook/takedown-fixtures";
import { cellAddress } from "../workbook/a1";
import type { SampleJson, SampleCell } from "./sample-data";

const frame = makeFrame({ levels: 3, bays: 2, beamsPerBay: 2 });
const sheets = Object.entries(frame.sheets).map(([name, rows]) => ({ name, rows: rows.map((r) => r.map((c) => (c ?? null) as SampleCell)) }));
const tables = sheets.map((s) => ({ name: s.name, sheet: s.name, ref: `A1:${cellAddress(s.rows.length - 1, (s.rows[0]?.length ?? 1) - 1)}` }));
const sample: SampleJson & { generated: string } = { generated: "by src/taskpane-demo/make-demo-building.ts; do not edit", sheets, tables };
writeFileSync(join(__dirname, "demo-building.json"), JSON.stringify(sample, null, 1) + "\n");
console.log(`demo-building.json: ${frame.memberCount} members`);
