// The invented demo team of docs/model.md §6. Loaded only into an empty database.
import bcrypt from "bcryptjs";
import { sql } from "drizzle-orm";
import { getDb } from "../client";
import { memberships, teams, users, type Role } from "../schema";

export const DEMO_TEAM = "Harbourline Labs";
export const DEMO_PASSWORD = "sensewright-demo";
export const DEMO_ACCOUNTS: readonly { email: string; name: string; role: Role }[] = [
  { email: "owner@harbourline.example", name: "Demo Owner", role: "owner" },
  { email: "designer@harbourline.example", name: "Demo Designer", role: "designer" },
  { email: "reviewer@harbourline.example", name: "Demo Reviewer", role: "reviewer" },
  { email: "maker@harbourline.example", name: "Demo Maker", role: "maker" },
];

export type DemoIds = { teamId: string; userIds: Record<Role, string> };

export async function isDatabaseEmpty(): Promise<boolean> {
  const db = await getDb();
  const rows = await db.select({ n: sql<number>`count(*)::int` }).from(users);
  return (rows[0]?.n ?? 0) === 0;
}

/** Creates the demo team and its four accounts. */
export async function seedDemoTeam(): Promise<DemoIds> {
  const db = await getDb();
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const ids = await db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name: DEMO_TEAM }).returning({ id: teams.id });
    if (!team) throw new Error("demo team not created");
    const userIds = {} as Record<Role, string>;
    for (const account of DEMO_ACCOUNTS) {
      const [u] = await tx
        .insert(users)
        .values({ email: account.email, name: account.name, passwordHash: hash })
        .returning({ id: users.id });
      if (!u) throw new Error("demo user not created");
      userIds[account.role] = u.id;
      await tx.insert(memberships).values({ teamId: team.id, userId: u.id, role: account.role });
    }
    return { teamId: team.id, userIds };
  });
  return ids;
}

/** Whether the demo accounts exist (the sign-in page lists them only then). */
export async function demoLoaded(): Promise<boolean> {
  const db = await getDb();
  const rows = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(users)
    .where(sql`lower(${users.email}) like '%@harbourline.example'`);
  return (rows[0]?.n ?? 0) > 0;
}
