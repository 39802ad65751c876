// The set page's ways out to rep compare, trends, the CSV export and the printable report.
import Link from "next/link";
import type { Lift } from "@/lib/validation/common";
import { ButtonLink } from "@/components/ui/button";

export function SetCompareLinks({
  setId,
  athleteId,
  lift,
  repIds,
}: {
  setId: string;
  athleteId: string;
  lift: Lift;
  /** The set's reps in order. */
  repIds: string[];
}) {
  const query = new URLSearchParams({ athlete: athleteId, lift }).toString();
  return (
    <nav aria-label="Compare and export" className="flex flex-wrap items-center gap-2">
      {repIds.length >= 2 ? (
        <ButtonLink href={`/app/compare?reps=${repIds[0]},${repIds[repIds.length - 1]}`} variant="primary" size="md">
          Compare rep 1 with last rep
        </ButtonLink>
      ) : null}
      <ButtonLink href={`/app/compare?${query}`} variant="secondary" size="md">
        Pick reps from other sets
      </ButtonLink>
      <ButtonLink href={`/app/trends?${query}`} variant="quiet" size="md">
        Trends
      </ButtonLink>
      <Link href={`/api/exports/reps?set=${setId}`} prefetch={false} className="px-2 text-sm font-medium text-action underline-offset-2 hover:underline">
        Rep measures (CSV)
      </Link>
      <Link href={`/app/sets/${setId}/print`} className="px-2 text-sm font-medium text-action underline-offset-2 hover:underline">
        Printable report
      </Link>
    </nav>
  );
}
