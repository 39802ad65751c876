// A plain GET form choosing an athlete and a lift (compare's picker and trends share it); works without script.
import { LIFT_LABELS } from "@/lib/client/set-form";
import { LIFTS, type Lift } from "@/lib/validation/common";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/field";

export function AthleteLiftForm({
  action,
  athletes,
  athleteId,
  lift,
}: {
  action: string;
  athletes: { id: string; name: string }[];
  athleteId?: string;
  lift?: Lift;
}) {
  return (
    <form action={action} method="get" className="flex flex-wrap items-end gap-3">
      <SelectField
        label="Athlete"
        name="athlete"
        defaultValue={athleteId}
        options={athletes.map((a) => ({ value: a.id, label: a.name }))}
        className="min-w-48"
      />
      <SelectField
        label="Lift"
        name="lift"
        defaultValue={lift ?? "squat"}
        options={LIFTS.map((l) => ({ value: l, label: LIFT_LABELS[l] }))}
        className="min-w-40"
      />
      <Button type="submit" variant="secondary">
        Show
      </Button>
    </form>
  );
}
