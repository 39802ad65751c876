"use client";
// One curve per compared rep over 0–100 % of the rep (the stored 101-point series), axes labelled with
// units. Used for the angle, bar height and bar speed curves.
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { SERIES_PCT } from "@/lib/analysis/series";
import { formatNumber } from "@/components/ui/measure";
import type { CompareRepView, SeriesName } from "@/lib/compare/types";
import { repDash, repStroke } from "./colours";

export interface SeriesChartProps {
  reps: CompareRepView[];
  series: SeriesName;
  title: string;
  unit: string;
  /** Stored value to display value (e.g. metres to centimetres). */
  factor?: number;
  digits?: number;
}

export function SeriesChart({ reps, series, title, unit, factor = 1, digits = 1 }: SeriesChartProps) {
  const drawn = reps.map((rep, i) => ({ rep, i })).filter(({ rep }) => rep.series[series]);
  const data = SERIES_PCT.map((pct, k) => ({
    pct,
    ...Object.fromEntries(drawn.map(({ rep }) => [rep.repId, (rep.series[series] as number[])[k] * factor])),
  }));
  return (
    <figure data-testid={`curve-${series}`} className="grid gap-1">
      <figcaption className="text-sm font-medium text-ink">
        {title} <span className="font-light text-ink-muted">({unit})</span>
      </figcaption>
      {drawn.length === 0 ? (
        <p className="text-sm text-ink-muted">Not measured in this camera view.</p>
      ) : (
        <div className="h-56 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={data} margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
              <CartesianGrid stroke="var(--pl-line)" strokeDasharray="2 4" />
              <XAxis
                dataKey="pct"
                type="number"
                domain={[0, 100]}
                ticks={[0, 25, 50, 75, 100]}
                stroke="var(--pl-ink-faint)"
                tick={{ fontSize: 11 }}
                label={{ value: "Rep time (%)", position: "insideBottom", offset: -14, fontSize: 11, fill: "var(--pl-ink-muted)" }}
              />
              <YAxis
                stroke="var(--pl-ink-faint)"
                tick={{ fontSize: 11 }}
                width={44}
                domain={["auto", "auto"]}
                tickFormatter={(v: number) => formatNumber(v, digits > 1 ? 1 : 0)}
                label={{ value: `${title} (${unit})`, angle: -90, position: "insideLeft", offset: 4, fontSize: 11, fill: "var(--pl-ink-muted)", style: { textAnchor: "middle" } }}
              />
              <Tooltip
                formatter={(value) => `${formatNumber(Number(value), digits)} ${unit}`}
                labelFormatter={(pct) => `${formatNumber(Number(pct), 0)} % of the rep`}
                contentStyle={{ background: "var(--pl-surface)", borderColor: "var(--pl-line)", fontSize: 12 }}
              />
              <Legend verticalAlign="top" height={24} wrapperStyle={{ fontSize: 11 }} />
              {drawn.map(({ rep, i }) => (
                <Line
                  key={rep.repId}
                  dataKey={rep.repId}
                  name={rep.shortLabel}
                  type="monotone"
                  dot={false}
                  stroke={repStroke(i)}
                  strokeDasharray={repDash(i)}
                  strokeWidth={2}
                  isAnimationActive={false}
                />
              ))}
            </LineChart>
          </ResponsiveContainer>
        </div>
      )}
    </figure>
  );
}
