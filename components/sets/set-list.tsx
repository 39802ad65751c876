// An athlete's own sets, newest first: lift, date, load in their unit, reps and RPE.
import Link from "next/link";
import type { SetSummary } from "@/db/queries/sets";
import { massFromKg } from "@/lib/client/units";
import type { UnitPreference } from "@/lib/validation/common";
import { Badge } from "@/components/ui/badge";
import { DateText } from "@/components/ui/date-text";
import { Measure } from "@/components/ui/measure";

export const LIFT_NAMES = { squat: "Squat", bench: "Bench press", deadlift: "Deadlift" } as const;

const STATUS_LABELS: Record<SetSummary["status"], string> = {
  draft: "No clip yet",
  uploaded: "Clip uploaded",
  analysed: "Measured",
  failed: "Analysis failed",
};

export function SetList({ sets, unit }: { sets: SetSummary[]; unit: UnitPreference }) {
  return (
    <ul className="divide-y divide-line rounded-lg border border-line bg-surface">
      {sets.map((set) => (
        <li key={set.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 px-4 py-3">
          <div className="min-w-0">
            <div className="font-medium">
              <Link href={`/app/sets/${set.id}`} className="hover:underline">
                {LIFT_NAMES[set.lift]}
              </Link>
              {set.variant ? <span className="font-normal text-ink-muted"> · {set.variant}</span> : null}
            </div>
            <div className="mt-0.5 flex items-center gap-2 text-xs text-ink-muted">
              <DateText value={set.sessionDate} />
              {set.teamName ? <span>· {set.teamName}</span> : null}
              <Badge tone={set.status === "failed" ? "fault" : "neutral"}>{STATUS_LABELS[set.status]}</Badge>
            </div>
          </div>
          <div className="flex items-baseline gap-3">
            <Measure value={massFromKg(set.loadKg, unit)} unit={unit} digits={1} />
            <span className="nums text-sm text-ink-muted">
              × <span className="font-medium text-ink">{set.reps}</span>
            </span>
            {set.rpe !== null ? (
              <span className="nums text-sm text-ink-muted">
                RPE <span className="font-medium text-ink">{set.rpe}</span>
              </span>
            ) : null}
          </div>
        </li>
      ))}
    </ul>
  );
}
