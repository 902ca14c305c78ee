// Named prepared statements for PGlite, as drizzle's .prepare(name) makes them on a PostgreSQL
// server. PGlite's query() sends every call as an unnamed statement, so PostgreSQL parses, analyses
// and plans the text each time: for the design page's one read (5.8 kB of SQL) planning was 1.6 of
// its 2.2 ms. A named statement is parsed once, and after five executions PostgreSQL keeps a
// generic plan when it costs no more than the custom ones (PostgreSQL 17 manual, PREPARE, "Notes";
// extended query protocol, §53.2.3). Only the texts of prepared queries are kept: a generic plan
// suits lookups by key, but a search's best plan depends on its pattern (a rare word wants the
// trigram index, a common one the ordered scan), and a generic one made the rare search 3× slower.
// Statements inside a transaction (drizzle's tx) go through PGlite's own path.
import { parse, protocol, type PGlite, type QueryOptions, type Results } from "@electric-sql/pglite";

type Statement = { name: string; paramTypes: number[] };

const { serialize } = protocol;

/**
 * The texts of the process's prepared queries (db/queries/prepared.ts registers them). On globalThis,
 * as the handle in client.ts: Next loads this module once for instrumentation, which opens the
 * database, and again for routes and pages, which prepare the queries.
 */
const sharedKey = Symbol.for("sensewright.statementCache");
const shared = ((globalThis as { [sharedKey]?: { texts: Set<string>; made: number } })[sharedKey] ??= {
  texts: new Set(),
  made: 0, // statement names, unique in the process: two caches on one client must not collide
});
const preparedTexts = shared.texts;

/** Keep `text` as a named statement from its first use. */
export function keepStatement(text: string): void {
  preparedTexts.add(text);
}

type Options = {
  /** Which texts to keep as named statements; the rest run as PGlite's query() runs them. */
  keeps?: (text: string) => boolean;
  /** How many the backend keeps; the least recently used is closed beyond that. */
  max?: number;
};

/** A statement PostgreSQL no longer has, or whose result types a schema change altered: parse again. */
function isStale(e: unknown): boolean {
  const { code, message } = (e ?? {}) as { code?: string; message?: string };
  return code === "26000" || (code === "0A000" && /cached plan must not change result type/.test(message ?? ""));
}

/**
 * `client` with a query() that keeps a named statement per text it `keeps` (at most `max`, least
 * recently used closed first). Results, parsers, serialisers and errors are PGlite's own; any other
 * text, and a call with options the cache does not handle (a blob, parameter types), goes through
 * PGlite unchanged.
 */
export function withStatementCache(
  client: PGlite,
  { keeps = (text) => preparedTexts.has(text), max = 200 }: Options = {},
): PGlite {
  const statements = new Map<string, Statement>(); // insertion order = least recently used first

  async function prepare(text: string, stale?: Statement): Promise<Statement> {
    const parts: Uint8Array[] = [];
    if (stale) parts.push(serialize.close({ type: "S", name: stale.name }));
    else if (statements.size >= max) {
      const [oldText, oldest] = statements.entries().next().value as [string, Statement];
      statements.delete(oldText);
      parts.push(serialize.close({ type: "S", name: oldest.name }));
    }
    const name = `sw_${++shared.made}`;
    parts.push(serialize.parse({ name, text }), serialize.describe({ type: "S", name }), serialize.sync());
    const { messages } = await client.execProtocol(Buffer.concat(parts), { syncToFs: false });
    const statement = { name, paramTypes: parse.parseDescribeStatementResults(messages) };
    statements.set(text, statement);
    return statement;
  }

  async function run<T>(
    text: string,
    params: unknown[],
    options: QueryOptions | undefined,
    stale?: Statement,
  ): Promise<Results<T>> {
    let statement = stale ? undefined : statements.get(text);
    if (statement) {
      statements.delete(text); // to the most recently used end
      statements.set(text, statement);
    } else statement = await prepare(text, stale);
    const values = params.map((value, i) => {
      if (value === null || value === undefined) return null;
      const type = statement.paramTypes[i]!;
      const write = options?.serializers?.[type] ?? client.serializers[type];
      return write ? write(value) : String(value);
    });
    const { messages } = await client.execProtocol(
      Buffer.concat([
        serialize.bind({ statement: statement.name, values }),
        serialize.describe({ type: "P" }),
        serialize.execute({}),
        serialize.sync(),
      ]),
      { syncToFs: false },
    );
    return parse.parseResults(messages, client.parsers, options)[0] as Results<T>;
  }

  async function query<T>(text: string, params: unknown[] = [], options?: QueryOptions): Promise<Results<T>> {
    if (!keeps(text) || options?.blob || options?.paramTypes || options?.onNotice)
      return client.query<T>(text, params, options);
    await client._checkReady();
    // As PGlite's query(): after any open transaction, and alone on the backend.
    const result = await client._runExclusiveTransaction(() =>
      client._runExclusiveQuery(async () => {
        try {
          return await run<T>(text, params, options);
        } catch (e) {
          const stale = statements.get(text);
          if (!stale || !isStale(e)) throw Object.assign(e as object, { query: text, params, queryOptions: options });
          statements.delete(text);
          return await run<T>(text, params, options, stale);
        }
      }),
    );
    await client.syncToFs();
    return result;
  }

  return new Proxy(client, {
    get(target, key) {
      if (key === "query") return query;
      const value: unknown = Reflect.get(target, key, target);
      // PGlite's methods read its private fields, so they run on the client itself, not the proxy.
      return typeof value === "function" ? value.bind(target) : value;
    },
  });
}
