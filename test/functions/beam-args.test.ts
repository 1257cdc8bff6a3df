/**
 * Reading the `loads` and `supports` ranges into the member model (docs/interface.md section 1): both
 * loads formats, blank rows as hosts pass them (null, "" or 0), and every error naming its row.
 */
import { describe, expect, it } from "vitest";
import { beamModel, parseLoads, parseSupports, withRangeRow } from "../../src/functions/beam-args";
import { fail } from "../../src/engine/errors";
import { toGrid, type Grid } from "../../src/functions/args";

/** Ranges go through the runner's normalisation first ("" -> null), as in the functions. */
const norm = (g: unknown[][]): Grid => toGrid(g);

const SPAN = 20;

function loadsOf(grid: unknown[][] | number) {
  const r = parseLoads(typeof grid === "number" ? grid : norm(grid), SPAN);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

function loadError(grid: unknown[][]): string {
  const r = parseLoads(norm(grid), SPAN);
  if (r.ok) throw new Error("expected an error");
  return r.error.message;
}

function supportsOf(grid: unknown[][] | undefined) {
  const r = parseSupports(grid === undefined ? undefined : norm(grid), SPAN);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

function supportError(grid: unknown[][]): string {
  const r = parseSupports(norm(grid), SPAN);
  if (r.ok) throw new Error("expected an error");
  return r.error.message;
}

describe("loads, 5-column format kind | magnitude | start | end | end magnitude", () => {
  it("a number is a full-length uniform line load", () => {
    expect(loadsOf(1.5).items).toEqual([{ kind: "line", start: 0, end: SPAN, w1: 1.5, w2: 1.5 }]);
  });
  it("reads each kind, case-insensitively; blank start/end of a line load = full length; blank end magnitude = uniform", () => {
    const r = loadsOf([
      ["Line", 2, null, null, null],
      ["POINT", 10, 5, null, null],
      ["moment", -3, 12, null, null],
      ["line", 1, 4, 8, 3],
    ]);
    expect(r.items).toEqual([
      { kind: "line", start: 0, end: SPAN, w1: 2, w2: 2 },
      { kind: "point", x: 5, p: 10 },
      { kind: "moment", x: 12, m: -3 },
      { kind: "line", start: 4, end: 8, w1: 1, w2: 3 },
    ]);
    expect(r.rows).toEqual([1, 2, 3, 4]);
  });
  it("skips blank rows however the host passes blanks, and keeps the range's row numbers", () => {
    const r = loadsOf([
      [null, null, null, null, null],
      ["", "", "", "", ""],
      [0, 0, 0, 0, 0],
      ["point", 4, 2, null, null],
    ]);
    expect(r.items).toEqual([{ kind: "point", x: 2, p: 4 }]);
    expect(r.rows).toEqual([4]);
  });
  it("a line load with start and end 0 (blanks passed as 0) is full length", () => {
    expect(loadsOf([["line", 2, 0, 0, null]]).items).toEqual([{ kind: "line", start: 0, end: SPAN, w1: 2, w2: 2 }]);
  });
  it("a 4-column range whose first filled cell is a kind is the kind format without end magnitude", () => {
    expect(loadsOf([[null, null, null, null], ["point", 3, 7, null]]).items).toEqual([{ kind: "point", x: 7, p: 3 }]);
  });
  it("errors name the row", () => {
    expect(loadError([["line", 1, null, null, null], [null, 5, 2, null, null]])).toBe("loads, row 2: kind is blank but the row has values; give line, point or moment.");
    expect(loadError([["udl", 1, null, null, null]])).toBe('loads, row 1: kind "udl" is not line, point or moment.');
    expect(loadError([["point", 1, 25, null, null]])).toBe("loads, row 1: start 25 is outside the member (0 to 20).");
    expect(loadError([["line", 1, 2, 21, null]])).toBe("loads, row 1: end 21 is outside the member (0 to 20).");
    expect(loadError([["line", 1, -1, 5, null]])).toBe("loads, row 1: start -1 is outside the member (0 to 20).");
    expect(loadError([["line", "heavy", null, null, null]])).toBe('loads, row 1: magnitude "heavy" is text where a number belongs.');
    expect(loadError([["line", null, null, null, null]])).toBe("loads, row 1: magnitude is blank; a number is required.");
    expect(loadError([["line", 1, 8, 4, null]])).toBe("loads, row 1: end 4 must be greater than start 8 for a line load.");
    expect(loadError([["point", 1, null, null, null]])).toBe("loads, row 1: start is blank; a number is required.");
    expect(loadError([["point", 1, 3, 6, null]])).toBe("loads, row 1: a point load acts at one position (start); end 6 must be blank.");
    expect(loadError([["line", 1, null, null, "x"]])).toBe('loads, row 1: end magnitude "x" is text where a number belongs.');
  });
});

describe("loads, 4-column numeric format magnitude | start | end | end magnitude", () => {
  it("start and end blank = full-length line; only start = point; start and end = partial line, linear to end magnitude", () => {
    const r = loadsOf([
      [1.5, null, null, null],
      [10, 6, null, null],
      [2, 4, 12, null],
      [0, 0, 20, 3],
    ]);
    expect(r.items).toEqual([
      { kind: "line", start: 0, end: SPAN, w1: 1.5, w2: 1.5 },
      { kind: "point", x: 6, p: 10 },
      { kind: "line", start: 4, end: 12, w1: 2, w2: 2 },
      { kind: "line", start: 0, end: 20, w1: 0, w2: 3 },
    ]);
  });
  it("a point load at 0 when start is 0 and end blank; the same from a host passing blanks as 0", () => {
    expect(loadsOf([[5, 0, null, null]]).items).toEqual([{ kind: "point", x: 0, p: 5 }]);
    expect(loadsOf([[5, 6, 0, 0]]).items).toEqual([{ kind: "point", x: 6, p: 5 }]);
  });
  it("text in the magnitude column is an error naming the row", () => {
    expect(loadError([[1, null, null, null], ["abc", 2, null, null]])).toBe('loads, row 2: magnitude "abc" is text where a number belongs.');
  });
});

describe("supports", () => {
  it("default: pins at 0 and span", () => {
    expect(supportsOf(undefined).items).toEqual([
      { x: 0, type: "pin" },
      { x: SPAN, type: "pin" },
    ]);
  });
  it("position | type with roller = pin and a blank type = pin, in the order given", () => {
    const r = supportsOf([
      [20, "Roller"],
      [0, "FIXED"],
      [10, null],
    ]);
    expect(r.items).toEqual([
      { x: 20, type: "pin" },
      { x: 0, type: "fixed" },
      { x: 10, type: "pin" },
    ]);
  });
  it("a one-column range is pins, and there 0 is a position", () => {
    expect(supportsOf([[0], [null], [12]]).items).toEqual([
      { x: 0, type: "pin" },
      { x: 12, type: "pin" },
    ]);
  });
  it("blank two-column rows (null, empty or zeros) are skipped; all blank = default", () => {
    expect(supportsOf([[0, "pin"], [0, 0], [null, null], [20, "pin"]]).rows).toEqual([1, 4]);
    expect(supportsOf([[0, 0], [null, ""]]).items).toEqual([
      { x: 0, type: "pin" },
      { x: SPAN, type: "pin" },
    ]);
  });
  it("errors name the row", () => {
    expect(supportError([[0, "pin"], [20, "hinge"]])).toBe('supports, row 2: type "hinge" is not pin, roller or fixed.');
    expect(supportError([[0, "pin"], [22, "pin"]])).toBe("supports, row 2: position 22 is outside the member (0 to 20).");
    expect(supportError([[0, "pin"], ["end", "pin"]])).toBe('supports, row 2: position "end" is text where a number belongs.');
    expect(supportError([[5, "pin"], [null, null], [5, "fixed"]])).toBe("supports, row 3: position 5 repeats the support of row 1; give each support once.");
  });
});

describe("engine errors restated with the range's rows", () => {
  it("the n-th load of the model is reported at its row in the range", () => {
    const input = beamModel(SPAN, [[null, null, null, null, null], ["point", 1, 2, null, null], [null, null, null, null, null], ["point", 1, 3, null, null]], undefined);
    expect(input.ok).toBe(true);
    if (!input.ok) return;
    const engineError = fail("invalid", "something about it.", "loads", 2);
    if (engineError.ok) return;
    expect(withRangeRow(engineError.error, input.value).message).toBe("loads, row 4: something about it.");
  });
});
