/**
 * Reading the plan tables (Grids, Levels, Framing, Decks) into a {@link Plan}: headers matched by
 * the takedown's matching, every cell problem named with its sheet and cell. Rows with a problem
 * are left out of the plan; the rest is read.
 */
import { a1 } from "../a1";
import { matchTable, tableCell, type MatchedTable, type TableReading, type TableSpec } from "../takedown/tables";
import type { CellValue, TableData, UnitSystem } from "../takedown/types";
import { gridKey, readCoordinate, readCorners, type GridLines } from "./coords";
import { selfIntersects, signedArea } from "./geometry";
import { DECKS_SPEC, FRAMING_SPEC, GRIDS_SPEC, KIND_NAMES, LEVELS_SPEC, PASSED_THROUGH, TYPE_NAMES } from "./specs";
import type { FramingProblem, FramingProblemCode, Plan, PlanDeck, PlanLevel, PlanMember, Point } from "./types";

/** The plan tables as read from the workbook; Grids and Levels may be absent. */
export interface PlanTables {
  readonly grids?: TableData;
  readonly levels?: TableData;
  readonly framing: TableData;
  readonly decks?: TableData;
}

/** A plan as read and what was wrong with the tables. */
export interface PlanReading {
  readonly plan: Plan;
  readonly grids: GridLines;
  readonly problems: readonly FramingProblem[];
}

const TABLE_CODES: ReadonlySet<string> = new Set(["missingColumn", "ambiguousColumn", "badValue"]);

/** A problem at a table cell (row and column indices into `data.values`). */
export function problemAtCell(data: TableData, row: number, col: number, code: FramingProblemCode, message: string, mark?: string): FramingProblem {
  return { code, message, sheet: data.sheet, cell: a1(data.top + row, data.left + col), ...(mark !== undefined ? { mark } : {}) };
}

/** How the user reads each plan table (column mapping, header row), as for the member tables. */
export interface PlanReadings {
  readonly grids?: TableReading;
  readonly levels?: TableReading;
  readonly framing?: TableReading;
  readonly decks?: TableReading;
}

function match<K extends string>(spec: TableSpec<K>, data: TableData, units: UnitSystem, problems: FramingProblem[], reading?: TableReading): MatchedTable<K> {
  const m = matchTable(spec, data, units, reading?.mapping, reading?.headerRow);
  for (const p of m.problems) problems.push({ ...p, code: (TABLE_CODES.has(p.code) ? p.code : "badValue") as FramingProblemCode });
  return m.table;
}

function text(v: CellValue | undefined): string {
  return v === null || v === undefined ? "" : String(v).trim();
}

/**
 * Read the plan tables.
 * @param tables - the tables as read from the sheets
 * @param units - unit system of the lengths (ft or m)
 * @param readings - per table, the user's column mapping and header row (`--map framing.X1=C`)
 */
export function readPlan(tables: PlanTables, units: UnitSystem = "US", readings: PlanReadings = {}): PlanReading {
  const problems: FramingProblem[] = [];
  const gx = new Map<string, number>();
  const gy = new Map<string, number>();
  if (tables.grids) {
    const t = match(GRIDS_SPEC, tables.grids, units, problems, readings.grids);
    for (const r of t.rows) {
      const row = t.data.values[r]!;
      const name = text(row[t.columns.grid!]);
      const x = t.columns.x !== undefined ? row[t.columns.x] : null;
      const y = t.columns.y !== undefined ? row[t.columns.y] : null;
      const hasX = typeof x === "number" && Number.isFinite(x);
      const hasY = typeof y === "number" && Number.isFinite(y);
      if (name === "" || hasX === hasY) {
        problems.push(problemAtCell(t.data, r, t.columns.grid ?? 0, "badValue", `Grid "${name}" needs a name and exactly one of X or Y as a number.`));
        continue;
      }
      const key = gridKey(name);
      if (gx.has(key) || gy.has(key)) {
        problems.push(problemAtCell(t.data, r, t.columns.grid!, "badValue", `Grid "${name}" is named twice.`));
        continue;
      }
      if (hasX) gx.set(key, x);
      else gy.set(key, y as number);
    }
  }
  const grids: GridLines = { x: gx, y: gy };

  const levels: PlanLevel[] = [];
  if (tables.levels) {
    const t = match(LEVELS_SPEC, tables.levels, units, problems, readings.levels);
    for (const r of t.rows) {
      const row = t.data.values[r]!;
      const name = text(row[t.columns.level!]);
      const e = t.columns.elevation !== undefined ? row[t.columns.elevation] : null;
      if (name === "" || typeof e !== "number" || !Number.isFinite(e)) {
        problems.push(problemAtCell(t.data, r, t.columns.elevation ?? 0, "badValue", `Level "${name}" needs a name and an elevation.`));
        continue;
      }
      levels.push({ name, elevation: e, cell: tableCell(t.data, r, t.columns.level!) });
    }
    levels.sort((a, b) => a.elevation - b.elevation || (a.name < b.name ? -1 : 1));
  }
  const levelNames = new Set(levels.map((l) => l.name));

  const members: PlanMember[] = [];
  const t = match(FRAMING_SPEC, tables.framing, units, problems, readings.framing);
  const marks = new Map<string, ReturnType<typeof tableCell>>();
  for (const r of t.rows) {
    const row = t.data.values[r]!;
    const c = t.columns;
    if (c.mark === undefined || c.x1 === undefined || c.y1 === undefined) break;
    const mark = text(row[c.mark]);
    if (mark === "" || marks.has(mark)) {
      problems.push(problemAtCell(t.data, r, c.mark, "badValue", mark === "" ? "A Framing row has no Mark." : `Mark ${mark} is used twice in the Framing table (first at ${a1(marks.get(mark)!.row, marks.get(mark)!.col)}); this row is left out.`, mark || undefined));
      continue;
    }
    marks.set(mark, tableCell(t.data, r, c.mark));
    const typeName = text(c.type !== undefined ? row[c.type] : null).toLowerCase();
    const type = TYPE_NAMES[typeName];
    if (type === undefined) {
      problems.push(problemAtCell(t.data, r, c.type!, "badValue", `Type "${typeName}" of ${mark} is not joist, beam, girder, wall, column or foundation.`, mark));
      continue;
    }
    const level = text(c.level !== undefined ? row[c.level] : null);
    if (levels.length > 0 && !levelNames.has(level) && type !== "foundation") {
      problems.push(problemAtCell(t.data, r, c.level ?? c.mark, "unknownLevel", `Level "${level}" of ${mark} is not in the Levels table.`, mark));
      continue;
    }
    const point = (xc: number | undefined, yc: number | undefined, which: string): Point | null => {
      const out: number[] = [];
      for (const [col, axis] of [[xc, "x"], [yc, "y"]] as const) {
        if (col === undefined) {
          problems.push(problemAtCell(t.data, r, c.mark!, "badCoordinate", `${mark} needs ${axis.toUpperCase()}${which}.`, mark));
          return null;
        }
        const v = readCoordinate(row[col], axis, grids, t.data.dates?.[r]?.[col] === true);
        if (!v.ok) {
          problems.push(problemAtCell(t.data, r, col, v.code, `${axis.toUpperCase()}${which} of ${mark} ${v.message}.`, mark));
          return null;
        }
        out.push(v.value);
      }
      return { x: out[0]!, y: out[1]! };
    };
    const p1 = point(c.x1, c.y1, "1");
    if (!p1) continue;
    const atPoint = type === "column" || type === "foundation";
    const p2 = atPoint ? p1 : point(c.x2, c.y2, "2");
    if (!p2) continue;
    const extra: Record<string, number | string | null> = {};
    for (const k of PASSED_THROUGH) if (c[k] !== undefined) extra[k] = (row[c[k]] ?? null) as number | string | null;
    const cell = (col: number | undefined): ReturnType<typeof tableCell> => tableCell(t.data, r, col ?? c.mark!);
    members.push({ mark, type, level, p1, p2, extra, cells: { mark: cell(c.mark), x1: cell(c.x1), x2: cell(atPoint ? c.x1 : c.x2) } });
  }

  const decks: PlanDeck[] = [];
  if (tables.decks) {
    const d = match(DECKS_SPEC, tables.decks, units, problems, readings.decks);
    const c = d.columns;
    for (const r of d.rows) {
      if (c.area === undefined) break;
      const row = d.data.values[r]!;
      const area = text(row[c.area]);
      const level = text(c.level !== undefined ? row[c.level] : null);
      if (levels.length > 0 && !levelNames.has(level)) {
        problems.push(problemAtCell(d.data, r, c.level ?? c.area, "unknownLevel", `Level "${level}" of deck ${area} is not in the Levels table.`));
        continue;
      }
      const kindName = text(c.kind !== undefined ? row[c.kind] : null).toLowerCase();
      const kind = KIND_NAMES[kindName];
      if (kind === undefined) {
        problems.push(problemAtCell(d.data, r, c.kind!, "badValue", `Kind "${kindName}" of deck ${area} is not one-way, two-way or opening.`));
        continue;
      }
      let span = 0;
      if (kind === "one-way") {
        const s = c.span !== undefined ? row[c.span] : null;
        const st = text(s).toLowerCase();
        if (st === "x") span = 0;
        else if (st === "y") span = Math.PI / 2;
        else if (typeof s === "number" && Number.isFinite(s)) span = (s * Math.PI) / 180;
        else {
          problems.push(problemAtCell(d.data, r, c.span ?? c.area, "badValue", `Span of deck ${area} must be x, y or an angle in degrees from +x.`));
          continue;
        }
      }
      let corners: Point[];
      let shapeCol: number;
      const cornersCell = c.corners !== undefined ? row[c.corners] : null;
      if (text(cornersCell) !== "") {
        shapeCol = c.corners!;
        const v = readCorners(cornersCell, grids);
        if (!v.ok) {
          problems.push(problemAtCell(d.data, r, shapeCol, v.code, `Corners of deck ${area}: ${v.message}.`));
          continue;
        }
        corners = v.value;
      } else {
        shapeCol = c.x1 ?? c.area;
        const vals: number[] = [];
        let failed = false;
        for (const [col, axis] of [[c.x1, "x"], [c.y1, "y"], [c.x2, "x"], [c.y2, "y"]] as const) {
          const v = col === undefined ? null : readCoordinate(row[col], axis, grids, d.data.dates?.[r]?.[col] === true);
          if (!v || !v.ok) {
            problems.push(problemAtCell(d.data, r, col ?? c.area, v ? v.code : "badCoordinate", `Deck ${area} needs Corners or X1, Y1, X2, Y2${v && !v.ok ? `: ${v.message}` : ""}.`));
            failed = true;
            break;
          }
          vals.push(v.value);
        }
        if (failed) continue;
        const [x1, y1, x2, y2] = vals as [number, number, number, number];
        corners = [{ x: x1, y: y1 }, { x: x2, y: y1 }, { x: x2, y: y2 }, { x: x1, y: y2 }];
      }
      if (corners.length > 1 && corners[0]!.x === corners[corners.length - 1]!.x && corners[0]!.y === corners[corners.length - 1]!.y) corners.pop();
      if (corners.length < 3 || Math.abs(signedArea(corners)) === 0 || selfIntersects(corners, 0)) {
        problems.push(problemAtCell(d.data, r, shapeCol, "selfIntersecting", `Deck ${area} is not a simple polygon (its edges cross or touch, or it has no area).`));
        continue;
      }
      if (signedArea(corners) < 0) corners.reverse();
      const zone = text(c.zone !== undefined ? row[c.zone] : null);
      decks.push({ area, level, kind, zone, span, corners, cells: { area: tableCell(d.data, r, c.area), shape: tableCell(d.data, r, shapeCol) } });
    }
  }
  return { plan: { levels, members, decks }, grids, problems };
}
