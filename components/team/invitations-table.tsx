"use client";
// Open invitations (pending or expired) with resend and revoke; accepted ones show up as athletes instead.
import { createColumnHelper } from "@tanstack/react-table";
import type { RosterInvitationView } from "@/lib/client/responses";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { DateText } from "@/components/ui/date-text";
import type { RosterActions } from "./use-roster";

const column = createColumnHelper<RosterInvitationView>();

export function InvitationsTable({
  invitations,
  resend,
  revoke,
}: {
  invitations: RosterInvitationView[];
  resend: RosterActions["resend"];
  revoke: RosterActions["revoke"];
}) {
  const open = invitations.filter((invitation) => invitation.status === "pending" || invitation.status === "expired");
  const columns = [
    column.accessor("email", { header: "E-mail", cell: (info) => <span className="break-all">{info.getValue()}</span> }),
    column.accessor("status", {
      header: "Status",
      cell: (info) =>
        info.getValue() === "pending" ? <Badge tone="action">Pending</Badge> : <Badge tone="caution">Expired</Badge>,
    }),
    column.accessor("createdAt", { header: "Sent", cell: (info) => <DateText value={info.getValue()} />, meta: { align: "right" } }),
    column.accessor("expiresAt", {
      header: "Expires",
      cell: (info) => <DateText value={info.getValue()} />,
      meta: { align: "right" },
    }),
    column.display({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => <InvitationActions invitation={info.row.original} resend={resend} revoke={revoke} />,
      meta: { align: "right" },
    }),
  ];
  return (
    <DataTable
      data={open}
      columns={columns}
      caption="Open invitations"
      getRowId={(row) => row.id}
      initialSorting={[{ id: "createdAt", desc: true }]}
      empty="No open invitations."
    />
  );
}

function InvitationActions({
  invitation,
  resend,
  revoke,
}: {
  invitation: RosterInvitationView;
  resend: RosterActions["resend"];
  revoke: RosterActions["revoke"];
}) {
  const resending = resend.isPending && resend.variables === invitation.id;
  const revoking = revoke.isPending && revoke.variables === invitation.id;
  return (
    <span className="inline-flex gap-1">
      <Button
        size="sm"
        variant="quiet"
        pending={resending}
        onClick={() => resend.mutate(invitation.id)}
        aria-label={`Send the invitation to ${invitation.email} again`}
      >
        Resend
      </Button>
      {invitation.status === "pending" ? (
        <Button
          size="sm"
          variant="quiet"
          pending={revoking}
          onClick={() => revoke.mutate(invitation.id)}
          aria-label={`Revoke the invitation to ${invitation.email}`}
        >
          Revoke
        </Button>
      ) : null}
    </span>
  );
}
