"use client";
// Bar paths of every compared rep relative to its own start point, over the plumb line (x = 0): how far
// and which way each rep's bar wandered, whatever the camera position.
import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import { formatNumber } from "@/components/ui/measure";
import type { CompareRepView } from "@/lib/compare/types";
import { repDash, repStroke } from "./colours";

export function BarPaths({ reps, unit, factor }: { reps: CompareRepView[]; unit: string; factor: number }) {
  const drawn = reps
    .map((rep, i) => ({ rep, i }))
    .filter(({ rep }) => rep.series.barXM && rep.series.barYM)
    .map(({ rep, i }) => ({
      rep,
      i,
      points: (rep.series.barXM as number[]).map((x, k) => ({ x: x * factor, y: (rep.series.barYM as number[])[k] * factor })),
    }));
  // Symmetric about the plumb line, at least ±10 cm (4 in), so drift to either side reads the same.
  const reach = Math.max(0.1 * factor, ...drawn.flatMap((d) => d.points.map((p) => Math.abs(p.x))));
  if (drawn.length === 0) return <p className="text-sm text-ink-muted">No bar path was measured for these reps.</p>;
  return (
    <figure data-testid="bar-paths" className="grid gap-1">
      <figcaption className="text-sm font-medium text-ink">
        Bar paths from their start <span className="font-light text-ink-muted">({unit})</span>
      </figcaption>
      <div className="h-80 w-full max-w-md">
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="var(--pl-line)" strokeDasharray="2 4" />
            <XAxis
              dataKey="x"
              type="number"
              domain={[-reach, reach]}
              allowDataOverflow
              stroke="var(--pl-ink-faint)"
              tick={{ fontSize: 11 }}
              tickFormatter={(v: number) => formatNumber(v, 0)}
              label={{ value: `Horizontal from start (${unit})`, position: "insideBottom", offset: -14, fontSize: 11, fill: "var(--pl-ink-muted)" }}
            />
            <YAxis
              dataKey="y"
              type="number"
              domain={["auto", "auto"]}
              stroke="var(--pl-ink-faint)"
              tick={{ fontSize: 11 }}
              width={44}
              tickFormatter={(v: number) => formatNumber(v, 0)}
              label={{ value: `Height from start (${unit})`, angle: -90, position: "insideLeft", fontSize: 11, fill: "var(--pl-ink-muted)", style: { textAnchor: "middle" } }}
            />
            <ReferenceLine x={0} stroke="var(--pl-line-strong)" />
            <Tooltip
              formatter={(value) => `${formatNumber(Number(value), 1)} ${unit}`}
              contentStyle={{ background: "var(--pl-surface)", borderColor: "var(--pl-line)", fontSize: 12 }}
            />
            <Legend verticalAlign="top" height={24} wrapperStyle={{ fontSize: 11 }} />
            {drawn.map(({ rep, i, points }) => (
              <Scatter
                key={rep.repId}
                name={rep.shortLabel}
                data={points}
                line={{ stroke: repStroke(i), strokeWidth: 2, strokeDasharray: repDash(i) }}
                shape={() => <g />}
                fill={repStroke(i)}
                isAnimationActive={false}
              />
            ))}
          </ScatterChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
