/**
 * Three-span continuous member: the governing patterns of the envelope checked against CalculiX
 * (test/helpers/calculix.ts) solving the same factored, patterned member independently.
 * Without `ccx` the file fails in CI and is skipped, loudly, elsewhere.
 */
import { describe, expect, it } from "vitest";
import type { BeamLoad, Support } from "../../../src/engine/beam/types";
import { builtInCombinations, envelope, governingModel } from "../../../src/engine/envelope";
import { ccxAvailable, momentByStatics, solveWithCalculix } from "../../helpers/calculix";

const available = ccxAvailable();
if (!available && !process.env.CI) {
  console.warn("\n*** WARNING: CalculiX (ccx) not found: the envelope's finite-element check was SKIPPED. Install it with: apt-get install calculix-ccx ***\n");
}

const LRFD = builtInCombinations({ method: "LRFD", halfLive: false });
const line = (start: number, end: number, w: number): BeamLoad => ({ kind: "line", start, end, w1: w, w2: w });
const pins = (...xs: number[]): Support[] => xs.map((x) => ({ x, type: "pin" }));

describe.skipIf(!available && !process.env.CI)("three spans 5 + 6 + 5 m, D 2 kN/m and L 4 kN/m everywhere (CalculiX)", () => {
  const member = { span: 16, supports: pins(0, 5, 11, 16), loads: { D: [line(0, 16, 2)], L: [line(0, 16, 4)] } };
  const r = envelope(member, LRFD);
  if (!r.ok) throw new Error(r.error.message);
  const env = r.value;

  it("largest sagging moment: L on spans 1 and 3 (skip loading), value by statics of CalculiX's reactions", () => {
    expect(env.momentMax.pattern).toBe("L on spans 1, 3");
    const m = governingModel(member, LRFD, env.momentMax);
    if (!m.ok) throw new Error(m.error.message);
    const fe = solveWithCalculix(m.value);
    const byStatics = momentByStatics(m.value, fe.reactions, fe.reactions.map(() => 0), env.momentMax.x);
    expect(Math.abs(byStatics - env.momentMax.value)).toBeLessThan(2e-5 * env.momentMax.value);
  });

  it("largest interior reaction: L on the two adjacent spans; every governing reaction matches CalculiX", () => {
    expect(env.reactionMax[1]!.pattern).toBe("L on spans 1, 2");
    for (const [i, g] of [...env.reactionMax.entries(), ...env.reactionMin.entries()]) {
      const m = governingModel(member, LRFD, g);
      if (!m.ok) throw new Error(m.error.message);
      const fe = solveWithCalculix(m.value);
      expect(Math.abs(fe.reactions[i]! - g.value)).toBeLessThan(2e-5 * Math.max(...fe.reactions.map(Math.abs)));
    }
  });
});
