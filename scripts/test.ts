// `npm test`: installs what is missing (Debian packages, model weights), starts the local
// PostgreSQL and runs every vitest project: unit, integration (real database), e2e (real Chromium).
import { spawnSync } from "node:child_process";
import { ensureSystemPackages } from "./system-packages";
import { ensureLocalPostgres } from "./postgres";
import { ensureModels } from "./models";
import { log } from "./run";

const started = Date.now();
ensureSystemPackages(["postgresql", "chromium", "ffmpeg"]);
await ensureModels();
if (!process.env.DATABASE_URL) ensureLocalPostgres();

const result = spawnSync("npx", ["vitest", "run", ...process.argv.slice(2)], { stdio: "inherit" });
log(`test suite finished in ${((Date.now() - started) / 1000).toFixed(0)} s`);
process.exit(result.status ?? 1);
