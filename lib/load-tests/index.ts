export * from "./peak";
export * from "./predicted-csv";
export * from "./results";
export * from "./schema";
