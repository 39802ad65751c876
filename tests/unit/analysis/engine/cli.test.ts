import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CliUsageError, parseCliArgs, runCli } from "@/lib/cli/analyse";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

describe("parseCliArgs", () => {
  it("reads a track file and its options", () => {
    expect(parseCliArgs(["set.json"])).toEqual({ mode: "track", trackPath: "set.json", includeFrames: false, loadKg: undefined, compact: false });
    expect(parseCliArgs(["--frames", "set.json", "--load-kg", "142.5"])).toMatchObject({ includeFrames: true, loadKg: 142.5 });
    expect(parseCliArgs(["-h"])).toEqual({ mode: "help" });
  });

  it("refuses wrong usage with a clear message", () => {
    expect(() => parseCliArgs([])).toThrow(/missing the track file/);
    expect(() => parseCliArgs(["a.json", "b.json"])).toThrow(/one track file/);
    expect(() => parseCliArgs(["--load-kg", "heavy", "a.json"])).toThrow(/--load-kg/);
    expect(() => parseCliArgs(["--colour", "a.json"])).toThrow(CliUsageError);
  });
});

describe("the analyse command", () => {
  let dir: string;
  let good: string;
  let bad: string;
  beforeAll(() => {
    dir = mkdtempSync(path.join(tmpdir(), "plumbline-cli-"));
    good = path.join(dir, "squat.json");
    bad = path.join(dir, "bad.json");
    writeFileSync(good, JSON.stringify(generateSyntheticSet({ lift: "squat", seed: 21, reps: 3 }).track));
    writeFileSync(bad, JSON.stringify({ version: 1, lift: "squat", view: "side", fps: 30, width: 640, height: 360, calibration: { metresPerPixel: 0.004 }, frames: [{ t: 0, keypoints: [], bar: { x: "left", y: 1, score: 1 } }] }));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  async function run(args: string[]) {
    let out = "";
    let err = "";
    const code = await runCli(args, { out: (t) => (out += t), err: (t) => (err += t) });
    return { code, out, err };
  }

  it("prints one JSON document with reps and set, and frames only when asked", async () => {
    const plain = await run([good]);
    expect(plain.code).toBe(0);
    const result = JSON.parse(plain.out);
    expect(result.reps).toHaveLength(3);
    expect(result.set.repCount).toBe(3);
    expect(result.frames).toBeUndefined();
    const withFrames = JSON.parse((await run([good, "--frames", "--load-kg", "100", "--compact"])).out);
    expect(withFrames.frames.length).toBeGreaterThan(100);
    expect(withFrames.set.estimatedOneRepMaxKg.loadKg).toBe(100);
  });

  it("exits 1 with the reason for a missing or invalid file, and 2 for wrong usage", async () => {
    const missing = await run([path.join(dir, "nope.json")]);
    expect(missing.code).toBe(1);
    expect(missing.err).toMatch(/cannot read track file .*nope\.json.*no such file/);
    const invalid = await run([bad]);
    expect(invalid.code).toBe(1);
    expect(invalid.err).toMatch(/frames\[0\]\.bar\.x/);
    const usage = await run([]);
    expect(usage.code).toBe(2);
    expect(usage.err).toMatch(/usage:/);
  });

  it("runs as a real process through tsx", () => {
    const tsx = path.join("node_modules", ".bin", "tsx");
    const ok = spawnSync(tsx, ["lib/cli/analyse.ts", good, "--compact"], { encoding: "utf8" });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).reps).toHaveLength(3);
    const missing = spawnSync(tsx, ["lib/cli/analyse.ts", path.join(dir, "nope.json")], { encoding: "utf8" });
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/no such file/);
  }, 60_000);
});
