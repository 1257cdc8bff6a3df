/**
 * Types of the framing-plan engine: the plan as read from the Grids, Levels, Framing and Decks
 * tables, the problems found in it and what the derivation returns. Lengths are in the plan's
 * length unit (ft for a US takedown, m for SI) throughout; widths are tributary widths in that
 * unit (an area load times a width is a line load).
 */
import type { CellRef } from "../takedown/types";

/** A point of the plan (ft or m). */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/** The closed set of things a plan can get wrong. */
export type FramingProblemCode =
  | "missingColumn"
  | "ambiguousColumn"
  | "badValue"
  /** A member end on no column and no member of higher rank. */
  | "endOnNothing"
  /** Two members of the same rank cross: which bears on which is not known. */
  | "equalRankCrossing"
  /** Two deck areas of one level overlap: their load would be counted twice. */
  | "overlappingDecks"
  /** A strip of deck (between its edges or openings) with no supporting member across it. */
  | "unsupportedDeck"
  /** Two members of one level lie on one line and overlap. */
  | "collinearOverlap"
  /** Two columns of one level at one point. */
  | "duplicateColumn"
  /** A coordinate names a grid the Grids table does not have (or an X cell names a Y grid). */
  | "unknownGrid"
  /** A coordinate cell holds something that is not a number, a grid name or a grid name with an offset. */
  | "badCoordinate"
  /** A member whose two ends snap to one point. */
  | "zeroLength"
  /** A deck polygon whose edges cross, or with fewer than three distinct corners. */
  | "selfIntersecting"
  /** A two-way deck that is not a rectangle bounded by members on all four sides. */
  | "badTwoWay"
  /** A level named in Framing or Decks that the Levels table does not have. */
  | "unknownLevel";

/** One thing wrong with the plan, with the sheet and A1 cell to select. */
export interface FramingProblem {
  readonly code: FramingProblemCode;
  readonly message: string;
  readonly sheet: string;
  /** A1 address on that sheet. */
  readonly cell: string;
  readonly mark?: string;
}

/** Member types of a framing plan. */
export type FramingType = "joist" | "beam" | "girder" | "wall" | "column" | "foundation";

/** Rank of the types that span: a member bears on one of higher rank (joist < beam < girder < wall). */
export const RANK: Readonly<Record<FramingType, number>> = { joist: 1, beam: 2, girder: 3, wall: 4, column: 5, foundation: 6 };

/** A level: its name and elevation (ft or m). */
export interface PlanLevel {
  readonly name: string;
  readonly elevation: number;
  readonly cell: CellRef;
}

/** One row of the Framing table, coordinates resolved (before snapping). */
export interface PlanMember {
  readonly mark: string;
  readonly type: FramingType;
  readonly level: string;
  /** Start point (the only point of a column or foundation). */
  readonly p1: Point;
  /** End point; equals p1 for a column or foundation. */
  readonly p2: Point;
  /** Values passed through to the Members table unchanged (KLL, wD, wL, wLr, wS, wR). */
  readonly extra: Readonly<Record<string, number | string | null>>;
  /** Cells of the row: the Mark cell, and the X1 and X2 cells (end problems point at them). */
  readonly cells: { readonly mark: CellRef; readonly x1: CellRef; readonly x2: CellRef };
}

/** Deck kinds of the Decks table. */
export type DeckKind = "one-way" | "two-way" | "opening";

/** One row of the Decks table: a polygon (counter-clockwise, no repeated closing corner). */
export interface PlanDeck {
  readonly area: string;
  readonly level: string;
  readonly kind: DeckKind;
  readonly zone: string;
  /** Span direction in radians from +x (one-way decks); 0 otherwise. */
  readonly span: number;
  readonly corners: readonly Point[];
  /** The row's first cell and the cell the polygon came from (Corners or X1). */
  readonly cells: { readonly area: CellRef; readonly shape: CellRef };
}

/** A framing plan as read from its tables. */
export interface Plan {
  readonly levels: readonly PlanLevel[];
  readonly members: readonly PlanMember[];
  readonly decks: readonly PlanDeck[];
}

/** Options of the derivation. */
export interface DeriveOptions {
  /**
   * Snapping tolerance (plan length unit): points closer than this are one node; a point within
   * it of a member is on that member. Default 1/16 in (1/192 ft) for US, 1.5 mm (0.0015 m) for SI.
   */
  readonly tolerance?: number;
  /** Unit system of the coordinates; only the default tolerance depends on it. Default "US". */
  readonly units?: "US" | "SI";
}

/** A derived part of a member's tributary: width (ft or m) varying linearly from `from` to `to` (ft or m along the member). */
export interface TributaryPiece {
  readonly zone: string;
  /** The deck area (Decks table `Area`) it comes from. */
  readonly area: string;
  readonly from: number;
  readonly to: number;
  readonly width: number;
  readonly endWidth: number;
}

/**
 * The deck region a member receives, as a plan polygon (counter-clockwise, ft or m): one per
 * derived piece before adjacent pieces are merged. Its area equals the integral of the piece's
 * width along the member, so a member's regions add up to its tributary area.
 */
export interface TributaryRegion {
  readonly mark: string;
  readonly zone: string;
  /** The deck area (Decks table `Area`) it is part of. */
  readonly area: string;
  readonly polygon: readonly Point[];
}

/** What one end of a member (or the base of a column) bears on. */
export interface DerivedSupport {
  /** Mark of the supporting column, member or foundation. */
  readonly support: string;
  /** Position along the supporting member (ft or m from its start); null on a column or foundation. */
  readonly supportAt: number | null;
}

/** A member bearing on another where it crosses it, or on a column it passes over (a Bearings row): continuous over it. */
export interface DerivedBearing {
  readonly mark: string;
  readonly support: string;
  /** Position along the bearing member (ft or m from its start). */
  readonly at: number;
  /** Position along the supporting member (ft or m from its start); null on a column. */
  readonly supportAt: number | null;
}

/** One derived row in the shape of the Members table, plus the plan coordinates (snapped). */
export interface DerivedMember {
  readonly mark: string;
  readonly type: FramingType;
  readonly level: string;
  /** Length of a spanning member, storey height of a column (ft or m); null when unknown. */
  readonly span: number | null;
  readonly startSupport: string | null;
  readonly startAt: number | null;
  readonly endSupport: string | null;
  readonly endAt: number | null;
  readonly x1: number;
  readonly y1: number;
  readonly x2: number;
  readonly y2: number;
  readonly extra: Readonly<Record<string, number | string | null>>;
  /** Deck load pieces along the member, sorted by `from`. */
  readonly tributary: readonly TributaryPiece[];
  /** Sum of the pieces' areas (ft² or m²). */
  readonly tributaryArea: number;
  /** The Mark cell of the Framing row (or of the column it was added for, for an added foundation). */
  readonly source: CellRef;
}

/** The derivation's result: members in Members-table shape, bearings and problems. */
export interface Derivation {
  readonly members: readonly DerivedMember[];
  readonly bearings: readonly DerivedBearing[];
  readonly problems: readonly FramingProblem[];
  /** The deck region each member receives (for drawings), sorted by mark; sums to its tributary area. */
  readonly regions: readonly TributaryRegion[];
  /** The tolerance used (ft or m). */
  readonly tolerance: number;
}
