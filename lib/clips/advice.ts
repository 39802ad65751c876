// The trade's filming advice, checked before a clip is uploaded. Each piece is a warning, never a refusal:
// the athlete knows their set; the check only says what would make the measures weaker.

export interface FilmingWarning {
  code: "load-below-working" | "load-above-working" | "few-reps" | "portrait" | "short-clip";
  message: string;
  /** Where the rule comes from. */
  source: string;
}

/** Working loads for technique and bar-speed review: roughly 75–95 % of one-rep max (common practice). */
export const WORKING_LOAD_PCT = { min: 75, max: 95 } as const;
/** Fewer reps than this give too little to compare rep to rep (common practice). */
export const MIN_REPS_FOR_REVIEW = 2;
/** Clips shorter than this rarely hold a whole rep with its set-up (common practice). */
export const MIN_CLIP_DURATION_S = 3;

export interface FilmingFacts {
  loadKg: number | null;
  oneRepMaxKg: number | null;
  reps: number | null;
  clip: { widthPx: number; heightPx: number; durationS: number } | null;
}

function loadWarning(loadKg: number | null, oneRepMaxKg: number | null): FilmingWarning | null {
  if (loadKg === null || oneRepMaxKg === null || oneRepMaxKg <= 0) return null;
  const pct = (100 * loadKg) / oneRepMaxKg;
  const source = "Working load 75–95 % of 1RM: common practice";
  if (pct < WORKING_LOAD_PCT.min) {
    return {
      code: "load-below-working",
      message: `This load is ${Math.round(pct)} % of your one-rep max in the profile, below a working load (75–95 %). Bar speed at light loads says little about the heavy sets.`,
      source,
    };
  }
  if (pct > WORKING_LOAD_PCT.max) {
    return {
      code: "load-above-working",
      message: `This load is ${Math.round(pct)} % of your one-rep max in the profile, above a working load (75–95 %). Check the load, or update your one-rep max.`,
      source,
    };
  }
  return null;
}

/** Warnings for a set about to be filed; an empty list when nothing stands out. */
export function filmingWarnings(facts: FilmingFacts): FilmingWarning[] {
  const warnings: FilmingWarning[] = [];
  const load = loadWarning(facts.loadKg, facts.oneRepMaxKg);
  if (load) warnings.push(load);
  if (facts.reps !== null && facts.reps < MIN_REPS_FOR_REVIEW) {
    warnings.push({
      code: "few-reps",
      message: "A single rep gives nothing to compare: film several reps when you can.",
      source: "common practice",
    });
  }
  if (facts.clip && facts.clip.heightPx > facts.clip.widthPx) {
    warnings.push({
      code: "portrait",
      message: "The clip is upright (portrait). Landscape is best; at least keep the whole body and the bar in frame.",
      source: "common practice",
    });
  }
  if (facts.clip && facts.clip.durationS < MIN_CLIP_DURATION_S) {
    warnings.push({
      code: "short-clip",
      message: `The clip is only ${facts.clip.durationS.toFixed(1)} s long: it may not hold a whole rep.`,
      source: "common practice",
    });
  }
  return warnings;
}

/** Standing advice shown beside the clip picker. */
export const FILMING_ADVICE = [
  "Phone still: on a tripod or a bench, not in a hand.",
  "The whole body and both ends of the bar in frame, from set-up to rack.",
  "Side view at about hip height for bar path and angles; front view for knees and stance.",
  "Several reps at a working load.",
] as const;
