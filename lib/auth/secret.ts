// AUTH_SECRET, or one generated on first start and kept under the data directory.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { dataDir, env } from "@/lib/env";

export function ensureAuthSecret(): string {
  const configured = env().AUTH_SECRET ?? process.env.NEXTAUTH_SECRET;
  if (configured) return configured;
  const file = path.join(dataDir(), "auth-secret");
  let secret: string;
  try {
    secret = fs.readFileSync(file, "utf8").trim();
  } catch {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    secret = crypto.randomBytes(32).toString("base64url");
    fs.writeFileSync(file, secret, { mode: 0o600 });
  }
  console.warn(
    `[auth] AUTH_SECRET is not set: using the secret generated in ${file}. ` +
      "A shared deployment must set its own AUTH_SECRET.",
  );
  process.env.AUTH_SECRET = secret;
  return secret;
}
