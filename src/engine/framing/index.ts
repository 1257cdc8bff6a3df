/**
 * Framing plan engine (pure): plan tables -> member rows, bearings, tributary pieces, problems.
 * No wiring yet: a later step writes its output as the Members and Loads tables.
 */
export * from "./types";
export { DECKS_SPEC, FRAMING_SPEC, GRIDS_SPEC, LEVELS_SPEC, COORDINATE_FORMS } from "./specs";
export { readPlan, type PlanTables, type PlanReading, type PlanReadings } from "./read";
export { derive, derivePlan, DEFAULT_TOLERANCE } from "./derive";
