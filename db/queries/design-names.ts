// Names already taken in a team, for import's duplicate check and its suggested free name.
import { and, eq, or, sql } from "drizzle-orm";
import { getDb } from "../client";
import { designs } from "../schema";

/** Team design names equal to `name` or of the form "name (n)", compared without case. */
export async function namesLike(teamId: string, name: string): Promise<string[]> {
  const db = await getDb();
  const lower = name.toLowerCase();
  const rows = await db
    .select({ name: designs.name })
    .from(designs)
    .where(
      and(
        eq(designs.teamId, teamId),
        or(sql`lower(${designs.name}) = ${lower}`, sql`starts_with(lower(${designs.name}), ${`${lower} (`})`),
      ),
    );
  return rows.map((r) => r.name);
}
