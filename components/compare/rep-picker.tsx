"use client";
// Picks reps to compare from recent analysed sets of the same athlete and lift (any session).
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { formatDay } from "@/components/ui/date-text";
import { formatNumber } from "@/components/ui/measure";

export interface PickerSet {
  setId: string;
  sessionDate: string;
  load: string;
  variant: string | null;
  reps: { id: string; repIndex: number; meanConcentricVelocityMps: number | null }[];
}

export function RepPicker({ sets, initial }: { sets: PickerSet[]; initial: string[] }) {
  const router = useRouter();
  const [picked, setPicked] = useState<string[]>(initial);
  const toggle = (id: string) => setPicked((now) => (now.includes(id) ? now.filter((p) => p !== id) : [...now, id].slice(-6)));

  if (sets.length === 0) return <p className="text-sm text-ink-muted">No analysed sets of this lift to pick from yet.</p>;
  return (
    <form
      className="grid gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        router.push(`/app/compare?reps=${picked.join(",")}`);
      }}
    >
      <ul className="grid gap-3">
        {sets.map((set) => (
          <li key={set.setId}>
            <fieldset>
              <legend className="text-sm font-medium text-ink">
                {formatDay(set.sessionDate)} · {set.load}
                {set.variant ? ` · ${set.variant}` : ""}
              </legend>
              <div className="mt-1 flex flex-wrap gap-2">
                {set.reps.map((rep) => (
                  <label
                    key={rep.id}
                    className="inline-flex min-h-10 cursor-pointer items-center gap-2 rounded border border-line-strong px-3 text-sm has-[:checked]:border-action has-[:checked]:bg-action-soft"
                  >
                    <input type="checkbox" checked={picked.includes(rep.id)} onChange={() => toggle(rep.id)} className="accent-[var(--pl-action)]" />
                    Rep {rep.repIndex}
                    {rep.meanConcentricVelocityMps !== null ? (
                      <span className="nums text-xs text-ink-muted">{formatNumber(rep.meanConcentricVelocityMps, 2)} m/s</span>
                    ) : null}
                  </label>
                ))}
              </div>
            </fieldset>
          </li>
        ))}
      </ul>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={picked.length < 2}>
          Compare {picked.length} reps
        </Button>
        <span className="text-xs text-ink-muted">The first rep picked is the reference; at most six.</span>
      </div>
    </form>
  );
}
