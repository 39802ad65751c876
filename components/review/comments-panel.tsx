"use client";
// Comments pinned to moments of the clip: a new one pins to the frame the player shows (and names its rep, which
// the writer may change); clicking a comment's moment seeks the player there. Threads are one level deep.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
import { commentResponseSchema, commentsResponseSchema, type CommentViewData } from "@/lib/review/responses";
import { formatClipTime, repAt, threadsOf } from "@/lib/review/format";
import { Button } from "@/components/ui/button";
import { FormError, Select, Textarea } from "@/components/ui/field";

export interface FrameInfo {
  index: number;
  timeS: number;
  repNumber: number | null;
}

export interface RepSpan {
  repIndex: number;
  startS: number;
  endS: number;
}

interface Props {
  setId: string;
  viewerId: string;
  canModerate: boolean;
  initialComments: CommentViewData[];
  frame: FrameInfo | null;
  reps: RepSpan[];
  onSeek: (timeS: number) => void;
}

const commentsKey = (setId: string) => ["sets", setId, "comments"] as const;

function messageOf(error: unknown): string | undefined {
  if (!error) return undefined;
  return error instanceof ApiError ? error.message : "Something went wrong. Please try again.";
}

export function CommentsPanel({ setId, viewerId, canModerate, initialComments, frame, reps, onSeek }: Props) {
  const queryClient = useQueryClient();
  const { data } = useQuery({
    queryKey: commentsKey(setId),
    queryFn: () => apiFetch(`/api/sets/${setId}/comments`, { schema: commentsResponseSchema }),
    initialData: { comments: initialComments },
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: commentsKey(setId) });
  const add = useMutation({
    mutationFn: (body: Record<string, unknown>) =>
      apiFetch(`/api/sets/${setId}/comments`, { method: "POST", body, schema: commentResponseSchema }),
    onSuccess: refresh,
  });
  const threads = threadsOf(data.comments);

  return (
    <section aria-labelledby="comments-heading" className="grid gap-3">
      <h2 id="comments-heading" className="text-base font-semibold text-ink">
        Comments
      </h2>
      <NewComment frame={frame} reps={reps} pending={add.isPending} error={messageOf(add.error)} onSubmit={(body) => add.mutateAsync(body)} />
      {threads.length === 0 ? <p className="text-sm text-ink-muted">No comments yet.</p> : null}
      <ol className="grid gap-3" data-testid="comment-list">
        {threads.map(({ root, replies }) => (
          <li key={root.id} className="grid gap-2 rounded border border-line bg-surface p-3">
            <CommentItem setId={setId} comment={root} viewerId={viewerId} canModerate={canModerate} onSeek={onSeek} onChanged={refresh} />
            {replies.length > 0 ? (
              <ol className="grid gap-2 border-l-2 border-line pl-3">
                {replies.map((reply) => (
                  <li key={reply.id}>
                    <CommentItem setId={setId} comment={reply} viewerId={viewerId} canModerate={canModerate} onSeek={onSeek} onChanged={refresh} />
                  </li>
                ))}
              </ol>
            ) : null}
            <ReplyForm onReply={(body) => add.mutateAsync({ body, parentId: root.id, timeS: root.timeS, frameIndex: root.frameIndex })} />
          </li>
        ))}
      </ol>
    </section>
  );
}

function NewComment({
  frame,
  reps,
  pending,
  error,
  onSubmit,
}: {
  frame: FrameInfo | null;
  reps: RepSpan[];
  pending: boolean;
  error?: string;
  onSubmit: (body: Record<string, unknown>) => Promise<unknown>;
}) {
  const [body, setBody] = useState("");
  // "auto" follows the rep at the player's frame; a chosen rep (or none) sticks until the comment is sent.
  const [repChoice, setRepChoice] = useState<string>("auto");
  const timeS = frame?.timeS ?? 0;
  const autoRep = frame?.repNumber ?? repAt(reps, timeS);
  const repNumber = repChoice === "auto" ? autoRep : repChoice === "none" ? null : Number(repChoice);

  async function submit(event: FormEvent) {
    event.preventDefault();
    if (!body.trim()) return;
    await onSubmit({ body, timeS, frameIndex: frame?.index ?? 0, repNumber });
    setBody("");
    setRepChoice("auto");
  }

  return (
    <form onSubmit={(event) => void submit(event).catch(() => undefined)} className="grid gap-2" data-testid="new-comment">
      <label htmlFor="new-comment-body" className="text-sm font-medium text-ink">
        Comment at{" "}
        <span className="nums" data-testid="new-comment-time">
          {formatClipTime(timeS)}
        </span>
        <span className="font-normal text-ink-muted"> · frame {(frame?.index ?? 0) + 1}</span>
      </label>
      <Textarea id="new-comment-body" value={body} onChange={(event) => setBody(event.target.value)} maxLength={4000} className="min-h-20" />
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-2 text-sm text-ink-muted">
          Rep
          <Select
            aria-label="Rep this comment is about"
            value={repChoice}
            onChange={(event) => setRepChoice(event.target.value)}
            className="w-auto"
            options={[
              { value: "auto", label: autoRep === null ? "None here" : `Rep ${autoRep} (here)` },
              { value: "none", label: "No rep" },
              ...reps.map((r) => ({ value: String(r.repIndex), label: `Rep ${r.repIndex}` })),
            ]}
          />
        </label>
        <Button type="submit" size="sm" disabled={pending || !body.trim()} className="ml-auto">
          {pending ? "Posting…" : "Post comment"}
        </Button>
      </div>
      <FormError message={error} />
    </form>
  );
}

function CommentItem({
  setId,
  comment,
  viewerId,
  canModerate,
  onSeek,
  onChanged,
}: {
  setId: string;
  comment: CommentViewData;
  viewerId: string;
  canModerate: boolean;
  onSeek: (timeS: number) => void;
  onChanged: () => void;
}) {
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(comment.body);
  const own = comment.authorId === viewerId;
  const save = useMutation({
    mutationFn: (body: string) => apiFetch(`/api/sets/${setId}/comments/${comment.id}`, { method: "PUT", body: { body }, schema: commentResponseSchema }),
    onSuccess: () => {
      setEditing(false);
      onChanged();
    },
  });
  const remove = useMutation({
    mutationFn: () => apiFetch(`/api/sets/${setId}/comments/${comment.id}`, { method: "DELETE" }),
    onSuccess: onChanged,
  });

  if (comment.deleted) return <p className="text-sm italic text-ink-faint">Comment deleted.</p>;
  return (
    <article className="grid gap-1 text-sm" data-testid="comment" data-comment-id={comment.id}>
      <header className="flex flex-wrap items-baseline gap-x-2 text-xs text-ink-muted">
        <span className="font-medium text-ink">{comment.authorName ?? "Former member"}</span>
        {comment.parentId === null ? (
          <button
            type="button"
            onClick={() => onSeek(comment.timeS)}
            data-testid="comment-seek"
            data-time-s={comment.timeS}
            className="nums rounded px-1 text-action underline-offset-2 hover:underline focus-visible:outline-2 focus-visible:outline-focus"
            aria-label={`Show the clip at ${formatClipTime(comment.timeS)}`}
          >
            {formatClipTime(comment.timeS)}
            {comment.repNumber ? ` · rep ${comment.repNumber}` : ""}
          </button>
        ) : null}
        {comment.edited ? <span>(edited)</span> : null}
      </header>
      {editing ? (
        <form
          className="grid gap-2"
          onSubmit={(event) => {
            event.preventDefault();
            save.mutate(draft);
          }}
        >
          <Textarea aria-label="Edit comment" value={draft} onChange={(event) => setDraft(event.target.value)} className="min-h-16" />
          <div className="flex gap-2">
            <Button type="submit" size="sm" disabled={save.isPending || !draft.trim()}>
              Save
            </Button>
            <Button type="button" size="sm" variant="quiet" onClick={() => setEditing(false)}>
              Cancel
            </Button>
          </div>
          <FormError message={messageOf(save.error)} />
        </form>
      ) : (
        <p className="whitespace-pre-wrap text-ink" data-testid="comment-body">
          {comment.body}
        </p>
      )}
      {(own || canModerate) && !editing ? (
        <div className="flex gap-1">
          {own ? (
            <Button type="button" size="sm" variant="quiet" onClick={() => setEditing(true)}>
              Edit
            </Button>
          ) : null}
          <Button type="button" size="sm" variant="quiet" disabled={remove.isPending} onClick={() => remove.mutate()}>
            Delete
          </Button>
        </div>
      ) : null}
      <FormError message={messageOf(remove.error)} />
    </article>
  );
}

function ReplyForm({ onReply }: { onReply: (body: string) => Promise<unknown> }) {
  const [open, setOpen] = useState(false);
  const [body, setBody] = useState("");
  const [error, setError] = useState<string>();
  if (!open) {
    return (
      <Button type="button" size="sm" variant="quiet" className="justify-self-start" onClick={() => setOpen(true)}>
        Reply
      </Button>
    );
  }
  return (
    <form
      className="grid gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        if (!body.trim()) return;
        onReply(body).then(
          () => {
            setBody("");
            setOpen(false);
            setError(undefined);
          },
          (e: unknown) => setError(messageOf(e)),
        );
      }}
    >
      <Textarea aria-label="Reply" value={body} onChange={(event) => setBody(event.target.value)} className="min-h-16" />
      <div className="flex gap-2">
        <Button type="submit" size="sm" disabled={!body.trim()}>
          Reply
        </Button>
        <Button type="button" size="sm" variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      <FormError message={error} />
    </form>
  );
}
