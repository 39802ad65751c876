// Demo reviews: the coach has answered (and the athlete has read) every analysed demo set except the few
// left waiting on the desk, with a summary and cues drawn from the set's own flags, and one short comment
// thread per athlete on their newest answered set. Stable ids and "do nothing on conflict": safe to rerun.
import { and, desc, eq, inArray, notInArray } from "drizzle-orm";
import type { Database } from "@/db";
import { analyses, reps, sets, setMeasures, trainingSessions, type StoredFlag } from "@/db/schema";
import { setComments, setReviews } from "@/db/schema-review";
import type { FaultCode } from "@/lib/analysis/faults";
import type { ReviewCue } from "@/lib/validation/review";
import { DEMO_CLIP_FPS } from "./demo-clips";

const DAY_MS = 24 * 60 * 60 * 1000;


/** What the demo coach writes for each kind of flag (invented coaching wording, not a rule). */
const CUE_FOR_FLAG: Partial<Record<FaultCode, ReviewCue>> = {
  "hips-rise-first": { change: "Chest and hips leave the bottom together", drill: "Tempo squats, 3 s down, 2 s pause", priority: "high" },
  "bar-drift": { change: "Keep the bar over mid-foot off the floor", drill: "Paused deadlifts just below the knee", priority: "high" },
  "depth-not-reached": { change: "Sit to depth on every rep, not only the first", drill: "Box squats to a parallel box", priority: "medium" },
  "shallow-rep": { change: "Same depth on the last rep as on the first", drill: "Pin squats at depth", priority: "medium" },
  "velocity-loss": { change: "Stop the set when the bar slows down a lot", drill: "Cap sets at about 20 % velocity loss next block", priority: "low" },
};

const PLAIN_CUE: ReviewCue = { change: "Keep the same set-up on every rep", drill: "", priority: "low" };

function flagCodes(repFlags: StoredFlag[][], setFlags: StoredFlag[]): FaultCode[] {
  const codes = new Set([...repFlags.flat(), ...setFlags].map((f) => f.code as FaultCode));
  return [...codes];
}

function summaryFor(codes: FaultCode[]): { summary: string; cues: ReviewCue[] } {
  const cues = codes.flatMap((code) => (CUE_FOR_FLAG[code] ? [CUE_FOR_FLAG[code]] : []));
  if (cues.length === 0) {
    return { summary: "Solid set: positions held from the first rep to the last and the bar stayed close. Same plan next week.", cues: [PLAIN_CUE] };
  }
  return { summary: "Good work overall. One or two things to tidy up before the load goes up — see the cues.", cues };
}

/** The demo coach's reviews of every analysed demo set except `waitingSetIds`. */
export async function seedDemoReviews(db: Database, coachId: string, athleteIds: string[], waitingSetIds: string[]): Promise<void> {
  const answered = await db
    .select({ setId: sets.id, athleteId: sets.athleteId, sessionDate: trainingSessions.sessionDate, analysisId: analyses.id })
    .from(sets)
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
    .where(and(inArray(sets.athleteId, athleteIds), waitingSetIds.length > 0 ? notInArray(sets.id, waitingSetIds) : undefined))
    .orderBy(desc(trainingSessions.sessionDate));
  if (answered.length === 0) return;
  const analysisIds = answered.map((a) => a.analysisId);
  const [repRows, measureRows] = await Promise.all([
    db.select({ analysisId: reps.analysisId, flags: reps.flags, repIndex: reps.repIndex, startS: reps.startS }).from(reps).where(inArray(reps.analysisId, analysisIds)),
    db.select({ analysisId: setMeasures.analysisId, flags: setMeasures.flags }).from(setMeasures).where(inArray(setMeasures.analysisId, analysisIds)),
  ]);
  const repsOf = new Map<string, typeof repRows>();
  for (const row of repRows) repsOf.set(row.analysisId, [...(repsOf.get(row.analysisId) ?? []), row]);
  const setFlagsOf = new Map(measureRows.map((m) => [m.analysisId, m.flags]));

  const reviewRows = answered.map((a) => {
    const sessionAt = new Date(`${a.sessionDate}T18:00:00Z`).getTime();
    const { summary, cues } = summaryFor(flagCodes((repsOf.get(a.analysisId) ?? []).map((r) => r.flags), setFlagsOf.get(a.analysisId) ?? []));
    return {
      setId: a.setId,
      status: "seen" as const,
      summary,
      cues,
      startedBy: coachId,
      startedAt: new Date(sessionAt + 0.5 * DAY_MS),
      answeredBy: coachId,
      answeredAt: new Date(sessionAt + DAY_MS),
      seenAt: new Date(sessionAt + 1.5 * DAY_MS),
    };
  });
  await db.transaction(async (tx) => {
    for (let i = 0; i < reviewRows.length; i += 500) await tx.insert(setReviews).values(reviewRows.slice(i, i + 500)).onConflictDoNothing();
    // A short thread on each athlete's newest answered set, pinned to the start of its first rep.
    for (const [n, athleteId] of athleteIds.entries()) {
      const newest = answered.find((a) => a.athleteId === athleteId);
      const firstRep = newest && (repsOf.get(newest.analysisId) ?? []).find((r) => r.repIndex === 1);
      if (!newest || !firstRep) continue;
      const at = new Date(`${newest.sessionDate}T18:00:00Z`).getTime();
      const coachCommentId = demoCommentId(n, 0);
      await tx
        .insert(setComments)
        .values([
          {
            id: coachCommentId,
            setId: newest.setId,
            authorId: coachId,
            body: "Watch your brace here: the set-up on rep 1 is the one to copy on every rep.",
            timeS: firstRep.startS,
            frameIndex: Math.round(firstRep.startS * DEMO_CLIP_FPS),
            repNumber: 1,
            createdAt: new Date(at + DAY_MS),
          },
          {
            id: demoCommentId(n, 1),
            setId: newest.setId,
            parentId: coachCommentId,
            authorId: athleteId,
            body: "Got it — I'll film next week's top set from the same spot.",
            timeS: firstRep.startS,
            frameIndex: Math.round(firstRep.startS * DEMO_CLIP_FPS),
            repNumber: 1,
            createdAt: new Date(at + 1.6 * DAY_MS),
          },
        ])
        .onConflictDoNothing();
    }
  });
}

/** Stable ids for the demo comments (a range of their own beside the demo sets' ids). */
function demoCommentId(athleteOrdinal: number, commentOrdinal: number): string {
  return `5e1d0c0a-7c3b-4a51-9a8e-c0${athleteOrdinal.toString(16).padStart(5, "0")}${commentOrdinal.toString(16).padStart(5, "0")}`;
}
