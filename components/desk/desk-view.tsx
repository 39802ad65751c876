"use client";
// The review desk: counts per status, filters and sort (all in the URL), the table of sets, and keyboard
// navigation — j/k or the arrow keys move through the rows, Enter opens the review.
import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { clsx } from "clsx";
import { DataTable } from "@/components/ui/data-table";
import { formatDay } from "@/components/ui/date-text";
import { Select } from "@/components/ui/field";
import { Measure } from "@/components/ui/measure";
import { ReviewStatusBadge, SharedBadge } from "@/components/review/status-badge";
import { massFromKg } from "@/lib/client/units";
import { LIFT_LABELS } from "@/lib/client/set-form";
import { deskHref, moveRow } from "@/lib/review/desk-params";
import { REVIEW_STATUS_LABELS } from "@/lib/review/status";
import { LIFTS, type UnitPreference } from "@/lib/validation/common";
import { DESK_SORTS, REVIEW_STATUSES, type DeskQuery, type DeskSort, type ReviewStatus } from "@/lib/validation/review";
import type { Desk, DeskRow } from "@/db/queries/desk";

const SORT_LABELS: Record<DeskSort, string> = {
  oldest: "Oldest first",
  newest: "Newest first",
  athlete: "Athlete",
  velocityLoss: "Most velocity loss",
  flags: "Most flags",
};

const column = createColumnHelper<DeskRow>();

function columnsFor(unit: UnitPreference) {
  return [
    column.accessor("athleteName", {
      header: "Athlete",
      enableSorting: false,
      cell: (info) => (
        <Link
          href={`/app/sets/${info.row.original.setId}/review`}
          data-desk-row={info.row.index}
          data-testid="desk-row-link"
          data-set-id={info.row.original.setId}
          className="font-medium text-ink underline-offset-2 hover:underline focus-visible:outline-2 focus-visible:outline-focus"
        >
          {info.getValue()}
        </Link>
      ),
    }),
    column.accessor("lift", {
      header: "Lift",
      enableSorting: false,
      cell: (info) => (
        <span>
          {LIFT_LABELS[info.getValue()]}
          {info.row.original.variant ? <span className="text-ink-muted"> · {info.row.original.variant}</span> : null}
        </span>
      ),
    }),
    column.accessor("loadKg", {
      header: "Load",
      enableSorting: false,
      cell: (info) => <Measure value={massFromKg(info.getValue(), unit)} unit={unit} digits={1} size="sm" />,
      meta: { align: "right" },
    }),
    column.accessor("sessionDate", { header: "Date", enableSorting: false, cell: (info) => formatDay(info.getValue()), meta: { align: "right" } }),
    column.accessor("repCount", { header: "Reps", enableSorting: false, cell: (info) => <Measure value={info.getValue()} size="sm" />, meta: { align: "right" } }),
    column.accessor("velocityLossPct", {
      header: "Velocity loss",
      enableSorting: false,
      cell: (info) => <Measure value={info.getValue()} unit="%" size="sm" />,
      meta: { align: "right" },
    }),
    column.accessor("flagCount", { header: "Flags", enableSorting: false, cell: (info) => <Measure value={info.getValue()} size="sm" />, meta: { align: "right" } }),
    column.accessor("status", {
      header: "Status",
      enableSorting: false,
      cell: (info) => (
        <span className="inline-flex flex-wrap gap-1">
          <ReviewStatusBadge status={info.getValue()} />
          {info.row.original.shared ? <SharedBadge /> : null}
        </span>
      ),
    }),
  ];
}

const TYPING = new Set(["INPUT", "SELECT", "TEXTAREA"]);

export function DeskView({ desk, query, unit }: { desk: Desk; query: DeskQuery; unit: UnitPreference }) {
  const router = useRouter();
  const tableRef = useRef<HTMLDivElement>(null);
  const [active, setActive] = useState(-1);
  const rowCount = desk.rows.length;

  useEffect(() => {
    function onKey(event: KeyboardEvent) {
      const target = event.target as HTMLElement | null;
      if (event.altKey || event.ctrlKey || event.metaKey || (target && (TYPING.has(target.tagName) || target.isContentEditable))) return;
      const links = tableRef.current?.querySelectorAll<HTMLAnchorElement>("[data-desk-row]") ?? [];
      const focused = [...links].indexOf(document.activeElement as HTMLAnchorElement);
      const current = focused >= 0 ? focused : active;
      if (event.key === "Enter" && focused < 0 && current >= 0 && links[current]) {
        event.preventDefault();
        router.push(links[current].getAttribute("href") ?? "");
        return;
      }
      const next = moveRow(current, event.key, links.length);
      if (next === null) return;
      event.preventDefault();
      setActive(next);
      links[next]?.focus();
    }
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, [active, router]);

  const go = (change: Partial<DeskQuery>) => router.push(deskHref(query, change));
  const total = REVIEW_STATUSES.reduce((sum, s) => sum + desk.counts[s], 0);

  return (
    <div className="grid gap-4">
      <nav aria-label="Status" className="flex flex-wrap gap-2" data-testid="desk-counts">
        <StatusLink href={deskHref(query, { status: "open" })} current={query.status === "open"} label="Open" count={desk.counts.waiting + desk.counts.in_review} />
        <StatusLink href={deskHref(query, { status: "all" })} current={query.status === "all"} label="All" count={total} />
        {REVIEW_STATUSES.map((status: ReviewStatus) => (
          <StatusLink
            key={status}
            href={deskHref(query, { status })}
            current={query.status === status}
            label={REVIEW_STATUS_LABELS[status]}
            count={desk.counts[status]}
            status={status}
          />
        ))}
      </nav>
      <div className="flex flex-wrap items-end gap-3">
        <FilterSelect
          label="Athlete"
          value={query.athlete ?? ""}
          onChange={(v) => go({ athlete: v || undefined })}
          options={[{ value: "", label: "All athletes" }, ...desk.athletes.map((a) => ({ value: a.id, label: a.name }))]}
        />
        <FilterSelect
          label="Lift"
          value={query.lift ?? ""}
          onChange={(v) => go({ lift: (v || undefined) as DeskQuery["lift"] })}
          options={[{ value: "", label: "All lifts" }, ...LIFTS.map((l) => ({ value: l, label: LIFT_LABELS[l] }))]}
        />
        <FilterSelect
          label="Sort"
          value={query.sort}
          onChange={(v) => go({ sort: v as DeskSort })}
          options={DESK_SORTS.map((s) => ({ value: s, label: SORT_LABELS[s] }))}
        />
        <p className="ml-auto hidden text-xs text-ink-muted lg:block">
          <kbd className="rounded border border-line px-1">j</kbd> / <kbd className="rounded border border-line px-1">k</kbd> move ·{" "}
          <kbd className="rounded border border-line px-1">Enter</kbd> opens
        </p>
      </div>
      <div ref={tableRef} className="[&_tr:has(a:focus)]:bg-action-soft" data-testid="desk-table" data-row-count={rowCount}>
        <DataTable
          data={desk.rows}
          columns={columnsFor(unit)}
          caption="Sets waiting for an answer"
          getRowId={(row) => row.setId}
          empty={
            query.athlete || query.lift || (query.status !== "open" && query.status !== "all")
              ? "No sets match these filters."
              : query.status === "open"
                ? "Nothing waiting for an answer."
                : "No analysed sets from your athletes yet."
          }
        />
      </div>
    </div>
  );
}

function StatusLink({ href, current, label, count, status }: { href: string; current: boolean; label: string; count: number; status?: ReviewStatus }) {
  return (
    <Link
      href={href}
      aria-current={current ? "page" : undefined}
      data-status-count={status ?? label.toLowerCase()}
      className={clsx(
        "inline-flex items-center gap-2 rounded border px-3 py-1.5 text-sm font-medium",
        current ? "border-action bg-action-soft text-action" : "border-line-strong text-ink-muted hover:bg-sunken hover:text-ink",
      )}
    >
      {label}
      <span className="nums text-ink">{count}</span>
    </Link>
  );
}

function FilterSelect({
  label,
  value,
  onChange,
  options,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  options: { value: string; label: string }[];
}) {
  const id = useId();
  return (
    <div className="grid gap-1">
      <label htmlFor={id} className="text-xs font-medium text-ink-muted">
        {label}
      </label>
      <Select id={id} value={value} onChange={(event) => onChange(event.target.value)} options={options} className="min-w-40" />
    </div>
  );
}
