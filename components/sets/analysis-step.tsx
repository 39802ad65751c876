"use client";
// The analysis step of a set: fetch the clip, check this browser can decode it (if not, have the server
// make an H.264 copy and wait for it), show the first frame to mark the plate, run the worker with
// progress and a cancel button, and save the result. All heavy work happens in the worker.
import dynamic from "next/dynamic";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { clipResponseSchema, savedAnalysisSchema, type ClipViewData } from "@/lib/client/clip-responses";
import { decodeFirstFrame, UndecodableClipError } from "@/lib/client/inspect-clip";
import { AnalysisRunError, poseModelVersion, startAnalysis, type AnalysisRun } from "@/lib/client/analysis-runner";
import { suggestPlateCircle } from "@/lib/tracking";
import { FULL_SIZE_PLATE_DIAMETER_M } from "@/lib/analysis/calibration";
import type { EngineView } from "@/lib/clips/analysis-view";
import type { FrameDecoder } from "@/lib/clips/decoder-choice";
import type { Lift } from "@/lib/validation/common";
import type { ProgressMessage } from "@/workers/analyse-messages";
import { Banner } from "@/components/ui/banner";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import type { PlateCircleValue } from "./plate-marker";
import { ProgressBar } from "./upload-progress";

const PlateMarker = dynamic(() => import("./plate-marker"), { ssr: false });

/** How often the page asks whether the server's conversion finished. */
const CONVERSION_POLL_MS = 1500;

const STAGE_LABELS: Record<ProgressMessage["stage"], string> = {
  "loading-model": "Loading the pose model",
  "opening-clip": "Opening the clip",
  tracking: "Tracking the bar and the athlete",
  measuring: "Measuring the reps",
};

type Step =
  | { kind: "loading"; message: string }
  | { kind: "converting" }
  | { kind: "marking" }
  | { kind: "running"; progress: ProgressMessage | null }
  | { kind: "saving" }
  | { kind: "failed"; message: string; canRetry: boolean };

export interface AnalysisStepProps {
  setId: string;
  lift: Lift;
  view: EngineView;
  loadKg: number;
  athleteHeightM: number | null;
  /** Called once the result is saved (the page then refreshes to show it). */
  onSaved?: () => void;
}

const getClip = (setId: string) => apiFetch(`/api/sets/${setId}/clip`, { schema: clipResponseSchema }).then((r) => r.clip);

async function fetchBlob(url: string): Promise<Blob> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`The clip could not be fetched from storage (status ${response.status}).`);
  return response.blob();
}

export function AnalysisStep({ setId, lift, view, loadKg, athleteHeightM, onSaved }: AnalysisStepProps) {
  const router = useRouter();
  const [step, setStep] = useState<Step>({ kind: "loading", message: "Fetching the clip" });
  const [frame, setFrame] = useState<ImageData | null>(null);
  const [circle, setCircle] = useState<PlateCircleValue | null>(null);
  const [rimFound, setRimFound] = useState<boolean | null>(null);
  const [diameter, setDiameter] = useState(String(FULL_SIZE_PLATE_DIAMETER_M));
  const clipBlob = useRef<Blob | null>(null);
  const decoder = useRef<FrameDecoder>("webcodecs");
  const run = useRef<AnalysisRun | null>(null);

  const waitForConversion = useCallback(async (): Promise<ClipViewData> => {
    let clip = await apiFetch(`/api/sets/${setId}/clip/conversion`, { method: "POST", schema: clipResponseSchema }).then((r) => r.clip);
    while (clip.status === "converting") {
      await new Promise((resolve) => setTimeout(resolve, CONVERSION_POLL_MS));
      clip = await getClip(setId);
    }
    if (clip.status !== "ready" || !clip.convertedUrl) throw new Error(clip.error ?? "The clip could not be converted.");
    return clip;
  }, [setId]);

  const load = useCallback(async () => {
    try {
      setStep({ kind: "loading", message: "Fetching the clip" });
      let clip = await getClip(setId);
      let blob = await fetchBlob(clip.convertedUrl ?? (clip.url as string));
      try {
        setStep({ kind: "loading", message: "Checking this browser can decode the clip" });
        const first = await decodeFirstFrame(blob);
        decoder.current = first.decoder;
        setFrame(first.image);
      } catch (error) {
        if (!(error instanceof UndecodableClipError) || clip.convertedUrl) throw error;
        setStep({ kind: "converting" });
        clip = await waitForConversion();
        blob = await fetchBlob(clip.convertedUrl as string);
        const first = await decodeFirstFrame(blob);
        decoder.current = first.decoder;
        setFrame(first.image);
      }
      clipBlob.current = blob;
      setStep({ kind: "marking" });
    } catch (error) {
      setStep({ kind: "failed", message: error instanceof Error ? error.message : "The clip could not be opened.", canRetry: true });
    }
  }, [setId, waitForConversion]);

  useEffect(() => {
    void load();
    return () => run.current?.cancel();
  }, [load]);

  const tap = (x: number, y: number) => {
    if (!frame) return;
    const found = suggestPlateCircle(frame, Math.round(x), Math.round(y));
    setRimFound(found !== null);
    // No rim found: a circle a tenth of the frame's height, to drag to the plate's edge by hand.
    setCircle(found ? { cx: found.cx, cy: found.cy, radiusPx: found.radiusPx } : { cx: x, cy: y, radiusPx: frame.height / 10 });
  };

  const analyse = async (withPlate: boolean) => {
    const blob = clipBlob.current;
    const plateDiameterM = Number(diameter.replace(",", "."));
    if (!blob) return;
    if (withPlate && (!circle || !(plateDiameterM > 0 && plateDiameterM <= 1))) return;
    setStep({ kind: "running", progress: null });
    const started = startAnalysis(
      {
        clip: blob,
        decoder: decoder.current,
        lift,
        view,
        bar: withPlate && circle ? { kind: "plate", cx: circle.cx, cy: circle.cy, radiusPx: circle.radiusPx } : null,
        plateDiameterM: withPlate ? plateDiameterM : undefined,
        athleteHeightM: withPlate ? undefined : (athleteHeightM ?? undefined),
        loadKg: loadKg > 0 ? loadKg : undefined,
      },
      (progress) => setStep({ kind: "running", progress }),
    );
    run.current = started;
    try {
      const result = await started.result;
      setStep({ kind: "saving" });
      await apiFetch(`/api/sets/${setId}/analysis`, {
        method: "POST",
        body: {
          model: { id: result.stats.poseModel, version: poseModelVersion(result.stats.poseModel) },
          settings: { decoder: result.stats.decoder, barSource: result.barSource, plate: result.plate, plateDiameterM: withPlate ? plateDiameterM : null, stats: result.stats },
          calibration: result.track.calibration,
          result: result.analysis,
          track: result.track,
        },
        schema: savedAnalysisSchema,
      });
      onSaved?.();
      router.refresh();
    } catch (error) {
      const cancelled = error instanceof AnalysisRunError && error.code === "cancelled";
      setStep(cancelled ? { kind: "marking" } : { kind: "failed", message: error instanceof Error ? error.message : "The analysis failed.", canRetry: true });
    } finally {
      run.current = null;
    }
  };

  if (step.kind === "loading") return <ProgressBar label={step.message} fraction={null} />;
  if (step.kind === "converting") {
    return <ProgressBar label="This browser cannot play the clip's format: converting it to H.264 on the server" fraction={null} />;
  }
  if (step.kind === "failed") {
    return (
      <Banner tone="fault" title="The analysis could not finish" live>
        <p>{step.message}</p>
        {step.canRetry ? (
          <Button className="mt-3" variant="secondary" onClick={() => (frame ? setStep({ kind: "marking" }) : void load())}>
            Try again
          </Button>
        ) : null}
      </Banner>
    );
  }
  if (step.kind === "running" || step.kind === "saving") {
    const progress = step.kind === "running" ? step.progress : null;
    return (
      <div className="grid gap-3">
        <ProgressBar
          label={step.kind === "saving" ? "Saving the measures" : progress ? STAGE_LABELS[progress.stage] : "Starting the analysis"}
          fraction={step.kind === "saving" ? 1 : (progress?.fraction ?? null)}
          detail={progress && progress.framesDone > 0 ? `${progress.framesDone} frames, ${progress.clipTimeS.toFixed(1)} s of the clip` : undefined}
        />
        {step.kind === "running" ? (
          <div>
            <Button variant="secondary" onClick={() => run.current?.cancel()}>
              Cancel
            </Button>
          </div>
        ) : null}
      </div>
    );
  }
  return (
    <div className="grid gap-4">
      <p className="text-sm text-ink-muted">
        Tap the centre of the plate on the first frame. The rim found is drawn as a circle: drag the handle on its edge to fit it. The plate&apos;s known
        size turns pixels into metres.
      </p>
      {frame ? <PlateMarker frame={frame} circle={circle} onTap={tap} onChange={setCircle} /> : null}
      {rimFound === false ? (
        <Banner tone="caution" title="No plate rim found there">
          Drag the circle&apos;s handle to the plate&apos;s edge, or tap the plate again.
        </Banner>
      ) : null}
      <div className="grid items-end gap-4 sm:grid-cols-[12rem_1fr]">
        <TextField
          label="Plate diameter"
          inputMode="decimal"
          suffix="m"
          value={diameter}
          onChange={(event) => setDiameter(event.target.value)}
          hint="0.45 m: a full-size plate (IWF and IPF rules)."
        />
        <div className="flex flex-wrap gap-2">
          <Button size="lg" onClick={() => void analyse(true)} disabled={!circle}>
            Analyse the set
          </Button>
          <Button size="lg" variant="quiet" onClick={() => void analyse(false)} disabled={athleteHeightM === null}>
            Skip: estimate the bar from pose
          </Button>
        </div>
      </div>
      <p className="text-xs text-ink-muted">
        {athleteHeightM === null
          ? "Without a plate mark the bar is estimated from the hands and scaled by the athlete's height: add a height to the profile to use it."
          : "Without a plate mark the bar position is an estimate from the hands or shoulders, scaled by the athlete's height; its measures are labelled as estimates."}
      </p>
    </div>
  );
}
