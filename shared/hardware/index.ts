/** Standard hardware tables, each row with its source tag (domain.md §3, §4). */
export * from "./sources";
export * from "./bolts";
export * from "./threads";
export * from "./materials";
export * from "./torque";
export * from "./cables";
export * from "./design-loads";
export * from "./plates";
