// A set's review: the player with its markup, the measures, comments pinned to moments and the coach's summary.
// Open to the set's athlete, their coach, an admin, and teammates while the coach shares the set with the team.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireServerViewer, requireSetReader, type Viewer } from "@/lib/access";
import { ApiError } from "@/lib/errors";
import { getAnalysis } from "@/db/queries/analyses";
import { listComments } from "@/db/queries/comments";
import { getProfile } from "@/db/queries/profiles";
import { getReview, getShare } from "@/db/queries/reviews";
import { getSetSummary } from "@/db/queries/sets";
import { massFromKg } from "@/lib/client/units";
import { CAMERA_VIEW_LABELS, LIFT_LABELS } from "@/lib/client/set-form";
import { reviewPayload } from "@/lib/review/view";
import { reviewPayloadSchema, commentsResponseSchema } from "@/lib/review/responses";
import { ReviewMeasures } from "@/components/review/review-measures";
import { ReviewWorkspace } from "@/components/review/review-workspace";
import { Caution } from "@/components/ui/banner";
import { buttonClasses } from "@/components/ui/button";
import { formatDay } from "@/components/ui/date-text";
import { EmptyState } from "@/components/ui/empty-state";
import { formatNumber } from "@/components/ui/measure";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Review" };

async function reader(viewer: Viewer, setId: string) {
  try {
    return await requireSetReader(viewer, setId);
  } catch (error) {
    // Someone else's set looks exactly like a missing one.
    if (error instanceof ApiError) notFound();
    throw error;
  }
}

/** Server data as the browser will see it over JSON (dates as strings), so the client state has one shape. */
function asJson<T>(schema: { parse: (value: unknown) => T }, value: unknown): T {
  return schema.parse(JSON.parse(JSON.stringify(value)));
}

export default async function ReviewPage({ params }: { params: Promise<{ setId: string }> }) {
  const viewer = await requireServerViewer();
  const { set, role } = await reader(viewer, (await params).setId);
  const [summary, analysis, review, share, comments, viewerProfile] = await Promise.all([
    getSetSummary(set.id),
    getAnalysis(set.id, { frames: false }),
    getReview(set.id),
    getShare(set.id),
    listComments(set.id),
    getProfile(viewer.userId),
  ]);
  if (!summary) notFound();
  const unit = viewerProfile?.unitPreference ?? "kg";
  const title = `${LIFT_LABELS[set.lift]}${set.variant ? ` · ${set.variant}` : ""}`;
  const facts = [
    set.athleteId === viewer.userId ? null : summary.athleteName,
    formatDay(summary.sessionDate),
    `${formatNumber(massFromKg(set.loadKg, unit), 1)} ${unit} × ${set.reps}`,
    set.rpe === null ? null : `RPE ${set.rpe}`,
    `${CAMERA_VIEW_LABELS[set.cameraView]} view`,
  ].filter(Boolean);
  const backLink =
    role === "teammate" ? null : (
      <Link href={`/app/sets/${set.id}`} className={buttonClasses({ variant: "secondary", size: "sm" })}>
        Set details
      </Link>
    );

  if (!analysis) {
    return (
      <div className="grid max-w-3xl gap-6">
        <PageHeader title={`Review: ${title}`} description={facts.join(" · ")} actions={backLink} />
        <EmptyState title="Nothing to review yet">The set has not been analysed. Once the analysis is saved, the review opens here.</EmptyState>
        <Caution />
      </div>
    );
  }
  return (
    <div className="grid gap-2">
      <PageHeader title={`Review: ${title}`} description={facts.join(" · ")} actions={backLink} />
      <ReviewWorkspace
        setId={set.id}
        viewerId={viewer.userId}
        initial={asJson(reviewPayloadSchema, reviewPayload(review, share, role))}
        initialComments={asJson(commentsResponseSchema, { comments }).comments}
        reps={analysis.reps.map((r) => ({ repIndex: r.repIndex, startS: r.startS, endS: r.endS }))}
        measures={<ReviewMeasures analysis={analysis} cameraView={set.cameraView} />}
      />
    </div>
  );
}
