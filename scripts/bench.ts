// `npm run bench`: prints `name: value` lines. Speed is reported here, never asserted in tests.
// Each section lives in scripts/bench/<name>.ts and exports run(): Promise<Record<string, number>>.
import fs from "node:fs";
import path from "node:path";

type Section = { run: () => Promise<Record<string, number>> };

const order = ["engine", "pdf", "profile", "wizard", "server", "pages"];
const dir = path.join(process.cwd(), "scripts", "bench");
const only = process.argv.slice(2);

async function main() {
  const available = fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".ts"))
    .map((f) => f.replace(/\.ts$/, ""));
  const names = [...order.filter((n) => available.includes(n)), ...available.filter((n) => !order.includes(n))];
  let failed = false;
  for (const name of names) {
    if (only.length && !only.includes(name)) continue;
    try {
      const mod = (await import(path.join(dir, `${name}.ts`))) as Section;
      const result = await mod.run();
      for (const [key, value] of Object.entries(result)) {
        console.log(`${key}: ${Number.isInteger(value) ? value : Number(value.toPrecision(4))}`);
      }
    } catch (e) {
      failed = true;
      console.error(`${name}: failed — ${(e as Error).message}`);
    }
  }
  process.exit(failed ? 1 : 0);
}

void main();
