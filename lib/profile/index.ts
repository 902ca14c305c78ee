// Current profiles: CSV in, samples and a summary out, and the decimated series the chart draws.
// Pure TypeScript (papaparse and the engine only): no database, no React.
export * from "./csv";
export * from "./parse";
// The summary's arithmetic is the engine's (lib/design/profile.ts); re-exported for the routes.
export * from "@/lib/design/profile";
export * from "./decimate";
export * from "./limits";
export * from "./design";
export * from "./capacity";
export * from "./plan-series";
export * from "./chart";
