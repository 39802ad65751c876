// Display units: how loads and lengths are shown in compare, trends and exports (stored values stay SI).
import type { Metadata } from "next";
import Link from "next/link";
import { requireServerViewer } from "@/lib/access";
import { getPreferences } from "@/db/queries/preferences";
import { UnitsForm } from "@/components/settings/units-form";
import { Card, CardBody } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Display units" };

export default async function UnitsPage() {
  const viewer = await requireServerViewer();
  const preferences = await getPreferences(viewer.userId);
  return (
    <div className="max-w-2xl">
      <PageHeader
        title="Display units"
        description="How loads and lengths read in rep compare, trends and exports. Measures stay stored in kilograms and metres."
        actions={
          <Link href="/app/settings/profile" className="text-sm font-medium text-action underline-offset-2 hover:underline">
            Profile
          </Link>
        }
      />
      <Card>
        <CardBody>
          <UnitsForm initial={{ massUnit: preferences.mass, lengthUnit: preferences.length }} />
        </CardBody>
      </Card>
    </div>
  );
}
