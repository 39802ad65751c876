// drizzle-kit settings: `npm run db:generate` writes SQL migrations from db/schema.ts and the
// area schemas beside it (db/schema-<area>.ts) into drizzle/ (committed).
import { defineConfig } from "drizzle-kit";
import { databaseUrl } from "./scripts/database-url";

export default defineConfig({
  dialect: "postgresql",
  schema: ["./db/schema.ts", "./db/schema-*.ts"],
  out: "./drizzle",
  dbCredentials: { url: databaseUrl() },
  strict: true,
  verbose: true,
});
