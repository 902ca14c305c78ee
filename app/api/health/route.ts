import { databaseKind, getDb } from "@/db/client";
import { publicRoute } from "@/lib/auth/gate";
import { sql } from "drizzle-orm";

export const dynamic = "force-dynamic";

export const GET = publicRoute(async () => {
  const db = await getDb();
  await db.execute(sql`select 1`);
  return { ok: true, database: await databaseKind() };
});
