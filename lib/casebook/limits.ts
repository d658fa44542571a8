/** Limits shared by the overlay API and the pages (safe for client components). */
export const OVERLAY_MAX_TESTS = 8;
