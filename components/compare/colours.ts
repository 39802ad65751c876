// Stroke colours per compared rep, from the design tokens; the reference rep is drawn dashed.
export const REP_STROKES = [
  "var(--pl-ink-faint)",
  "var(--pl-speed-5)",
  "var(--pl-speed-8)",
  "var(--pl-speed-3)",
  "var(--pl-ink)",
  "var(--pl-speed-6)",
] as const;

export const repStroke = (index: number): string => REP_STROKES[index % REP_STROKES.length];
export const repDash = (index: number): string | undefined => (index === 0 ? "6 4" : undefined);
