/**
 * What the pane does, without React: find the input tables, remember the user's choices in the
 * workbook, run a build while letting the host breathe, select a problem's cell. The components
 * call this; it calls only the workbook port (never `Excel.run`), so the same pane runs against
 * Excel and against the in-memory workbook of the demo page.
 */
import type { CellSelection, PictureInput, TableInfo, WorkbookPort } from "../workbook/port";
import type { BuildTakedown, ColumnMapping, HeaderRows, Problem, TakedownBuildResult, UnitSystem } from "../workbook/takedown-api";
import { readSavedMatching, SETTINGS_SHEET, writeSavedMatching } from "../workbook/saved-matching";
import { detectRoles, reportColumns, type TableReport, type TableRole } from "./schema";

/** Keys of the workbook settings the pane keeps. */
export const SETTING_KEYS = {
  tables: "loadpath.tables",
  mapping: "loadpath.mapping",
  units: "loadpath.units",
} as const;

/** Default name of the generated sheet (docs/interface.md section 3). */
export const DEFAULT_SHEET = "Takedown";

/**
 * The input tables chosen for each role ("" = none). Bearings may be absent: choices saved in a
 * workbook before the pane offered a Bearings table have none.
 */
export type TableChoice = Readonly<Record<Exclude<TableRole, "bearings">, string>> & { readonly bearings?: string };

/** What the pane remembers in the workbook. */
export interface PaneSettings {
  readonly tables: TableChoice | null;
  readonly mapping: ColumnMapping;
  readonly units: UnitSystem;
  /** Header rows (1-based sheet rows) of a saved matching, kept as they are. */
  readonly headerRows?: HeaderRows;
  /** The Bearings table of a saved matching, kept as it is (the pane has no list for it). */
  readonly bearings?: string;
  /** Where the settings came from: the settings sheet, or the pane's own workbook settings. */
  readonly source?: "sheet" | "pane";
  /** Why the settings sheet could not be read (then the pane's own settings are used). */
  readonly problem?: string;
}

/** The tables of the workbook and the choice the pane starts from. */
export interface ScanResult {
  readonly tables: readonly TableInfo[];
  /** Saved choice where its tables still exist, otherwise the tables found by their headers. */
  readonly choice: TableChoice;
  /** Roles whose table was found by its headers (not saved, not picked). */
  readonly detected: readonly TableRole[];
}

/** A build's outcome as the pane shows it. */
export type RunOutcome =
  | { readonly kind: "done"; readonly result: TakedownBuildResult }
  | { readonly kind: "askReplace"; readonly sheet: string };

function parseJson<T>(text: string | null): T | null {
  if (text === null || text === "") return null;
  try {
    return JSON.parse(text) as T;
  } catch {
    return null;
  }
}

/**
 * Wait for the host: a macrotask lets the page paint the progress and handle input, so a long
 * build never leaves the pane unresponsive (the host restarts a pane busy for ~5 s).
 */
export function yieldToHost(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** A progress callback that yields to the host at most every `everyMs` milliseconds. */
export function breathingProgress(report: (fraction: number, message: string) => void, everyMs = 40): (fraction: number, message: string) => Promise<void> {
  let last = 0;
  return async (fraction, message) => {
    report(fraction, message);
    const now = Date.now();
    if (now - last >= everyMs) {
      last = now;
      await yieldToHost();
    }
  };
}

/** The pane's session over one workbook. */
export class PaneSession {
  /**
   * @param port - the workbook (Excel or the in-memory demo workbook).
   * @param build - the takedown orchestrator.
   * @param sheetName - the generated sheet's name.
   */
  constructor(
    readonly port: WorkbookPort,
    private readonly build: BuildTakedown,
    readonly sheetName: string = DEFAULT_SHEET,
  ) {}

  /**
   * The saved matching: the settings sheet when the workbook has one (the command line reads the
   * same sheet), else the pane's own workbook settings (kept as the user changes things, and by
   * workbooks saved before the settings sheet), else defaults.
   */
  async loadSettings(): Promise<PaneSettings> {
    const sheet = await readSavedMatching(this.port);
    if (sheet !== null && "matching" in sheet) {
      const m = sheet.matching;
      const t = m.tables ?? {};
      const tables = t.zones !== undefined || t.members !== undefined || t.loads !== undefined ? { zones: t.zones ?? "", members: t.members ?? "", loads: t.loads ?? "" } : null;
      return {
        tables,
        mapping: m.mapping ?? {},
        units: m.units ?? "US",
        ...(m.headerRows !== undefined ? { headerRows: m.headerRows } : {}),
        ...(t.bearings !== undefined ? { bearings: t.bearings } : {}),
        source: "sheet",
      };
    }
    const [tables, mapping, units] = await Promise.all([
      this.port.getSetting(SETTING_KEYS.tables),
      this.port.getSetting(SETTING_KEYS.mapping),
      this.port.getSetting(SETTING_KEYS.units),
    ]);
    return {
      tables: parseJson<TableChoice>(tables),
      mapping: parseJson<ColumnMapping>(mapping) ?? {},
      units: units === "SI" ? "SI" : "US",
      ...(sheet !== null && "error" in sheet ? { problem: sheet.error } : {}),
    };
  }

  /** Remember the choices in the pane's workbook settings as the user makes them (not the saved matching). */
  async saveSettings(settings: PaneSettings): Promise<void> {
    await this.port.setSetting(SETTING_KEYS.tables, JSON.stringify(settings.tables ?? {}));
    await this.port.setSetting(SETTING_KEYS.mapping, JSON.stringify(settings.mapping));
    await this.port.setSetting(SETTING_KEYS.units, settings.units);
  }

  /**
   * Save the matching the user confirmed on the settings sheet (tables, columns, header rows,
   * units), where the command line reads it too. Writes only that sheet; rebuilds nothing.
   */
  async saveMatching(settings: PaneSettings): Promise<void> {
    const t = settings.tables ?? { zones: "", members: "", loads: "" };
    const tables = Object.fromEntries(
      Object.entries({ zones: t.zones, members: t.members, loads: t.loads, bearings: settings.bearings ?? "" }).filter(([, v]) => v !== ""),
    );
    await writeSavedMatching(this.port, {
      units: settings.units,
      tables,
      ...(settings.headerRows !== undefined ? { headerRows: settings.headerRows } : {}),
      mapping: settings.mapping,
    });
    await this.saveSettings(settings);
  }

  /**
   * The column step of a chosen table: each needed column with the header cell it is taken from,
   * ambiguous and missing ones first (read as the build reads it: title block, group and units rows).
   */
  async columnReport(role: TableRole, table: string, mapping: ColumnMapping, headerRow?: number): Promise<TableReport> {
    const data = await this.port.readTable(table);
    return reportColumns(role, data, mapping, headerRow);
  }

  /** List the workbook's tables (the add-in's own sheet left out) and pick one for each role. */
  async scan(saved: TableChoice | null, mapping: ColumnMapping): Promise<ScanResult> {
    const all = await this.port.listTables();
    const tables = all.filter((t) => t.sheet !== this.sheetName && t.sheet !== SETTINGS_SHEET);
    const names = new Set(tables.map((t) => t.name));
    const found = detectRoles(tables, mapping);
    const choice: Record<TableRole, string> = { zones: "", members: "", loads: "", bearings: "" };
    const detected: TableRole[] = [];
    for (const role of ["zones", "members", "loads", "bearings"] as const) {
      const keep = saved?.[role];
      if (keep && names.has(keep)) choice[role] = keep;
      else if (found[role]) {
        choice[role] = found[role]!;
        detected.push(role);
      }
    }
    return { tables, choice, detected };
  }

  /**
   * Build the takedown. When a sheet of the generated sheet's name exists and the add-in did not
   * make it, nothing is written and the pane is asked to confirm (`replaceForeign` after a yes).
   */
  async run(
    choice: TableChoice,
    settings: Omit<PaneSettings, "tables"> & { readonly native?: boolean },
    onProgress: (fraction: number, message: string) => void,
    replaceForeign = false,
  ): Promise<RunOutcome> {
    if (!replaceForeign) {
      const names = await this.port.sheetNames();
      if (names.includes(this.sheetName) && (await this.port.sheetMarker(this.sheetName)) === null) {
        return { kind: "askReplace", sheet: this.sheetName };
      }
    }
    const result = await this.build(
      this.port,
      {
        zones: choice.zones,
        members: choice.members,
        ...(choice.loads ? { loads: choice.loads } : {}),
        // interior supports of continuous members, as the command line's --bearings (the table
        // chosen in the pane, else the one kept in the saved matching)
        ...((choice.bearings ?? "") || settings.bearings ? { bearings: (choice.bearings ?? "") || settings.bearings } : {}),
        units: settings.units,
        mapping: settings.mapping,
        ...(settings.headerRows ? { headerRows: settings.headerRows } : {}),
        sheetName: this.sheetName,
        replaceForeign,
        // hand-off version: classic spreadsheet functions only (src/engine/native)
        ...(settings.native ? { native: true } : {}),
      },
      breathingProgress(onProgress),
    );
    return { kind: "done", result };
  }

  /** Select a problem's cell in the workbook and bring it into view. */
  async show(problem: Problem): Promise<void> {
    await this.port.select(problem.sheet, problem.cell);
  }

  /** True when the workbook tells the pane where the selection moves. */
  followsSelection(): boolean {
    return typeof this.port.onSelectionChanged === "function" && (this.port.followsSelection?.() ?? false);
  }

  /**
   * Follow the active cell; resolves to the function that stops following.
   * @throws Error when the workbook does not report selection changes (see {@link followsSelection})
   */
  async watchSelection(handler: (selection: CellSelection) => void): Promise<() => void> {
    if (!this.port.onSelectionChanged) throw new Error("This workbook does not report selection changes.");
    return this.port.onSelectionChanged(handler);
  }

  /** The active cell now, or null when the workbook cannot tell. */
  async activeCell(): Promise<CellSelection | null> {
    return this.port.activeCell ? this.port.activeCell() : null;
  }

  /** True when pictures can be placed on the add-in's sheet. */
  canInsertPicture(): boolean {
    return typeof this.port.insertPicture === "function" && (this.port.canInsertPicture?.() ?? false);
  }

  /** Place a picture on the generated sheet (the add-in's own; the port refuses any other). */
  async insertPicture(picture: PictureInput): Promise<void> {
    if (!this.port.insertPicture) throw new Error("This workbook cannot take pictures from the pane.");
    await this.port.insertPicture(this.sheetName, picture);
  }
}
