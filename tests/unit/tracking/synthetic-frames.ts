// Builds in-memory frames of the synthetic plate scene for tracker tests that need no video codec.
import type { RgbaFrame } from "@/lib/tracking";
import { createRenderer } from "@/tests/fixtures/clips/scene";

export interface PlateShot {
  x: number;
  y: number;
  radiusPx: number;
  gain?: number;
  occluder?: { centreX: number; halfWidthPx: number } | null;
}

/** Returns a function that renders one sharp frame (a fresh buffer) per call. */
export function plateCamera(width: number, height: number, seed = 7, noiseSigma = 3) {
  const renderer = createRenderer(width, height, seed, noiseSigma);
  let shots = 0;
  return (shot: PlateShot): RgbaFrame => ({
    width,
    height,
    data: renderer
      .render({
        centres: [{ x: shot.x, y: shot.y }],
        radiusPx: shot.radiusPx,
        gain: shot.gain ?? 1,
        occluder: shot.occluder ?? null,
        noiseSeed: shots++,
      })
      .slice(),
  });
}
