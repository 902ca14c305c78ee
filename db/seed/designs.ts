import type { DemoIds } from "./team";

/** Demo designs of the Harbourline scenario (filled in by the designs feature). */
export async function seedDemoDesigns(_ids: DemoIds): Promise<void> {}
