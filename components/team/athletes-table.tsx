"use client";
// The coach's athletes: name, when they joined, their last set; removal asks for a second click.
import { createColumnHelper } from "@tanstack/react-table";
import { useState } from "react";
import type { RosterAthleteView } from "@/lib/client/responses";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { DateText } from "@/components/ui/date-text";
import type { RosterActions } from "./use-roster";

const column = createColumnHelper<RosterAthleteView>();

export function AthletesTable({ athletes, remove }: { athletes: RosterAthleteView[]; remove: RosterActions["remove"] }) {
  const columns = [
    column.accessor("name", {
      header: "Athlete",
      cell: (info) => (
        <div className="min-w-0">
          <div className="font-medium text-ink">{info.getValue()}</div>
          <div className="truncate text-xs text-ink-muted">{info.row.original.email}</div>
        </div>
      ),
    }),
    column.accessor("email", { header: "E-mail", enableSorting: false }),
    column.accessor("joinedAt", {
      header: "Joined",
      cell: (info) => <DateText value={info.getValue()} />,
      meta: { align: "right" },
    }),
    // Undefined rather than null, so athletes without a set sort after the others either way.
    column.accessor((row) => row.lastSetAt ?? undefined, {
      id: "lastSetAt",
      header: "Last set",
      sortingFn: "basic",
      cell: (info) => {
        const value = info.getValue();
        return value ? <DateText value={value} /> : <span className="text-ink-faint">No sets yet</span>;
      },
      sortUndefined: "last",
      meta: { align: "right" },
    }),
    column.display({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => <RemoveButton athlete={info.row.original} remove={remove} />,
      meta: { align: "right" },
    }),
  ];
  return (
    <DataTable
      data={athletes}
      columns={columns}
      caption="Athletes on this team"
      filterLabel="Filter athletes"
      getRowId={(row) => row.userId}
      initialSorting={[{ id: "name", desc: false }]}
      columnVisibility={{ email: false }}
      empty="No athletes yet. Invite them with the form on this page."
    />
  );
}

function RemoveButton({ athlete, remove }: { athlete: RosterAthleteView; remove: RosterActions["remove"] }) {
  const [confirming, setConfirming] = useState(false);
  const pending = remove.isPending && remove.variables === athlete.userId;
  if (!confirming) {
    return (
      <Button size="sm" variant="quiet" onClick={() => setConfirming(true)} aria-label={`Remove ${athlete.name} from the team`}>
        Remove
      </Button>
    );
  }
  return (
    <span className="inline-flex gap-1">
      <Button size="sm" variant="danger" pending={pending} onClick={() => remove.mutate(athlete.userId)}>
        Remove {athlete.name.split(" ")[0]}
      </Button>
      <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
        Keep
      </Button>
    </span>
  );
}
