// The drawing tools offered in the toolbar, by name.
import { arrowTool, rulerTool, verticalProtractorTool } from "./two-point";
import { noteTool } from "./note";
import { penTool } from "./pen";
import { protractorTool } from "./protractor";
import { ringTool } from "./ring";
import type { ToolDefinition } from "./types";

const TOOLS = {
  ruler: rulerTool,
  protractor: protractorTool,
  "protractor-vertical": verticalProtractorTool,
  arrow: arrowTool,
  ring: ringTool,
  pen: penTool,
  note: noteTool,
} as const;

export type DrawingToolName = keyof typeof TOOLS;
/** Drafts are opaque outside each tool, so callers hold every tool at the same type. */
export const DRAWING_TOOLS: Record<DrawingToolName, ToolDefinition<unknown>> = TOOLS;
export type ToolName = "select" | DrawingToolName;
