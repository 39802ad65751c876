// Display preferences per user. Without a saved row, mass follows the athlete profile's unit (kg when there
// is none) and lengths follow mass (lb users read inches), so nobody has to set both before reading a chart.
import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import { athleteProfiles } from "@/db/schema";
import { userPreferences } from "@/db/schema-preferences";
import type { DisplayUnits, LengthUnit, MassUnit } from "@/lib/compare/units";
import type { PreferencesData } from "@/lib/validation/preferences";

export interface Preferences extends DisplayUnits {
  /** False while the units are the defaults worked out from the profile. */
  saved: boolean;
}

export async function getPreferences(userId: string): Promise<Preferences> {
  // One round trip for both optional rows.
  const { rows } = await db.execute<{ mass_unit: MassUnit | null; length_unit: LengthUnit | null; profile_unit: MassUnit | null }>(sql`
    select
      (select mass_unit from ${userPreferences} where user_id = ${userId}) as mass_unit,
      (select length_unit from ${userPreferences} where user_id = ${userId}) as length_unit,
      (select unit_preference from ${athleteProfiles} where user_id = ${userId}) as profile_unit`);
  const row = rows[0];
  if (row?.mass_unit && row.length_unit) return { mass: row.mass_unit, length: row.length_unit, saved: true };
  const mass = row?.profile_unit ?? "kg";
  return { mass, length: mass === "kg" ? "metric" : "imperial", saved: false };
}

export async function savePreferences(userId: string, data: PreferencesData): Promise<Preferences> {
  await db
    .insert(userPreferences)
    .values({ userId, ...data })
    .onConflictDoUpdate({ target: userPreferences.userId, set: { ...data, updatedAt: new Date() } });
  return { mass: data.massUnit, length: data.lengthUnit, saved: true };
}
