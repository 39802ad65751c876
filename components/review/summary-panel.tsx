"use client";
// The coach's answer: free text plus cues (what to change, a drill or accessory, a priority), saved as a draft and
// then sent, which mails the athlete. The athlete and teammates read it once it is sent.
import { useState } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
import { reviewPayloadSchema, type ReviewPayloadView } from "@/lib/review/responses";
import { canSendReview } from "@/lib/review/status";
import { CUE_PRIORITIES, type CuePriority, type ReviewCue } from "@/lib/validation/review";
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { Banner } from "@/components/ui/banner";
import { Button } from "@/components/ui/button";
import { FormError, Input, Select, Textarea } from "@/components/ui/field";

const PRIORITY_LABELS: Record<CuePriority, string> = { high: "High", medium: "Medium", low: "Low" };
const PRIORITY_TONES: Record<CuePriority, BadgeTone> = { high: "fault", medium: "caution", low: "neutral" };

interface Props {
  setId: string;
  payload: ReviewPayloadView;
  onChange: (payload: ReviewPayloadView) => void;
}

export function SummaryPanel({ setId, payload, onChange }: Props) {
  return (
    <section aria-labelledby="summary-heading" className="grid gap-3">
      <h2 id="summary-heading" className="text-base font-semibold text-ink">
        Summary
      </h2>
      {payload.canEdit ? <SummaryEditor setId={setId} payload={payload} onChange={onChange} /> : <SummaryReader payload={payload} />}
    </section>
  );
}

function SummaryReader({ payload }: { payload: ReviewPayloadView }) {
  const { summary, cues } = payload.review;
  if (summary === null || cues === null) {
    return <p className="text-sm text-ink-muted">The coach has not answered yet. Comments are open in the meantime.</p>;
  }
  return (
    <div className="grid gap-3" data-testid="summary-read">
      {summary ? <p className="whitespace-pre-wrap text-sm text-ink">{summary}</p> : null}
      {cues.length > 0 ? (
        <ol className="grid gap-2">
          {cues.map((cue, i) => (
            <li key={i} className="grid gap-0.5 rounded border border-line p-2 text-sm">
              <div className="flex items-center gap-2">
                <Badge tone={PRIORITY_TONES[cue.priority]}>{PRIORITY_LABELS[cue.priority]}</Badge>
                <span className="font-medium text-ink">{cue.change}</span>
              </div>
              {cue.drill ? <p className="text-ink-muted">Drill: {cue.drill}</p> : null}
            </li>
          ))}
        </ol>
      ) : null}
    </div>
  );
}

const emptyCue = (): ReviewCue => ({ change: "", drill: "", priority: "medium" });

function SummaryEditor({ setId, payload, onChange }: Props) {
  const [summary, setSummary] = useState(payload.review.summary ?? "");
  const [cues, setCues] = useState<ReviewCue[]>(payload.review.cues ?? []);
  const [busy, setBusy] = useState<"save" | "send" | null>(null);
  const [error, setError] = useState<string>();
  const [notice, setNotice] = useState<string>();
  const { status } = payload.review;
  const sent = status === "answered" || status === "seen";
  const filledCues = cues.filter((c) => c.change.trim());

  function updateCue(index: number, change: Partial<ReviewCue>) {
    setCues((all) => all.map((cue, i) => (i === index ? { ...cue, ...change } : cue)));
  }

  async function saveDraft(): Promise<ReviewPayloadView> {
    const saved = await apiFetch(`/api/sets/${setId}/review`, {
      method: "PUT",
      body: { summary, cues: filledCues },
      schema: reviewPayloadSchema,
    });
    onChange(saved);
    return saved;
  }

  async function run(kind: "save" | "send") {
    setBusy(kind);
    setError(undefined);
    setNotice(undefined);
    try {
      await saveDraft();
      if (kind === "send") {
        const answered = await apiFetch(`/api/sets/${setId}/review/send`, { method: "POST", schema: reviewPayloadSchema });
        onChange(answered);
        setNotice(answered.mailed ? "Sent. The athlete got an e-mail with the link." : "Sent, but the e-mail could not be delivered. The athlete sees it on their next visit.");
      } else {
        setNotice("Draft saved.");
      }
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Something went wrong. Please try again.");
    } finally {
      setBusy(null);
    }
  }

  return (
    <div className="grid gap-3" data-testid="summary-editor">
      {sent ? (
        <Banner tone="info">Sent to the athlete. Changing it reopens the review until you send it again.</Banner>
      ) : null}
      <label htmlFor="review-summary" className="text-sm font-medium text-ink">
        What you saw
      </label>
      <Textarea id="review-summary" value={summary} onChange={(event) => setSummary(event.target.value)} maxLength={8000} />
      <fieldset className="grid gap-2">
        <legend className="mb-1 text-sm font-medium text-ink">Cues</legend>
        {cues.map((cue, i) => (
          <div key={i} className="grid gap-2 rounded border border-line p-2" data-testid="cue">
            <Input aria-label={`Cue ${i + 1}: what to change`} placeholder="What to change" value={cue.change} onChange={(e) => updateCue(i, { change: e.target.value })} />
            <Input aria-label={`Cue ${i + 1}: drill or accessory`} placeholder="Drill or accessory (optional)" value={cue.drill} onChange={(e) => updateCue(i, { drill: e.target.value })} />
            <div className="flex items-center gap-2">
              <Select
                aria-label={`Cue ${i + 1}: priority`}
                value={cue.priority}
                onChange={(e) => updateCue(i, { priority: e.target.value as CuePriority })}
                options={CUE_PRIORITIES.map((p) => ({ value: p, label: `${PRIORITY_LABELS[p]} priority` }))}
                className="w-auto"
              />
              <Button type="button" size="sm" variant="quiet" className="ml-auto" onClick={() => setCues((all) => all.filter((_, k) => k !== i))}>
                Remove
              </Button>
            </div>
          </div>
        ))}
        <Button type="button" size="sm" variant="secondary" className="justify-self-start" disabled={cues.length >= 12} onClick={() => setCues((all) => [...all, emptyCue()])}>
          Add a cue
        </Button>
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" disabled={busy !== null} onClick={() => void run("save")}>
          {busy === "save" ? "Saving…" : "Save draft"}
        </Button>
        <Button
          type="button"
          disabled={busy !== null || !canSendReview({ summary, cues: filledCues })}
          onClick={() => void run("send")}
        >
          {busy === "send" ? "Sending…" : sent ? "Send again" : "Send to athlete"}
        </Button>
      </div>
      {notice ? (
        <p role="status" className="text-sm text-ink-muted" data-testid="summary-notice">
          {notice}
        </p>
      ) : null}
      <FormError message={error} />
    </div>
  );
}
