// Name a new team; its creator becomes the coach.
import type { Metadata } from "next";
import { NewTeamForm } from "@/components/team/new-team-form";
import { Card, CardBody } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "New team" };

export default function NewTeamPage() {
  return (
    <div className="max-w-form">
      <PageHeader title="Name your team" description="You will coach it; next you invite your athletes." />
      <Card>
        <CardBody>
          <NewTeamForm />
        </CardBody>
      </Card>
      <p className="mt-4 text-sm text-ink-muted">
        Joining a team as an athlete? Open the invitation link your coach sent you by e-mail.
      </p>
    </div>
  );
}
