export * from "./enums";
export * from "./users";
export * from "./clubs";
export * from "./contests";
export * from "./sessions";
export * from "./events";
export * from "./sync";
export * from "./coaching";
