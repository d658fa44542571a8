export * from "./auth";
export * from "./records";
export * from "./tests";
export * from "./review";
