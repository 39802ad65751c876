"use client";
// Adds or re-sends a set's clip from the set page (a set saved without one, or an upload that stopped):
// resumes an unfinished upload of the same file, and refreshes the page once storage checked the clip.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { uploadClip, type UploadProgress } from "@/lib/client/clip-upload";
import { formatMegabytes } from "@/lib/clips/limits";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { ClipPicker, type PickedClip } from "./clip-picker";
import { FilmingAdvice } from "./filming-warnings";
import { ProgressBar } from "./upload-progress";

export function ClipUploader({ setId }: { setId: string }) {
  const router = useRouter();
  const [clip, setClip] = useState<PickedClip | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [error, setError] = useState<string>();

  const send = async () => {
    if (!clip) return;
    setError(undefined);
    setProgress({ sentBytes: 0, totalBytes: clip.file.size });
    try {
      await uploadClip({ setId, file: clip.file, onProgress: setProgress });
      router.refresh();
    } catch (failure) {
      setProgress(null);
      setError(`${failure instanceof Error ? failure.message : "The upload failed."} Retry to resume.`);
    }
  };

  return (
    <div className="grid gap-4">
      <FormError message={error} />
      <ClipPicker value={clip} onChange={setClip} disabled={progress !== null} />
      <FilmingAdvice />
      {progress ? (
        <ProgressBar
          label="Uploading the clip"
          fraction={progress.totalBytes > 0 ? progress.sentBytes / progress.totalBytes : null}
          detail={`${formatMegabytes(progress.sentBytes)} of ${formatMegabytes(progress.totalBytes)}`}
        />
      ) : (
        <div>
          <Button size="lg" onClick={() => void send()} disabled={!clip}>
            {error ? "Retry the upload" : "Upload the clip"}
          </Button>
        </div>
      )}
    </div>
  );
}
