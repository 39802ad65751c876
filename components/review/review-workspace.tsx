"use client";
// The review page's working area: the player on the left; status, sharing, measures, comments and the summary
// on the right. Opening it moves the status (a coach opening a waiting set starts the review; the athlete opening an
// answered one marks it seen; an admin looking in changes nothing). Comments seek the player; a new comment pins to the player's current frame.
import dynamic from "next/dynamic";
import { useEffect, useState, type ReactNode } from "react";
import { apiFetch } from "@/lib/client/api";
import { reviewPayloadSchema, type CommentViewData, type ReviewPayloadView } from "@/lib/review/responses";
import { formatDay } from "@/components/ui/date-text";
import { CommentsPanel, type FrameInfo, type RepSpan } from "./comments-panel";
import { ShareToggle } from "./share-toggle";
import { ReviewStatusBadge } from "./status-badge";
import { SummaryPanel } from "./summary-panel";

// The player draws on canvas layers, which exist only in the browser.
const ReviewPlayer = dynamic(() => import("@/components/player/review-player").then((m) => m.ReviewPlayer), {
  ssr: false,
  loading: () => <div className="aspect-video w-full animate-pulse rounded-lg bg-sunken" aria-label="Loading the clip" />,
});

interface Props {
  setId: string;
  viewerId: string;
  initial: ReviewPayloadView;
  initialComments: CommentViewData[];
  reps: RepSpan[];
  measures: ReactNode;
}

export function ReviewWorkspace({ setId, viewerId, initial, initialComments, reps, measures }: Props) {
  const [payload, setPayload] = useState(initial);
  const [frame, setFrame] = useState<FrameInfo | null>(null);
  const [seekRequest, setSeekRequest] = useState<{ timeS: number } | null>(null);

  useEffect(() => {
    const action =
      initial.role === "coach" && initial.review.status === "waiting" ? "start" : initial.role === "athlete" && initial.review.status === "answered" ? "seen" : null;
    if (!action) return;
    apiFetch(`/api/sets/${setId}/review/${action}`, { method: "POST", schema: reviewPayloadSchema }).then(setPayload, () => undefined);
  }, [setId, initial]);

  const { review } = payload;
  const summary = <SummaryPanel setId={setId} payload={payload} onChange={setPayload} />;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_26rem]">
      {/* The player stays in view while the coach scrolls through measures, comments and the summary. */}
      <div className="grid content-start gap-3 lg:sticky lg:top-20 lg:max-h-[calc(100dvh-6rem)] lg:self-start lg:overflow-y-auto">
        <ReviewPlayer setId={setId} canEditMarkup={payload.canEdit} seekRequest={seekRequest} onFrameChange={setFrame} />
      </div>
      <aside className="grid content-start gap-6" aria-label="Review">
        <div className="grid gap-2">
          <div className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
            <ReviewStatusBadge status={review.status} />
            {review.answeredAt ? <span>Answered {formatDay(review.answeredAt)}</span> : null}
            {review.seenAt ? <span>· seen {formatDay(review.seenAt)}</span> : null}
          </div>
          <ShareToggle setId={setId} share={payload.share} canEdit={payload.canEdit} onChange={(share) => setPayload((p) => ({ ...p, share }))} />
        </div>
        {/* Readers come for the answer, so it leads; the coach writes it last, after measures and comments. */}
        {payload.canEdit ? null : summary}
        {measures}
        <CommentsPanel
          setId={setId}
          viewerId={viewerId}
          canModerate={payload.canEdit}
          initialComments={initialComments}
          frame={frame}
          reps={reps}
          onSeek={(timeS) => setSeekRequest({ timeS })}
        />
        {payload.canEdit ? summary : null}
      </aside>
    </div>
  );
}
