// A set's measured result: the trace over the clip, the set's measures, a table of reps (speed, range,
// drift, key angles, loss against the fastest rep), fault flags with their rule, threshold and source,
// and the cautions. Every number shows its unit; missing ones are "–" (not measurable in this view).
import type { StoredAnalysis, StoredRep } from "@/db/queries/analyses";
import { OBLIQUE_CAUTION } from "@/lib/clips/analysis-view";
import type { CameraView, Lift } from "@/lib/validation/common";
import { Badge } from "@/components/ui/badge";
import { Caution } from "@/components/ui/banner";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Measure } from "@/components/ui/measure";
import { BarTrace } from "./bar-trace";

interface Column {
  label: string;
  unit: string;
  digits: number;
  value: (rep: StoredRep, bestMps: number | null) => number | null;
}

const cm = (m: number | null) => (m === null ? null : m * 100);

const COMMON_COLUMNS: Column[] = [
  { label: "Mean concentric velocity", unit: "m/s", digits: 2, value: (r) => r.meanConcentricVelocityMps },
  { label: "Peak velocity", unit: "m/s", digits: 2, value: (r) => r.peakConcentricVelocityMps },
  {
    label: "Loss vs fastest rep",
    unit: "%",
    digits: 0,
    value: (r, best) => (best && r.meanConcentricVelocityMps !== null ? 100 * (1 - r.meanConcentricVelocityMps / best) : null),
  },
  { label: "Range of motion", unit: "cm", digits: 0, value: (r) => cm(r.romM) },
  { label: "Max drift", unit: "cm", digits: 1, value: (r) => r.maxHorizontalDeviationCm },
  { label: "Concentric time", unit: "s", digits: 2, value: (r) => r.concentricDurationS },
];

const LIFT_COLUMNS: Record<Lift, Column[]> = {
  squat: [
    { label: "Knee at bottom", unit: "°", digits: 0, value: (r) => r.kneeAngleAtBottomDeg },
    { label: "Hip at bottom", unit: "°", digits: 0, value: (r) => r.hipAngleAtBottomDeg },
    { label: "Torso at bottom", unit: "°", digits: 0, value: (r) => r.torsoAngleAtBottomDeg },
    { label: "Depth margin", unit: "cm", digits: 1, value: (r) => r.depthMarginCm },
  ],
  bench: [{ label: "Path toward shoulders", unit: "cm", digits: 1, value: (r) => r.benchPathShapeCm }],
  deadlift: [
    { label: "Torso at start", unit: "°", digits: 0, value: (r) => r.torsoAngleAtStartDeg },
    { label: "Hip at start", unit: "°", digits: 0, value: (r) => r.hipAngleAtStartDeg },
    { label: "Hip rise index", unit: "", digits: 2, value: (r) => r.hipRiseIndex },
  ],
};

const FRONT_COLUMNS: Column[] = [
  { label: "Knee projection angle", unit: "°", digits: 0, value: (r) => r.kneeProjectionAngleDeg },
  { label: "Stance / shoulders", unit: "×", digits: 2, value: (r) => r.stanceToShoulderWidthRatio },
];

const SCALE_METHODS = { plate: "plate of known size", scale: "given scale", "athlete-height": "athlete's height" } as const;

interface ThresholdInfo {
  rule?: string;
}

function thresholdRules(settings: Record<string, unknown>): Record<string, ThresholdInfo> {
  const engine = settings.engine as { thresholds?: Record<string, ThresholdInfo> } | undefined;
  return engine?.thresholds ?? {};
}

export function AnalysisResult({
  analysis,
  lift,
  cameraView,
  videoUrl,
  widthPx,
  heightPx,
}: {
  analysis: StoredAnalysis;
  lift: Lift;
  cameraView: CameraView;
  videoUrl: string | null;
  widthPx: number | null;
  heightPx: number | null;
}) {
  const columns = [...COMMON_COLUMNS, ...(cameraView === "front" ? FRONT_COLUMNS : LIFT_COLUMNS[lift])];
  const best = analysis.set?.bestMeanVelocityMps ?? null;
  const rules = thresholdRules(analysis.settings);
  const flags = [...analysis.reps.flatMap((r) => r.flags), ...(analysis.set?.flags ?? [])];
  const estimated = (analysis.settings.engine as { barSource?: string } | undefined)?.barSource === "pose-estimate";

  return (
    <div className="grid gap-6">
      {widthPx && heightPx && analysis.frames ? (
        <BarTrace videoUrl={videoUrl} widthPx={widthPx} heightPx={heightPx} frames={analysis.frames} reps={analysis.reps} />
      ) : null}
      <Card>
        <CardHeader
          title="The set"
          description={`Scale from the ${SCALE_METHODS[analysis.scale.method]}, ±${analysis.scale.uncertaintyPct.toFixed(0)} %.`}
          actions={estimated ? <Badge tone="caution">Bar estimated from pose</Badge> : null}
        />
        <CardBody className="grid grid-cols-2 gap-4 sm:grid-cols-4">
          <Stat label="Reps found">
            <Measure value={analysis.set?.repCount ?? analysis.reps.length} size="lg" />
          </Stat>
          <Stat label="Fastest rep">
            <Measure value={best} unit="m/s" digits={2} size="lg" />
          </Stat>
          <Stat label="Velocity loss">
            <Measure value={analysis.set?.velocityLossPct} unit="%" digits={0} size="lg" />
          </Stat>
          <Stat label="Reps in reserve (est.)">
            <Measure value={analysis.set?.estimatedRepsInReserve} digits={0} size="lg" />
          </Stat>
          {analysis.set?.estimatedRepsInReserveSource ? (
            <p className="col-span-full text-xs text-ink-faint">Reps in reserve: {analysis.set.estimatedRepsInReserveSource}</p>
          ) : null}
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Reps" />
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="reps-table">
            <thead className="text-left text-xs text-ink-muted">
              <tr className="border-b border-line">
                <th scope="col" className="px-4 py-2 font-medium">
                  Rep
                </th>
                {columns.map((c) => (
                  <th key={c.label} scope="col" className="px-3 py-2 text-right font-medium">
                    {c.label}
                  </th>
                ))}
                <th scope="col" className="px-4 py-2 font-medium">
                  Flags
                </th>
              </tr>
            </thead>
            <tbody>
              {analysis.reps.map((rep) => (
                <tr key={rep.id} className="border-b border-line last:border-0" data-rep={rep.repIndex}>
                  <th scope="row" className="nums px-4 py-2 text-left font-medium">
                    {rep.repIndex}
                  </th>
                  {columns.map((c) => (
                    <td key={c.label} className="px-3 py-2 text-right">
                      <Measure value={c.value(rep, best)} unit={c.unit || undefined} digits={c.digits} size="sm" />
                    </td>
                  ))}
                  <td className="px-4 py-2">
                    <div className="flex flex-wrap gap-1">
                      {rep.flags.map((f) => (
                        <Badge key={f.code} tone="fault">
                          {f.code}
                        </Badge>
                      ))}
                    </div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
      {flags.length > 0 ? (
        <Card>
          <CardHeader title="Flags" description="Each with its rule, threshold (your coach can change it) and where the threshold comes from." />
          <CardBody>
            <ul className="grid gap-3 text-sm">
              {flags.map((flag, i) => (
                <li key={`${flag.code}-${flag.rep}-${i}`} className="grid gap-0.5 border-l-2 border-fault pl-3">
                  <p className="font-medium text-ink">
                    {flag.rep ? `Rep ${flag.rep}: ` : "Set: "}
                    {flag.message}
                  </p>
                  {rules[flag.code]?.rule ? <p className="text-ink-muted">Rule: {rules[flag.code].rule}</p> : null}
                  <p className="nums text-ink-muted">
                    Threshold {flag.threshold} {flag.unit}; measured {flag.value === null ? "–" : Number(flag.value).toFixed(1)} {flag.unit}. Source: {flag.source}
                  </p>
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
      ) : null}
      <section aria-labelledby="cautions-heading" className="grid gap-2 text-sm text-ink-muted">
        <h2 id="cautions-heading" className="text-base font-semibold text-ink">
          Cautions
        </h2>
        <ul className="grid list-disc gap-1 pl-5" data-testid="cautions">
          {cameraView === "oblique" ? <li>{OBLIQUE_CAUTION}</li> : null}
          {[...new Set([...analysis.cautions, ...analysis.notes])].map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
        <Caution />
      </section>
    </div>
  );
}

function Stat({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid content-start gap-0.5">
      <span className="text-xs text-ink-muted">{label}</span>
      {children}
    </div>
  );
}
