// Runs every benchmark module in this folder (each exports `run()` that prints its figures).
// Pass names to run a subset: `npm run bench -- analysis`.
import { readdirSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

const here = import.meta.dirname;
const wanted = process.argv.slice(2);
const modules = readdirSync(here)
  .filter((f) => f.endsWith(".ts") && f !== "run.ts")
  .map((f) => f.replace(/\.ts$/, ""))
  .filter((name) => wanted.length === 0 || wanted.includes(name))
  .sort();

for (const name of modules) {
  const mod = (await import(pathToFileURL(path.join(here, `${name}.ts`)).href)) as { run: () => Promise<void> };
  console.log(`\n== bench: ${name}`);
  await mod.run();
}
