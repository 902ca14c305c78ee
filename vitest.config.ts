import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    alias: {
      "@": fileURLToPath(new URL("./", import.meta.url)),
      "server-only": fileURLToPath(new URL("./tests/fixtures/server-only.ts", import.meta.url)),
    },
  },
  test: {
    environment: "node",
    include: ["lib/**/*.test.ts", "db/**/*.test.ts", "tests/unit/**/*.test.ts"],
    // A fresh PGlite takes seconds to start; database tests share one per file.
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // Database tests get an in-memory PGlite per test file, or (with DATABASE_URL) a fresh database
    // of their own on that PostgreSQL server.
    env: process.env.DATABASE_URL ? {} : { PGLITE_DIR: "memory://" },
    setupFiles: ["./tests/fixtures/vitest-db.ts"],
  },
});
