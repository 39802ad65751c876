// Profile settings: body mass, height, unit and known one-rep maxes. `?next=` continues onboarding after saving.
import type { Metadata } from "next";
import Link from "next/link";
import { requireServerViewer } from "@/lib/access";
import { getProfile } from "@/db/queries/profiles";
import { safeNextPath } from "@/lib/next-path";
import { ProfileForm } from "@/components/settings/profile-form";
import { Card, CardBody } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Profile" };

export default async function ProfilePage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const viewer = await requireServerViewer();
  const [profile, { next }] = await Promise.all([getProfile(viewer.userId), searchParams]);
  const afterSave = next === undefined ? undefined : safeNextPath(next);
  return (
    <div className="max-w-2xl">
      <PageHeader
        title={afterSave ? "A few numbers about you" : "Profile"}
        description="Stored in kilograms and metres; shown in the unit you choose. Every field can wait."
        actions={
          <Link href="/app/settings/units" className="text-sm font-medium text-action underline-offset-2 hover:underline">
            Display units
          </Link>
        }
      />
      <Card>
        <CardBody>
          <ProfileForm profile={profile} afterSave={afterSave} />
        </CardBody>
      </Card>
    </div>
  );
}
