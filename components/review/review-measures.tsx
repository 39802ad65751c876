// The measures beside the player, compact: the set's figures, one line per rep, the flags with their rule and
// source, and the cautions. The set page shows the full tables; this is what a reviewer glances at.
import type { StoredAnalysis } from "@/db/queries/analyses";
import { OBLIQUE_CAUTION } from "@/lib/clips/analysis-view";
import type { CameraView } from "@/lib/validation/common";
import { Caution } from "@/components/ui/banner";
import { Measure } from "@/components/ui/measure";

export function ReviewMeasures({ analysis, cameraView }: { analysis: StoredAnalysis; cameraView: CameraView }) {
  const best = analysis.set?.bestMeanVelocityMps ?? null;
  const flags = [...analysis.reps.flatMap((r) => r.flags), ...(analysis.set?.flags ?? [])];
  // How the engine measured (filters, calibration, landmarks) folds away; the cautions stay in view.
  const notes = analysis.notes.filter((line) => !analysis.cautions.includes(line));
  return (
    <section aria-labelledby="measures-heading" className="grid gap-3" data-testid="review-measures">
      <h2 id="measures-heading" className="text-base font-semibold text-ink">
        Measures
      </h2>
      <dl className="grid grid-cols-2 gap-3 text-sm">
        <Figure label="Reps found">
          <Measure value={analysis.set?.repCount ?? analysis.reps.length} />
        </Figure>
        <Figure label="Fastest rep">
          <Measure value={best} unit="m/s" digits={2} />
        </Figure>
        <Figure label="Velocity loss">
          <Measure value={analysis.set?.velocityLossPct} unit="%" />
        </Figure>
        <Figure label="Reps in reserve (est.)">
          <Measure value={analysis.set?.estimatedRepsInReserve} />
        </Figure>
      </dl>
      {analysis.set?.estimatedRepsInReserveSource ? (
        <p className="text-xs text-ink-faint">Reps in reserve: {analysis.set.estimatedRepsInReserveSource}</p>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-xs text-ink-muted">
            <tr className="border-b border-line">
              <th scope="col" className="py-1.5 pr-2 font-medium">
                Rep
              </th>
              <th scope="col" className="px-2 py-1.5 text-right font-medium">
                Mean velocity
              </th>
              <th scope="col" className="px-2 py-1.5 text-right font-medium">
                Loss
              </th>
              <th scope="col" className="px-2 py-1.5 text-right font-medium">
                Max drift
              </th>
              <th scope="col" className="py-1.5 pl-2 text-right font-medium">
                Flags
              </th>
            </tr>
          </thead>
          <tbody>
            {analysis.reps.map((rep) => (
              <tr key={rep.id} className="border-b border-line last:border-0">
                <th scope="row" className="nums py-1.5 pr-2 text-left font-medium">
                  {rep.repIndex}
                </th>
                <td className="px-2 py-1.5 text-right">
                  <Measure value={rep.meanConcentricVelocityMps} unit="m/s" digits={2} size="sm" />
                </td>
                <td className="px-2 py-1.5 text-right">
                  <Measure
                    value={best && rep.meanConcentricVelocityMps !== null ? 100 * (1 - rep.meanConcentricVelocityMps / best) : null}
                    unit="%"
                    size="sm"
                  />
                </td>
                <td className="px-2 py-1.5 text-right">
                  <Measure value={rep.maxHorizontalDeviationCm} unit="cm" digits={1} size="sm" />
                </td>
                <td className="py-1.5 pl-2 text-right">
                  <Measure value={rep.flags.length} size="sm" />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {flags.length > 0 ? (
        <details className="text-sm">
          <summary className="cursor-pointer font-medium text-ink">Flags ({flags.length})</summary>
          <ul className="mt-2 grid gap-2">
            {flags.map((flag, i) => (
              <li key={`${flag.code}-${flag.rep}-${i}`} className="grid gap-0.5 border-l-2 border-fault pl-3">
                <p className="text-ink">
                  {flag.rep ? `Rep ${flag.rep}: ` : "Set: "}
                  {flag.message}
                </p>
                <p className="nums text-xs text-ink-muted">
                  Threshold {flag.threshold} {flag.unit}; measured {flag.value === null ? "–" : Number(flag.value).toFixed(1)} {flag.unit}. Source:{" "}
                  {flag.source}
                </p>
              </li>
            ))}
          </ul>
        </details>
      ) : null}
      <div className="grid gap-1 text-xs text-ink-muted" data-testid="cautions">
        <Caution />
        <ul className="grid list-disc gap-1 pl-5">
          {cameraView === "oblique" ? <li>{OBLIQUE_CAUTION}</li> : null}
          {analysis.cautions.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
        {notes.length > 0 ? (
          <details>
            <summary className="cursor-pointer font-medium text-ink">Method notes ({notes.length})</summary>
            <ul className="mt-1 grid list-disc gap-1 pl-5">
              {notes.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </details>
        ) : null}
        <p>Feedback here is a coach&apos;s reading of a video: defer to qualified coaching in person and to your federation&apos;s rules.</p>
      </div>
    </section>
  );
}

function Figure({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid gap-0.5">
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}
