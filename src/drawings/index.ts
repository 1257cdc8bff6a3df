/**
 * Drawings of members from the exact beam engine's results, as SVG strings: pure functions
 * with no DOM or React, shared by the task pane and the HTML calculation report.
 *
 * - {@link renderMemberSheet}: free-body diagram + shear + moment (+ deflected shape).
 * - {@link renderLoadPath}: what a member carries and where its reactions go.
 * - {@link renderFramingPlan}: a level's framing plan from the derived plan (tributary regions shaded).
 * - {@link renderKeyPlan}: a schematic key plan of typed member tables (levels and column stacks).
 */
export { renderMemberSheet } from "./sheet";
export { renderLoadPath, MAX_ROWS_PER_SIDE } from "./load-path";
export { renderFramingPlan, planLevels, loadPathOf, type FramingPlanModel, type FramingPlanOptions } from "./plan";
export { renderKeyPlan, keyPlanOfModel, type KeyPlanInput, type KeyPlanMember } from "./key-plan";
export { solveDrawing, toBeamModel } from "./model";
export { escapeXml } from "./escape";
export { formatLength, formatValue, parseDrawnNumber } from "./format";
export { REVIEW_NOTICE } from "./notice";
export { flexuralRigidityKipFt2, flexuralRigidityKnM2, SI_UNITS, US_UNITS } from "./types";
export type { DrawingUnits, DrawnLineLoad, DrawnMoment, DrawnPointLoad, DrawnSupport, MemberDrawing } from "./types";
export type { LoadPathBranch, LoadPathTree } from "./load-path-types";
