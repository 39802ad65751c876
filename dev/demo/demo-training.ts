// The demo's eight weeks of training, as a plan: which sets each demo lifter did, at what load, and how
// the bar moved in each rep (scripted velocities and faults for the synthetic track generator).
// Pure and deterministic: the same inputs give the same plan, so the seed can find its sets again.
import { MINIMUM_VELOCITY_THRESHOLD_MPS } from "@/lib/analysis/references";
import type { Lift } from "@/lib/validation/common";
import { Prng } from "@/lib/synthetic/prng";

export const DEMO_WEEKS = 8;

/**
 * Mean concentric velocity at 60 % of 1RM, before each lifter's own spread: about 1.0 m/s in the squat,
 * 0.8 m/s in the bench press, 0.7 m/s in the deadlift (common practice; the bench figure close to
 * González-Badillo & Sánchez-Medina 2010, Int J Sports Med 31:347-352, from memory). At 1RM each lift
 * slows to its minimum velocity threshold (the engine's Helms et al. 2017 values), on a straight line.
 */
export const VELOCITY_AT_60_PCT_MPS: Record<Lift, number> = { squat: 1.0, bench: 0.8, deadlift: 0.7 };

/** Strength gained per week over the block, as a share of 1RM (common practice for trained lifters: a few % a month). */
const WEEKLY_GAIN = 0.006;

export interface DemoLifterInput {
  athleteId: string;
  statureM: number;
  oneRepMaxesKg: Partial<Record<Lift, number>>;
}

/** What a lifter does differently from the textbook, by lift: faults the analysis should flag. */
interface LifterStyle {
  seed: number;
  /** Days before the seeding of this lifter's last training day (staggers the three lifters). */
  lastDayDaysAgo: number;
  variants: Partial<Record<Lift, string>>;
  /** Spread of the lifter's own load–velocity line around the common one (1 = the common line). */
  speedFactor: number;
  /** Weeks (0-based) whose top squat set sees the hips rise first on the later reps. */
  hipsRiseWeeks: number[];
  /** Weeks whose top squat set has one rep cut short. */
  shallowWeeks: number[];
  /** Weeks whose top deadlift sets drift forward off the floor. */
  driftWeeks: number[];
}

/** Per demo athlete id; only these three get a training history (the fourth shows the empty state). */
export const DEMO_LIFTER_STYLES: Record<string, LifterStyle> = {
  "demo-athlete-tobin": {
    seed: 11,
    lastDayDaysAgo: 1,
    variants: { squat: "high bar", bench: "touch and go", deadlift: "conventional" },
    speedFactor: 1.04,
    hipsRiseWeeks: [4, 6, 7],
    shallowWeeks: [],
    driftWeeks: [2],
  },
  "demo-athlete-noor": {
    seed: 23,
    lastDayDaysAgo: 2,
    variants: { squat: "low bar", bench: "competition pause", deadlift: "conventional" },
    speedFactor: 0.96,
    hipsRiseWeeks: [],
    shallowWeeks: [1, 5, 7],
    driftWeeks: [],
  },
  "demo-athlete-bea": {
    seed: 37,
    lastDayDaysAgo: 3,
    variants: { squat: "high bar", bench: "touch and go", deadlift: "conventional" },
    speedFactor: 1.0,
    hipsRiseWeeks: [],
    shallowWeeks: [],
    driftWeeks: [3, 5, 6, 7],
  },
};

export interface DemoSetPlan {
  /** Stable: the n-th planned set of the whole demo. */
  ordinal: number;
  athleteId: string;
  week: number;
  daysAgo: number;
  /** Order within the training day (recorded six minutes apart). */
  orderInDay: number;
  lift: Lift;
  variant: string | null;
  loadKg: number;
  reps: number;
  rpe: number;
  note: string | null;
  /** True for the day's first (heaviest) set of a lift. */
  topSet: boolean;
  motion: {
    seed: number;
    statureM: number;
    velocitiesMps: number[];
    paused: boolean;
    barDriftM: number;
    hipsRiseEarlyReps: number[];
    shallowRep: number | null;
  };
}

/** Velocity on the lifter's load–velocity line at a share of their current 1RM. */
export function velocityAtMps(lift: Lift, shareOfOneRepMax: number, speedFactor: number): number {
  const atMax = MINIMUM_VELOCITY_THRESHOLD_MPS[lift].valueMps;
  const at60 = VELOCITY_AT_60_PCT_MPS[lift] * speedFactor;
  return atMax + ((at60 - atMax) * (1 - shareOfOneRepMax)) / 0.4;
}

/** Reps possible at a share of 1RM, by inverting Epley's formula (Epley 1985, from memory): 1RM = load × (1 + reps / 30). */
export function repsPossible(shareOfOneRepMax: number): number {
  return 30 * (1 / shareOfOneRepMax - 1);
}

/**
 * Mean velocity of each rep: the set slows the more of its possible reps it uses, faster near failure,
 * where the last possible rep moves at the lift's velocity at 1RM (common practice), plus a little noise.
 */
export function repVelocitiesMps(lift: Lift, share: number, reps: number, speedFactor: number, rng: Prng): number[] {
  const first = velocityAtMps(lift, share, speedFactor) + rng.normal(0, 0.015);
  const floor = MINIMUM_VELOCITY_THRESHOLD_MPS[lift].valueMps;
  const possible = Math.max(reps + 0.5, repsPossible(share));
  return Array.from({ length: reps }, (_, k) => {
    const used = k / possible;
    return Math.max(floor + 0.03, first - (first - floor) * used ** 2.2 + rng.normal(0, 0.008));
  });
}

/** RPE as 10 minus the reps left in reserve, to the half point trainers log (common practice). */
function rpeFor(share: number, reps: number): number {
  const inReserve = repsPossible(share) - reps;
  return Math.min(10, Math.max(6, Math.round((10 - inReserve) * 2) / 2));
}

const roundToPlate = (kg: number) => Math.round(kg / 2.5) * 2.5;

interface Session {
  day: "A" | "B" | "C";
  lifts: { lift: Lift; shares: number[]; reps: number[] }[];
}

/**
 * A weekly undulating block: heavier each week, with the top set from 76 % to 92 % of the known
 * 1RM and back-off sets a few percent lighter, never under 70 % (common practice).
 */
function weekSessions(week: number, hasDeadlift: boolean): Session[] {
  const top = 0.76 + (0.16 * week) / (DEMO_WEEKS - 1);
  const topReps = top < 0.8 ? 5 : top < 0.86 ? 4 : top < 0.9 ? 3 : 2;
  const backOff = (n: number) => Array.from({ length: n }, (_, i) => top - 0.05 - 0.01 * i);
  const sessions: Session[] = [
    {
      day: "A",
      lifts: [
        { lift: "squat", shares: [top, ...backOff(week % 2 === 0 ? 2 : 1)], reps: [topReps, topReps + 1, topReps + 1] },
        { lift: "bench", shares: [top, ...backOff(2)], reps: [topReps, topReps + 1, topReps + 1] },
      ],
    },
  ];
  const dayB: Session = { day: "B", lifts: [] };
  if (hasDeadlift) dayB.lifts.push({ lift: "deadlift", shares: [top - 0.02, top - 0.06], reps: [Math.max(2, topReps - 1), topReps] });
  if (week % 2 === 1) dayB.lifts.push({ lift: "bench", shares: [0.72, 0.72, 0.7], reps: [6, 6, 6] });
  if (dayB.lifts.length > 0) sessions.push(dayB);
  if (week % 2 === 0) sessions.push({ day: "C", lifts: [{ lift: "squat", shares: [0.7, 0.7], reps: [5, 5] }] });
  return sessions;
}

/** Days from a training day to the end of its week (A on Monday, B on Thursday, C on Saturday). */
const DAYS_TO_WEEK_END: Record<Session["day"], number> = { A: 6, B: 3, C: 1 };

const NOTES: Record<Lift, string[]> = {
  squat: ["Top set, belt on", "Felt quick out of the hole", "Heavy today, slept badly", "Braced well"],
  bench: ["Top set", "Grip one finger wider", "Leg drive felt good", "Slow off the chest"],
  deadlift: ["Top set, hook grip", "Bar felt heavy off the floor", "Lats tight", "Good lockout"],
};

/** The whole demo history for the given lifters (those without a style are skipped). */
export function planDemoTraining(lifters: DemoLifterInput[]): DemoSetPlan[] {
  const plans: DemoSetPlan[] = [];
  for (const lifter of lifters) {
    const style = DEMO_LIFTER_STYLES[lifter.athleteId];
    if (!style) continue;
    const rng = new Prng(style.seed);
    for (let week = 0; week < DEMO_WEEKS; week++) {
      // The lifter's real 1RM grows through the block; loads stay set from the 1RM on their profile.
      const strength = 1 - WEEKLY_GAIN * (DEMO_WEEKS - 1 - week);
      for (const session of weekSessions(week, lifter.oneRepMaxesKg.deadlift !== undefined)) {
        const daysAgo = (DEMO_WEEKS - 1 - week) * 7 + DAYS_TO_WEEK_END[session.day] - 1 + style.lastDayDaysAgo;
        let orderInDay = 0;
        for (const { lift, shares, reps: repsBySet } of session.lifts) {
          const oneRepMaxKg = lifter.oneRepMaxesKg[lift];
          if (oneRepMaxKg === undefined) continue;
          const setCount = shares.length;
          for (let i = 0; i < setCount; i++) {
            const loadKg = roundToPlate(shares[i] * oneRepMaxKg);
            const share = loadKg / (oneRepMaxKg * strength);
            const reps = repsBySet[i];
            const topSet = i === 0;
            const heavyDay = session.day !== "C" && topSet;
            const hipsRise = heavyDay && lift === "squat" && style.hipsRiseWeeks.includes(week);
            const shallow = heavyDay && lift === "squat" && style.shallowWeeks.includes(week);
            const drift = heavyDay && lift === "deadlift" && style.driftWeeks.includes(week);
            plans.push({
              ordinal: plans.length,
              athleteId: lifter.athleteId,
              week,
              daysAgo,
              orderInDay: orderInDay++,
              lift,
              variant: style.variants[lift] ?? null,
              loadKg,
              reps,
              rpe: rpeFor(share, reps),
              note: topSet && rng.chance(0.5) ? rng.pick(NOTES[lift]) : null,
              topSet,
              motion: {
                seed: style.seed * 1000 + plans.length,
                statureM: lifter.statureM,
                velocitiesMps: repVelocitiesMps(lift, share, reps, style.speedFactor, rng),
                paused: style.variants[lift] === "competition pause",
                barDriftM: drift ? rng.uniform(0.05, 0.07) : rng.uniform(0, 0.01),
                hipsRiseEarlyReps: hipsRise ? Array.from({ length: reps - 1 }, (_, k) => k + 2) : [],
                shallowRep: shallow ? reps : null,
              },
            });
          }
        }
      }
    }
  }
  return plans;
}

/** Sets whose clips the demo keeps, by athlete and lift: the newest top set of each (one fault each to review). */
export const DEMO_CLIP_PICKS: readonly { athleteId: string; lift: Lift }[] = [
  { athleteId: "demo-athlete-tobin", lift: "squat" },
  { athleteId: "demo-athlete-noor", lift: "squat" },
  { athleteId: "demo-athlete-noor", lift: "bench" },
  { athleteId: "demo-athlete-bea", lift: "deadlift" },
];

/** The planned sets that get a clip: for each pick, the newest top set of that lift. */
export function pickClipSets(plans: readonly DemoSetPlan[]): DemoSetPlan[] {
  return DEMO_CLIP_PICKS.flatMap(({ athleteId, lift }) => {
    const candidates = plans.filter((p) => p.athleteId === athleteId && p.lift === lift && p.topSet);
    const newest = candidates.reduce<DemoSetPlan | null>((best, p) => (best === null || p.daysAgo < best.daysAgo ? p : best), null);
    return newest ? [newest] : [];
  });
}
