// Queries built once per database handle. Drizzle builds a query's SQL text from its parts on every
// call, which on a signed-in page (the membership read, the design page's one read) cost about as
// much as PGlite's execution of it; a prepared query keeps the text and takes only its parameters.
import type { Db } from "../client";

/** `build` run once per handle (a closed and reopened database gets its own). */
export function preparedOnce<P>(build: (db: Db) => P): (db: Db) => P {
  const kept = new WeakMap<Db, P>();
  return (db) => {
    let query = kept.get(db);
    if (!query) {
      query = build(db);
      kept.set(db, query);
    }
    return query;
  };
}
