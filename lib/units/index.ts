/** One module for units: conversions (NIST SP 811 factors) and quantities in words. */
export * from "./convert";
export * from "./format";
