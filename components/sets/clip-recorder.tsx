"use client";
// Records a clip with the device camera (MediaRecorder): preview, start, stop, and the recording handed
// back as a file. Asks for the rear camera on phones, where the athlete's coach or partner films.
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";

function recorderType(): string {
  const types = ["video/mp4;codecs=avc1", "video/webm;codecs=vp9", "video/webm;codecs=vp8", "video/webm"];
  return types.find((t) => MediaRecorder.isTypeSupported(t)) ?? "";
}

export function ClipRecorder({ onRecorded, onClose }: { onRecorded: (file: File) => void; onClose: () => void }) {
  const preview = useRef<HTMLVideoElement>(null);
  const stream = useRef<MediaStream | null>(null);
  const recorder = useRef<MediaRecorder | null>(null);
  const [recording, setRecording] = useState(false);
  // Start waits for the camera: a click before it opens would otherwise do nothing.
  const [cameraReady, setCameraReady] = useState(false);
  const [error, setError] = useState<string>();

  useEffect(() => {
    let cancelled = false;
    navigator.mediaDevices
      ?.getUserMedia({ video: { facingMode: "environment", width: { ideal: 1920 }, height: { ideal: 1080 } }, audio: false })
      .then((media) => {
        if (cancelled) return media.getTracks().forEach((t) => t.stop());
        stream.current = media;
        if (preview.current) preview.current.srcObject = media;
        setCameraReady(true);
      })
      .catch(() => setError("The camera could not be opened. Allow camera access, or pick a clip from the phone instead."));
    return () => {
      cancelled = true;
      stream.current?.getTracks().forEach((t) => t.stop());
    };
  }, []);

  const start = () => {
    if (!stream.current) return;
    const mimeType = recorderType();
    const chunks: Blob[] = [];
    const rec = new MediaRecorder(stream.current, mimeType ? { mimeType } : undefined);
    rec.ondataavailable = (event) => event.data.size > 0 && chunks.push(event.data);
    rec.onstop = () => {
      const type = rec.mimeType || "video/webm";
      const extension = type.startsWith("video/mp4") ? "mp4" : "webm";
      onRecorded(new File(chunks, `recorded-set.${extension}`, { type }));
    };
    rec.start(1000);
    recorder.current = rec;
    setRecording(true);
  };

  const stop = () => {
    recorder.current?.stop();
    setRecording(false);
  };

  return (
    <div className="grid gap-3 rounded-lg border border-line bg-surface p-3">
      {error ? (
        <p role="alert" className="text-sm text-fault">
          {error}
        </p>
      ) : (
        <video ref={preview} autoPlay muted playsInline className="aspect-video w-full rounded bg-sunken object-contain" />
      )}
      <div className="flex flex-wrap gap-2">
        {recording ? (
          <Button variant="danger" onClick={stop}>
            Stop recording
          </Button>
        ) : (
          <Button onClick={start} disabled={!cameraReady || Boolean(error)}>
            Start recording
          </Button>
        )}
        <Button variant="quiet" onClick={onClose} disabled={recording}>
          Close camera
        </Button>
      </div>
    </div>
  );
}
