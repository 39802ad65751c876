// Request rates with rate-limiter-flexible's in-memory store. Plumbline runs as one Node process, so that
// process sees every request and memory is enough; running several would need its Postgres store instead.
import "server-only";
import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";
import { ApiError, type ErrorCode } from "@/lib/errors";
import { rateRule, type RateName } from "@/lib/limits";

const globalForLimits = globalThis as unknown as { plumblineLimiters?: Map<string, RateLimiterMemory> };

function limiterFor(name: RateName): RateLimiterMemory {
  const rule = rateRule(name);
  const id = `${name}:${rule.points}:${rule.durationS}`;
  globalForLimits.plumblineLimiters ??= new Map();
  let limiter = globalForLimits.plumblineLimiters.get(id);
  if (!limiter) {
    limiter = new RateLimiterMemory({ keyPrefix: name, points: rule.points, duration: rule.durationS });
    globalForLimits.plumblineLimiters.set(id, limiter);
  }
  return limiter;
}

/** Takes `points` from `key`'s allowance, or throws a 429 saying when to retry. */
export async function consumeRate(name: RateName, key: string, code: ErrorCode, what: string, points = 1): Promise<void> {
  try {
    await limiterFor(name).consume(key, points);
  } catch (error) {
    if (!(error instanceof RateLimiterRes)) throw error;
    const waitS = Math.max(1, Math.ceil(error.msBeforeNext / 1000));
    throw new ApiError(code, `Too many ${what} in a short time. Try again in ${waitS} s.`);
  }
}
