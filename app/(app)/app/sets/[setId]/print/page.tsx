// The printable set report: the set's facts, key frames of each rep, the rep and set measures, the flags
// with their rule and source, the coach's summary and markup, and the cautions. Print stylesheet beside it.
import "./print.css";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireServerViewer, requireSetAccess } from "@/lib/access";
import { ApiError } from "@/lib/errors";
import { CAMERA_VIEW_LABELS, LIFT_LABELS } from "@/lib/client/set-form";
import { clipView } from "@/lib/clips/view";
import { COMPARE_MEASURES } from "@/lib/compare/differences";
import { displayMass, kindDisplay } from "@/lib/compare/units";
import { getAnalysis } from "@/db/queries/analyses";
import { clipStateOf } from "@/db/queries/clips";
import { getPreferences } from "@/db/queries/preferences";
import { getSetSummary } from "@/db/queries/sets";
import { listMarkup } from "@/db/queries/markup";
import { getReview } from "@/db/queries/reviews";
import { KeyFrames } from "@/components/print/key-frames";
import { PrintReviewNotes } from "@/components/print/review-notes";
import { PrintButton } from "@/components/print/print-button";
import { Caution } from "@/components/ui/banner";
import { formatDay } from "@/components/ui/date-text";
import { Measure, formatNumber } from "@/components/ui/measure";

export const metadata: Metadata = { title: "Set report" };

export default async function PrintSetPage({ params }: { params: Promise<{ setId: string }> }) {
  const viewer = await requireServerViewer();
  const set = await requireSetAccess(viewer, (await params).setId).catch((error: unknown) => {
    if (error instanceof ApiError) notFound();
    throw error;
  });
  const [summary, analysis, units, clip, review, shapes] = await Promise.all([
    getSetSummary(set.id),
    getAnalysis(set.id, { frames: false }),
    getPreferences(viewer.userId),
    clipView(clipStateOf(set)),
    getReview(set.id),
    listMarkup(set.id),
  ]);
  // The athlete reads the summary only once it is sent, as on the review page.
  const readableReview = set.athleteId !== viewer.userId || review.status === "answered" || review.status === "seen" ? review : null;
  if (!summary) notFound();
  const measures = COMPARE_MEASURES.filter((m) => analysis?.reps.some((r) => r[m.key] !== null));
  const flags = analysis ? [...analysis.reps.flatMap((r) => r.flags), ...(analysis.set?.flags ?? [])] : [];

  return (
    <article data-print-report className="grid max-w-4xl gap-6 text-ink">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight">
            {LIFT_LABELS[set.lift]}
            {set.variant ? ` · ${set.variant}` : ""} — {summary.athleteName}
          </h1>
          <p className="text-sm text-ink-muted">
            {[
              formatDay(summary.sessionDate),
              `${formatNumber(displayMass(set.loadKg, units), 1)} ${units.mass} × ${set.reps}`,
              set.rpe === null ? null : `RPE ${set.rpe}`,
              `${CAMERA_VIEW_LABELS[set.cameraView]} view`,
              summary.teamName,
            ]
              .filter(Boolean)
              .join(" · ")}
          </p>
        </div>
        <PrintButton />
      </div>

      {!analysis ? (
        <p className="text-sm text-ink-muted">This set has not been analysed yet.</p>
      ) : (
        <>
          <section className="grid gap-2">
            <h2 className="text-base font-semibold">Key frames</h2>
            <KeyFrames
              videoUrl={clip.convertedUrl ?? clip.url}
              reps={analysis.reps.map((r) => ({ repIndex: r.repIndex, startS: r.startS, bottomS: r.bottomS, lockoutS: r.concentricEndS ?? r.endS }))}
            />
          </section>

          <section className="grid gap-2 break-inside-avoid">
            <h2 className="text-base font-semibold">Set</h2>
            <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-4">
              <div>
                <dt className="text-xs text-ink-muted">Fastest rep</dt>
                <dd><Measure value={analysis.set?.bestMeanVelocityMps} unit="m/s" digits={2} /></dd>
              </div>
              <div>
                <dt className="text-xs text-ink-muted">Last rep</dt>
                <dd><Measure value={analysis.set?.lastMeanVelocityMps} unit="m/s" digits={2} /></dd>
              </div>
              <div>
                <dt className="text-xs text-ink-muted">Velocity loss</dt>
                <dd><Measure value={analysis.set?.velocityLossPct} unit="%" /></dd>
              </div>
              <div>
                <dt className="text-xs text-ink-muted">Start back angle spread</dt>
                <dd><Measure value={analysis.set?.startTorsoAngleSpreadDeg} unit="°" digits={1} /></dd>
              </div>
            </dl>
          </section>

          <section className="grid gap-2 break-inside-avoid">
            <h2 className="text-base font-semibold">Reps</h2>
            <div className="overflow-x-auto">
              <table data-testid="print-measures" className="nums w-full text-sm">
                <thead className="text-left text-xs text-ink-muted">
                  <tr className="border-b border-line">
                    <th className="py-1 pr-3 font-medium">Measure</th>
                    {analysis.reps.map((r) => (
                      <th key={r.id} className="py-1 pr-3 font-medium">Rep {r.repIndex}</th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {measures.map((m) => {
                    const { unit, factor, digits } = kindDisplay(m.kind, units);
                    return (
                      <tr key={m.key} className="border-b border-line last:border-0">
                        <th scope="row" className="py-1 pr-3 text-left font-normal">{m.label}</th>
                        {analysis.reps.map((r) => {
                          const v = r[m.key];
                          return (
                            <td key={r.id} className="py-1 pr-3">
                              <Measure value={v === null ? null : v * factor} unit={unit} digits={digits} size="sm" />
                            </td>
                          );
                        })}
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          </section>

          {flags.length > 0 ? (
            <section className="grid gap-2 break-inside-avoid">
              <h2 className="text-base font-semibold">Flags</h2>
              <ul className="grid gap-1 text-sm">
                {flags.map((f, i) => (
                  <li key={`${f.code}-${f.rep}-${i}`}>
                    {f.message} <span className="text-xs text-ink-muted">Threshold {f.threshold} {f.unit}; source: {f.source}.</span>
                  </li>
                ))}
              </ul>
            </section>
          ) : null}

          <PrintReviewNotes review={readableReview} shapes={shapes} metresPerPixel={analysis.scale.metresPerPixel} />

          <section className="grid gap-1 text-xs text-ink-muted">
            {analysis.cautions.map((c) => (
              <p key={c}>{c}</p>
            ))}
            <Caution />
          </section>
        </>
      )}
    </article>
  );
}
