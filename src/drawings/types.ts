/**
 * Inputs of the drawings. They describe one member as the engineer knows it (marks of what
 * holds it up, marks of the members whose reactions it receives) plus the numbers the beam
 * engine needs. Sign conventions are those of docs/interface.md section 1: loads down +, reactions
 * up +, moments counter-clockwise +, bending moment sagging +, deflection down +.
 */
import type { SupportType } from "../engine/beam/types";

/** Unit labels printed on a drawing, and the one conversion a drawing needs (deflection). */
export interface DrawingUnits {
  /** Positions and spans, e.g. "ft" or "m". */
  readonly length: string;
  /** Forces, e.g. "kip" or "kN". */
  readonly force: string;
  /** Line loads, e.g. "kip/ft" or "kN/m". */
  readonly lineLoad: string;
  /** Moments, e.g. "kip-ft" or "kN·m". */
  readonly moment: string;
  /** Deflections, e.g. "in" or "mm". */
  readonly deflection: string;
  /** Deflection units in one length unit: 12 (in per ft), 1000 (mm per m), 1 (same unit). */
  readonly deflectionPerLength: number;
}

/** US customary: ft, kip, kip/ft, kip-ft; EI in kip·ft²; deflection printed in inches. */
export const US_UNITS: DrawingUnits = {
  length: "ft",
  force: "kip",
  lineLoad: "kip/ft",
  moment: "kip-ft",
  deflection: "in",
  deflectionPerLength: 12,
};

/** SI: m, kN, kN/m, kN·m; EI in kN·m²; deflection printed in millimetres. */
export const SI_UNITS: DrawingUnits = {
  length: "m",
  force: "kN",
  lineLoad: "kN/m",
  moment: "kN\u00B7m",
  deflection: "mm",
  deflectionPerLength: 1000,
};

/** A support of the drawn member. */
export interface DrawnSupport {
  /** Position from the left end, in units.length. */
  readonly x: number;
  readonly type: SupportType;
  /** What holds the member up here, e.g. "C-4" or "G-2 @ 12.5 ft". Drawn as text. */
  readonly label?: string;
}

/** A line load over [start, end], varying linearly from w1 to w2 (units.lineLoad, down +). */
export interface DrawnLineLoad {
  readonly start: number;
  readonly end: number;
  readonly w1: number;
  readonly w2: number;
  /** Where it comes from or what it is, e.g. "Office zone" or "cladding". Drawn as text. */
  readonly label?: string;
}

/** A concentrated force (units.force, down +) at x, usually another member's reaction. */
export interface DrawnPointLoad {
  readonly x: number;
  readonly p: number;
  /** Mark of the member it comes from, e.g. "B-7". Drawn as text. */
  readonly from?: string;
}

/** An applied couple (units.moment, counter-clockwise +) at x. */
export interface DrawnMoment {
  readonly x: number;
  readonly m: number;
  /** Where it comes from. Drawn as text. */
  readonly from?: string;
}

/**
 * One member to draw under one load case or combination. The numbers shown are computed from
 * these loads by the exact beam engine, never taken from elsewhere.
 */
export interface MemberDrawing {
  /** The member's mark, e.g. "B-3". */
  readonly mark: string;
  /** beam, girder, joist... printed after the mark. */
  readonly memberType?: string;
  /** Level name, printed in the title. */
  readonly level?: string;
  /** Length of the member in units.length (> 0). */
  readonly span: number;
  readonly units: DrawingUnits;
  readonly supports: readonly DrawnSupport[];
  readonly lines: readonly DrawnLineLoad[];
  readonly points: readonly DrawnPointLoad[];
  readonly moments: readonly DrawnMoment[];
  /** The case or combination the loads belong to: "D", "L", "1.2D + 1.6L". */
  readonly caseLabel: string;
  /**
   * Flexural rigidity EI in units.force × units.length² (kip·ft², kN·m²). When given (> 0),
   * the deflected shape is drawn too. See {@link flexuralRigidityKipFt2} and
   * {@link flexuralRigidityKnM2}.
   */
  readonly ei?: number;
}

/**
 * EI in kip·ft² from E in ksi and I in in⁴ (1 ft = 12 in, so kip·in² / 144).
 * @param eKsi - modulus of elasticity, ksi
 * @param iIn4 - moment of inertia, in⁴
 */
export function flexuralRigidityKipFt2(eKsi: number, iIn4: number): number {
  return (eKsi * iIn4) / 144;
}

/**
 * EI in kN·m² from E in MPa and I in mm⁴ (N·mm² = 1e-9 kN·m²).
 * @param eMpa - modulus of elasticity, MPa (N/mm²)
 * @param iMm4 - moment of inertia, mm⁴
 */
export function flexuralRigidityKnM2(eMpa: number, iMm4: number): number {
  return eMpa * iMm4 * 1e-9;
}
