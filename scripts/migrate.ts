// `npm run db:migrate`: applies the committed migrations in drizzle/ to DATABASE_URL (or the local cluster).
import { databaseUrl } from "./database-url";
import { ensureDatabase, migrateDatabase } from "./databases";
import { ensureLocalPostgres } from "./postgres";
import { log } from "./run";

if (!process.env.DATABASE_URL) ensureLocalPostgres();
const url = databaseUrl();
await ensureDatabase(url);
await migrateDatabase(url);
log("migrations applied");
