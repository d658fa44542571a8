export * from "./auth";
export * from "./records";
export * from "./tests";
export * from "./review";
export * from "./rigs";
export * from "./pressure";
export * from "./casebook";
export * from "./tasks";
