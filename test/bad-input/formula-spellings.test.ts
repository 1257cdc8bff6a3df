/**
 * Bad input, class D: formulas as Excel stores them in .xlsx files, read by `loadpath recalc`.
 * Every literal form Excel writes (exponents `1E-3`, `1.5E+10`, `.5`, percentages, strings with
 * doubled quotes, booleans, error literals), quoted sheet names ('My Sheet'!A1, 'It''s'!A1),
 * absolute, whole-column and whole-row references, `_xlfn.` prefixes, the `_xldudf_LOADPATH_`
 * spelling of add-in calls and workbook defined names (`=Span*2`) must evaluate. Each expected
 * value is worked by hand beside its formula, and the same file recalculated by Gnumeric
 * (`ssconvert --recalc`) must agree wherever Gnumeric evaluates the formula.
 *
 * A cell that cannot be evaluated headless (a structured reference, a function the engine lacks)
 * keeps its formula and cached value in the written file, is listed with its cell and why, makes
 * the exit status 1, and the cells that use it compute from its cached value. A table value
 * computed from a defined name reads the same in a takedown as the number typed in.
 */
import { existsSync } from "node:fs";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { hasGnumeric, recalcWithGnumeric, requireInCi } from "../handoff/programs";
import { hashOf, runCli, scratch, type Ran } from "./reading-helpers";

const dir = scratch("spellings");
const INPUT = join(dir, "corpus.xlsx");
const OUTPUT = join(dir, "corpus-out.xlsx");
/** What the file caches for every formula before recalculation: nothing computed gives it. */
const STALE = -12345;

/** Data!B1 = 20 (named Span), Data!B2 = 4, Data!C1:C3 = 1, 2, 3, Data!B40 and D40 = 1 and 2; 'My Sheet'!A1 = 7 (named Rate); 'It''s'!A1 = 11. */
const CORPUS: readonly { cell: string; formula: string; expected: number | string | boolean; gnumeric?: false }[] = [
  { cell: "A1", formula: "Span*2", expected: 40 },
  { cell: "A2", formula: "Span*Rate", expected: 140 },
  { cell: "A3", formula: "B1*1E-3", expected: 0.02 },
  { cell: "A4", formula: "1.5E+10/B1", expected: 7.5e8 },
  { cell: "A5", formula: "2.5E-2*B2", expected: 0.1 },
  { cell: "A6", formula: "1E3+1", expected: 1001 },
  { cell: "A7", formula: ".5*B1", expected: 10 },
  { cell: "A8", formula: "50%*B1", expected: 10 },
  // Gnumeric computes it, but the text with a quote it caches is not read back by ExcelJS; A10 checks "" there.
  { cell: "A9", formula: '"say ""hi"""', expected: 'say "hi"', gnumeric: false },
  { cell: "A10", formula: 'LEN("""")', expected: 1 },
  { cell: "A11", formula: '"C:\\temp\\"&"x"', expected: "C:\\temp\\x" },
  { cell: "A12", formula: "IF(TRUE,1,2)+IF(FALSE,10,20)", expected: 21 },
  { cell: "A13", formula: "ISNA(#N/A)", expected: true },
  { cell: "A14", formula: "IFERROR(1/0,-1)", expected: -1 },
  { cell: "A15", formula: "'My Sheet'!A1+1", expected: 8 },
  // Gnumeric's .xlsx reader rejects a doubled apostrophe in a sheet name ("Invalid expression").
  { cell: "A16", formula: "'It''s'!A1*2", expected: 22, gnumeric: false },
  { cell: "A17", formula: "$B$1+Data!$B2+B$2", expected: 28 },
  { cell: "A18", formula: "SUM(C:C)", expected: 6 },
  { cell: "A19", formula: "SUM(40:40)", expected: 3 },
  { cell: "A20", formula: "_xlfn.STDEV.S(C1:C3)", expected: 1 },
  { cell: "A21", formula: "_xldudf_LOADPATH_MOMENT_MAX(B1,1.5)", expected: 75, gnumeric: false },
  { cell: "A22", formula: '_xldudf_LOADPATH_DEFLECTION_MAX(B1,1.5,29000,510,"US")', expected: (5 * (1.5 / 12) * 240 ** 4) / (384 * 29000 * 510), gnumeric: false },
  { cell: "A23", formula: '_xldudf_LOADPATH_LL_REDUCE(50,4,900,1,"kip-ft")', expected: 50 * (0.25 + 15 / Math.sqrt(3600)), gnumeric: false },
  { cell: "A24", formula: "-B1^2", expected: 400 },
  { cell: "A25", formula: "SUMPRODUCT(C1:C3,C1:C3)", expected: 14 },
];

/** Cells that cannot be evaluated headless, their cached values, and a cell that uses each. */
const UNEVALUABLE = [
  { cell: "D1", formula: "SUM(Table1[Span])", cached: 99, user: { cell: "E1", formula: "D1+1", expected: 100 } },
  { cell: "D2", formula: '_xlfn.CONCAT("a","b")', cached: "ab", user: { cell: "E2", formula: "LEN(D2)", expected: 2 } },
  { cell: "D3", formula: "NOSUCHFUNCTION(B1)", cached: 5, user: { cell: "E3", formula: "D3*2", expected: 10 } },
] as const;

async function writeCorpus(): Promise<void> {
  const wb = new ExcelJS.Workbook();
  const data = wb.addWorksheet("Data");
  wb.addWorksheet("My Sheet").getCell("A1").value = 7;
  wb.addWorksheet("It's").getCell("A1").value = 11;
  data.getCell("B1").value = 20;
  data.getCell("B2").value = 4;
  [1, 2, 3].forEach((v, i) => (data.getCell(`C${i + 1}`).value = v));
  data.getCell("B40").value = 1;
  data.getCell("D40").value = 2;
  wb.definedNames.add("Data!$B$1", "Span");
  wb.definedNames.add("'My Sheet'!$A$1", "Rate");
  for (const c of CORPUS) data.getCell(c.cell).value = { formula: c.formula, result: STALE } as ExcelJS.CellValue;
  for (const u of UNEVALUABLE) {
    data.getCell(u.cell).value = { formula: u.formula, result: u.cached } as ExcelJS.CellValue;
    data.getCell(u.user.cell).value = { formula: u.user.formula, result: STALE } as ExcelJS.CellValue;
  }
  await wb.xlsx.writeFile(INPUT);
}

async function sheetOf(path: string): Promise<ExcelJS.Worksheet> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  return wb.getWorksheet("Data")!;
}

function resultOf(ws: ExcelJS.Worksheet, cell: string): unknown {
  const v = ws.getCell(cell).value as { result?: unknown } | null;
  return v && typeof v === "object" && "result" in v ? v.result : v;
}

function expectValue(actual: unknown, expected: number | string | boolean, what: string): void {
  if (typeof expected === "number") {
    expect(typeof actual, what).toBe("number");
    expect(Math.abs((actual as number) - expected), what).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));
  } else expect(actual, what).toBe(expected);
}

let ran: Ran;
let inputHash: string;

beforeAll(async () => {
  await writeCorpus();
  inputHash = hashOf(INPUT);
  ran = await runCli("recalc", INPUT, "-o", OUTPUT);
});

describe("formula spellings as Excel stores them (loadpath recalc)", () => {
  it("every spelling evaluates to the value worked by hand", async () => {
    const ws = await sheetOf(OUTPUT);
    for (const c of CORPUS) expectValue(resultOf(ws, c.cell), c.expected, `${c.cell}: =${c.formula}`);
  });

  it("the file keeps the formulas as written", async () => {
    const ws = await sheetOf(OUTPUT);
    for (const c of CORPUS) expect(ws.getCell(c.cell).formula, c.cell).toBe(c.formula);
  });

  it("defined names are not called unknown; no spelling is listed as a problem", () => {
    const others = ran.err.split("\n").filter((line) => line !== "" && !UNEVALUABLE.some((u) => line.startsWith(`Data!${u.cell}:`)));
    expect(others).toEqual([]);
  });

  it("a cell that cannot be evaluated keeps its formula and cached value, is listed by cell, and its users read the cached value", async () => {
    const ws = await sheetOf(OUTPUT);
    for (const u of UNEVALUABLE) {
      expect(ws.getCell(u.cell).formula, u.cell).toBe(u.formula);
      expect(resultOf(ws, u.cell), u.cell).toBe(u.cached);
      expectValue(resultOf(ws, u.user.cell), u.user.expected, `${u.user.cell}: =${u.user.formula}`);
      expect(ran.err).toMatch(new RegExp(`^Data!${u.cell}: .*not recalculated, the cell keeps its formula and cached value`, "m"));
      expect(ran.err).not.toContain(`Data!${u.user.cell}:`);
    }
    expect(ran.err).toMatch(/Data!D2: function CONCAT is not available headless/);
    expect(ran.err).toMatch(/Data!D1: the formula cannot be read here/);
    expect(ran.status).toBe(1);
  });

  it("the input is unchanged", () => {
    expect(hashOf(INPUT)).toBe(inputHash);
  });

  it("Gnumeric (ssconvert --recalc) gives the same values", async () => {
    const present = hasGnumeric();
    requireInCi("ssconvert (gnumeric)", present);
    if (!present) return;
    const out = join(dir, "corpus-gnumeric.xlsx");
    recalcWithGnumeric(INPUT, out);
    expect(existsSync(out)).toBe(true);
    const ws = await sheetOf(out);
    for (const c of CORPUS) if (c.gnumeric !== false) expectValue(resultOf(ws, c.cell), c.expected, `Gnumeric ${c.cell}: =${c.formula}`);
  });
});

describe("defined names in the tables a takedown reads", () => {
  it("a span computed from a defined name (=BaySpan) gives the same takedown as the number typed in", async () => {
    const { makeFrame } = await import("../workbook/takedown-fixtures");
    const frame = makeFrame({ levels: 2, bays: 1, beamsPerBay: 1 });
    const write = async (path: string, named: boolean): Promise<void> => {
      const wb = new ExcelJS.Workbook();
      for (const [name, rows] of Object.entries(frame.sheets)) {
        const ws = wb.addWorksheet(name);
        rows.forEach((row, r) => {
          ws.addRow(row);
          // Spans of 30 ft: as `=BaySpan` (a name for Zones!$J$1) in one file, as 30 in the other.
          if (named && name === "Members" && r > 0 && row[3] === 30) ws.getCell(r + 1, 4).value = { formula: "BaySpan", result: 30 } as ExcelJS.CellValue;
        });
      }
      wb.getWorksheet("Zones")!.getCell("J1").value = 30;
      if (named) wb.definedNames.add("Zones!$J$1", "BaySpan");
      await wb.xlsx.writeFile(path);
    };
    const typed = join(dir, "typed.xlsx");
    const named = join(dir, "named.xlsx");
    await write(typed, false);
    await write(named, true);
    const a = await runCli("takedown", typed, "--json", join(dir, "typed.json"));
    const b = await runCli("takedown", named, "--json", join(dir, "named.json"));
    expect(a.status).toBe(0);
    expect(b.err).toBe("");
    expect(b.status).toBe(0);
    const { readFileSync } = await import("node:fs");
    const results = (file: string): { members: unknown; columns: Record<string, unknown> } => JSON.parse(readFileSync(join(dir, file), "utf8")) as { members: unknown; columns: Record<string, unknown> };
    const reference = results("typed.json");
    expect(Object.keys(reference.columns).length).toBeGreaterThan(0);
    expect(results("named.json").members).toEqual(reference.members);
    expect(results("named.json").columns).toEqual(reference.columns);
  });
});
