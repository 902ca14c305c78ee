// Idempotency keys (API v2): the same key from the same user within 24 h gets the first answer
// back and writes nothing. The key is claimed inside the transaction that does the work, so two
// concurrent repeats cannot both write (the second waits on the unique index, then finds the claim).
import { and, eq, lt, sql } from "drizzle-orm";
import { getDb, type Tx } from "../client";
import { idempotencyKeys } from "../schema";

export const IDEMPOTENCY_WINDOW_HOURS = 24;

export type Idempotent<T> = { replayed: boolean; answer: T };

export async function withIdempotencyKey<T extends Record<string, unknown>>(
  who: { userId: string; scope: string; key: string },
  work: (tx: Tx) => Promise<T>,
): Promise<Idempotent<T>> {
  const db = await getDb();
  const match = and(
    eq(idempotencyKeys.userId, who.userId),
    eq(idempotencyKeys.scope, who.scope),
    eq(idempotencyKeys.key, who.key),
  );
  return db.transaction(async (tx) => {
    // An expired claim no longer counts: the key may be used afresh.
    await tx
      .delete(idempotencyKeys)
      .where(
        and(match, lt(idempotencyKeys.createdAt, sql`now() - make_interval(hours => ${IDEMPOTENCY_WINDOW_HOURS})`)),
      );
    const claimed = await tx
      .insert(idempotencyKeys)
      .values({ userId: who.userId, scope: who.scope, key: who.key, response: {} })
      .onConflictDoNothing()
      .returning({ key: idempotencyKeys.key });
    if (claimed.length === 0) {
      const [row] = await tx.select({ response: idempotencyKeys.response }).from(idempotencyKeys).where(match);
      return { replayed: true, answer: (row?.response ?? {}) as T };
    }
    const answer = await work(tx);
    await tx.update(idempotencyKeys).set({ response: answer }).where(match);
    return { replayed: false, answer };
  });
}
