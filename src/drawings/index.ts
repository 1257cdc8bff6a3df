/**
 * Drawings of members from the exact beam engine's results, as SVG strings: pure functions
 * with no DOM or React, shared by the task pane and the HTML calculation report.
 *
 * - {@link renderMemberSheet}: free-body diagram + shear + moment (+ deflected shape).
 * - {@link renderLoadPath}: what a member carries and where its reactions go.
 */
export { renderMemberSheet } from "./sheet";
export { renderLoadPath, MAX_ROWS_PER_SIDE } from "./load-path";
export { solveDrawing, toBeamModel } from "./model";
export { escapeXml } from "./escape";
export { formatLength, formatValue, parseDrawnNumber } from "./format";
export { REVIEW_NOTICE } from "./notice";
export { flexuralRigidityKipFt2, flexuralRigidityKnM2, SI_UNITS, US_UNITS } from "./types";
export type { DrawingUnits, DrawnLineLoad, DrawnMoment, DrawnPointLoad, DrawnSupport, MemberDrawing } from "./types";
export type { LoadPathBranch, LoadPathTree } from "./load-path-types";
