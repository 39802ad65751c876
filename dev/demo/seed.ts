// `npm run seed`: demo data for trying Plumbline locally — an invented gym with one coach, four athletes with
// profiles, a few training sessions of set metadata, one pending invitation and an operator account.
// Idempotent: fixed ids, so running it again changes nothing.
//
// Demo accounts (all with the password `plumbline-demo`):
//   coach     Mara Vell          coach@ironbark.example      coaches "Ironbark Barbell Club"
//   athletes  Tobin Achterberg   tobin@ironbark.example
//             Noor Halvorsen     noor@ironbark.example
//             Bea Santangelo     bea@ironbark.example
//             Oskar Lindqvist    oskar@ironbark.example
//   operator  Ironbark Operator  operator@ironbark.example   role "admin"
// A pending invitation for new.lifter@ironbark.example; the seed prints its link (/invite/<DEMO_INVITATION_TOKEN>).
import { createHash } from "node:crypto";
import { pathToFileURL } from "node:url";
import { hashPassword } from "better-auth/crypto";
import { createDatabase, type Transaction } from "@/db";
import {
  account,
  athleteProfiles,
  invitations,
  memberships,
  oneRepMaxes,
  sets,
  teams,
  trainingSessions,
  user,
} from "@/db/schema";
import type { CreateSetData } from "@/lib/validation/set";
import type { Lift, UnitPreference } from "@/lib/validation/common";
import { databaseUrl } from "@/scripts/database-url";
import { ensureDatabase, migrateDatabase } from "@/scripts/databases";
import { ensureLocalPostgres } from "@/scripts/postgres";
import { log } from "@/scripts/run";
import { seedBilling } from "./seed-billing";
import { seedDemoReviews } from "./seed-reviews";
import { demoWaitingSetIds, seedDemoSets } from "./seed-sets";

export const DEMO_PASSWORD = "plumbline-demo";
export const DEMO_TEAM_ID = "5e1d0c0a-7c3b-4a51-9a8e-000000000001";
/** The demo invitation's token (43 base64url characters, like real ones); only its SHA-256 is stored. */
export const DEMO_INVITATION_TOKEN = createHash("sha256").update("plumbline-demo-invitation").digest("base64url");

interface DemoPerson {
  id: string;
  name: string;
  email: string;
  role?: "admin";
  profile?: { bodyMassKg: number; heightM: number; unitPreference: UnitPreference; oneRepMaxesKg: Partial<Record<Lift, number>> };
}

export const DEMO_COACH: DemoPerson = { id: "demo-coach-mara", name: "Mara Vell", email: "coach@ironbark.example" };
export const DEMO_OPERATOR: DemoPerson = { id: "demo-operator", name: "Ironbark Operator", email: "operator@ironbark.example", role: "admin" };
export const DEMO_ATHLETES: DemoPerson[] = [
  {
    id: "demo-athlete-tobin",
    name: "Tobin Achterberg",
    email: "tobin@ironbark.example",
    profile: { bodyMassKg: 92.4, heightM: 1.83, unitPreference: "kg", oneRepMaxesKg: { squat: 210, bench: 140, deadlift: 245 } },
  },
  {
    id: "demo-athlete-noor",
    name: "Noor Halvorsen",
    email: "noor@ironbark.example",
    profile: { bodyMassKg: 63.1, heightM: 1.66, unitPreference: "kg", oneRepMaxesKg: { squat: 135, bench: 72.5, deadlift: 160 } },
  },
  {
    id: "demo-athlete-bea",
    name: "Bea Santangelo",
    email: "bea@ironbark.example",
    profile: { bodyMassKg: 71.7, heightM: 1.7, unitPreference: "lb", oneRepMaxesKg: { squat: 142.9, bench: 79.4, deadlift: 176.9 } },
  },
  {
    id: "demo-athlete-oskar",
    name: "Oskar Lindqvist",
    email: "oskar@ironbark.example",
    profile: { bodyMassKg: 104.8, heightM: 1.9, unitPreference: "kg", oneRepMaxesKg: { squat: 250, bench: 165 } },
  },
];

type DemoSet = Omit<CreateSetData, "teamId" | "athleteId" | "sessionDate" | "recordedAt">;

/** Sessions per athlete: days before the first seeding, and the sets done that day. */
const DEMO_SESSIONS: { athleteIndex: number; daysAgo: number; sets: DemoSet[] }[] = [
  {
    athleteIndex: 0,
    daysAgo: 9,
    sets: [
      { lift: "squat", variant: "high bar", loadKg: 170, reps: 5, rpe: 7.5, cameraView: "side", note: "Top set" },
      { lift: "squat", variant: "high bar", loadKg: 180, reps: 3, rpe: 8.5, cameraView: "side", note: null },
    ],
  },
  {
    athleteIndex: 0,
    daysAgo: 2,
    sets: [{ lift: "deadlift", variant: "conventional", loadKg: 215, reps: 3, rpe: 8, cameraView: "side", note: "Felt quick off the floor" }],
  },
  {
    athleteIndex: 1,
    daysAgo: 5,
    sets: [
      { lift: "bench", variant: "competition pause", loadKg: 62.5, reps: 4, rpe: 8, cameraView: "side", note: null },
      { lift: "squat", variant: null, loadKg: 115, reps: 5, rpe: 7, cameraView: "front", note: "Watch the knees" },
    ],
  },
  {
    athleteIndex: 2,
    daysAgo: 3,
    sets: [{ lift: "deadlift", variant: "sumo", loadKg: 150, reps: 2, rpe: 8.5, cameraView: "side", note: null }],
  },
];

function seedId(n: number): string {
  return `5e1d0c0a-7c3b-4a51-9a8e-${n.toString(16).padStart(12, "0")}`;
}

async function upsertPerson(tx: Transaction, person: DemoPerson, passwordHash: string): Promise<void> {
  await tx
    .insert(user)
    .values({ id: person.id, name: person.name, email: person.email, emailVerified: true, role: person.role ?? "user" })
    .onConflictDoNothing();
  await tx
    .insert(account)
    .values({ id: `${person.id}-credential`, accountId: person.id, providerId: "credential", userId: person.id, password: passwordHash })
    .onConflictDoNothing();
  if (!person.profile) return;
  const { oneRepMaxesKg, ...profile } = person.profile;
  await tx.insert(athleteProfiles).values({ userId: person.id, ...profile }).onConflictDoNothing();
  for (const [lift, loadKg] of Object.entries(oneRepMaxesKg) as [Lift, number][]) {
    await tx.insert(oneRepMaxes).values({ userId: person.id, lift, loadKg }).onConflictDoNothing();
  }
}

async function seedTeam(tx: Transaction, now: Date): Promise<void> {
  await tx
    .insert(teams)
    .values({ id: DEMO_TEAM_ID, name: "Ironbark Barbell Club", createdBy: DEMO_COACH.id })
    .onConflictDoNothing();
  const rows = [
    { teamId: DEMO_TEAM_ID, userId: DEMO_COACH.id, role: "coach" as const },
    ...DEMO_ATHLETES.map((a) => ({ teamId: DEMO_TEAM_ID, userId: a.id, role: "athlete" as const })),
  ];
  await tx.insert(memberships).values(rows).onConflictDoNothing();
  await tx
    .insert(invitations)
    .values({
      id: seedId(2),
      teamId: DEMO_TEAM_ID,
      email: "new.lifter@ironbark.example",
      tokenHash: createHash("sha256").update(DEMO_INVITATION_TOKEN).digest("hex"),
      invitedBy: DEMO_COACH.id,
      expiresAt: new Date(now.getTime() + 7 * 24 * 3600 * 1000),
    })
    .onConflictDoNothing();
}

async function seedSessions(tx: Transaction, now: Date): Promise<void> {
  let n = 100;
  for (const session of DEMO_SESSIONS) {
    const athleteId = DEMO_ATHLETES[session.athleteIndex].id;
    const day = new Date(now.getTime() - session.daysAgo * 24 * 3600 * 1000);
    const sessionId = seedId(n++);
    await tx
      .insert(trainingSessions)
      .values({ id: sessionId, athleteId, teamId: DEMO_TEAM_ID, sessionDate: day.toISOString().slice(0, 10) })
      .onConflictDoNothing();
    for (const [i, set] of session.sets.entries()) {
      await tx
        .insert(sets)
        .values({
          id: seedId(n++),
          sessionId,
          athleteId,
          teamId: DEMO_TEAM_ID,
          ...set,
          recordedAt: new Date(day.getTime() + i * 6 * 60 * 1000),
          createdBy: athleteId,
        })
        .onConflictDoNothing();
    }
  }
}

/** Loads the demo data into the (migrated) database at `url`; safe to run any number of times. */
export async function seedDemoData(url: string, now = new Date()): Promise<void> {
  const { db, pool } = createDatabase(url, 2);
  try {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    await db.transaction(async (tx) => {
      for (const person of [DEMO_COACH, DEMO_OPERATOR, ...DEMO_ATHLETES]) await upsertPerson(tx, person, passwordHash);
      await seedTeam(tx, now);
      await seedSessions(tx, now);
      await seedBilling(tx, now);
    });
    await seedDemoSets(url, now);
    await seedDemoReviews(db, DEMO_COACH.id, DEMO_ATHLETES.map((a) => a.id), demoWaitingSetIds());
  } finally {
    await pool.end();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  if (!process.env.DATABASE_URL) ensureLocalPostgres();
  const url = databaseUrl();
  await ensureDatabase(url);
  await migrateDatabase(url);
  await seedDemoData(url);
  log(`demo data loaded; sign in as ${DEMO_COACH.email} with the password "${DEMO_PASSWORD}"`);
  log(`demo invitation: /invite/${DEMO_INVITATION_TOKEN}`);
}
