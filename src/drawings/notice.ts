/** The caution every generated output carries (DEVELOPERS.md, Rules every change keeps). */
export const REVIEW_NOTICE = "For review by a qualified engineer; local codes govern.";
