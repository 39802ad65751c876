// What the trends page hands its charts: one entry per analysed set, SI units, dates as epoch milliseconds.
export interface TrendPoint {
  setId: string;
  timeMs: number;
  loadKg: number;
  bestMeanVelocityMps: number | null;
  velocityLossPct: number | null;
  startTorsoAngleSpreadDeg: number | null;
  meanMaxHorizontalDeviationCm: number | null;
  minDepthMarginCm: number | null;
}
