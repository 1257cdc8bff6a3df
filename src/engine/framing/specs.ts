/**
 * The plan tables' columns (headers, units, required), declared once as data and matched by the
 * takedown's header matching (src/engine/takedown/tables.ts), and the coordinate forms a cell may hold.
 */
import { spec, type TableSpec } from "../takedown/tables";

/** Grids: `Grid | X | Y`, a grid line at X (constant x) or at Y (constant y), ft or m. */
export const GRIDS_SPEC = {
  title: "Grids",
  columns: { grid: spec("Grid", "none", true), x: spec("X", "length"), y: spec("Y", "length") },
} as const satisfies TableSpec<string>;

/** Levels: `Level | Elevation` (ft or m), the order of the levels. */
export const LEVELS_SPEC = {
  title: "Levels",
  columns: { level: spec("Level", "none", true), elevation: spec("Elevation", "length", true) },
} as const satisfies TableSpec<string>;

/**
 * Framing: `Mark | Type | Level | X1 | Y1 | X2 | Y2 | KLL | wD | wL | wLr | wS | wR`. Coordinates
 * are lengths (ft or m) or grid names, so their columns are matched with a length unit but may
 * hold text ({@link COORDINATE_FORMS}).
 */
export const FRAMING_SPEC = {
  title: "Framing",
  columns: {
    mark: spec("Mark", "none", true),
    type: spec("Type"),
    level: spec("Level", "none", true),
    x1: spec("X1", "length", true),
    y1: spec("Y1", "length", true),
    x2: spec("X2", "length"),
    y2: spec("Y2", "length"),
    kll: spec("KLL"),
    wD: spec("wD", "lineLoad"),
    wL: spec("wL", "lineLoad"),
    wLr: spec("wLr", "lineLoad"),
    wS: spec("wS", "lineLoad"),
    wR: spec("wR", "lineLoad"),
  },
} as const satisfies TableSpec<string>;

/** Decks: `Area | Level | Kind | Zone | Span | X1 | Y1 | X2 | Y2 | Corners`. */
export const DECKS_SPEC = {
  title: "Decks",
  columns: {
    area: spec("Area", "none", true),
    level: spec("Level", "none", true),
    kind: spec("Kind"),
    zone: spec("Zone"),
    span: spec("Span"),
    x1: spec("X1", "length"),
    y1: spec("Y1", "length"),
    x2: spec("X2", "length"),
    y2: spec("Y2", "length"),
    corners: spec("Corners"),
  },
} as const satisfies TableSpec<string>;

/** Framing columns passed through to the Members table unchanged. */
export const PASSED_THROUGH = ["kll", "wD", "wL", "wLr", "wS", "wR"] as const;

/** Accepted Type spellings (case-insensitive) -> type; blank is a beam. */
export const TYPE_NAMES: Readonly<Record<string, "joist" | "beam" | "girder" | "wall" | "column" | "foundation">> = {
  "": "beam",
  joist: "joist",
  beam: "beam",
  girder: "girder",
  wall: "wall",
  column: "column",
  foundation: "foundation",
  footing: "foundation",
};

/** Accepted Kind spellings (case-insensitive) -> kind; blank is one-way. */
export const KIND_NAMES: Readonly<Record<string, "one-way" | "two-way" | "opening">> = {
  "": "one-way",
  "one-way": "one-way",
  oneway: "one-way",
  "two-way": "two-way",
  twoway: "two-way",
  opening: "opening",
};

/**
 * The forms a coordinate takes, as data: the pattern (whole cell text, trimmed) and an example.
 * A number cell is always a coordinate. Text is looked up as a grid name exactly first, so a grid
 * named "A-1" is never read as "A" minus 1 and the text "2" naming grid 2 is that grid.
 */
export const COORDINATE_FORMS = {
  /** A number typed as text: `12.5`. */
  number: { pattern: /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/, example: "12.5" },
  /** A grid name with an offset: `B+2.5`, `3-1.25` (ft or m). */
  offset: { pattern: /^(.+?)\s*([+-])\s*((\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?)$/, example: "B+2.5" },
  /** A polygon corner at a grid intersection, each side a coordinate: `A/1`, `B+2/3-1`. */
  gridCorner: { separator: "/", example: "A/1" },
  /** A polygon corner by numbers: `12.5,40`. */
  xyCorner: { separator: ",", example: "12.5,40" },
  /** Between polygon corners. */
  cornerSeparator: { separator: ";", example: "A/1; C/1; C/3; 12.5,40" },
} as const;
