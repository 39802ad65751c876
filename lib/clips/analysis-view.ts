// Which camera view the analysis engine reads a set's clip as: a 45° clip is read as a side view
// (angles and horizontal distances come out foreshortened; the page says so).
import type { CameraView as SetCameraView } from "@/lib/validation/common";

export type EngineView = "side" | "front";

export function engineViewFor(view: SetCameraView): EngineView {
  return view === "front" ? "front" : "side";
}

export const OBLIQUE_CAUTION =
  "Filmed at 45°: joint angles and horizontal bar distances are foreshortened by the camera angle and read smaller than they are.";
