// Current profiles: CSV in, samples and a summary out, and the decimated series the chart draws.
// Pure TypeScript (papaparse and the engine only): no database, no React.
export * from "./csv";
export * from "./parse";
export * from "./summary";
export * from "./decimate";
export * from "./samples";
export * from "./limits";
export * from "./design";
export * from "./ticks";
