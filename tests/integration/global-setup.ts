// Integration tests run against a real PostgreSQL database created fresh for every run.
import { freshTestDatabase } from "@/scripts/test-database";

export default async function setup(): Promise<void> {
  process.env.DATABASE_URL = await freshTestDatabase("plumbline_test");
  // Every test signs people up from one address; tests/integration/abuse-limits.test.ts sets the real rates.
  process.env.PLUMBLINE_RATE_LIMIT_FACTOR ??= "1000";
}
