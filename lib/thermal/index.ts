export * from "./least-squares";
export * from "./model";
