// zod schemas of the JSON the route handlers send back, as the browser receives it (dates as ISO strings).
import { z } from "zod";
import { LIFTS, MEMBERSHIP_ROLES, UNIT_PREFERENCES } from "@/lib/validation/common";

const isoDateTime = z.string();

export const teamCreatedSchema = z.object({ team: z.object({ id: z.string(), name: z.string() }) });

export const rosterAthleteSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  joinedAt: isoDateTime,
  lastSetAt: isoDateTime.nullable(),
});
export type RosterAthleteView = z.infer<typeof rosterAthleteSchema>;

export const rosterInvitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  status: z.enum(["pending", "expired", "revoked", "accepted"]),
  expiresAt: isoDateTime,
  createdAt: isoDateTime,
});
export type RosterInvitationView = z.infer<typeof rosterInvitationSchema>;

export const rosterSchema = z.object({
  team: z.object({ id: z.string(), name: z.string() }),
  athletes: z.array(rosterAthleteSchema),
  invitations: z.array(rosterInvitationSchema),
});
export type RosterView = z.infer<typeof rosterSchema>;

export const inviteResultSchema = z.object({
  invited: z.array(z.object({ id: z.string(), email: z.string(), expiresAt: isoDateTime })),
  skipped: z.array(z.object({ email: z.string(), reason: z.string(), message: z.string().optional() })),
});
export type InviteResult = z.infer<typeof inviteResultSchema>;

export const invitationChangedSchema = z.object({ invitation: z.object({ id: z.string() }).loose() });

export const acceptedSchema = z.object({
  membership: z.object({ teamId: z.string(), teamName: z.string(), role: z.enum(MEMBERSHIP_ROLES) }),
});

export const profileSchema = z.object({
  bodyMassKg: z.number().nullable(),
  heightM: z.number().nullable(),
  unitPreference: z.enum(UNIT_PREFERENCES),
  oneRepMaxes: z.partialRecord(z.enum(LIFTS), z.number()),
  updatedAt: isoDateTime,
});
export const profileResponseSchema = z.object({ profile: profileSchema.nullable() });

export const setSummarySchema = z
  .object({
    id: z.string(),
    lift: z.enum(LIFTS),
    variant: z.string().nullable(),
    loadKg: z.number(),
    reps: z.number(),
    rpe: z.number().nullable(),
    status: z.string(),
    recordedAt: isoDateTime,
  })
  .loose();
export type SetSummary = z.infer<typeof setSummarySchema>;
export const setListSchema = z.object({ sets: z.array(setSummarySchema) });
