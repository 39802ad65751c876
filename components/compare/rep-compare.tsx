"use client";
// Rep compare: synced clips, stick figures at a chosen phase, the curves over 0–100 % of the rep, the bar
// paths and the difference table, with the cautions. Lengths follow the viewer's display units.
import type { DisplayUnits } from "@/lib/compare/units";
import { kindDisplay } from "@/lib/compare/units";
import { Caution } from "@/components/ui/banner";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { BarPaths } from "./bar-paths";
import { CompareVideos } from "./compare-videos";
import { DifferenceTable } from "./difference-table";
import { SeriesChart } from "./series-chart";
import { StickFigures } from "./stick-figures";
import type { CompareRepView } from "@/lib/compare/types";

export function RepCompare({ reps, units }: { reps: CompareRepView[]; units: DisplayUnits }) {
  const length = kindDisplay("lengthM", units);
  return (
    <div className="grid grid-cols-1 gap-6">
      <Card>
        <CardHeader title="Clips, phase-aligned" description="Start, bottom and lockout line up; the first clip leads." />
        <CardBody>
          <CompareVideos reps={reps} />
        </CardBody>
      </Card>

      <Card>
        <CardHeader title="Differences" description={`Each rep against ${reps[0].shortLabel}.`} />
        <CardBody>
          <DifferenceTable reps={reps} units={units} />
        </CardBody>
      </Card>

      <Card>
        <CardHeader title="Curves over the rep" description="0 % is the rep's start, 100 % its end; each rep is stretched to the same length." />
        <CardBody className="grid grid-cols-1 gap-6 lg:grid-cols-2">
          <SeriesChart reps={reps} series="barVelocityMps" title="Bar speed" unit="m/s" digits={2} />
          <SeriesChart reps={reps} series="barYM" title="Bar height" unit={length.unit} factor={length.factor} />
          <SeriesChart reps={reps} series="kneeAngleDeg" title="Knee angle" unit="°" digits={0} />
          <SeriesChart reps={reps} series="hipAngleDeg" title="Hip angle" unit="°" digits={0} />
          <SeriesChart reps={reps} series="torsoAngleDeg" title="Torso angle to vertical" unit="°" digits={0} />
        </CardBody>
      </Card>

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader title="Positions" description="Stick figures from the stored pose, feet on the same point." />
          <CardBody>
            <StickFigures reps={reps} />
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Bar paths" description="Each path starts at 0, 0; the vertical is the plumb line." />
          <CardBody>
            <BarPaths reps={reps} unit={length.unit} factor={length.factor} />
          </CardBody>
        </Card>
      </div>

      <div className="grid gap-1">
        <Caution />
        <p className="text-xs text-ink-muted">
          Angles and distances come from 2-D video: they cannot show spinal flexion or movement toward the camera. Technique
          decisions belong to a qualified coach and your federation&apos;s rules.
        </p>
      </div>
    </div>
  );
}
