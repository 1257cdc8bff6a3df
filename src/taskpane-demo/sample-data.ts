/**
 * The demo page's sample workbook as JSON (made at build time from the sample .xlsx by
 * sample-json.cjs) and the variant with planted mistakes. Pure data handling: the page, the
 * browser tests and their independent sums share it.
 */
import { cellAddress, parseCell } from "../workbook/a1";

/** A cell as stored: value, "=formula" or null. */
export type SampleCell = number | string | boolean | null;

/** The sample workbook: every sheet's rows and every Excel table's extent. */
export interface SampleJson {
  readonly sheets: readonly { readonly name: string; readonly rows: readonly (readonly SampleCell[])[] }[];
  readonly tables: readonly { readonly name: string; readonly sheet: string; readonly ref: string }[];
}

/** The built sample served beside the demo page (dist/samples/). */
export const SAMPLE_FILE = "takedown-sample.json";

/** The SI sample building served beside the demo page (pane-demo.html?sample=timber). */
export const SAMPLE_FILE_SI = "takedown-sample-si.json";

/** The two-storey SI sample (continuous joists from a Bearings table, walls), pane-demo.html?sample=two-storey. */
export const SAMPLE_FILE_TWO_STOREY = "takedown-sample-two-storey.json";

/** A table of the sample: position, headers and body rows. */
export interface SampleTable {
  readonly name: string;
  readonly sheet: string;
  readonly top: number;
  readonly left: number;
  readonly headers: readonly string[];
  readonly body: readonly (readonly SampleCell[])[];
}

/** Read a table of the sample by name. */
export function sampleTable(sample: SampleJson, name: string): SampleTable {
  const t = sample.tables.find((x) => x.name === name);
  if (!t) throw new Error(`The sample has no table "${name}".`);
  const [a, b] = t.ref.replace(/\$/g, "").split(":");
  const p = parseCell(a!);
  const q = parseCell(b ?? a!);
  const rows = sample.sheets.find((s) => s.name === t.sheet)?.rows ?? [];
  const grid = Array.from({ length: q.row - p.row + 1 }, (_, i) => Array.from({ length: q.col - p.col + 1 }, (_, j) => rows[p.row + i]?.[p.col + j] ?? null));
  return { name: t.name, sheet: t.sheet, top: p.row, left: p.col, headers: grid[0]!.map((h) => String(h ?? "")), body: grid.slice(1) };
}

/** Index of a column whose header is `name`, ignoring case and a trailing "(unit)"; -1 if none. */
export function columnOf(table: SampleTable, name: string): number {
  return table.headers.findIndex((h) => h.replace(/\s*\([^)]*\)\s*$/, "").trim().toLowerCase() === name.toLowerCase());
}

/** The members table of the sample (the one with Mark, Span and Start support columns). */
export function membersTableOf(sample: SampleJson): SampleTable {
  for (const t of sample.tables) {
    const table = sampleTable(sample, t.name);
    if (["Mark", "Span", "Start support"].every((h) => columnOf(table, h) >= 0)) return table;
  }
  throw new Error("The sample has no members table.");
}

/** The sample with planted mistakes, and the cells the pane must point to. */
export interface PlantedMistakes {
  readonly sample: SampleJson;
  /** "Sheet!A1" of the start support that names no member. */
  readonly unknownSupportCell: string;
  /** Every cell of the two rows that hold each other up. */
  readonly cycleCells: readonly string[];
}

const LOAD_CARRIERS = new Set(["", "beam", "girder", "joist"]);

/**
 * Plant two mistakes in the members table: the first beam's start support names a member that
 * does not exist, and two girders (or beams) are each made to end on the other (a cycle).
 */
export function mistakesOf(sample: SampleJson): PlantedMistakes {
  const t = membersTableOf(sample);
  const mark = columnOf(t, "Mark");
  const type = columnOf(t, "Type");
  const start = columnOf(t, "Start support");
  const end = columnOf(t, "End support");
  const endAt = columnOf(t, "End at");
  const carriers = t.body.map((r, i) => ({ r, i })).filter(({ r }) => r[mark] !== null && LOAD_CARRIERS.has(String(type >= 0 ? (r[type] ?? "") : "").toLowerCase()));
  if (carriers.length < 3 || end < 0 || endAt < 0) throw new Error("The sample's members table is too small to plant the mistakes in.");
  const [a, b, c] = [carriers[0]!, carriers[carriers.length - 2]!, carriers[carriers.length - 1]!];
  const edits = new Map<string, SampleCell>();
  const at = (i: number, col: number): string => cellAddress(t.top + 1 + i, t.left + col);
  edits.set(at(a.i, start), "NO-SUCH-MEMBER");
  edits.set(at(b.i, end), c.r[mark]!);
  edits.set(at(b.i, endAt), 1);
  edits.set(at(c.i, end), b.r[mark]!);
  edits.set(at(c.i, endAt), 1);
  const sheets = sample.sheets.map((s) =>
    s.name !== t.sheet
      ? s
      : {
          name: s.name,
          rows: s.rows.map((row, r) => {
            const width = Math.max(row.length, t.left + t.headers.length);
            return Array.from({ length: width }, (_, col) => {
              const key = cellAddress(r, col);
              return edits.has(key) ? edits.get(key)! : (row[col] ?? null);
            });
          }),
        },
  );
  const rowCells = (i: number): string[] => t.headers.map((_, col) => `${t.sheet}!${at(i, col)}`);
  return {
    sample: { sheets, tables: sample.tables },
    unknownSupportCell: `${t.sheet}!${at(a.i, start)}`,
    cycleCells: [...rowCells(b.i), ...rowCells(c.i)],
  };
}
