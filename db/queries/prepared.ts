// Queries built once per database handle. Drizzle builds a query's SQL text from its parts on every
// call, which on a signed-in page (the membership read, the design page's one read) cost about as
// much as PGlite's execution of it; a prepared query keeps the text and takes only its parameters.
// On PGlite its text is also kept as a named statement, parsed and planned once (statement-cache.ts);
// on a PostgreSQL server drizzle names it itself.
import type { Db } from "../client";
import { keepStatement } from "../statement-cache";

/** `build` run once per handle (a closed and reopened database gets its own). */
export function preparedOnce<P extends object>(build: (db: Db) => P): (db: Db) => P {
  const kept = new WeakMap<Db, P>();
  return (db) => {
    let query = kept.get(db);
    if (!query) {
      query = build(db);
      kept.set(db, query);
      // drizzle's prepared query holds its SQL text here (drizzle-orm/pglite/session.js)
      const text = (query as { queryString?: unknown }).queryString;
      if (typeof text === "string") keepStatement(text);
    }
    return query;
  };
}
