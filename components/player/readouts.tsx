// Live read-outs of the frame on screen: knee, hip and torso angles from its pose, and the bar's speed.
import { Measure } from "@/components/ui/measure";
import type { FrameAngles } from "@/lib/player/readouts";

export function Readouts({ angles, barSpeedMps }: { angles: FrameAngles | null; barSpeedMps: number | null }) {
  const items = [
    { label: "Knee", value: angles?.kneeDeg ?? null, unit: "°", digits: 0, id: "knee" },
    { label: "Hip", value: angles?.hipDeg ?? null, unit: "°", digits: 0, id: "hip" },
    { label: "Torso to vertical", value: angles?.torsoDeg ?? null, unit: "°", digits: 0, id: "torso" },
    { label: "Bar speed", value: barSpeedMps, unit: "m/s", digits: 2, id: "bar-speed" },
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 sm:grid-cols-4" data-testid="player-readouts" aria-live="off">
      {items.map((item) => (
        <div key={item.id} className="grid gap-0.5" data-readout={item.id}>
          <dt className="text-2xs uppercase tracking-wide text-ink-faint">{item.label}</dt>
          <dd>
            <Measure value={item.value} unit={item.unit} digits={item.digits} />
          </dd>
        </div>
      ))}
      <p className="col-span-full text-2xs text-ink-faint">
        This frame only{angles ? `, ${angles.side} side` : ""}: angles from the pose model, speed from the tracked bar over ±2 frames. Estimates from video.
      </p>
    </dl>
  );
}
