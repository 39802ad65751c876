"use client";
// Asks for a note's text where it was placed; Enter saves, Escape drops it.
import { useState } from "react";
import { MAX_NOTE_CHARS } from "@/lib/validation/markup";

export function NoteEditor({ onSave, onCancel }: { onSave: (text: string) => void; onCancel: () => void }) {
  const [text, setText] = useState("");
  return (
    <form
      className="flex items-center gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        if (text.trim()) onSave(text.trim());
      }}
    >
      <label className="sr-only" htmlFor="markup-note-text">
        Note text
      </label>
      <input
        id="markup-note-text"
        autoFocus
        value={text}
        maxLength={MAX_NOTE_CHARS}
        onChange={(event) => setText(event.target.value)}
        onKeyDown={(event) => {
          if (event.key === "Escape") onCancel();
        }}
        placeholder="Write the note, then Enter"
        className="h-8 min-w-0 flex-1 rounded border border-line-strong bg-surface px-2 text-sm text-ink"
      />
      <button type="submit" className="h-8 rounded bg-action px-3 text-sm font-medium text-on-action">
        Add note
      </button>
      <button type="button" className="h-8 rounded px-2 text-sm text-action hover:bg-action-soft" onClick={onCancel}>
        Cancel
      </button>
    </form>
  );
}
