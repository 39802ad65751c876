// The conversion job end to end: an HEVC clip (what many phones record; Debian's Chromium cannot decode
// it) is uploaded, conversion is requested through the route, the pg-boss job runner makes an H.264 copy
// with ffmpeg, and the set's clip goes converting -> ready with a playable copy beside the original.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { startJobRunner, type JobRunner } from "@/lib/jobs/runner";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import * as conversionRoute from "@/app/api/sets/[setId]/clip/conversion/route";
import { buildWorld, call, json, startTestMail, type World } from "./helpers";
import { createTestSet, getClip, startTestStorage, uploadWhole, type TestStorage } from "./clip-helpers";

interface ClipBody {
  status: string;
  codec: string | null;
  error: string | null;
  url: string | null;
  convertedUrl: string | null;
}

let mail: MailFake;
let storage: TestStorage;
let runner: JobRunner | undefined;
let world: World;
let workDir: string;

function probe(file: string): { codec: string; frames: number; durationS: number } {
  const out = execFileSync(
    "ffprobe",
    ["-v", "error", "-count_frames", "-select_streams", "v:0", "-show_entries", "stream=codec_name,nb_read_frames:format=duration", "-of", "json", file],
    { encoding: "utf8" },
  );
  const parsed = JSON.parse(out) as { streams: { codec_name: string; nb_read_frames: string }[]; format: { duration: string } };
  return { codec: parsed.streams[0].codec_name, frames: Number(parsed.streams[0].nb_read_frames), durationS: Number(parsed.format.duration) };
}

async function waitForClip(setId: string, done: (clip: ClipBody) => boolean): Promise<ClipBody> {
  const deadline = Date.now() + 90_000;
  for (;;) {
    const clip = (await json<{ clip: ClipBody }>(await getClip(world.athleteA1, setId))).clip;
    if (done(clip) || Date.now() > deadline) return clip;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  world = await buildWorld("conversion");
  workDir = mkdtempSync(path.join(tmpdir(), "plumbline-conversion-test-"));
  runner = await startJobRunner(process.env.DATABASE_URL as string);
});

afterAll(async () => {
  await runner?.stop();
  rmSync(workDir, { recursive: true, force: true });
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

describe("clip conversion job", () => {
  it("converts an HEVC clip to H.264 with the same frames, and marks the clip ready", async () => {
    const source = await ensureClip({ width: 640, height: 360, durationS: 12 });
    const hevc = path.join(workDir, "phone.mp4");
    execFileSync("ffmpeg", ["-hide_banner", "-loglevel", "error", "-i", source.videoPath, "-c:v", "libx265", "-preset", "ultrafast", "-x265-params", "log-level=error", "-tag:v", "hvc1", hevc]);
    const original = probe(hevc);
    expect(original.codec).toBe("hevc");

    const setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
    const uploaded = await uploadWhole(world.athleteA1, setId, readFileSync(hevc));
    expect(uploaded.status).toBe(200);
    expect((await json<{ clip: ClipBody }>(uploaded)).clip).toMatchObject({ status: "uploaded", codec: "hevc", convertedUrl: null });

    const requested = await call(conversionRoute.POST, "", { method: "POST", cookie: world.athleteA1.cookie, params: { setId } });
    expect(requested.status).toBe(202);
    const requestedClip = (await json<{ clip: ClipBody }>(requested)).clip;
    expect(["converting", "ready"]).toContain(requestedClip.status);
    // Asking again while it runs neither fails nor queues a second job.
    expect((await call(conversionRoute.POST, "", { method: "POST", cookie: world.coachA.cookie, params: { setId } })).status).toBe(202);

    const ready = await waitForClip(setId, (clip) => clip.status === "ready" || clip.status === "failed");
    expect(ready.status).toBe("ready");
    expect(ready.error).toBeNull();
    const copy = path.join(workDir, "converted.mp4");
    writeFileSync(copy, Buffer.from(await (await fetch(ready.convertedUrl as string)).arrayBuffer()));
    const converted = probe(copy);
    expect(converted.codec).toBe("h264");
    expect(converted.frames).toBe(original.frames);
    expect(converted.durationS).toBeCloseTo(original.durationS, 1);
    // The original stays as uploaded.
    expect((await fetch(ready.url as string)).status).toBe(200);
  });

  it("refuses to convert before a clip is uploaded (409)", async () => {
    const setId = await createTestSet(world.athleteA1);
    const response = await call(conversionRoute.POST, "", { method: "POST", cookie: world.athleteA1.cookie, params: { setId } });
    expect(response.status).toBe(409);
    expect((await json<{ clip: ClipBody }>(await getClip(world.athleteA1, setId))).clip.status).toBe("none");
  });
});
