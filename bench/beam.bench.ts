/**
 * Throughput of the single-member solver. One "analysis" = solveBeam + reactions + largest
 * sagging + most hogging + largest shear, the work behind a row of member results.
 */
import { solveBeam, type BeamModel, type BeamSolution } from "../src/engine/beam";
import { opsPerSecond, report } from "./timing";

const simpleSpan: BeamModel = {
  span: 24,
  supports: [
    { x: 0, type: "pin" },
    { x: 24, type: "pin" },
  ],
  loads: [{ kind: "line", start: 0, end: 24, w1: 1.2, w2: 1.2 }],
};

/** Three unequal spans (20, 25, 18) on four pins with ten loads of every kind. */
const threeSpan: BeamModel = {
  span: 63,
  supports: [
    { x: 0, type: "pin" },
    { x: 20, type: "pin" },
    { x: 45, type: "pin" },
    { x: 63, type: "pin" },
  ],
  loads: [
    { kind: "line", start: 0, end: 63, w1: 0.8, w2: 0.8 },
    { kind: "line", start: 5, end: 15, w1: 0.5, w2: 0.5 },
    { kind: "line", start: 22, end: 40, w1: 0, w2: 1.1 },
    { kind: "line", start: 46, end: 60, w1: 0.9, w2: 0.3 },
    { kind: "point", x: 8, p: 12 },
    { kind: "point", x: 31.5, p: 20 },
    { kind: "point", x: 52, p: 9 },
    { kind: "point", x: 45, p: 5 },
    { kind: "moment", x: 12, m: 15 },
    { kind: "moment", x: 57, m: -8 },
  ],
};

let sink = 0;

function analysis(model: BeamModel): void {
  const r = solveBeam(model);
  if (!r.ok) throw new Error(r.error.message);
  const s: BeamSolution = r.value;
  sink += s.reactions[0] + s.maxSagging().value + s.maxHogging().value + s.maxShear().value;
}

function deflection(model: BeamModel): void {
  const r = solveBeam(model);
  if (!r.ok) throw new Error(r.error.message);
  sink += r.value.maxDeflectionEI().value;
}

/** Prints analyses per second for the simple and the three-span cases. */
export async function run(): Promise<void> {
  report("simple span, one full uniform load: analyses", opsPerSecond(() => analysis(simpleSpan)), "/s", ">= 1,000,000/s");
  report("three-span continuous, ten mixed loads: analyses", opsPerSecond(() => analysis(threeSpan)), "/s", ">= 100,000/s");
  report("three-span continuous, ten mixed loads: maxDeflectionEI", opsPerSecond(() => deflection(threeSpan)), "/s");
  report("simple span, one full uniform load: maxDeflectionEI", opsPerSecond(() => deflection(simpleSpan)), "/s");
  if (!Number.isFinite(sink)) console.log("   (checksum not finite)");
}
