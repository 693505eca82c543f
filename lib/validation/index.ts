export * from "./eng";
export * from "./tolerance";
export * from "./retrofit";
export * from "./stage";
export * from "./target";
export * from "./workspace";
export * from "./control";
export * from "./measurement";
