// One set: its details, then whichever step it is at — add the clip, analyse it (plate mark, progress,
// cancel), or the measured result with the trace, reps, flags and cautions.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireServerViewer, requireSetAccess, type Viewer } from "@/lib/access";
import { ApiError } from "@/lib/errors";
import { getAnalysis } from "@/db/queries/analyses";
import { clipStateOf } from "@/db/queries/clips";
import { getProfile } from "@/db/queries/profiles";
import { getSetSummary } from "@/db/queries/sets";
import type { LiftSet } from "@/db/schema";
import { engineViewFor } from "@/lib/clips/analysis-view";
import { clipView } from "@/lib/clips/view";
import { massFromKg } from "@/lib/client/units";
import { CAMERA_VIEW_LABELS, LIFT_LABELS } from "@/lib/client/set-form";
import { AnalysisResult } from "@/components/sets/analysis-result";
import { AnalysisStep } from "@/components/sets/analysis-step";
import { SetCompareLinks } from "@/components/compare/set-compare-links";
import { ClipUploader } from "@/components/sets/clip-uploader";
import { Reanalyse } from "@/components/sets/reanalyse";
import { Banner } from "@/components/ui/banner";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { formatDay } from "@/components/ui/date-text";
import { formatNumber } from "@/components/ui/measure";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Set" };

async function readableSet(viewer: Viewer, setId: string): Promise<LiftSet> {
  try {
    return await requireSetAccess(viewer, setId);
  } catch (error) {
    // Someone else's set looks exactly like a missing one.
    if (error instanceof ApiError) notFound();
    throw error;
  }
}

export default async function SetPage({ params }: { params: Promise<{ setId: string }> }) {
  const viewer = await requireServerViewer();
  const set = await readableSet(viewer, (await params).setId);
  const [summary, analysis, athleteProfile, viewerProfile] = await Promise.all([
    getSetSummary(set.id),
    getAnalysis(set.id),
    getProfile(set.athleteId),
    getProfile(viewer.userId),
  ]);
  if (!summary) notFound();
  const clip = await clipView(clipStateOf(set));
  const unit = viewerProfile?.unitPreference ?? "kg";
  const title = `${LIFT_LABELS[set.lift]}${set.variant ? ` · ${set.variant}` : ""}`;
  const facts = [
    formatDay(summary.sessionDate),
    `${formatNumber(massFromKg(set.loadKg, unit), 1)} ${unit} × ${set.reps}`,
    set.rpe === null ? null : `RPE ${set.rpe}`,
    `${CAMERA_VIEW_LABELS[set.cameraView]} view`,
    summary.teamName,
    set.athleteId === viewer.userId ? null : summary.athleteName,
  ].filter(Boolean);
  const stepProps = {
    setId: set.id,
    lift: set.lift,
    view: engineViewFor(set.cameraView),
    loadKg: set.loadKg,
    athleteHeightM: athleteProfile?.heightM ?? null,
  };
  const hasClip = clip.status === "uploaded" || clip.status === "ready" || clip.status === "converting" || clip.status === "failed";

  return (
    <div className="grid max-w-4xl gap-6">
      <PageHeader
        title={title}
        description={facts.join(" · ")}
        actions={
          analysis ? (
            <Link href={`/app/sets/${set.id}/review`} className={buttonClasses({ size: "sm" })}>
              Open the review
            </Link>
          ) : null
        }
      />
      {set.note ? <p className="-mt-4 text-sm text-ink-muted">{set.note}</p> : null}
      {analysis ? (
        <>
          <SetCompareLinks setId={set.id} athleteId={set.athleteId} lift={set.lift} repIds={analysis.reps.map((r) => r.id)} />
          <AnalysisResult
            analysis={analysis}
            lift={set.lift}
            cameraView={set.cameraView}
            videoUrl={clip.convertedUrl ?? clip.url}
            widthPx={clip.widthPx}
            heightPx={clip.heightPx}
          />
          <Reanalyse {...stepProps} />
        </>
      ) : hasClip ? (
        <Card>
          <CardHeader title="Analyse the set" description="Runs on this device; the clip is not sent anywhere else." />
          <CardBody>
            <AnalysisStep {...stepProps} />
          </CardBody>
        </Card>
      ) : (
        <Card>
          <CardHeader title="Add the clip" description="The set is saved; it has no clip yet." />
          <CardBody>
            {clip.status === "uploading" ? (
              <Banner tone="caution" className="mb-4" title="An upload did not finish">
                Pick the same file again to resume where it stopped.
              </Banner>
            ) : null}
            <ClipUploader setId={set.id} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
