import { defineConfig } from "drizzle-kit";

// Migrations are generated here and applied by the app itself (db/migrate.ts).
// `npm run db:generate` needs no database; point DATABASE_URL at a server only for drizzle-kit's other commands.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./db/migrations",
  ...(process.env.DATABASE_URL
    ? { dbCredentials: { url: process.env.DATABASE_URL } }
    : { driver: "pglite", dbCredentials: { url: process.env.PGLITE_DIR ?? "./.data/pglite" } }),
});
