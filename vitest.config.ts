import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    alias: { "@": fileURLToPath(new URL("./", import.meta.url)) },
  },
  test: {
    environment: "node",
    include: ["lib/**/*.test.ts", "db/**/*.test.ts", "tests/unit/**/*.test.ts"],
    // A fresh PGlite takes seconds to start; database tests share one per file.
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // server-only throws outside React Server Components; tests import server modules directly.
    server: { deps: { inline: [] } },
  },
});
