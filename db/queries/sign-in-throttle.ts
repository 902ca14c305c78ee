// Counters of failed sign-ins, one row per bucket in a fixed window. Every step is one statement,
// so two server processes on one PostgreSQL count into the same row without losing a failure.
import { and, gt, inArray, lte, sql } from "drizzle-orm";
import { getDb } from "../client";
import { signInFailures } from "../schema";

export type BucketState = { bucket: string; failures: number; windowStartedAt: Date };

/** The buckets' counts within the window that is open at `now` (expired windows count as empty). */
export async function readBuckets(buckets: string[], windowMs: number, now: Date): Promise<BucketState[]> {
  if (buckets.length === 0) return [];
  const db = await getDb();
  const openSince = new Date(now.getTime() - windowMs);
  return db
    .select()
    .from(signInFailures)
    .where(and(inArray(signInFailures.bucket, buckets), gt(signInFailures.windowStartedAt, openSince)));
}

/** Counts one failure in each bucket: a bucket whose window has closed starts a new one at `now`. */
export async function countFailure(buckets: string[], windowMs: number, now: Date): Promise<void> {
  const db = await getDb();
  const openSince = new Date(now.getTime() - windowMs);
  for (const bucket of buckets) {
    await db
      .insert(signInFailures)
      .values({ bucket, failures: 1, windowStartedAt: now })
      .onConflictDoUpdate({
        target: signInFailures.bucket,
        set: {
          failures: sql`case when ${signInFailures.windowStartedAt} <= ${openSince} then 1 else ${signInFailures.failures} + 1 end`,
          windowStartedAt: sql`case when ${signInFailures.windowStartedAt} <= ${openSince} then ${now} else ${signInFailures.windowStartedAt} end`,
        },
      });
  }
  // Closed windows are dead weight: drop them while we are here.
  await db.delete(signInFailures).where(lte(signInFailures.windowStartedAt, openSince));
}

/** Forgets a bucket (a successful sign-in clears its own account-and-address pair). */
export async function clearBucket(bucket: string): Promise<void> {
  const db = await getDb();
  await db.delete(signInFailures).where(inArray(signInFailures.bucket, [bucket]));
}
