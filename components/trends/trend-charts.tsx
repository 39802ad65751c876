"use client";
// Trends for one athlete and lift: bar speed at given loads over time, the load–velocity profile with the
// 1RM it implies (minimum velocity threshold editable here), velocity loss per set, and consistency of
// start position, bar drift and depth over time.
import { useMemo, useState } from "react";
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  ScatterChart,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { displayCm, displayMass, smallLengthLabel, type DisplayUnits } from "@/lib/compare/units";
import { estimateOneRepMax, fitLoadVelocity } from "@/lib/trends/load-velocity";
import { groupByLoad, rampStep } from "@/lib/trends/load-groups";
import { KG_PER_LB } from "@/lib/validation/common";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Measure, formatNumber } from "@/components/ui/measure";
import { AXIS, ChartFigure, GRID, TOOLTIP_STYLE, dayTick, xLabel, yLabel } from "./chart-parts";
import type { TrendPoint } from "./types";

interface Props {
  points: TrendPoint[];
  units: DisplayUnits;
  showDepth: boolean;
  minimumVelocity: { valueMps: number; source: string };
}

const speed = (step: number) => `var(--pl-speed-${step})`;

function SpeedAtLoad({ points, units }: Pick<Props, "points" | "units">) {
  const groups = groupByLoad(points.filter((p) => p.bestMeanVelocityMps !== null), units, 4);
  return (
    <ChartFigure id="trend-speed-at-load" title="Best rep speed at each load, over time" note="Loads within one plate step count as one load; the four most-filmed loads are shown.">
      <ResponsiveContainer width="100%" height="100%">
        <ScatterChart margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
          <CartesianGrid {...GRID} />
          <XAxis dataKey="timeMs" type="number" scale="time" domain={["dataMin", "dataMax"]} tickFormatter={dayTick} {...AXIS} label={xLabel("Date")} />
          <YAxis dataKey="velocity" type="number" domain={["auto", "auto"]} width={48} tickFormatter={(v: number) => formatNumber(v, 2)} {...AXIS} label={yLabel("Mean concentric velocity (m/s)")} />
          <Tooltip contentStyle={TOOLTIP_STYLE} formatter={(v, name) => (name === "timeMs" ? dayTick(Number(v)) : `${formatNumber(Number(v), 2)} m/s`)} />
          <Legend verticalAlign="top" height={24} wrapperStyle={{ fontSize: 11 }} />
          {groups.map((g, i) => (
            <Scatter
              key={g.load}
              name={`${formatNumber(g.load, 1)} ${units.mass}`}
              data={g.points.map((p) => ({ timeMs: p.timeMs, velocity: p.bestMeanVelocityMps }))}
              fill={speed(rampStep(i, groups.length))}
              line={{ stroke: speed(rampStep(i, groups.length)), strokeWidth: 2 }}
              isAnimationActive={false}
            />
          ))}
        </ScatterChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

function LoadVelocityProfile({ points, units, minimumVelocity }: Omit<Props, "showDepth">) {
  const [mvtMps, setMvtMps] = useState(minimumVelocity.valueMps);
  const profile = points.flatMap((p) => (p.bestMeanVelocityMps === null ? [] : [{ loadKg: p.loadKg, velocityMps: p.bestMeanVelocityMps }]));
  const fit = useMemo(() => fitLoadVelocity(profile), [profile]);
  const estimate = fit ? estimateOneRepMax(fit, mvtMps) : null;
  const mass = (kg: number) => displayMass(kg, units);
  const loads = profile.map((p) => p.loadKg);
  const lineEndKg = Math.max(...loads, estimate?.highKg ?? estimate?.valueKg ?? 0);
  const lineStartKg = Math.min(...loads);
  const line = fit
    ? [lineStartKg, lineEndKg].map((kg) => ({ load: mass(kg), velocity: fit.interceptMps + fit.slopeMpsPerKg * kg }))
    : [];
  const slopePerUnit = fit ? fit.slopeMpsPerKg * (units.mass === "kg" ? 1 : KG_PER_LB) : null;

  return (
    <div className="grid gap-4">
      <ChartFigure id="trend-load-velocity" title="Load–velocity profile" note="Each dot is a set's fastest rep; the line is the least-squares fit over all shown sets.">
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
            <CartesianGrid {...GRID} />
            <XAxis dataKey="load" type="number" domain={["auto", "auto"]} {...AXIS} label={xLabel(`Load (${units.mass})`)} />
            <YAxis dataKey="velocity" type="number" domain={[0, "auto"]} width={48} tickFormatter={(v: number) => formatNumber(v, 2)} {...AXIS} label={yLabel("Mean concentric velocity (m/s)")} />
            <Tooltip contentStyle={TOOLTIP_STYLE} formatter={(v, name) => (name === "load" ? `${formatNumber(Number(v), 1)} ${units.mass}` : `${formatNumber(Number(v), 2)} m/s`)} />
            {estimate && estimate.lowKg !== null && estimate.highKg !== null ? (
              <ReferenceArea x1={mass(estimate.lowKg)} x2={mass(estimate.highKg)} fill="var(--pl-action-soft)" fillOpacity={0.8} />
            ) : null}
            <ReferenceLine y={mvtMps} stroke="var(--pl-caution)" strokeDasharray="4 4" label={{ value: "velocity at 1RM", fontSize: 11, fill: "var(--pl-ink-muted)", position: "insideTopRight" }} />
            {estimate ? <ReferenceLine x={mass(estimate.valueKg)} stroke="var(--pl-action)" /> : null}
            <Scatter name="Sets" data={profile.map((p) => ({ load: mass(p.loadKg), velocity: p.velocityMps }))} fill={speed(6)} isAnimationActive={false} />
            {fit ? <Scatter name="Fit" data={line} line={{ stroke: speed(8), strokeWidth: 2 }} shape={() => <g />} isAnimationActive={false} /> : null}
          </ScatterChart>
        </ResponsiveContainer>
      </ChartFigure>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm sm:grid-cols-4" data-testid="load-velocity-fit">
        <div>
          <dt className="text-xs text-ink-muted">Estimated 1RM</dt>
          <dd>
            {estimate ? (
              <>
                <Measure value={mass(estimate.valueKg)} unit={units.mass} digits={1} size="lg" />
                {estimate.lowKg !== null && estimate.highKg !== null ? (
                  <div className="nums text-xs text-ink-muted">
                    95 % band {formatNumber(mass(estimate.lowKg), 1)}–{formatNumber(mass(estimate.highKg), 1)} {units.mass}
                  </div>
                ) : (
                  <div className="text-xs text-ink-muted">Band needs three or more sets</div>
                )}
              </>
            ) : (
              <span className="text-ink-muted">Needs sets at two or more loads, slower when heavier</span>
            )}
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">Slope</dt>
          <dd>
            <Measure value={slopePerUnit} unit={`m/s per ${units.mass}`} digits={4} />
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">Intercept</dt>
          <dd>
            <Measure value={fit?.interceptMps} unit="m/s" digits={2} />
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">R² · sets</dt>
          <dd className="nums">
            <Measure value={fit?.rSquared} digits={3} /> · {fit?.n ?? profile.length}
          </dd>
        </div>
      </dl>
      <label className="flex flex-wrap items-center gap-2 text-sm text-ink">
        Velocity at 1RM (minimum velocity threshold)
        <input
          type="number"
          min={0.05}
          max={1}
          step={0.01}
          inputMode="decimal"
          value={mvtMps}
          onChange={(e) => {
            const v = Number(e.target.value);
            if (Number.isFinite(v) && v > 0) setMvtMps(v);
          }}
          className="nums h-10 w-24 rounded border border-line-strong bg-surface px-2"
        />
        <span className="font-light text-ink-muted">m/s</span>
      </label>
      <p className="text-xs text-ink-muted">
        Default: {minimumVelocity.source} (figures from memory). Band: {estimate?.method ?? "see the method once there is an estimate"}. An
        extrapolated 1RM is an estimate, not a tested max.
      </p>
    </div>
  );
}

function VelocityLoss({ points }: Pick<Props, "points">) {
  const data = points.filter((p) => p.velocityLossPct !== null).map((p) => ({ day: dayTick(p.timeMs), loss: p.velocityLossPct }));
  return (
    <ChartFigure id="trend-velocity-loss" title="Velocity loss per set" note="Slowest against fastest rep of each set, in per cent.">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
          <CartesianGrid {...GRID} />
          <XAxis dataKey="day" {...AXIS} label={xLabel("Set (date)")} />
          <YAxis width={48} {...AXIS} label={yLabel("Velocity loss (%)")} />
          <Tooltip contentStyle={TOOLTIP_STYLE} formatter={(v) => `${formatNumber(Number(v), 0)} %`} />
          <Bar dataKey="loss" name="Velocity loss" fill={speed(5)} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

function Consistency({ points, units, showDepth }: Omit<Props, "minimumVelocity">) {
  const len = smallLengthLabel(units);
  const cm = (v: number | null) => (v === null ? null : displayCm(v, units));
  const data = points.map((p) => ({
    timeMs: p.timeMs,
    backAngle: p.startTorsoAngleSpreadDeg,
    drift: cm(p.meanMaxHorizontalDeviationCm),
    depth: cm(p.minDepthMarginCm),
  }));
  const chart = (key: "backAngle" | "drift" | "depth", title: string, unit: string, note: string) => (
    <ChartFigure id={`trend-${key}`} title={title} note={note}>
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
          <CartesianGrid {...GRID} />
          <XAxis dataKey="timeMs" type="number" scale="time" domain={["dataMin", "dataMax"]} tickFormatter={dayTick} {...AXIS} label={xLabel("Date")} />
          <YAxis width={48} tickFormatter={(v: number) => formatNumber(v, 1)} {...AXIS} label={yLabel(`${title} (${unit})`)} />
          <Tooltip contentStyle={TOOLTIP_STYLE} labelFormatter={(v) => dayTick(Number(v))} formatter={(v) => `${formatNumber(Number(v), 1)} ${unit}`} />
          {key === "depth" ? <ReferenceLine y={0} stroke="var(--pl-caution)" strokeDasharray="4 4" /> : null}
          <Line dataKey={key} name={title} stroke={speed(7)} strokeWidth={2} connectNulls dot={{ r: 3 }} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
      {chart("backAngle", "Start back angle spread", "°", "Standard deviation of the torso angle at each rep's start: lower is steadier.")}
      {chart("drift", "Bar drift", len, "Mean over the set's reps of the largest distance from the plumb line.")}
      {showDepth
        ? chart("depth", "Depth margin, shallowest rep", len, "Positive: the hip joint went below the top of the knee (estimated from keypoints); at or under 0 it did not. Depth across the camera axis cannot be seen.")
        : null}
    </div>
  );
}

export function TrendCharts(props: Props) {
  if (props.points.length === 0) return <p className="text-sm text-ink-muted">No analysed sets of this lift yet.</p>;
  return (
    <div className="grid grid-cols-1 gap-6">
      <Card>
        <CardHeader title="Bar speed" />
        <CardBody className="grid grid-cols-1 gap-6 lg:grid-cols-2">
          <SpeedAtLoad points={props.points} units={props.units} />
          <VelocityLoss points={props.points} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Load–velocity profile and estimated 1RM" />
        <CardBody>
          <LoadVelocityProfile points={props.points} units={props.units} minimumVelocity={props.minimumVelocity} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Consistency" description="From rep to rep within each set, over time." />
        <CardBody>
          <Consistency points={props.points} units={props.units} showDepth={props.showDepth} />
        </CardBody>
      </Card>
    </div>
  );
}
