/**
 * Governing values of one member over load combinations and live load patterns (ASCE/SEI 7-22
 * Sec. 4.3.3), and its deflection check against span ratios. Pure; any consistent units.
 */
export * from "./combination-sets";
export * from "./envelope";
export { DEFAULT_PATTERNED, type MemberCases } from "./member-cases";
export { ENUMERATION_LIMIT, type PatternRecord } from "./patterns";
export { memberSegments, type MemberSegment } from "./segments";
export * from "./deflection-limits";
