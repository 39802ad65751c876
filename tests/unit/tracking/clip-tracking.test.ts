// End to end on encoded synthetic clips: decode with ffmpeg, calibrate from the suggested plate
// circle, track from a tap on the first frame, and compare with the clip's ground truth.
import { beforeAll, describe, expect, it } from "vitest";
import { createBarTracker, suggestPlateCircle, type BarSample, type BarTracker, type PlateCircle } from "@/lib/tracking";
import { decodeFrames } from "@/lib/video/ffmpeg-frames";
import { ensureClip, type ClipOptions, type ClipTruth } from "@/tests/fixtures/clips/generate-clip";

interface Tracked {
  truth: ClipTruth;
  circle: PlateCircle;
  samples: (BarSample | null)[];
  times: number[];
  finalScale: number;
}

/** Taps a few pixels off the plate centre, as a person would, and tracks the whole clip. */
async function trackClip(options: ClipOptions): Promise<Tracked> {
  const { videoPath, truth } = await ensureClip(options);
  let circle: PlateCircle | null = null;
  let tracker: BarTracker | null = null;
  const samples: (BarSample | null)[] = [];
  const times: number[] = [];
  for await (const decoded of decodeFrames(videoPath)) {
    const frame = { width: decoded.width, height: decoded.height, data: decoded.rgba };
    if (!tracker) {
      const start = truth.frames[0];
      circle = suggestPlateCircle(frame, start.cx + 3, start.cy - 2);
      if (!circle) throw new Error("no plate circle found on the first frame");
      tracker = createBarTracker({ tapX: circle.cx, tapY: circle.cy, firstFrame: frame, radiusPx: circle.radiusPx });
    }
    samples.push(tracker.track(frame));
    times.push(decoded.tS);
  }
  const finalScale = tracker?.scale ?? Number.NaN;
  tracker?.dispose();
  return { truth, circle: circle!, samples, times, finalScale };
}

/** Bar displacement from its start in metres, tracked (scaled by the suggested circle) and true. */
function displacementErrorsM({ truth, circle, samples }: Tracked): number[] {
  const metresPerPixel = truth.plateDiameterM / 2 / circle.radiusPx;
  const first = samples[0]!;
  return samples.map((s, i) => {
    if (!s) return Number.NaN;
    const t = truth.frames[i];
    const dx = (s.x - first.x) * metresPerPixel - t.xM;
    const dy = (s.y - first.y) * metresPerPixel - t.yM;
    return Math.hypot(dx, dy);
  });
}

function rms(values: number[]): number {
  const finite = values.filter(Number.isFinite);
  return Math.sqrt(finite.reduce((s, v) => s + v * v, 0) / finite.length);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** Tracked height (metres, up positive) at time t, linear between the neighbouring samples. */
function heightAt({ truth, circle, samples, times }: Tracked, tS: number): number {
  const metresPerPixel = truth.plateDiameterM / 2 / circle.radiusPx;
  const i = Math.min(times.length - 2, Math.max(0, Math.floor(tS * truth.options.fps)));
  const a = samples[i];
  const b = samples[i + 1];
  if (!a || !b) return Number.NaN;
  const w = (tS - times[i]) / (times[i + 1] - times[i]);
  return -((a.y + (b.y - a.y) * w) * metresPerPixel);
}

const CASES: { name: string; options: ClipOptions; hidesPlate: boolean }[] = [
  { name: "640x360 H.264", options: { width: 640, height: 360, codec: "h264" }, hidesPlate: false },
  {
    name: "1280x720 H.264 with a passer-by that hides the plate",
    options: { width: 1280, height: 720, codec: "h264", durationS: 8, occluderWidthRadii: 3 },
    hidesPlate: true,
  },
  { name: "640x360 VP9", options: { width: 640, height: 360, codec: "vp9", seed: 2 }, hidesPlate: false },
];

describe.each(CASES)("bar tracking on a synthetic clip: $name", ({ options, hidesPlate }) => {
  let run: Tracked;

  beforeAll(async () => {
    run = await trackClip(options);
    const errors = displacementErrorsM(run);
    const pixelErrors = run.samples.map((s, i) => (s ? Math.hypot(s.x - run.truth.frames[i].cx, s.y - run.truth.frames[i].cy) : Number.NaN));
    console.log(
      `${options.width}x${options.height} ${options.codec}: radius ${run.circle.radiusPx.toFixed(2)} px (truth ${run.truth.plateRadiusPx.toFixed(2)}), ` +
        `RMS ${(100 * rms(errors)).toFixed(3)} cm, ${rms(pixelErrors).toFixed(3)} px, lost ${run.samples.filter((s) => !s).length} of ${run.samples.length} frames`,
    );
  }, 600_000);

  it("decodes every frame at its scripted time", () => {
    expect(run.samples.length).toBe(run.truth.frameCount);
    run.times.forEach((t, i) => expect(Math.abs(t - run.truth.frames[i].t)).toBeLessThan(0.002));
  });

  it("suggests a plate circle within 2 % of the true radius and 1 px of the centre", () => {
    const start = run.truth.frames[0];
    expect(Math.abs(run.circle.radiusPx / run.truth.plateRadiusPx - 1)).toBeLessThan(0.02);
    expect(Math.hypot(run.circle.cx - start.cx, run.circle.cy - start.cy)).toBeLessThan(1);
  });

  it("holds the plate scale steady, as the plate keeps its size", () => {
    expect(Math.abs(run.finalScale - 1)).toBeLessThan(0.02);
  });

  it("keeps the bar position error under 1 cm RMS after plate calibration", () => {
    // Brief's quality target: bar position error under 1 cm RMS on synthetic clips.
    const errors = displacementErrorsM(run);
    expect(rms(errors)).toBeLessThan(0.01);
    expect(errors.filter(Number.isFinite).length).toBeGreaterThan(0.97 * errors.length);
  });

  it("gives each rep's mean concentric velocity within 0.03 m/s", () => {
    // Brief's quality target: mean concentric velocity error under 0.03 m/s.
    expect(run.truth.reps.length).toBeGreaterThanOrEqual(2);
    for (const rep of run.truth.reps) {
      const rise = heightAt(run, rep.concentricEndS) - heightAt(run, rep.concentricStartS);
      const velocityMps = rise / rep.concentricDurationS;
      expect(Math.abs(velocityMps - rep.meanConcentricVelocityMps)).toBeLessThan(0.03);
    }
  });

  it("lowers confidence while the plate is covered and recovers after", () => {
    const span = run.truth.occlusion!;
    const inside = run.samples.filter((_, i) => run.times[i] >= span.startS && run.times[i] <= span.endS);
    const outside = run.samples.filter((_, i) => run.times[i] < span.startS - 0.1 || run.times[i] > span.endS + 0.2);
    expect(Math.min(...inside.map((s) => s?.score ?? 0))).toBeLessThan(0.8);
    if (hidesPlate) expect(inside.filter((s) => s === null).length).toBeGreaterThan(0);
    expect(median(outside.map((s) => s?.score ?? 0))).toBeGreaterThan(0.9);
    const errors = displacementErrorsM(run);
    const after = errors.filter((_, i) => run.times[i] > span.endS + 0.2 && run.times[i] < span.endS + 1);
    expect(after.every((e) => e < 0.005)).toBe(true);
  });
});
