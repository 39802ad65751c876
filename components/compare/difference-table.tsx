"use client";
// The difference table: each measure of every rep against the first, highlighted past a threshold the
// viewer can change here (for this page only); each threshold says where its default comes from.
import { clsx } from "clsx";
import { useMemo, useState } from "react";
import { defaultThresholds, differenceTable, type Thresholds } from "@/lib/compare/differences";
import { kindDisplay, type DisplayUnits } from "@/lib/compare/units";
import { formatNumber } from "@/components/ui/measure";
import type { CompareRepView } from "@/lib/compare/types";

function signed(value: number, digits: number): string {
  const text = formatNumber(Math.abs(value), digits);
  return value > 0 ? `+${text}` : value < 0 ? `−${text}` : text;
}

export function DifferenceTable({ reps, units }: { reps: CompareRepView[]; units: DisplayUnits }) {
  const [thresholds, setThresholds] = useState<Thresholds>(defaultThresholds);
  const rows = useMemo(() => differenceTable(reps.map((r) => r.measures), thresholds), [reps, thresholds]);
  const [reference, ...others] = reps;

  return (
    <div className="overflow-x-auto">
      <table data-testid="difference-table" className="nums w-full min-w-[36rem] text-sm">
        <thead className="text-left text-xs text-ink-muted">
          <tr className="border-b border-line">
            <th className="py-2 pr-3 font-medium">Measure</th>
            <th className="py-2 pr-3 font-medium">{reference.shortLabel}</th>
            {others.map((rep) => (
              <th key={rep.repId} className="py-2 pr-3 font-medium">
                {rep.shortLabel} <span className="font-light">(difference)</span>
              </th>
            ))}
            <th className="py-2 font-medium">Highlight past</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(({ measure, reference: ref, others: cells }) => {
            const { unit, factor, digits } = kindDisplay(measure.kind, units);
            const show = (v: number | null) => (v === null ? "–" : `${formatNumber(v * factor, digits)} ${unit}`);
            return (
              <tr key={measure.key} className="border-b border-line align-top last:border-0">
                <th scope="row" className="py-2 pr-3 text-left font-normal text-ink">
                  {measure.label}
                </th>
                <td className="py-2 pr-3">{show(ref)}</td>
                {cells.map((cell, i) => (
                  <td
                    key={others[i].repId}
                    data-past-threshold={cell.pastThreshold || undefined}
                    className={clsx("py-2 pr-3", cell.pastThreshold && "bg-caution-soft font-semibold text-ink")}
                  >
                    {show(cell.value)}
                    {cell.difference !== null ? (
                      <span className={clsx("ml-1", cell.pastThreshold ? "text-caution" : "text-ink-muted")}>
                        ({signed(cell.difference * factor, digits)})
                      </span>
                    ) : null}
                  </td>
                ))}
                <td className="py-1">
                  <label className="flex items-center gap-1 text-xs text-ink-muted">
                    <span className="sr-only">Threshold for {measure.label}</span>
                    <input
                      type="number"
                      min={0}
                      step="any"
                      inputMode="decimal"
                      value={Number((thresholds[measure.key] * factor).toFixed(digits + 1))}
                      onChange={(event) => {
                        const typed = Number(event.target.value);
                        if (Number.isFinite(typed) && typed >= 0) setThresholds({ ...thresholds, [measure.key]: typed / factor });
                      }}
                      className="h-8 w-20 rounded border border-line-strong bg-surface px-2 text-ink"
                    />
                    {unit} <span className="whitespace-nowrap">· {measure.thresholdSource}</span>
                  </label>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">
        Highlighted: the difference from {reference.shortLabel} is larger than the threshold. Defaults are common practice, not
        research limits; change them for this page here.
      </p>
    </div>
  );
}
