/**
 * From a drawing's input to the beam engine's model and solution. The drawings show only
 * numbers that come out of this solution.
 */
import type { Result } from "../engine/errors";
import { solveBeam } from "../engine/beam/index";
import type { BeamLoad, BeamModel, BeamSolution } from "../engine/beam/types";
import type { MemberDrawing } from "./types";

/**
 * The engine's model of a drawn member. Loads are listed lines first, then point loads, then
 * couples, so an engine message about "loads, row N" counts rows in that order.
 * @param drawing - the member as drawn
 */
export function toBeamModel(drawing: MemberDrawing): BeamModel {
  const loads: BeamLoad[] = [
    ...drawing.lines.map((l): BeamLoad => ({ kind: "line", start: l.start, end: l.end, w1: l.w1, w2: l.w2 })),
    ...drawing.points.map((p): BeamLoad => ({ kind: "point", x: p.x, p: p.p })),
    ...drawing.moments.map((m): BeamLoad => ({ kind: "moment", x: m.x, m: m.m })),
  ];
  return { span: drawing.span, supports: drawing.supports.map((s) => ({ x: s.x, type: s.type })), loads };
}

/**
 * Solve the drawn member with the exact beam engine.
 * @param drawing - the member as drawn
 * @returns the engine's solution, or its error (never throws)
 */
export function solveDrawing(drawing: MemberDrawing): Result<BeamSolution> {
  return solveBeam(toBeamModel(drawing));
}
