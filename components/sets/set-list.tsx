// A list of sets, newest first: lift, date, load in the viewer's unit, reps and RPE. Given the viewer's
// id, it also names the athlete of every set that is not the viewer's own (a coach's list).
import Link from "next/link";
import type { SetSummary } from "@/db/queries/sets";
import { massFromKg } from "@/lib/client/units";
import type { UnitPreference } from "@/lib/validation/common";
import { Badge } from "@/components/ui/badge";
import { DateText } from "@/components/ui/date-text";
import { Measure } from "@/components/ui/measure";

export const LIFT_NAMES = { squat: "Squat", bench: "Bench press", deadlift: "Deadlift" } as const;

const STATUS: Record<SetSummary["status"], { label: string; tone: "neutral" | "action" | "fault" }> = {
  draft: { label: "No clip yet", tone: "neutral" },
  uploaded: { label: "Waiting for analysis", tone: "neutral" },
  analysed: { label: "Measured", tone: "action" },
  failed: { label: "Analysis failed", tone: "fault" },
};

interface SetListProps {
  sets: SetSummary[];
  unit: UnitPreference;
  viewerId?: string;
  testId?: string;
}

export function SetList({ sets, unit, viewerId, testId }: SetListProps) {
  return (
    <ul className="divide-y divide-line rounded-lg border border-line bg-surface" data-testid={testId}>
      {sets.map((set) => (
        <li key={set.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 px-4 py-3">
          <div className="min-w-0">
            <Link href={`/app/sets/${set.id}`} className="font-medium hover:underline">
              {LIFT_NAMES[set.lift]}
              {set.variant ? <span className="font-normal text-ink-muted"> · {set.variant}</span> : null}
            </Link>
            <div className="mt-0.5 flex flex-wrap items-center gap-2 text-xs text-ink-muted">
              {viewerId && set.athleteId !== viewerId ? <span className="font-medium text-ink">{set.athleteName}</span> : null}
              <DateText value={set.sessionDate} />
              {set.teamName ? <span>· {set.teamName}</span> : null}
              <Badge tone={STATUS[set.status].tone}>{STATUS[set.status].label}</Badge>
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
