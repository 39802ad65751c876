// Markup colours and strokes: each colour is a design token (a CSS variable from tailwind.config.ts),
// resolved to a value only when the canvas paints; strokes are screen pixels, so they stay crisp at any zoom.
import type { MarkupColour, MarkupStroke } from "@/lib/validation/markup";

export const COLOUR_TOKENS: Record<MarkupColour, string> = {
  action: "action",
  caution: "caution",
  fault: "fault",
  eccentric: "phase-eccentric",
  ink: "ink",
  surface: "surface",
};

/** Tailwind classes for the swatches in the toolbar (the same tokens). */
export const COLOUR_SWATCHES: Record<MarkupColour, { className: string; label: string }> = {
  action: { className: "bg-action", label: "Teal" },
  caution: { className: "bg-caution", label: "Amber" },
  fault: { className: "bg-fault", label: "Brick" },
  eccentric: { className: "bg-phase-eccentric", label: "Slate" },
  ink: { className: "bg-ink", label: "Iron" },
  surface: { className: "bg-surface", label: "Chalk" },
};

export const STROKE_SCREEN_PX: Record<MarkupStroke, number> = { fine: 2, medium: 3.5, heavy: 6 };

/** Resolves a token to a colour the canvas can paint with. */
export function tokenColour(token: string): string {
  if (typeof document === "undefined") return "";
  return getComputedStyle(document.documentElement).getPropertyValue(`--pl-${token}`).trim();
}

export type Palette = Record<MarkupColour | "phase-concentric" | "phase-pause" | "ink-faint" | "canvas", string>;

export function readPalette(): Palette {
  const colours = Object.fromEntries(Object.entries(COLOUR_TOKENS).map(([name, token]) => [name, tokenColour(token)]));
  return {
    ...(colours as Record<MarkupColour, string>),
    "phase-concentric": tokenColour("phase-concentric"),
    "phase-pause": tokenColour("phase-pause"),
    "ink-faint": tokenColour("ink-faint"),
    canvas: tokenColour("canvas"),
  };
}
