"use client";
// The coach's roster page body: athletes, open invitations and the invite form, kept fresh by TanStack Query.
import type { RosterView as Roster } from "@/lib/client/responses";
import { ApiError } from "@/lib/client/api";
import { Banner } from "@/components/ui/banner";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { AthletesTable } from "./athletes-table";
import { InvitationsTable } from "./invitations-table";
import { InviteForm } from "./invite-form";
import { useRoster, useRosterActions } from "./use-roster";

export function RosterView({ initial }: { initial: Roster }) {
  const { data: roster } = useRoster(initial);
  const actions = useRosterActions(roster.team.id);
  const openCount = roster.invitations.filter((i) => i.status === "pending" || i.status === "expired").length;
  const failure = [actions.resend, actions.revoke, actions.remove].find((action) => action.isError)?.error;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem] lg:items-start">
      <div className="grid gap-6">
        {failure ? (
          <Banner live tone="fault" title="That did not work">
            {failure instanceof ApiError ? failure.message : "Try again in a moment."}
          </Banner>
        ) : null}
        <Card aria-labelledby="athletes-heading">
          <CardHeader
            title={<span id="athletes-heading">Athletes</span>}
            description={`${roster.athletes.length} on ${roster.team.name}`}
          />
          <CardBody>
            <AthletesTable athletes={roster.athletes} remove={actions.remove} />
          </CardBody>
        </Card>
        <Card aria-labelledby="invitations-heading">
          <CardHeader
            title={<span id="invitations-heading">Invitations</span>}
            description={openCount === 1 ? "1 waiting for an answer" : `${openCount} waiting for an answer`}
          />
          <CardBody>
            <InvitationsTable invitations={roster.invitations} resend={actions.resend} revoke={actions.revoke} />
          </CardBody>
        </Card>
      </div>
      <Card aria-labelledby="invite-heading" className="lg:sticky lg:top-20">
        <CardHeader title={<span id="invite-heading">Invite athletes</span>} description="They get a link by e-mail." />
        <CardBody>
          <InviteForm invite={actions.invite} />
        </CardBody>
      </Card>
    </div>
  );
}
