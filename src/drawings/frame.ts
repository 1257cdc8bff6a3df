/**
 * The shared horizontal scale of a member sheet: the free-body diagram and the V, M and
 * deflection diagrams under it use the same x, so a position lines up through all of them.
 */

/** Width of every drawing in drawing units: one unit is one pixel in a 320 px wide pane. */
export const SHEET_WIDTH = 320;
/** Left and right margins of the member (room for end supports and labels). */
export const MEMBER_LEFT = 26;
export const MEMBER_RIGHT = SHEET_WIDTH - 26;

/** Maps a position along the member (length units) to drawing x. */
export interface Frame {
  /** Member length in length units. */
  readonly span: number;
  /** Drawing x of the left end. */
  readonly left: number;
  /** Drawing x of the right end. */
  readonly right: number;
}

/**
 * The frame of a member of the given span.
 * @param span - member length (> 0), length units
 */
export function memberFrame(span: number): Frame {
  return { span, left: MEMBER_LEFT, right: MEMBER_RIGHT };
}

/**
 * Drawing x of a position along the member, to scale.
 * @param frame - the sheet's frame
 * @param x - position from the left end, length units
 */
export function xOf(frame: Frame, x: number): number {
  return frame.left + (x / frame.span) * (frame.right - frame.left);
}

/**
 * Sorted distinct positions; positions closer than `tolerance` count as one.
 * @param xs - positions, length units
 * @param tolerance - merge distance, length units
 */
export function distinctPositions(xs: readonly number[], tolerance: number): number[] {
  const sorted = [...xs].filter(Number.isFinite).sort((a, b) => a - b);
  const out: number[] = [];
  for (const x of sorted) if (out.length === 0 || x - (out[out.length - 1] as number) > tolerance) out.push(x);
  return out;
}

/** A drawn part of a sheet in its own coordinates, with its vertical extent. */
export interface Block {
  readonly body: string;
  /** Smallest y used (may be negative). */
  readonly top: number;
  /** Largest y used. */
  readonly bottom: number;
}
