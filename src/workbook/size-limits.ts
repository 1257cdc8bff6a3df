/**
 * Size checks made before a headless takedown allocates anything: the memory a takedown of so
 * many members needs, against the heap this Node process may use. Node-only (reads the heap
 * limit from node:v8); the add-in never imports it.
 *
 * The figures are measured by `npm run bench -- memory` (bench/memory.bench.ts): the largest
 * JavaScript heap in use during `loadpath takedown` was 803 MB at 10,010 members and 2,589 MB at
 * 40,215 members of the invented frames, about 60 kB a member beyond a base of about 200 MB.
 */
import { getHeapStatistics } from "node:v8";
import type { WorkbookPort } from "./port";

/** Heap a takedown needs per member (bytes), rounded up from the measured ~60 kB. */
export const HEAP_BYTES_PER_MEMBER = 70_000;
/** Heap in use before the first member (bytes): the engine, the functions bundle, the file. */
export const HEAP_BASE_BYTES = 200e6;

/**
 * Why a takedown of `members` members cannot run in this process, or undefined when it fits.
 * @param members - rows of the Members table
 * @param heapLimit - bytes the heap may grow to (default: this process's limit)
 * @returns a message naming the member count, the memory needed and how to give it
 */
export function takedownMemoryProblem(members: number, heapLimit: number = getHeapStatistics().heap_size_limit): string | undefined {
  const needed = HEAP_BASE_BYTES + members * HEAP_BYTES_PER_MEMBER;
  if (needed <= 0.9 * heapLimit) return undefined;
  const mb = Math.ceil(needed / 1e6 / 0.9 / 512) * 512;
  return (
    `${members.toLocaleString("en-US")} members: a takedown this large needs about ${(needed / 1e9).toFixed(1)} GB of memory, more than the ` +
    `${(heapLimit / 1e9).toFixed(1)} GB this process may use; run it with a larger heap, e.g. NODE_OPTIONS=--max-old-space-size=${mb} ` +
    `(the machine needs that much free memory), or split the building into parts.`
  );
}

/**
 * Rows with a value below the header of a table (0 when it cannot be read: the build says why).
 * @param port - the workbook
 * @param table - the table, sheet or range of the members
 */
export async function tableRowCount(port: WorkbookPort, table: string): Promise<number> {
  try {
    const data = await port.readTable(table);
    let n = 0;
    for (let i = 1; i < data.values.length; i++) if (data.values[i]!.some((v) => v !== null && v !== "")) n++;
    return n;
  } catch {
    return 0;
  }
}
