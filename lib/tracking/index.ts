// Public surface of the bar tracker: what the analysis worker and the command line import.
export { createBarTracker, type BarSample, type BarTracker, type BarTrackerOptions } from "./bar-tracker";
export { suggestPlateCircle, type PlateCircle, type PlateCircleOptions } from "./plate-circle";
export { FrameInputError, type RgbaFrame } from "./frame";
export type { PixelRect } from "./pyramid";
