// Load on the production build over loopback (`npm run bench:load`): a fresh database with the demo team,
// the local fakes, `next start` (after `next build` when there is no build yet), then autocannon saving
// analyses (POST /api/sets/[setId]/analysis) and reading them back with their rep series (GET) at 50 and
// 200 concurrent connections, signed in as the seeded athletes and coach. Prints throughput, p50/p99
// latency and errors. Aim (issue 8): no errors, p99 under 100 ms for reads on a 2-core machine.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { pathToFileURL } from "node:url";
import autocannon from "autocannon";
import pg from "pg";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { startFakes } from "@/dev/fakes";
import { freePort, waitForHttp } from "@/scripts/ports";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { freshTestDatabase } from "@/scripts/test-database";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const repoRoot = path.resolve(import.meta.dirname, "../..");
const DURATION_S = Number(process.env.LOAD_DURATION_S ?? 10);
const CONNECTIONS = (process.env.LOAD_CONNECTIONS ?? "50,200").split(",").map(Number);
const SETS_PER_ATHLETE = 25;

interface Signed {
  cookie: string;
  setIds: string[];
}

function buildIfNeeded(env: NodeJS.ProcessEnv): void {
  const distDir = process.env.PLUMBLINE_DIST_DIR ?? ".next";
  if (existsSync(path.join(repoRoot, distDir, "BUILD_ID")) && process.env.LOAD_REBUILD !== "1") return;
  console.log(`[load] no build in ${distDir}: running next build`);
  const result = spawnSync("npx", ["next", "build"], { cwd: repoRoot, env, stdio: "inherit" });
  if (result.status !== 0) throw new Error("next build failed");
}

async function signIn(baseUrl: string, email: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: baseUrl },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (response.status !== 200) throw new Error(`sign-in of ${email} failed: ${response.status}`);
  return response.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

/** Team sets for the athlete through the API, marked as having a checked clip (the clip plays no part here). */
async function setsFor(baseUrl: string, cookie: string, db: pg.Client): Promise<string[]> {
  const ids: string[] = [];
  for (let i = 0; i < SETS_PER_ATHLETE; i++) {
    const response = await fetch(`${baseUrl}/api/sets`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: baseUrl, cookie },
      body: JSON.stringify({ teamId: DEMO_TEAM_ID, sessionDate: "2026-11-02", lift: "squat", loadKg: 150, reps: 5, cameraView: "side" }),
    });
    if (response.status !== 201) throw new Error(`set creation failed: ${response.status} ${await response.text()}`);
    ids.push(((await response.json()) as { set: { id: string } }).set.id);
  }
  await db.query("update sets set clip_status = 'uploaded', clip_storage_key = 'sets/' || id || '/load/original' where id = any($1)", [ids]);
  return ids;
}

interface Figures {
  scenario: string;
  connections: number;
  requests: number;
  throughput: number;
  p50: number;
  p99: number;
  errors: number;
}

async function drive(scenario: string, connections: number, baseUrl: string, pick: () => { method: "GET" | "POST"; path: string; cookie: string; body?: string }): Promise<Figures> {
  const result = await autocannon({
    url: baseUrl,
    connections,
    duration: DURATION_S,
    // A save of a 2 MB analysis queued behind 199 others takes longer than autocannon's 10 s default.
    timeout: 30,
    requests: [
      {
        setupRequest: (request) => {
          const next = pick();
          return {
            ...request,
            method: next.method,
            path: next.path,
            body: next.body,
            headers: { cookie: next.cookie, origin: baseUrl, ...(next.body ? { "content-type": "application/json" } : {}) },
          };
        },
      },
    ],
  });
  return {
    scenario,
    connections,
    requests: result.requests.total,
    throughput: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

/** Waits until a small request answers quickly again: the server has finished what the last run left queued. */
async function drained(baseUrl: string, cookie: string): Promise<void> {
  for (let i = 0; i < 120; i++) {
    const started = performance.now();
    await fetch(`${baseUrl}/api/me`, { headers: { cookie } });
    if (performance.now() - started < 50) return;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}

function print(rows: Figures[]): void {
  console.log("\nscenario                          conns   requests    req/s   p50 ms   p99 ms   errors");
  for (const r of rows) {
    console.log(
      `${r.scenario.padEnd(32)} ${String(r.connections).padStart(5)} ${String(r.requests).padStart(10)} ${r.throughput.toFixed(1).padStart(8)} ${r.p50.toFixed(1).padStart(8)} ${r.p99.toFixed(1).padStart(8)} ${String(r.errors).padStart(8)}`,
    );
  }
}

export async function run(): Promise<void> {
  const databaseUrl = await freshTestDatabase("plumbline_load");
  await seedDemoData(databaseUrl);
  const fakes = await startFakes({ ephemeral: true });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    ...fakes.env,
    DATABASE_URL: databaseUrl,
    BETTER_AUTH_URL: baseUrl,
    NODE_ENV: "production" as const,
    NEXT_TELEMETRY_DISABLED: "1",
    // One client address signs in every seeded person.
    PLUMBLINE_RATE_LIMIT_FACTOR: "1000",
  };
  buildIfNeeded(env);
  const server: ChildProcess = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(port)], { cwd: repoRoot, env, stdio: ["ignore", "ignore", "inherit"], detached: true });
  const db = new pg.Client({ connectionString: databaseUrl });
  try {
    await waitForHttp(`${baseUrl}/`, 90_000);
    await db.connect();
    const athletes: Signed[] = [];
    for (const person of DEMO_ATHLETES) {
      const cookie = await signIn(baseUrl, person.email);
      athletes.push({ cookie, setIds: await setsFor(baseUrl, cookie, db) });
    }
    const coach = await signIn(baseUrl, DEMO_COACH.email);

    const bodies = [3, 5].map((reps, seed) => {
      const { track } = generateSyntheticSet({ lift: "squat", seed: seed + 70, reps, view: "side" });
      const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 150 });
      return JSON.stringify({ model: { id: "movenet-lightning", version: "load" }, settings: {}, calibration: track.calibration, result, track });
    });
    console.log(`[load] analysis bodies: ${bodies.map((b) => `${Math.round(b.length / 1024)} KB`).join(", ")}; ${DURATION_S} s a run`);
    let n = 0;
    const anySet = () => {
      const athlete = athletes[n % athletes.length];
      const setId = athlete.setIds[Math.floor(n / athletes.length) % athlete.setIds.length];
      n++;
      return { athlete, setId };
    };
    const save = () => {
      const { athlete, setId } = anySet();
      return { method: "POST" as const, path: `/api/sets/${setId}/analysis`, cookie: athlete.cookie, body: bodies[n % bodies.length] };
    };
    // Reads alternate between the athlete and their coach, as the review desk and the athlete's page do.
    const read = () => {
      const { athlete, setId } = anySet();
      return { method: "GET" as const, path: `/api/sets/${setId}/analysis`, cookie: n % 2 ? athlete.cookie : coach };
    };

    // Every set gets a first analysis, so every read finds one, and the server is warm before timing.
    const warmUpStarted = performance.now();
    for (const athlete of athletes) {
      for (const setId of athlete.setIds) {
        const response = await fetch(`${baseUrl}/api/sets/${setId}/analysis`, {
          method: "POST",
          headers: { "content-type": "application/json", origin: baseUrl, cookie: athlete.cookie },
          body: bodies[0],
        });
        if (response.status !== 201) throw new Error(`warm-up save failed: ${response.status} ${await response.text()}`);
      }
    }

    const setCount = athletes.length * SETS_PER_ATHLETE;
    console.log(`[load] ${setCount} sequential saves (warm-up): ${((performance.now() - warmUpStarted) / setCount).toFixed(1)} ms each`);

    // Reads first, on the warm server; saves after, each run once the previous run's backlog has drained.
    const rows: Figures[] = [];
    for (const connections of CONNECTIONS) {
      await drained(baseUrl, coach);
      rows.push(await drive("read analysis + series (GET)", connections, baseUrl, read));
    }
    for (const connections of CONNECTIONS) {
      await drained(baseUrl, coach);
      rows.push(await drive("save analysis (POST)", connections, baseUrl, save));
    }
    print(rows);
  } finally {
    await db.end().catch(() => undefined);
    if (server.pid) process.kill(-server.pid, "SIGTERM");
    await fakes.stop();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await run();
}
