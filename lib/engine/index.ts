// The engine contract (see DEVELOPERS.md, "Engine"): analyzeStage, planTarget,
// listDevices and their types. Plain TypeScript, no framework, database or
// Node-only imports: it runs in the browser for live previews as well.
export * from "./errors";
export * from "./version";
export * from "./stage-api";
export * from "./timer-api";
export * from "./adjust";
