// Review desk, review statuses, comments and sharing through the real route handlers on a real database:
// who may read, write, send, mark seen and share, and who is refused (other athletes, other teams' coaches,
// teammates once a share is withdrawn). Sets are analysed by the real engine on a synthetic track.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { memberships, sets } from "@/db/schema";
import { setShares } from "@/db/schema-review";
import { saveAnalysis } from "@/db/queries/analyses";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import * as deskRoute from "@/app/api/desk/route";
import * as reviewRoute from "@/app/api/sets/[setId]/review/route";
import * as startRoute from "@/app/api/sets/[setId]/review/start/route";
import * as sendRoute from "@/app/api/sets/[setId]/review/send/route";
import * as seenRoute from "@/app/api/sets/[setId]/review/seen/route";
import * as commentsRoute from "@/app/api/sets/[setId]/comments/route";
import * as commentRoute from "@/app/api/sets/[setId]/comments/[commentId]/route";
import * as shareRoute from "@/app/api/sets/[setId]/share/route";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import * as clipRoute from "@/app/api/sets/[setId]/clip/route";
import { buildWorld, call, json, linkIn, mailTo, signUp, startTestMail, type TestPerson, type World } from "./helpers";
import { createTestSet } from "./clip-helpers";

interface ReviewBody {
  review: { status: string; summary: string | null; cues: unknown[] | null; seenAt: string | null; answeredAt: string | null };
  share: { sharedAt: string; sharedByName: string | null } | null;
  role: string;
  canEdit: boolean;
  mailed?: boolean;
}
interface DeskBody {
  desk: {
    rows: { setId: string; status: string; repCount: number | null; flagCount: number; shared: boolean; athleteName: string }[];
    counts: Record<string, number>;
    athletes: { id: string; name: string }[];
  };
}
interface CommentBody {
  comment: { id: string; parentId: string | null; timeS: number; frameIndex: number; repNumber: number | null; body: string; authorName: string };
}
interface CommentsBody {
  comments: { id: string; parentId: string | null; body: string; deleted: boolean; timeS: number }[];
}

let mail: MailFake;
let world: World;
const REPS = 3;
const result = (() => {
  const { track } = generateSyntheticSet({ lift: "squat", seed: 11, reps: REPS, view: "side" });
  return analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 });
})();

/** A set with a stored clip and a saved analysis: what the desk calls waiting. */
async function analysedSet(athlete: TestPerson, teamId: string, lift: "squat" | "bench" = "squat", recordedAt?: string): Promise<string> {
  const setId = await createTestSet(athlete, { teamId, lift, recordedAt });
  await db.update(sets).set({ clipStatus: "uploaded", clipStorageKey: `sets/${setId}/test/original` }).where(eq(sets.id, setId));
  const viewer = { userId: athlete.id, name: athlete.name, email: athlete.email, role: "user" as const, emailVerified: true };
  const analysis = lift === "squat" ? result : { ...result, settings: { ...result.settings, lift } };
  await saveAnalysis(viewer, setId, { model: "movenet-lightning@test", settings: {}, calibration: {}, result: analysis, trackStorageKey: null });
  return setId;
}

const getReview = (setId: string, who?: TestPerson) => call(reviewRoute.GET, "", { cookie: who?.cookie, params: { setId } });
const putReview = (setId: string, who: TestPerson, body: unknown) =>
  call(reviewRoute.PUT, "", { method: "PUT", cookie: who.cookie, params: { setId }, body });
const post = (route: { POST: unknown }, setId: string, who: TestPerson) =>
  call(route.POST, "", { method: "POST", cookie: who.cookie, params: { setId } });
const desk = (who: TestPerson, query = "") => call(deskRoute.GET, `/api/desk${query}`, { cookie: who.cookie });
const listComments = (setId: string, who: TestPerson) => call(commentsRoute.GET, "", { cookie: who.cookie, params: { setId } });
const addComment = (setId: string, who: TestPerson, body: Record<string, unknown>) =>
  call(commentsRoute.POST, "", { method: "POST", cookie: who.cookie, params: { setId }, body: { timeS: 1.5, frameIndex: 45, ...body } });
const share = (setId: string, who: TestPerson, shared: boolean) =>
  call(shareRoute.PUT, "", { method: "PUT", cookie: who.cookie, params: { setId }, body: { shared } });

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("review");
});

afterAll(async () => {
  await mail?.stop();
  await closeDb();
});

describe("who reads a set's review", () => {
  it("lets the athlete, their coach and an admin in, with the role each has; refuses everyone else", async () => {
    const setId = await analysedSet(world.athleteA1, world.teamA.id);
    const roles = await Promise.all(
      [world.athleteA1, world.coachA, world.admin].map(async (who) => {
        const response = await getReview(setId, who);
        expect(response.status).toBe(200);
        const body = await json<ReviewBody>(response);
        return [body.role, body.canEdit];
      }),
    );
    expect(roles).toEqual([["athlete", false], ["coach", true], ["admin", true]]);
    for (const who of [world.athleteA2, world.coachB, world.athleteB1, world.outsider]) {
      expect((await getReview(setId, who)).status).toBe(403);
      expect((await listComments(setId, who)).status).toBe(403);
    }
    expect((await getReview(setId)).status).toBe(401);
    expect((await getReview("not-a-uuid", world.coachA)).status).toBe(404);
    expect((await getReview("00000000-0000-4000-8000-000000000000", world.coachA)).status).toBe(404);
  });
});

describe("the review desk", () => {
  it("shows a coach their athletes' analysed sets as waiting, oldest first, with counts and filters", async () => {
    // Recorded out of creation order: the desk sorts by when the set was lifted.
    const second = await analysedSet(world.athleteA2, world.teamA.id, "bench", "2026-03-02T10:00:00Z");
    const first = await analysedSet(world.athleteA1, world.teamA.id, "squat", "2026-02-27T10:00:00Z");
    const unanalysed = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
    const response = await desk(world.coachA);
    expect(response.status).toBe(200);
    const { desk: all } = await json<DeskBody>(response);
    const ids = all.rows.map((r) => r.setId);
    expect(ids).toContain(first);
    expect(ids).toContain(second);
    expect(ids).not.toContain(unanalysed);
    expect(ids.indexOf(first)).toBeLessThan(ids.indexOf(second));
    const row = all.rows.find((r) => r.setId === first);
    expect(row).toMatchObject({ status: "waiting", repCount: REPS, shared: false });
    expect(all.counts.waiting).toBe(all.rows.filter((r) => r.status === "waiting").length);
    expect(all.athletes.map((a) => a.id).sort()).toEqual([world.athleteA1.id, world.athleteA2.id].sort());

    const benchOnly = await json<DeskBody>(await desk(world.coachA, "?lift=bench"));
    expect(benchOnly.desk.rows.map((r) => r.setId)).toEqual([second]);
    const athleteOnly = await json<DeskBody>(await desk(world.coachA, `?athlete=${world.athleteA2.id}`));
    expect(athleteOnly.desk.rows.map((r) => r.setId)).toEqual([second]);
    const answered = await json<DeskBody>(await desk(world.coachA, "?status=answered&sort=bogus"));
    expect(answered.desk.rows.every((r) => r.status === "answered")).toBe(true);
  });

  it("refuses athletes and people on no team, hides other teams' sets and shows admins everything", async () => {
    const setId = await analysedSet(world.athleteB1, world.teamB.id);
    expect((await desk(world.athleteA1)).status).toBe(403);
    expect((await desk(world.outsider)).status).toBe(403);
    expect((await call(deskRoute.GET, "/api/desk")).status).toBe(401);
    const coachA = await json<DeskBody>(await desk(world.coachA));
    expect(coachA.desk.rows.map((r) => r.setId)).not.toContain(setId);
    const coachB = await json<DeskBody>(await desk(world.coachB));
    expect(coachB.desk.rows.map((r) => r.setId)).toContain(setId);
    const admin = await json<DeskBody>(await desk(world.admin));
    expect(admin.desk.rows.map((r) => r.setId)).toContain(setId);
  });
});

describe("review statuses", () => {
  it("goes waiting -> in review -> answered (mail) -> seen, and only the coach writes and sends", async () => {
    const setId = await analysedSet(world.athleteA1, world.teamA.id);
    const draft = { summary: "Brace before the descent.", cues: [{ change: "Knees out on the way up", drill: "Paused squats", priority: "high" }] };

    expect((await post(startRoute, setId, world.athleteA1)).status).toBe(403);
    expect((await putReview(setId, world.athleteA1, draft)).status).toBe(403);
    expect((await post(sendRoute, setId, world.athleteA1)).status).toBe(403);
    expect((await post(startRoute, setId, world.coachB)).status).toBe(403);
    expect((await getReview(setId, world.athleteA1)).status).toBe(200);

    const started = await json<ReviewBody>(await post(startRoute, setId, world.coachA));
    expect(started.review.status).toBe("in_review");
    const deskRow = (await json<DeskBody>(await desk(world.coachA))).desk.rows.find((r) => r.setId === setId);
    expect(deskRow?.status).toBe("in_review");

    expect((await post(sendRoute, setId, world.coachA)).status).toBe(400);
    expect((await putReview(setId, world.coachA, { summary: "x", cues: [{ change: "", priority: "urgent" }] })).status).toBe(400);
    expect((await putReview(setId, world.coachA, draft)).status).toBe(200);
    const hidden = await json<ReviewBody>(await getReview(setId, world.athleteA1));
    expect(hidden.review).toMatchObject({ status: "in_review", summary: null, cues: null });

    const sent = await post(sendRoute, setId, world.coachA);
    expect(sent.status).toBe(200);
    const sentBody = await json<ReviewBody>(sent);
    expect(sentBody.review.status).toBe("answered");
    expect(sentBody.mailed).toBe(true);
    const answeredMails = mailTo(mail, world.athleteA1.email).filter((m) => m.subject.includes("answered your squat set"));
    expect(answeredMails).toHaveLength(1);
    const [message] = answeredMails;
    expect(new URL(linkIn(message)).pathname).toBe(`/app/sets/${setId}/review`);
    expect((await post(sendRoute, setId, world.coachA)).status).toBe(409);
    // The desk opens on what still needs the coach; answered sets are one filter away.
    const deskIds = async (query: string) => (await json<DeskBody>(await desk(world.coachA, query))).desk.rows.map((r) => r.setId);
    expect(await deskIds("")).not.toContain(setId);
    expect(await deskIds("?status=all")).toContain(setId);
    expect(await deskIds("?status=answered")).toContain(setId);

    const shown = await json<ReviewBody>(await getReview(setId, world.athleteA1));
    expect(shown.review.summary).toBe(draft.summary);
    expect(shown.review.cues).toEqual([{ ...draft.cues[0] }]);

    expect((await post(seenRoute, setId, world.coachA)).status).toBe(403);
    expect((await post(seenRoute, setId, world.admin)).status).toBe(403);
    const seen = await json<ReviewBody>(await post(seenRoute, setId, world.athleteA1));
    expect(seen.review.status).toBe("seen");
    expect(seen.review.seenAt).not.toBeNull();
    const again = await json<ReviewBody>(await post(seenRoute, setId, world.athleteA1));
    expect(again.review.seenAt).toBe(seen.review.seenAt);
  });

  it("leaves a waiting review waiting when the athlete opens it", async () => {
    const setId = await analysedSet(world.athleteA1, world.teamA.id);
    const response = await post(seenRoute, setId, world.athleteA1);
    expect(response.status).toBe(200);
    expect((await json<ReviewBody>(response)).review.status).toBe("waiting");
  });
});

describe("comments", () => {
  it("are written by the athlete and the coach, pinned to a moment, threaded, and changed only by their author", async () => {
    const setId = await analysedSet(world.athleteA1, world.teamA.id);
    const coachComment = await addComment(setId, world.coachA, { body: "Hips rise first here", timeS: 2.25, frameIndex: 67, repNumber: 2 });
    expect(coachComment.status).toBe(201);
    const { comment: root } = await json<CommentBody>(coachComment);
    expect(root).toMatchObject({ timeS: 2.25, frameIndex: 67, repNumber: 2, parentId: null });

    const reply = await json<CommentBody>(await addComment(setId, world.athleteA1, { body: "It felt heavy", parentId: root.id, timeS: 9, frameIndex: 1 }));
    expect(reply.comment).toMatchObject({ parentId: root.id, timeS: 2.25, frameIndex: 67, repNumber: 2 });
    const nested = await json<CommentBody>(await addComment(setId, world.coachA, { body: "Noted", parentId: reply.comment.id }));
    expect(nested.comment.parentId).toBe(root.id);

    expect((await addComment(setId, world.athleteA1, { body: "  " })).status).toBe(400);
    expect((await addComment(setId, world.athleteA1, { body: "x", timeS: -1 })).status).toBe(400);
    expect((await addComment(setId, world.athleteA2, { body: "Nice" })).status).toBe(403);
    expect((await addComment(setId, world.coachB, { body: "Nice" })).status).toBe(403);
    const otherSet = await analysedSet(world.athleteA1, world.teamA.id);
    expect((await addComment(otherSet, world.athleteA1, { body: "x", parentId: root.id })).status).toBe(404);

    const edit = (who: TestPerson, id: string, body: string) =>
      call(commentRoute.PUT, "", { method: "PUT", cookie: who.cookie, params: { setId, commentId: id }, body: { body } });
    const remove = (who: TestPerson, id: string) =>
      call(commentRoute.DELETE, "", { method: "DELETE", cookie: who.cookie, params: { setId, commentId: id } });
    expect((await edit(world.athleteA1, root.id, "rewritten")).status).toBe(403);
    expect((await edit(world.coachA, reply.comment.id, "rewritten")).status).toBe(403);
    expect((await edit(world.athleteA1, reply.comment.id, "It felt very heavy")).status).toBe(200);
    expect((await remove(world.athleteA1, root.id)).status).toBe(403);
    expect((await remove(world.coachB, root.id)).status).toBe(403);
    expect((await remove(world.coachA, root.id)).status).toBe(204);
    expect((await edit(world.coachA, root.id, "again")).status).toBe(404);

    const { comments } = await json<CommentsBody>(await listComments(setId, world.athleteA1));
    // The deleted root stays as an empty placeholder because it has replies.
    expect(comments.map((c) => [c.id, c.deleted, c.body])).toEqual([
      [root.id, true, ""],
      [reply.comment.id, false, "It felt very heavy"],
      [nested.comment.id, false, "Noted"],
    ]);
    expect((await remove(world.athleteA1, reply.comment.id)).status).toBe(204);
    expect((await remove(world.coachA, nested.comment.id)).status).toBe(204);
    expect((await json<CommentsBody>(await listComments(setId, world.coachA))).comments).toEqual([]);
  });
});

describe("sharing with the team", () => {
  it("lets teammates read and comment while shared, never edit, and shuts them out when withdrawn", async () => {
    const setId = await analysedSet(world.athleteA1, world.teamA.id);
    expect((await share(setId, world.athleteA1, true)).status).toBe(403);
    expect((await share(setId, world.athleteA2, true)).status).toBe(403);
    expect((await share(setId, world.coachB, true)).status).toBe(403);
    expect((await share(setId, world.coachA, "yes" as unknown as boolean)).status).toBe(400);

    const shared = await share(setId, world.coachA, true);
    expect(shared.status).toBe(200);
    expect((await json<{ share: { sharedByName: string } }>(shared)).share.sharedByName).toBe(world.coachA.name);
    expect((await share(setId, world.coachA, true)).status).toBe(200);

    const asTeammate = await getReview(setId, world.athleteA2);
    expect(asTeammate.status).toBe(200);
    expect(await json<ReviewBody>(asTeammate)).toMatchObject({ role: "teammate", canEdit: false, review: { summary: null } });
    // The player reads the analysis and the clip; both admit a teammate while shared.
    expect((await call(analysisRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId } })).status).toBe(200);
    expect((await call(clipRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId } })).status).toBe(200);
    expect((await call(analysisRoute.GET, "", { cookie: world.athleteB1.cookie, params: { setId } })).status).toBe(403);
    const teammateComment = await addComment(setId, world.athleteA2, { body: "Your bar drifts forward at the bottom" });
    expect(teammateComment.status).toBe(201);
    expect((await putReview(setId, world.athleteA2, { summary: "x", cues: [] })).status).toBe(403);
    expect((await post(startRoute, setId, world.athleteA2)).status).toBe(403);
    expect((await share(setId, world.athleteA2, false)).status).toBe(403);
    expect((await getReview(setId, world.athleteB1)).status).toBe(403);
    expect((await getReview(setId, world.coachB)).status).toBe(403);
    const deskRow = (await json<DeskBody>(await desk(world.coachA))).desk.rows.find((r) => r.setId === setId);
    expect(deskRow?.shared).toBe(true);

    expect((await share(setId, world.coachA, false)).status).toBe(200);
    expect((await getReview(setId, world.athleteA2)).status).toBe(403);
    expect((await listComments(setId, world.athleteA2)).status).toBe(403);
    expect((await call(analysisRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId } })).status).toBe(403);
    expect((await call(clipRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId } })).status).toBe(403);
    const { comment } = await json<CommentBody>(teammateComment);
    const editAfter = await call(commentRoute.PUT, "", {
      method: "PUT",
      cookie: world.athleteA2.cookie,
      params: { setId, commentId: comment.id },
      body: { body: "changed" },
    });
    expect(editAfter.status).toBe(403);

    const [record] = await db.select().from(setShares).where(and(eq(setShares.setId, setId)));
    expect(record).toMatchObject({ sharedBy: world.coachA.id, withdrawnBy: world.coachA.id, teamId: world.teamA.id });
    expect(record.withdrawnAt).not.toBeNull();
  });

  it("ends for teammates when the set's athlete leaves the team, as it does for the coach", async () => {
    const leaver = await signUp("review-leaver");
    await db.insert(memberships).values({ teamId: world.teamA.id, userId: leaver.id, role: "athlete" });
    const setId = await analysedSet(leaver, world.teamA.id);
    expect((await share(setId, world.coachA, true)).status).toBe(200);
    expect((await getReview(setId, world.athleteA2)).status).toBe(200);

    await db.delete(memberships).where(and(eq(memberships.teamId, world.teamA.id), eq(memberships.userId, leaver.id)));
    expect((await getReview(setId, world.coachA)).status).toBe(403);
    expect((await getReview(setId, world.athleteA2)).status).toBe(403);
    expect((await listComments(setId, world.athleteA2)).status).toBe(403);
    expect((await call(clipRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId } })).status).toBe(403);
    expect((await getReview(setId, leaver)).status).toBe(200);
  });
});
