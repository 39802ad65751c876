// Integration tests run against a real PostgreSQL database created fresh for every run.
import { freshTestDatabase } from "@/lib/dev/test-database";

export default async function setup(): Promise<void> {
  process.env.DATABASE_URL = await freshTestDatabase("plumbline_test");
}
