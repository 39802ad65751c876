// Phase-aligned playback for rep compare: each clip's time is mapped piecewise-linearly between its rep's
// start, bottom and lockout, so two reps of different speed reach the bottom and the lockout together.
// Pure functions: the player component calls them on every frame of the leading clip.

/** A rep's key instants on its clip's clock, in seconds. bottomS is null when the rep has no distinct bottom. */
export interface RepEvents {
  startS: number;
  bottomS: number | null;
  lockoutS: number;
}

/** The rep's anchor times in order, keeping the bottom only when it lies strictly inside the rep. */
function anchors(events: RepEvents): number[] {
  if (!(events.lockoutS > events.startS)) throw new RangeError("a rep must end after it starts");
  const { bottomS } = events;
  if (bottomS !== null && bottomS > events.startS && bottomS < events.lockoutS) return [events.startS, bottomS, events.lockoutS];
  return [events.startS, events.lockoutS];
}

/**
 * Where a clip time falls in the rep as a phase from 0 (start) to 1 (lockout), with the bottom at 0.5 when
 * it is known. Times before the start or after the lockout are clamped to 0 or 1.
 */
export function phaseAt(events: RepEvents, timeS: number): number {
  const a = anchors(events);
  if (timeS <= a[0]) return 0;
  if (timeS >= a[a.length - 1]) return 1;
  const segments = a.length - 1;
  for (let k = 0; k < segments; k++) {
    if (timeS <= a[k + 1]) return (k + (timeS - a[k]) / (a[k + 1] - a[k])) / segments;
  }
  return 1;
}

/** The clip time at a phase (inverse of phaseAt inside the rep). */
export function timeAtPhase(events: RepEvents, phase: number): number {
  const a = anchors(events);
  const segments = a.length - 1;
  const u = Math.min(1, Math.max(0, phase)) * segments;
  const k = Math.min(segments - 1, Math.floor(u));
  return a[k] + (u - k) * (a[k + 1] - a[k]);
}

/**
 * The time in the other clip that matches `timeS` in the leading one. Inside the rep the phases match;
 * before the start and after the lockout both clips run at plain speed from the matching anchor, so the
 * lead-in and the walk-out still play. Phases only line up when both reps have, or both lack, a bottom.
 */
export function syncedTime(lead: RepEvents, follow: RepEvents, timeS: number): number {
  if (timeS < lead.startS) return follow.startS + (timeS - lead.startS);
  if (timeS > lead.lockoutS) return follow.lockoutS + (timeS - lead.lockoutS);
  const leadHasBottom = anchors(lead).length === 3;
  const followHasBottom = anchors(follow).length === 3;
  if (leadHasBottom === followHasBottom) return timeAtPhase(follow, phaseAt(lead, timeS));
  // One rep has no bottom: align start and lockout only, by share of the rep's duration.
  const share = (timeS - lead.startS) / (lead.lockoutS - lead.startS);
  return follow.startS + share * (follow.lockoutS - follow.startS);
}

/** Percent of rep time (the axis of the stored 101-point series) at a clip time, clamped to 0..100. */
export function repPercentAt(events: RepEvents, timeS: number): number {
  const share = (timeS - events.startS) / (events.lockoutS - events.startS);
  return 100 * Math.min(1, Math.max(0, share));
}
