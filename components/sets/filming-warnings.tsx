// The trade's filming advice for a set about to be filed: the standing checklist, and warnings (never
// refusals) where the set or the clip falls outside it, each with where its rule comes from.
import { FILMING_ADVICE, type FilmingWarning } from "@/lib/clips/advice";
import { Banner } from "@/components/ui/banner";

export function FilmingAdvice() {
  return (
    <ul className="grid gap-1 text-xs text-ink-muted">
      {FILMING_ADVICE.map((line) => (
        <li key={line} className="flex gap-2">
          <span aria-hidden="true" className="mt-1.5 inline-block h-2 w-px shrink-0 bg-ink-faint" />
          {line}
        </li>
      ))}
    </ul>
  );
}

export function FilmingWarnings({ warnings }: { warnings: FilmingWarning[] }) {
  if (warnings.length === 0) return null;
  return (
    <Banner tone="caution" title="Worth a second look" live>
      <ul className="grid gap-1.5">
        {warnings.map((w) => (
          <li key={w.code} data-warning={w.code}>
            {w.message} <span className="text-ink-faint">({w.source})</span>
          </li>
        ))}
      </ul>
    </Banner>
  );
}
