/** The caution every generated output carries (design.md section 6). */
export const REVIEW_NOTICE = "For review by a qualified engineer; local codes govern.";
