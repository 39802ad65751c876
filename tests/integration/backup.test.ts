// Backup and restore: a populated test database is dumped with pg_dump (custom format) and restored with
// pg_restore into a fresh database; every table's row count and a few whole rows come back the same.
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inArray } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { saveAnalysis } from "@/db/queries/analyses";
import { sets } from "@/db/schema";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { backupDatabase, latestBackup, restoreDatabase } from "@/scripts/backup";
import { withDatabase } from "@/scripts/database-url";
import { recreateDatabase } from "@/scripts/databases";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import { createOldSet } from "./access-matrix/world";
import { buildWorld, startTestMail } from "./helpers";

let mail: MailFake;
let dir: string;
const restoredUrl = withDatabase(process.env.DATABASE_URL as string, `plumbline_restore${process.env.PLUMBLINE_DB_SUFFIX ?? ""}`);

beforeAll(async () => {
  mail = await startTestMail();
  dir = mkdtempSync(path.join(tmpdir(), "plumbline-backup-"));
  const world = await buildWorld("backup");
  const setIds = await Promise.all([1, 2].map(() => createOldSet(world.athleteA1, { teamId: world.teamA.id, note: "Ironbark: heavy single, 🏋️ \u202Ertl" })));
  await db.update(sets).set({ clipStatus: "uploaded", clipStorageKey: "backup/none" }).where(inArray(sets.id, setIds));
  const { track } = generateSyntheticSet({ lift: "squat", seed: 9, reps: 4, view: "side" });
  const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 });
  const viewer = { userId: world.athleteA1.id, name: "", email: "", role: "user" as const, emailVerified: true };
  for (const setId of setIds) await saveAnalysis(viewer, setId, { model: "m@1", settings: {}, calibration: track.calibration, result, trackStorageKey: null });
});

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await recreateDatabase(restoredUrl).catch(() => undefined);
  await mail?.stop();
  await closeDb();
});

async function snapshot(url: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const tables = (
      await client.query<{ name: string }>(
        "select format('%I.%I', table_schema, table_name) as name from information_schema.tables where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema') order by 1",
      )
    ).rows.map((r) => r.name);
    const counts: Record<string, number> = {};
    for (const table of tables) counts[table] = Number((await client.query(`select count(*) as n from ${table}`)).rows[0].n);
    const rows = {
      sets: (await client.query("select * from sets order by id")).rows,
      users: (await client.query('select id, name, email, role from "user" order by id')).rows,
      reps: (await client.query("select analysis_id, rep_index, mean_concentric_velocity_mps, flags from reps order by analysis_id, rep_index")).rows,
      series: (await client.query("select rep_id, name, points from rep_series order by rep_id, name limit 20")).rows,
      migrations: (await client.query("select hash from drizzle.__drizzle_migrations order by id")).rows,
    };
    return { counts, rows };
  } finally {
    await client.end();
  }
}

describe("db:backup and db:restore", () => {
  it("restore a populated database into a fresh one with every row", { timeout: 120_000 }, async () => {
    const source = process.env.DATABASE_URL as string;
    const file = backupDatabase(source, dir, new Date("2026-12-02T00:45:12.345Z"));
    expect(path.basename(file)).toMatch(/^plumbline_test.*-20261202T004512Z\.dump$/);
    expect(statSync(file).size).toBeGreaterThan(0);
    expect(latestBackup(dir)).toBe(file);

    await recreateDatabase(restoredUrl);
    await restoreDatabase(file, restoredUrl);
    const [before, after] = await Promise.all([snapshot(source), snapshot(restoredUrl)]);
    expect(before.counts["public.sets"]).toBeGreaterThanOrEqual(2);
    expect(before.counts["public.reps"]).toBeGreaterThanOrEqual(8);
    expect(after.counts).toEqual(before.counts);
    expect(after.rows).toEqual(before.rows);
  });

  it("refuses to restore into a database that already holds the tables, changing nothing", { timeout: 120_000 }, async () => {
    const file = latestBackup(dir) as string;
    const before = await snapshot(restoredUrl);
    await expect(restoreDatabase(file, restoredUrl)).rejects.toThrow();
    expect((await snapshot(restoredUrl)).counts).toEqual(before.counts);
  });
});
