// Zoom and pan of the player: a zoom factor (1 = whole clip) and an offset in screen pixels, kept so the
// clip always covers the viewport (no empty margins when panning a zoomed clip).
export interface View {
  zoom: number;
  panX: number;
  panY: number;
}

export const MIN_ZOOM = 1;
export const MAX_ZOOM = 8;
export const FIT: View = { zoom: 1, panX: 0, panY: 0 };

export function clampView(view: View, widthPx: number, heightPx: number): View {
  const zoom = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, view.zoom));
  const clamp = (pan: number, size: number) => Math.min(0, Math.max(size - size * zoom, pan));
  return { zoom, panX: clamp(view.panX, widthPx), panY: clamp(view.panY, heightPx) };
}

/** Zooms by `factor` keeping the point under `at` (screen pixels in the viewport) where it is. */
export function zoomAt(view: View, at: { x: number; y: number }, factor: number, widthPx: number, heightPx: number): View {
  const zoom = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, view.zoom * factor));
  const ratio = zoom / view.zoom;
  return clampView({ zoom, panX: at.x - (at.x - view.panX) * ratio, panY: at.y - (at.y - view.panY) * ratio }, widthPx, heightPx);
}
