// Note: a tap places the note; the text is asked for next (the geometry comes back with empty text, which
// the editor fills in before anything is saved — the server refuses an empty note).
import type { Point } from "../geometry";
import type { ToolDefinition } from "./types";

interface NoteDraft {
  at: Point;
}

export const noteTool: ToolDefinition<NoteDraft> = {
  kind: "note",
  begin: (p) => ({ at: p }),
  drag: (_draft, p) => ({ at: p }),
  release: (draft) => ({ type: "commit", geometry: { kind: "note", at: draft.at, text: "" } }),
  tap: (draft) => ({ type: "commit", geometry: { kind: "note", at: draft.at, text: "" } }),
  hover: (draft) => draft,
  place: () => ({ type: "cancel" }),
  preview: () => null,
};
