// The rooms of the code and who may enter which (docs/architecture.md). `npm run lint` runs this.
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "engine-is-pure",
      comment:
        "lib/design is the engine: pure TypeScript that also runs in the solver's Web Worker. It imports mathjs, zod and its own files, nothing of the app.",
      severity: "error",
      from: { path: "^lib/design/", pathNot: "\\.test\\.ts$" },
      to: { pathNot: ["^lib/design/", "^node_modules/(mathjs|zod)/"] },
    },
    {
      name: "db-takes-only-types-and-env-from-lib",
      comment:
        "db/ is the data layer: from lib/ it may import types and the environment (lib/env), never behaviour. The demo seed builds its data through the app's services on purpose, and a stored requirement is read back through the engine's schema (db/queries/designs.ts: storedRequirement) until that moves to the service layer.",
      severity: "error",
      from: { path: "^db/", pathNot: ["^db/seed/", "\\.test\\.ts$", "^db/queries/designs\\.ts$"] },
      to: { path: "^lib/", pathNot: "^lib/env\\.ts$", dependencyTypesNot: ["type-only"] },
    },
    {
      name: "components-never-reach-the-database",
      comment: "Components get their data from pages and routes; only `import type` of db/ is allowed.",
      severity: "error",
      from: { path: "^components/" },
      to: { path: "^db/", dependencyTypesNot: ["type-only"] },
    },
    {
      name: "no-cycles",
      comment: "Modules that import each other cannot be read, tested or moved one at a time.",
      severity: "error",
      from: {},
      to: { circular: true },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: ["^\\.next", "^node_modules", "^test-results", "^db/migrations"] },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default", "types"],
      extensions: [".ts", ".tsx", ".js", ".mjs", ".cjs", ".json"],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
