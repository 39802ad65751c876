// Athlete profiles: body mass, height, preferred display unit and one-rep maxes (SI units stored).
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { athleteProfiles, oneRepMaxes } from "@/db/schema";
import { LIFTS, type Lift } from "@/lib/validation/common";
import type { Profile, ProfileData } from "@/lib/validation/profile";

export async function getProfile(userId: string): Promise<Profile | null> {
  const [row] = await db.select().from(athleteProfiles).where(eq(athleteProfiles.userId, userId));
  if (!row) return null;
  const maxes = await db.select().from(oneRepMaxes).where(eq(oneRepMaxes.userId, userId));
  return {
    bodyMassKg: row.bodyMassKg,
    heightM: row.heightM,
    unitPreference: row.unitPreference,
    oneRepMaxes: Object.fromEntries(maxes.map((m) => [m.lift, m.loadKg])) as Partial<Record<Lift, number>>,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Replaces the whole profile: lifts left out of `oneRepMaxes` are cleared. */
export async function saveProfile(userId: string, data: ProfileData): Promise<Profile> {
  await db.transaction(async (tx) => {
    const values = { bodyMassKg: data.bodyMassKg, heightM: data.heightM, unitPreference: data.unitPreference };
    await tx
      .insert(athleteProfiles)
      .values({ userId, ...values })
      .onConflictDoUpdate({ target: athleteProfiles.userId, set: { ...values, updatedAt: new Date() } });
    const given = LIFTS.filter((lift) => data.oneRepMaxes[lift] !== undefined);
    const cleared = LIFTS.filter((lift) => !given.includes(lift));
    if (cleared.length > 0) {
      await tx.delete(oneRepMaxes).where(and(eq(oneRepMaxes.userId, userId), inArray(oneRepMaxes.lift, cleared)));
    }
    for (const lift of given) {
      const loadKg = data.oneRepMaxes[lift] as number;
      await tx
        .insert(oneRepMaxes)
        .values({ userId, lift, loadKg })
        .onConflictDoUpdate({ target: [oneRepMaxes.userId, oneRepMaxes.lift], set: { loadKg, updatedAt: new Date() } });
    }
  });
  return (await getProfile(userId)) as Profile;
}
