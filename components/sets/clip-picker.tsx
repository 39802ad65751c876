"use client";
// Picks the clip: a file from the phone or computer, or a recording made here. Each pick is checked in
// the browser first (content by its first bytes, size, duration); the server checks again on upload.
import { useId, useState } from "react";
import { inspectClip, type ClipFacts } from "@/lib/client/inspect-clip";
import { formatMegabytes } from "@/lib/clips/limits";
import { Button } from "@/components/ui/button";
import { ClipRecorder } from "./clip-recorder";

export interface PickedClip {
  file: File;
  facts: ClipFacts;
}

function describe(clip: PickedClip): string {
  const { facts } = clip;
  const parts = [facts.container.toUpperCase(), formatMegabytes(facts.sizeBytes)];
  if (facts.durationS !== null) parts.push(`${facts.durationS.toFixed(1)} s`);
  if (facts.widthPx && facts.heightPx) parts.push(`${facts.widthPx}×${facts.heightPx}`);
  return parts.join(" · ");
}

export function ClipPicker({
  value,
  onChange,
  error,
  disabled,
}: {
  value: PickedClip | null;
  onChange: (clip: PickedClip | null) => void;
  error?: string;
  disabled?: boolean;
}) {
  const inputId = useId();
  const [problem, setProblem] = useState<string>();
  const [checking, setChecking] = useState(false);
  const [recording, setRecording] = useState(false);

  const take = async (file: File | undefined) => {
    setProblem(undefined);
    if (!file) return onChange(null);
    setChecking(true);
    try {
      const inspected = await inspectClip(file);
      if (inspected.ok) onChange({ file, facts: inspected.facts });
      else {
        setProblem(inspected.message);
        onChange(null);
      }
    } finally {
      setChecking(false);
    }
  };

  const message = problem ?? error;
  return (
    <div className="grid gap-2">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <label htmlFor={inputId} className="text-sm font-medium text-ink">
          Clip
        </label>
        {message ? (
          <p role="alert" className="text-sm font-medium text-fault">
            {message}
          </p>
        ) : null}
      </div>
      <input
        id={inputId}
        type="file"
        accept="video/*"
        disabled={disabled || checking}
        aria-invalid={message ? true : undefined}
        onChange={(event) => void take(event.target.files?.[0])}
        className="block w-full text-sm text-ink-muted file:mr-3 file:h-10 file:rounded file:border file:border-line-strong file:bg-surface file:px-4 file:font-medium file:text-ink"
      />
      {checking ? <p className="text-xs text-ink-muted">Checking the clip…</p> : null}
      {value ? (
        <p className="text-xs text-ink-muted" data-testid="clip-facts">
          {value.file.name} — {describe(value)}
        </p>
      ) : null}
      {recording ? (
        <ClipRecorder
          onRecorded={(file) => {
            setRecording(false);
            void take(file);
          }}
          onClose={() => setRecording(false)}
        />
      ) : (
        <div>
          <Button variant="secondary" size="sm" onClick={() => setRecording(true)} disabled={disabled}>
            Record with the camera
          </Button>
        </div>
      )}
    </div>
  );
}
