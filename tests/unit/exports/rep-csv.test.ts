// The rep CSV parsed back with csv-parse: headers carry units, awkward text survives quoting, pounds and
// inches convert from the stored SI values.
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { exportFileName, repMeasuresCsv, type CsvRep } from "@/lib/exports/rep-csv";

const rep: CsvRep = {
  athleteName: 'Noor "The Anvil" Halvorsen, jr.',
  teamName: "Ironbark Barbell Club",
  sessionDate: "2026-11-03",
  recordedAt: new Date("2026-11-03T17:30:00Z"),
  setId: "7b0c3e8e-1f00-4c1e-9f3a-6c3c2c1d0a01",
  lift: "squat",
  variant: "low bar\nbelt",
  loadKg: 100,
  rpe: 8.5,
  flagCodes: ["bar-drift", "shallow-depth"],
  rep: {
    repIndex: 1,
    romM: 0.6,
    meanConcentricVelocityMps: 0.51234,
    peakConcentricVelocityMps: 0.9,
    meanPropulsiveVelocityMps: null,
    concentricDurationS: 1.2,
    eccentricDurationS: 1.5,
    pauseDurationS: null,
    stickingPointHeightM: 0.254,
    maxHorizontalDeviationCm: 5.08,
    netHorizontalDriftCm: -2.54,
    pathLengthM: 1.3,
    kneeAngleAtBottomDeg: 70.04,
    hipAngleAtBottomDeg: 60,
    torsoAngleAtStartDeg: 30,
    torsoAngleAtBottomDeg: 45,
    depthMarginCm: 2,
    depthReached: true,
    barOverMidFootOffsetCm: null,
    kneeProjectionAngleDeg: null,
  },
};

describe("repMeasuresCsv", () => {
  it("round-trips through csv-parse in metric units", () => {
    const records = parse(repMeasuresCsv([rep], { mass: "kg", length: "metric" }), { columns: true }) as Record<string, string>[];
    expect(records).toHaveLength(1);
    const row = records[0];
    expect(row.athlete).toBe('Noor "The Anvil" Halvorsen, jr.');
    expect(row.variant).toBe("low bar\nbelt");
    expect(row.load_kg).toBe("100");
    expect(row.mean_concentric_velocity_mps).toBe("0.512");
    expect(row.mean_propulsive_velocity_mps).toBe("");
    expect(row.range_of_motion_cm).toBe("60");
    expect(row.max_horizontal_deviation_cm).toBe("5.08");
    expect(row.depth_reached).toBe("yes");
    expect(row.flags).toBe("bar-drift shallow-depth");
    expect(row.recorded_at_utc).toBe("2026-11-03T17:30:00.000Z");
  });

  it("writes pounds and inches with the unit in the header", () => {
    const records = parse(repMeasuresCsv([rep], { mass: "lb", length: "imperial" }), { columns: true }) as Record<string, string>[];
    const row = records[0];
    // 1 lb = 0.45359237 kg exactly (International Yard and Pound Agreement, 1959): 100 kg = 220.462 lb.
    expect(row.load_lb).toBe("220.46");
    // 1 in = 2.54 cm exactly (same agreement).
    expect(row.max_horizontal_deviation_in).toBe("2");
    expect(row.net_horizontal_drift_in).toBe("-1");
    expect(row.sticking_point_height_in).toBe("10");
    expect(row.load_kg).toBeUndefined();
  });

  it("writes only the header for no reps", () => {
    const rows = parse(repMeasuresCsv([], { mass: "kg", length: "metric" })) as string[][];
    expect(rows).toHaveLength(1);
    expect(rows[0]).toContain("mean_concentric_velocity_mps");
  });
});

describe("exportFileName", () => {
  it("keeps only safe characters", () => {
    expect(exportFileName(["plumbline-reps", 'Noor "x"/..\\', "squat"])).toBe("plumbline-reps_Noor-x-.._squat.csv");
    expect(exportFileName([""])).toBe("reps.csv");
  });
});
