// The coach's side of the printed report: the summary with its cues (once the athlete may read it) and
// every markup shape with the frame it is pinned to and what it measures.
import { formatClipTime } from "@/lib/review/format";
import { measureOf } from "@/lib/markup/kinds";
import type { MarkupShape } from "@/db/queries/markup";
import type { ReviewState } from "@/db/queries/reviews";

const KIND_LABELS = { ruler: "Ruler", protractor: "Protractor", arrow: "Arrow", ring: "Ring", pen: "Pen", note: "Note" } as const;

export function PrintReviewNotes({
  review,
  shapes,
  metresPerPixel,
}: {
  /** null when the viewer may not read the summary yet (an athlete before it is sent). */
  review: ReviewState | null;
  shapes: MarkupShape[];
  metresPerPixel: number | null;
}) {
  const hasSummary = review !== null && (review.summary.trim() !== "" || review.cues.length > 0);
  if (!hasSummary && shapes.length === 0) return null;
  return (
    <section className="grid gap-3 break-inside-avoid" data-testid="print-review">
      {hasSummary ? (
        <div className="grid gap-2">
          <h2 className="text-base font-semibold">Coach&rsquo;s summary</h2>
          {review.summary.trim() !== "" ? <p className="whitespace-pre-wrap text-sm">{review.summary}</p> : null}
          {review.cues.length > 0 ? (
            <ul className="grid gap-1 text-sm">
              {review.cues.map((cue, i) => (
                <li key={i}>
                  <span className="font-medium">{cue.change}</span>
                  {cue.drill ? <span className="text-ink-muted"> — drill: {cue.drill}</span> : null}
                  <span className="text-xs text-ink-muted"> ({cue.priority} priority)</span>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {shapes.length > 0 ? (
        <div className="grid gap-2">
          <h2 className="text-base font-semibold">Markup</h2>
          <table className="nums w-full text-left text-sm">
            <thead className="text-xs text-ink-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">Frame</th>
                <th className="py-1 pr-3 font-medium">Time</th>
                <th className="py-1 pr-3 font-medium">Tool</th>
                <th className="py-1 font-medium">Reads</th>
              </tr>
            </thead>
            <tbody>
              {shapes.map((shape) => {
                const measure = measureOf(shape.geometry, { metresPerPixel });
                const reads = shape.geometry.kind === "note" ? `“${shape.geometry.text}”` : (measure?.label ?? "");
                return (
                  <tr key={shape.id} className="border-t border-line" data-testid="print-markup-shape">
                    <td className="py-1 pr-3">{shape.frameIndex}</td>
                    <td className="py-1 pr-3">{formatClipTime(shape.frameTimeS)}</td>
                    <td className="py-1 pr-3">{KIND_LABELS[shape.geometry.kind]}</td>
                    <td className="py-1">{reads}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
