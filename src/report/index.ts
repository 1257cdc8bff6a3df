/**
 * The printable calculation report of a takedown (HTML, self-contained, no scripts): gather the
 * built takedown with {@link collectTakedown}, then {@link renderReport}.
 */
export { collectTakedown, type TakedownRecord } from "./collect";
export { renderReport, REPORT_CSP, type ReportInput } from "./document";
export { REPORT_CAUTION } from "./text";
export { gravityCombinations } from "./factored";
export { loadPathTree, memberDrawing } from "./drawings";
export { columnStacks } from "./schedule";
