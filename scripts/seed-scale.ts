// `npm run seed:scale [-- --dir .data/scale --designs 10000 --revisions 30000 --reviews 5000 --profiles 200]`
// Fills its own PGlite directory with the demo team and a team at scale (db/seed/scale.ts). Refuses a
// directory a running server holds (db/lock.ts) and one already seeded.
import path from "node:path";
import { parseArgs } from "node:util";

const { values } = parseArgs({
  options: {
    dir: { type: "string", default: ".data/scale" },
    designs: { type: "string", default: "10000" },
    revisions: { type: "string", default: "30000" },
    reviews: { type: "string", default: "5000" },
    profiles: { type: "string", default: "200" },
  },
});

function count(name: keyof typeof values): number {
  const n = Number(values[name]);
  if (!Number.isInteger(n) || n < 0) {
    console.error(`[seed:scale] --${name} must be a whole number, got "${values[name]}"`);
    process.exit(2);
  }
  return n;
}

async function main() {
  const dir = path.resolve(values.dir!);
  if (process.env.DATABASE_URL) {
    console.error("[seed:scale] unset DATABASE_URL: the scale seed writes its own PGlite directory");
    process.exit(2);
  }
  const counts = {
    designs: count("designs"),
    revisions: count("revisions"),
    reviews: count("reviews"),
    profiles: count("profiles"),
  };
  process.env.PGLITE_DIR = dir;
  // Imported after PGLITE_DIR is set: the environment is read once, on first use.
  const { getDb, closeDb } = await import("../db/client");
  const { seedDemoIfEmpty } = await import("../db/seed");
  const { seedScaleTeam, SCALE_TEAM, SCALE_ACCOUNTS } = await import("../db/seed/scale");
  const t0 = performance.now();
  try {
    await getDb(); // takes the directory's lock, or refuses a directory a server holds
    await seedDemoIfEmpty();
    await seedScaleTeam(counts);
    // PGlite has no autovacuum: without this the first server start pays for it (or plans blind).
    const { refreshPlannerStatistics } = await import("../db/queries/planner-statistics");
    await refreshPlannerStatistics();
  } catch (e) {
    console.error(`[seed:scale] ${(e as Error).message}`);
    process.exit(1);
  }
  await closeDb();
  const s = ((performance.now() - t0) / 1000).toFixed(1);
  console.log(
    `[seed:scale] "${SCALE_TEAM}" in ${dir}: ${counts.designs} designs, ${counts.revisions} revisions, ` +
      `${counts.reviews} reviews, ${counts.profiles} profiles in ${s} s. ` +
      `Sign in as ${SCALE_ACCOUNTS.map((a) => a.email).join(", ")} (the demo password). ` +
      `Serve it with PGLITE_DIR=${dir} npm start.`,
  );
}

void main();
