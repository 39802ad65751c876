// The database: better-auth's tables, teams and invitations, athlete profiles, recorded sets and their analyses.
// camelCase fields over snake_case columns; every measure is stored in SI units named in the column.
import { relations, sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  customType,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  real,
  text,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { createdAt, timestamptz, updatedAt } from "./columns";
import { CAMERA_VIEWS, LIFTS, MEMBERSHIP_ROLES, UNIT_PREFERENCES } from "../lib/validation/common";
import { CLIP_STATUSES, SET_STATUSES } from "../lib/validation/set";


export const liftEnum = pgEnum("lift", LIFTS);
export const cameraViewEnum = pgEnum("camera_view", CAMERA_VIEWS);
export const membershipRoleEnum = pgEnum("membership_role", MEMBERSHIP_ROLES);
export const unitPreferenceEnum = pgEnum("unit_preference", UNIT_PREFERENCES);
export const setStatusEnum = pgEnum("set_status", SET_STATUSES);
export const clipStatusEnum = pgEnum("clip_status", CLIP_STATUSES);
export const scaleMethodEnum = pgEnum("scale_method", ["plate", "scale", "athlete-height"]);

// ---- better-auth (core tables plus the admin plugin's role/ban fields and session.impersonatedBy) ----

export const user = pgTable("user", {
  id: text("id").primaryKey(),
  name: text("name").notNull(),
  email: text("email").notNull().unique(),
  emailVerified: boolean("email_verified").default(false).notNull(),
  image: text("image"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
  role: text("role"),
  banned: boolean("banned").default(false),
  banReason: text("ban_reason"),
  banExpires: timestamptz("ban_expires"),
});

export const session = pgTable(
  "session",
  {
    id: text("id").primaryKey(),
    expiresAt: timestamptz("expires_at").notNull(),
    token: text("token").notNull().unique(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    impersonatedBy: text("impersonated_by"),
  },
  (t) => [index("session_user_id_idx").on(t.userId)],
);

export const account = pgTable(
  "account",
  {
    id: text("id").primaryKey(),
    accountId: text("account_id").notNull(),
    providerId: text("provider_id").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    accessToken: text("access_token"),
    refreshToken: text("refresh_token"),
    idToken: text("id_token"),
    accessTokenExpiresAt: timestamptz("access_token_expires_at"),
    refreshTokenExpiresAt: timestamptz("refresh_token_expires_at"),
    scope: text("scope"),
    password: text("password"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("account_user_id_idx").on(t.userId)],
);

export const verification = pgTable(
  "verification",
  {
    id: text("id").primaryKey(),
    identifier: text("identifier").notNull(),
    value: text("value").notNull(),
    expiresAt: timestamptz("expires_at").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("verification_identifier_idx").on(t.identifier)],
);

// ---- teams ----

export const teams = pgTable("teams", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

/** A person may coach one team and lift on another: one row per (team, user, role). */
export const memberships = pgTable(
  "memberships",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    role: membershipRoleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    unique("memberships_team_user_role_key").on(t.teamId, t.userId, t.role),
    index("memberships_user_id_idx").on(t.userId),
  ],
);

/** Only the token's SHA-256 is stored; the token itself travels in the e-mailed link. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: membershipRoleEnum("role").default("athlete").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: text("invited_by").references(() => user.id, { onDelete: "set null" }),
    expiresAt: timestamptz("expires_at").notNull(),
    lastSentAt: timestamptz("last_sent_at").defaultNow().notNull(),
    acceptedAt: timestamptz("accepted_at"),
    acceptedBy: text("accepted_by").references(() => user.id, { onDelete: "set null" }),
    revokedAt: timestamptz("revoked_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("invitations_team_id_idx").on(t.teamId, t.createdAt),
    // At most one open invitation per address and team; an expired one is renewed in place.
    uniqueIndex("invitations_open_team_email_key")
      .on(t.teamId, t.email)
      .where(sql`${t.acceptedAt} is null and ${t.revokedAt} is null`),
  ],
);

// ---- athletes ----

export const athleteProfiles = pgTable(
  "athlete_profiles",
  {
    userId: text("user_id")
      .primaryKey()
      .references(() => user.id, { onDelete: "cascade" }),
    bodyMassKg: doublePrecision("body_mass_kg"),
    heightM: doublePrecision("height_m"),
    unitPreference: unitPreferenceEnum("unit_preference").default("kg").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    check("athlete_profiles_body_mass_kg_check", sql`${t.bodyMassKg} is null or ${t.bodyMassKg} > 0`),
    check("athlete_profiles_height_m_check", sql`${t.heightM} is null or ${t.heightM} > 0`),
  ],
);

export const oneRepMaxes = pgTable(
  "one_rep_maxes",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    lift: liftEnum("lift").notNull(),
    loadKg: doublePrecision("load_kg").notNull(),
    updatedAt: updatedAt(),
  },
  (t) => [
    primaryKey({ name: "one_rep_maxes_pkey", columns: [t.userId, t.lift] }),
    check("one_rep_maxes_load_kg_check", sql`${t.loadKg} > 0`),
  ],
);

// ---- training sessions and sets ----

/** A day of training for one athlete, under a team or on their own (teamId null). */
export const trainingSessions = pgTable(
  "training_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    athleteId: text("athlete_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "set null" }),
    sessionDate: date("session_date", { mode: "string" }).notNull(),
    note: text("note"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    unique("training_sessions_athlete_team_date_key").on(t.athleteId, t.teamId, t.sessionDate).nullsNotDistinct(),
    index("training_sessions_team_date_idx").on(t.teamId, t.sessionDate),
  ],
);

/** One recorded set. athleteId and teamId repeat the session's so the list pages need no join. */
export const sets = pgTable(
  "sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => trainingSessions.id, { onDelete: "cascade" }),
    athleteId: text("athlete_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "set null" }),
    lift: liftEnum("lift").notNull(),
    variant: text("variant"),
    loadKg: doublePrecision("load_kg").notNull(),
    reps: integer("reps").notNull(),
    rpe: real("rpe"),
    cameraView: cameraViewEnum("camera_view").notNull(),
    note: text("note"),
    clipStorageKey: text("clip_storage_key"),
    clipStatus: clipStatusEnum("clip_status").default("none").notNull(),
    /** The S3 multipart upload in progress (clipStatus "uploading"); null otherwise. */
    clipUploadId: text("clip_upload_id"),
    clipSizeBytes: bigint("clip_size_bytes", { mode: "number" }),
    /** What the first bytes say the file is ("mp4", "mov", "webm", "mkv"), never the file name. */
    clipContainer: text("clip_container"),
    /** Video codec as ffprobe names it ("h264", "hevc", "vp9" …). */
    clipCodec: text("clip_codec"),
    clipDurationS: doublePrecision("clip_duration_s"),
    clipWidthPx: integer("clip_width_px"),
    clipHeightPx: integer("clip_height_px"),
    /** The H.264 copy made for browsers that cannot decode the original (clipStatus "ready"). */
    clipConvertedKey: text("clip_converted_key"),
    clipError: text("clip_error"),
    status: setStatusEnum("status").default("draft").notNull(),
    recordedAt: timestamptz("recorded_at").defaultNow().notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("sets_athlete_recorded_at_idx").on(t.athleteId, t.recordedAt.desc()),
    index("sets_team_recorded_at_idx").on(t.teamId, t.recordedAt.desc()),
    index("sets_session_id_idx").on(t.sessionId),
    check("sets_load_kg_check", sql`${t.loadKg} >= 0`),
    check("sets_reps_check", sql`${t.reps} >= 1`),
    check("sets_rpe_check", sql`${t.rpe} is null or (${t.rpe} >= 1 and ${t.rpe} <= 10)`),
  ],
);

// ---- analyses (filled by later issues; shape follows lib/analysis/result.ts) ----

/** Raw bytes (PostgreSQL bytea), given and read as a Uint8Array. */
const bytea = customType<{ data: Uint8Array; driverData: Buffer }>({
  dataType: () => "bytea",
  toDriver: (value) => Buffer.from(value.buffer, value.byteOffset, value.byteLength),
  fromDriver: (value) => new Uint8Array(value.buffer, value.byteOffset, value.byteLength),
});

/** One run of the analysis engine over a set; exactly one per set is current. */
export const analyses = pgTable(
  "analyses",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => sets.id, { onDelete: "cascade" }),
    isCurrent: boolean("is_current").default(true).notNull(),
    model: text("model").notNull(),
    engineVersion: text("engine_version").notNull(),
    settings: jsonb("settings").$type<Record<string, unknown>>().notNull(),
    calibration: jsonb("calibration").$type<Record<string, unknown>>(),
    scaleMetresPerPixel: doublePrecision("scale_metres_per_pixel").notNull(),
    scaleMethod: scaleMethodEnum("scale_method").notNull(),
    scaleUncertaintyPct: doublePrecision("scale_uncertainty_pct").notNull(),
    scaleNote: text("scale_note"),
    cautions: jsonb("cautions").$type<string[]>().default([]).notNull(),
    /** The engine's notes on what it could not measure and why. */
    notes: jsonb("notes").$type<string[]>().default([]).notNull(),
    /**
     * Per-frame bar positions for drawing the path over the clip, packed by lib/analysis/packed-frames.ts
     * (float64 t, x, y per frame): a fifth of the jsonb's bytes and no JSON to build or parse.
     */
    barFrames: bytea("bar_frames"),
    /** The full per-frame track (keypoints and bar) in object storage beside the clip. */
    trackStorageKey: text("track_storage_key"),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("analyses_set_id_idx").on(t.setId, t.createdAt.desc()),
    uniqueIndex("analyses_current_set_key").on(t.setId).where(sql`${t.isCurrent}`),
  ],
);

export interface StoredFlag {
  code: string;
  rep: number | null;
  message: string;
  threshold: number | null;
  value: number | null;
  unit: string;
  source: string;
}

/** One rep of an analysis; null where the camera view cannot show the measure. */
export const reps = pgTable(
  "reps",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    analysisId: uuid("analysis_id")
      .notNull()
      .references(() => analyses.id, { onDelete: "cascade" }),
    repIndex: integer("rep_index").notNull(),
    startS: doublePrecision("start_s").notNull(),
    endS: doublePrecision("end_s").notNull(),
    eccentricStartS: doublePrecision("eccentric_start_s"),
    eccentricEndS: doublePrecision("eccentric_end_s"),
    concentricStartS: doublePrecision("concentric_start_s"),
    concentricEndS: doublePrecision("concentric_end_s"),
    bottomS: doublePrecision("bottom_s"),
    romM: doublePrecision("rom_m"),
    meanConcentricVelocityMps: doublePrecision("mean_concentric_velocity_mps"),
    peakConcentricVelocityMps: doublePrecision("peak_concentric_velocity_mps"),
    meanPropulsiveVelocityMps: doublePrecision("mean_propulsive_velocity_mps"),
    propulsiveDurationS: doublePrecision("propulsive_duration_s"),
    concentricDurationS: doublePrecision("concentric_duration_s"),
    eccentricDurationS: doublePrecision("eccentric_duration_s"),
    pauseDurationS: doublePrecision("pause_duration_s"),
    stickingPointTimeS: doublePrecision("sticking_point_time_s"),
    stickingPointHeightM: doublePrecision("sticking_point_height_m"),
    stickingPointVelocityMps: doublePrecision("sticking_point_velocity_mps"),
    maxHorizontalDeviationCm: doublePrecision("max_horizontal_deviation_cm"),
    netHorizontalDriftCm: doublePrecision("net_horizontal_drift_cm"),
    pathLengthM: doublePrecision("path_length_m"),
    benchPathShapeCm: doublePrecision("bench_path_shape_cm"),
    kneeAngleAtStartDeg: doublePrecision("knee_angle_at_start_deg"),
    kneeAngleAtBottomDeg: doublePrecision("knee_angle_at_bottom_deg"),
    kneeAngleAtLockoutDeg: doublePrecision("knee_angle_at_lockout_deg"),
    hipAngleAtStartDeg: doublePrecision("hip_angle_at_start_deg"),
    hipAngleAtBottomDeg: doublePrecision("hip_angle_at_bottom_deg"),
    hipAngleAtLockoutDeg: doublePrecision("hip_angle_at_lockout_deg"),
    ankleAngleAtStartDeg: doublePrecision("ankle_angle_at_start_deg"),
    ankleAngleAtBottomDeg: doublePrecision("ankle_angle_at_bottom_deg"),
    ankleAngleAtLockoutDeg: doublePrecision("ankle_angle_at_lockout_deg"),
    torsoAngleAtStartDeg: doublePrecision("torso_angle_at_start_deg"),
    torsoAngleAtBottomDeg: doublePrecision("torso_angle_at_bottom_deg"),
    torsoAngleAtLockoutDeg: doublePrecision("torso_angle_at_lockout_deg"),
    shinAngleAtStartDeg: doublePrecision("shin_angle_at_start_deg"),
    shinAngleAtBottomDeg: doublePrecision("shin_angle_at_bottom_deg"),
    shinAngleAtLockoutDeg: doublePrecision("shin_angle_at_lockout_deg"),
    hipRiseIndex: doublePrecision("hip_rise_index"),
    depthReached: boolean("depth_reached"),
    depthMarginCm: doublePrecision("depth_margin_cm"),
    barOverMidFootOffsetCm: doublePrecision("bar_over_mid_foot_offset_cm"),
    /** How mid-foot was placed: between heel and toe, or estimated ahead of the ankle. */
    barOverMidFootMethod: text("bar_over_mid_foot_method"),
    kneeProjectionAngleDeg: doublePrecision("knee_projection_angle_deg"),
    kneeProjectionAngleLeftDeg: doublePrecision("knee_projection_angle_left_deg"),
    kneeProjectionAngleRightDeg: doublePrecision("knee_projection_angle_right_deg"),
    stanceToShoulderWidthRatio: doublePrecision("stance_to_shoulder_width_ratio"),
    /** Left-right differences (front view), keyed by measure name with the unit in the key. */
    leftRightAsymmetry: jsonb("left_right_asymmetry").$type<Record<string, number | null>>(),
    /** Share (0..1) of the rep's samples with a seen, not bridged, bar position. */
    barCoverage: doublePrecision("bar_coverage"),
    flags: jsonb("flags").$type<StoredFlag[]>().default([]).notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    unique("reps_analysis_rep_index_key").on(t.analysisId, t.repIndex),
    check("reps_rep_index_check", sql`${t.repIndex} >= 1`),
  ],
);

/** One time-normalised series of a rep (0..100 % of the rep, 101 points), e.g. "barVelocityMps". */
export const repSeries = pgTable(
  "rep_series",
  {
    repId: uuid("rep_id")
      .notNull()
      .references(() => reps.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    points: real("points").array().notNull(),
  },
  (t) => [
    primaryKey({ name: "rep_series_pkey", columns: [t.repId, t.name] }),
    check("rep_series_points_length_check", sql`cardinality(${t.points}) = 101`),
  ],
);

/** Set-level measures of one analysis; quoted estimates keep the source they came from. */
export const setMeasures = pgTable("set_measures", {
  analysisId: uuid("analysis_id")
    .primaryKey()
    .references(() => analyses.id, { onDelete: "cascade" }),
  repCount: integer("rep_count").notNull(),
  bestMeanVelocityMps: doublePrecision("best_mean_velocity_mps"),
  lastMeanVelocityMps: doublePrecision("last_mean_velocity_mps"),
  velocityLossPct: doublePrecision("velocity_loss_pct"),
  startPositionSpreadCm: doublePrecision("start_position_spread_cm"),
  startTorsoAngleSpreadDeg: doublePrecision("start_torso_angle_spread_deg"),
  barPathConsistencyCm: doublePrecision("bar_path_consistency_cm"),
  estimatedRepsInReserve: doublePrecision("estimated_reps_in_reserve"),
  estimatedRepsInReserveSource: text("estimated_reps_in_reserve_source"),
  estimatedPercentOneRepMax: doublePrecision("estimated_percent_one_rep_max"),
  estimatedPercentOneRepMaxSource: text("estimated_percent_one_rep_max_source"),
  estimatedOneRepMaxKg: doublePrecision("estimated_one_rep_max_kg"),
  estimatedOneRepMaxKgSource: text("estimated_one_rep_max_kg_source"),
  /** Every one-rep-max estimate with its source (from velocity, Epley, Brzycki) and the note on its limits. */
  estimatedOneRepMaxDetail: jsonb("estimated_one_rep_max_detail").$type<Record<string, unknown>>(),
  flags: jsonb("flags").$type<StoredFlag[]>().default([]).notNull(),
});

// ---- relations ----

export const userRelations = relations(user, ({ many, one }) => ({
  sessions: many(session),
  accounts: many(account),
  memberships: many(memberships),
  profile: one(athleteProfiles),
  oneRepMaxes: many(oneRepMaxes),
  trainingSessions: many(trainingSessions),
  sets: many(sets),
}));

export const sessionRelations = relations(session, ({ one }) => ({
  user: one(user, { fields: [session.userId], references: [user.id] }),
}));

export const accountRelations = relations(account, ({ one }) => ({
  user: one(user, { fields: [account.userId], references: [user.id] }),
}));

export const teamRelations = relations(teams, ({ many }) => ({
  memberships: many(memberships),
  invitations: many(invitations),
  trainingSessions: many(trainingSessions),
  sets: many(sets),
}));

export const membershipRelations = relations(memberships, ({ one }) => ({
  team: one(teams, { fields: [memberships.teamId], references: [teams.id] }),
  user: one(user, { fields: [memberships.userId], references: [user.id] }),
}));

export const invitationRelations = relations(invitations, ({ one }) => ({
  team: one(teams, { fields: [invitations.teamId], references: [teams.id] }),
}));

export const athleteProfileRelations = relations(athleteProfiles, ({ one }) => ({
  user: one(user, { fields: [athleteProfiles.userId], references: [user.id] }),
}));

export const oneRepMaxRelations = relations(oneRepMaxes, ({ one }) => ({
  user: one(user, { fields: [oneRepMaxes.userId], references: [user.id] }),
}));

export const trainingSessionRelations = relations(trainingSessions, ({ one, many }) => ({
  athlete: one(user, { fields: [trainingSessions.athleteId], references: [user.id] }),
  team: one(teams, { fields: [trainingSessions.teamId], references: [teams.id] }),
  sets: many(sets),
}));

export const setRelations = relations(sets, ({ one, many }) => ({
  session: one(trainingSessions, { fields: [sets.sessionId], references: [trainingSessions.id] }),
  athlete: one(user, { fields: [sets.athleteId], references: [user.id] }),
  team: one(teams, { fields: [sets.teamId], references: [teams.id] }),
  analyses: many(analyses),
}));

export const analysisRelations = relations(analyses, ({ one, many }) => ({
  set: one(sets, { fields: [analyses.setId], references: [sets.id] }),
  reps: many(reps),
  setMeasures: one(setMeasures),
}));

export const repRelations = relations(reps, ({ one, many }) => ({
  analysis: one(analyses, { fields: [reps.analysisId], references: [analyses.id] }),
  series: many(repSeries),
}));

export const repSeriesRelations = relations(repSeries, ({ one }) => ({
  rep: one(reps, { fields: [repSeries.repId], references: [reps.id] }),
}));

export const setMeasureRelations = relations(setMeasures, ({ one }) => ({
  analysis: one(analyses, { fields: [setMeasures.analysisId], references: [analyses.id] }),
}));

// ---- inferred types ----

export type User = typeof user.$inferSelect;
export type Session = typeof session.$inferSelect;
export type Account = typeof account.$inferSelect;
export type Verification = typeof verification.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type NewTeam = typeof teams.$inferInsert;
export type Membership = typeof memberships.$inferSelect;
export type NewMembership = typeof memberships.$inferInsert;
export type Invitation = typeof invitations.$inferSelect;
export type NewInvitation = typeof invitations.$inferInsert;
export type AthleteProfile = typeof athleteProfiles.$inferSelect;
export type OneRepMax = typeof oneRepMaxes.$inferSelect;
export type TrainingSession = typeof trainingSessions.$inferSelect;
export type NewTrainingSession = typeof trainingSessions.$inferInsert;
export type LiftSet = typeof sets.$inferSelect;
export type NewLiftSet = typeof sets.$inferInsert;
export type Analysis = typeof analyses.$inferSelect;
export type NewAnalysis = typeof analyses.$inferInsert;
export type Rep = typeof reps.$inferSelect;
export type NewRep = typeof reps.$inferInsert;
export type RepSeries = typeof repSeries.$inferSelect;
export type NewRepSeries = typeof repSeries.$inferInsert;
export type SetMeasures = typeof setMeasures.$inferSelect;
export type NewSetMeasures = typeof setMeasures.$inferInsert;
