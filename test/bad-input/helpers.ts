/**
 * Helpers of the bad-input corpus: the CLI run in process (src/cli/main.ts, every line it prints
 * collected) or as a real child process (bin/loadpath.js, needs `npm run build`), file digests
 * to prove inputs and earlier outputs unchanged, and workbooks written from plain rows.
 */
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import type { RawCellContent } from "hyperformula";
import { main, type CliIO } from "../../src/cli/main";

export const ROOT = resolve(__dirname, "../..");
export const SAMPLE_US = join(ROOT, "sample-workbooks", "steel-office-us.xlsx");
export const SAMPLE_SI = join(ROOT, "sample-workbooks", "timber-house-si.xlsx");
export const BIN = join(ROOT, "bin", "loadpath.js");

/** What a run printed and its exit status. */
export interface Run {
  readonly status: number;
  readonly out: string[];
  readonly err: string[];
}

/** Run `loadpath <args>` in process. */
export async function cli(...args: string[]): Promise<Run> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
  const status = await main(args, io);
  return { status, out, err };
}

/** SHA-256 of a file, or "missing". */
export function digest(path: string): string {
  return existsSync(path) ? createHash("sha256").update(readFileSync(path)).digest("hex") : "missing";
}

/** Names in a folder, sorted (temporary files included: none may be left behind). */
export function listing(dir: string): string[] {
  return readdirSync(dir).sort();
}

/** Write sheets of plain values (header row first) as an .xlsx file. */
export async function writeSheets(path: string, sheets: Record<string, RawCellContent[][]>): Promise<void> {
  const wb = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) {
    const ws = wb.addWorksheet(name);
    rows.forEach((r, i) => r.forEach((v, j) => v !== null && v !== undefined && (ws.getCell(i + 1, j + 1).value = v as ExcelJS.CellValue)));
  }
  await wb.xlsx.writeFile(path);
}

/**
 * Run bin/loadpath.js as a child process; when `closeAfterFirstChunk`, the reading end of its
 * stdout is closed as soon as the first output arrives (as `| head -1` does).
 */
export function child(args: readonly string[], closeAfterFirstChunk: boolean): Promise<{ code: number | null; signal: string | null; stdout: string; stderr: string }> {
  return new Promise((done, fail) => {
    const p = spawn(process.execPath, [BIN, ...args], { stdio: ["ignore", "pipe", "pipe"], cwd: ROOT });
    let stdout = "";
    let stderr = "";
    p.stdout.on("data", (chunk: Buffer) => {
      stdout += chunk.toString();
      if (closeAfterFirstChunk) p.stdout.destroy();
    });
    p.stderr.on("data", (chunk: Buffer) => void (stderr += chunk.toString()));
    p.on("error", fail);
    p.on("close", (code, signal) => done({ code, signal, stdout, stderr }));
  });
}
