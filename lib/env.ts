// Environment, parsed once. Server-only: the browser never sees these.
import path from "node:path";
import { z } from "zod";

const envSchema = z.object({
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  PGLITE_DIR: z.string().min(1).default("./.data/pglite"),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, "DATABASE_URL must be a postgres:// URL")
    .optional(),
  AUTH_SECRET: z.string().min(16, "AUTH_SECRET must be at least 16 characters").optional(),
  SMTP_URL: z.string().url().optional(),
  SEED_DEMO: z.enum(["0", "1"]).optional(),
  PUBLIC_URL: z.string().url().optional(),
  // 1: a reverse proxy in front of the app appends the client's address to X-Forwarded-For.
  TRUST_PROXY: z.enum(["0", "1"]).optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const blankToUndefined = Object.fromEntries(
    Object.entries(process.env).map(([k, v]) => [k, v === "" ? undefined : v]),
  );
  const parsed = envSchema.safeParse(blankToUndefined);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}

/** True when the embedded database (not a PostgreSQL server) is in use. */
export const usesPglite = () => !env().DATABASE_URL;

/** Where the app keeps its own files (lock, generated secret): the PGlite directory, or ./.data for a server. */
export function dataDir(): string {
  const e = env();
  if (e.DATABASE_URL || e.PGLITE_DIR.startsWith("memory://")) return path.resolve(".data");
  return path.resolve(e.PGLITE_DIR);
}

/** The address links in mail point to. */
export const publicUrl = () => env().PUBLIC_URL ?? process.env.NEXTAUTH_URL ?? `http://localhost:${env().PORT}`;
