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

/**
 * A zip archive (stored, no compression) holding the given files: the shape of a .xlsx file
 * without its workbook parts (APPNOTE.TXT local headers, central directory, end record).
 */
export function zipOf(files: Record<string, string>): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const [name, text] of Object.entries(files)) {
    const data = Buffer.from(text);
    const nameBytes = Buffer.from(name);
    const crc = crc32(data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(data.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(nameBytes.length, 26);
    locals.push(local, nameBytes, data);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(data.length, 20);
    central.writeUInt32LE(data.length, 24);
    central.writeUInt16LE(nameBytes.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, nameBytes);
    offset += 30 + nameBytes.length + data.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(Object.keys(files).length, 8);
  end.writeUInt16LE(Object.keys(files).length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

/** CRC-32 (ISO 3309, the zip format's checksum). */
function crc32(data: Buffer): number {
  let c = 0xffffffff;
  for (const byte of data) {
    c ^= byte;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return (c ^ 0xffffffff) >>> 0;
}
