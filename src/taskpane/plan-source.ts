/**
 * What the pane's plan section draws, and how a member on it maps to a row of the workbook:
 * the framing plan of a level (Grids, Levels, Framing, Decks read through the workbook port and
 * derived by src/engine/framing) when the workbook has a Framing table or sheet, else, after a
 * build, the schematic key plan of the typed member tables. Nothing here touches Office or the
 * DOM: the port is the only way out, and only for reading.
 */
import { derive, readPlan, type FramingProblem } from "../engine/framing";
import { levelsTopDown, checkPath } from "../engine/takedown";
import type { CellRef, UnitSystem } from "../engine/takedown/types";
import { keyPlanOfModel, renderKeyPlan, type KeyPlanInput } from "../drawings/key-plan";
import { planLevels, renderFramingPlan, type FramingPlanModel } from "../drawings/plan";
import { cellAddress, parseCell, sheetRef } from "../workbook/a1";
import type { CellSelection, TableInfo, WorkbookPort } from "../workbook/port";
import type { BuiltTakedown } from "../workbook/takedown-api";

/** The key of the key plan's "every level" choice. */
export const ALL_LEVELS = "";

/** A plan the pane can draw: its levels, and the workbook cell of each member's row. */
export type PanePlan =
  | {
      readonly kind: "framing";
      readonly model: FramingPlanModel;
      /** Levels with something on them, bottom up (the Levels table's order). */
      readonly levels: readonly string[];
      /** Mark -> the Mark cell of its Framing row. */
      readonly cells: ReadonlyMap<string, CellRef>;
      /** Reading and derivation problems as `Sheet!A1: message`. */
      readonly problems: readonly string[];
    }
  | {
      readonly kind: "key";
      readonly input: KeyPlanInput;
      /** Levels top down. */
      readonly levels: readonly string[];
      /** Mark -> the Mark cell of its Members row. */
      readonly cells: ReadonlyMap<string, CellRef>;
      readonly problems: readonly string[];
    };

/** The table (or plain sheet) of the workbook named like `name`, case-insensitively; tables first. */
function tableNamed(tables: readonly TableInfo[], name: string): string | undefined {
  const low = name.toLowerCase();
  return (tables.find((t) => t.kind === "table" && t.name.toLowerCase() === low) ?? tables.find((t) => t.name.toLowerCase() === low || (t.kind === "range" && t.sheet.toLowerCase() === low)))?.name;
}

/** True when the workbook has a Framing table or sheet (a framing plan). */
export function hasFramingPlan(tables: readonly TableInfo[]): boolean {
  return tableNamed(tables, "Framing") !== undefined;
}

function framingProblem(p: FramingProblem): string {
  return `${sheetRef(p.sheet)}!${p.cell}: ${p.message}`;
}

/**
 * Read and derive the framing plan: the Framing table or sheet with, where present, Grids,
 * Levels and Decks (default names, as the `loadpath plan` command finds them).
 * @param port - the workbook (read only)
 * @param tables - the workbook's tables, as listed by the port
 * @param units - US (ft) or SI (m)
 * @returns null when the workbook has no Framing table or sheet
 */
export async function framingPlanOf(port: WorkbookPort, tables: readonly TableInfo[], units: UnitSystem): Promise<PanePlan | null> {
  const framingName = tableNamed(tables, "Framing");
  if (framingName === undefined) return null;
  const read = async (name: string): Promise<Awaited<ReturnType<WorkbookPort["readTable"]>> | undefined> => {
    const found = tableNamed(tables, name);
    return found === undefined ? undefined : port.readTable(found);
  };
  const framing = await port.readTable(framingName);
  const [grids, levels, decks] = [await read("Grids"), await read("Levels"), await read("Decks")];
  const r = readPlan({ framing, ...(grids ? { grids } : {}), ...(levels ? { levels } : {}), ...(decks ? { decks } : {}) }, units);
  const derivation = derive(r.plan, { units });
  const model: FramingPlanModel = { plan: r.plan, grids: r.grids, derivation, units };
  const cells = new Map<string, CellRef>();
  for (const m of derivation.members) if (!cells.has(m.mark)) cells.set(m.mark, m.source);
  return { kind: "framing", model, levels: planLevels(model), cells, problems: [...r.problems, ...derivation.problems].map(framingProblem) };
}

/**
 * The key plan of a built takedown (typed member tables): levels top down, each member's Mark cell.
 * @param built - the build's model
 */
export function keyPlanOf(built: BuiltTakedown): PanePlan {
  const path = checkPath(built.model);
  const levels = levelsTopDown(built.model.members, path.deliveries);
  const input = keyPlanOfModel(built.model, levels);
  const cells = new Map<string, CellRef>();
  for (const m of built.model.members) if (m.firstOfMark && !cells.has(m.mark)) cells.set(m.mark, m.markCell);
  return { kind: "key", input, levels: input.levels, cells, problems: [] };
}

/** The key plan's input cut to one level: that level's members (what they bear on elsewhere is left out). */
export function keyPlanOfLevel(input: KeyPlanInput, level: string): KeyPlanInput {
  if (level === ALL_LEVELS) return input;
  return { levels: [level], members: input.members.filter((m) => m.level === level) };
}

/**
 * The drawing of a level at a width (drawing units = CSS pixels in the pane), with a member
 * highlighted. The renderers escape every text they draw.
 * @param plan - from {@link framingPlanOf} or {@link keyPlanOf}
 * @param level - a level name ({@link ALL_LEVELS} for every level of the key plan)
 * @param width - width in drawing units
 * @param selected - the mark to highlight, if any
 */
export function planSvg(plan: PanePlan, level: string, width: number, selected?: string): string {
  if (plan.kind === "framing") return renderFramingPlan(plan.model, level, { width, ...(selected ? { selected } : {}) });
  return renderKeyPlan(keyPlanOfLevel(plan.input, level), width, selected || undefined);
}

/** The level a member is on, or undefined. */
export function levelOfMark(plan: PanePlan, mark: string): string | undefined {
  if (plan.kind === "framing") return plan.model.derivation.members.find((m) => m.mark === mark && m.type !== "foundation")?.level;
  return plan.input.members.find((m) => m.mark === mark)?.level;
}

/** Where selecting a member goes: its row's Mark cell as sheet and A1 address, or null. */
export function cellOfMark(plan: PanePlan, mark: string): { sheet: string; address: string } | null {
  const c = plan.cells.get(mark);
  return c ? { sheet: c.sheet, address: cellAddress(c.row, c.col) } : null;
}

/**
 * The member whose row holds a selected cell (any cell of the row of its Mark cell), or null.
 * @param plan - the plan drawn
 * @param selection - the active cell
 */
export function markOfRow(plan: PanePlan, selection: CellSelection): string | null {
  let row: number;
  try {
    row = parseCell(selection.address.replace(/\$/g, "")).row;
  } catch {
    return null;
  }
  const sheet = selection.sheet.toLowerCase();
  for (const [mark, c] of plan.cells) if (c.row === row && c.sheet.toLowerCase() === sheet) return mark;
  return null;
}
