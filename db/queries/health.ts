import { sql } from "drizzle-orm";
import { databaseKind, getDb, type DatabaseKind } from "../client";

/** Round-trips a query so health reports a database that really answers. */
export async function pingDatabase(): Promise<DatabaseKind> {
  const db = await getDb();
  await db.execute(sql`select 1`);
  return databaseKind();
}
