import type { DemoIds } from "./team";

/** Demo parts library: invented generic parts (filled in by the library feature). */
export async function seedDemoLibrary(_ids: DemoIds): Promise<void> {}
