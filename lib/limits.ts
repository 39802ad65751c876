// Abuse limits in one place: request rates per person or address, and daily clip-upload quotas per team.
// Every figure can be changed by environment variable; the test set-ups raise the rates with
// PLUMBLINE_RATE_LIMIT_FACTOR so that many test sign-ups from one address are not throttled.
import { z } from "zod";

export interface RateRule {
  points: number;
  durationS: number;
}

/**
 * Base rates (common practice: a handful of sign-in attempts a minute stops password guessing without
 * bothering a person who mistypes; invitations and uploads are capped well above a busy coach's day).
 */
const BASE_RATES = {
  /** Sign-in attempts per client address. */
  signIn: { points: 10, durationS: 60, env: "PLUMBLINE_SIGN_IN_PER_MINUTE" },
  /** Accounts created per client address. */
  signUp: { points: 5, durationS: 60 * 60, env: "PLUMBLINE_SIGN_UPS_PER_HOUR" },
  /** Addresses invited per coach. */
  invitation: { points: 200, durationS: 60 * 60, env: "PLUMBLINE_INVITATIONS_PER_HOUR" },
  /** Clip uploads started per person. */
  clipUpload: { points: 60, durationS: 60 * 60, env: "PLUMBLINE_UPLOADS_PER_HOUR" },
} as const;
export type RateName = keyof typeof BASE_RATES;

const positiveNumber = z.coerce.number().positive();

function envNumber(name: string, fallback: number): number {
  const parsed = positiveNumber.safeParse(process.env[name]);
  return parsed.success ? parsed.data : fallback;
}

/** Read on every call, so a changed environment (a test) takes effect at once. */
export function rateRule(name: RateName): RateRule {
  const base = BASE_RATES[name];
  const factor = envNumber("PLUMBLINE_RATE_LIMIT_FACTOR", 1);
  return { points: Math.max(1, Math.round(envNumber(base.env, base.points) * factor)), durationS: base.durationS };
}

const GIB = 1024 * 1024 * 1024;

export interface UploadQuota {
  uploadsPerDay: number;
  bytesPerDay: number;
}

/**
 * Clip uploads a team (or an athlete's personal sets) may start in 24 hours: a 20-athlete team filming
 * a few sets each a day stays well inside (common practice; storage cost is what it guards).
 */
export function uploadQuota(): UploadQuota {
  return {
    uploadsPerDay: Math.round(envNumber("PLUMBLINE_TEAM_UPLOADS_PER_DAY", 200)),
    bytesPerDay: envNumber("PLUMBLINE_TEAM_UPLOAD_GB_PER_DAY", 20) * GIB,
  };
}
