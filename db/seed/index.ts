// SEED_DEMO=1: the invented demo team of docs/model.md §6, loaded only into an empty database.
import { seedDemoDesigns } from "./designs";
import { seedDemoLibrary } from "./library";
import { isDatabaseEmpty, seedDemoTeam } from "./team";
import { seedDemoUnits } from "./units";

export { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_TEAM, demoLoaded } from "./team";

/** Loads the demo data if the database has no users yet; returns whether it did. */
export async function seedDemoIfEmpty(): Promise<boolean> {
  if (!(await isDatabaseEmpty())) return false;
  const ids = await seedDemoTeam();
  await seedDemoLibrary(ids);
  await seedDemoDesigns(ids);
  await seedDemoUnits(ids);
  return true;
}
