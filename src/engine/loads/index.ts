/** Gravity load functions of the engine: tributary width, line loads, combinations, live load reduction, units. */
export * from "./units";
export { tributaryWidth, lineLoad } from "./tributary";
export * from "./combinations";
export * from "./combination-sets";
export * from "./live-reduction";
export * from "./kll";
export * from "./roof-live-reduction";
