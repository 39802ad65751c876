"use client";
// What the player needs from the server: the set's analysis (reps, frame times, bar positions, scale),
// its clip (a short-lived URL and the frame size) and the full per-frame track (pose keypoints) from
// object storage. Without a track the player still steps (on the engine's frame times) and draws the trace.
import { useQuery } from "@tanstack/react-query";
import { useMemo } from "react";
import { apiFetch } from "@/lib/client/api";
import { playerAnalysisResponseSchema, playerClipResponseSchema, playerTrackSchema, type PlayerKeypoint } from "@/lib/player/responses";

async function fetchTrack(url: string) {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`the track could not be read (${response.status})`);
  return playerTrackSchema.parse(await response.json());
}

export function usePlayerData(setId: string) {
  const analysisQuery = useQuery({
    queryKey: ["sets", setId, "analysis"],
    queryFn: () => apiFetch(`/api/sets/${setId}/analysis`, { schema: playerAnalysisResponseSchema }),
    staleTime: Infinity,
  });
  const clipQuery = useQuery({
    queryKey: ["sets", setId, "clip"],
    queryFn: () => apiFetch(`/api/sets/${setId}/clip`, { schema: playerClipResponseSchema }),
    staleTime: 5 * 60_000,
  });
  const trackUrl = analysisQuery.data?.trackUrl ?? null;
  const trackQuery = useQuery({
    queryKey: ["sets", setId, "track", analysisQuery.data?.analysis.id],
    queryFn: () => fetchTrack(trackUrl as string),
    enabled: trackUrl !== null,
    staleTime: Infinity,
    retry: 1,
  });

  const analysis = analysisQuery.data?.analysis ?? null;
  /** The engine's smoothed bar positions, for the trace and the speed read-out. */
  const barFrames = useMemo(() => analysis?.frames ?? [], [analysis]);
  const barTimes = useMemo(() => barFrames.map((f) => f.t), [barFrames]);
  // The track holds every analysed frame with the decoder's exact timestamp: those are the frames the
  // player steps through. Without a stored track, the engine's frame times stand in.
  const trackFailed = trackQuery.isError;
  const track = trackQuery.data ?? null;
  const timestamps = useMemo(() => (track ? track.frames.map((f) => f.t) : trackUrl && !trackFailed ? [] : barTimes), [track, trackUrl, trackFailed, barTimes]);
  const keypointsByFrame = useMemo((): PlayerKeypoint[][] | null => (track ? track.frames.map((f) => f.keypoints) : null), [track]);

  return {
    analysis,
    clip: clipQuery.data?.clip ?? null,
    barFrames,
    barTimes,
    timestamps,
    keypointsByFrame,
    trackFailed,
    /** Read URLs are short-lived; a long session asks for a fresh one when the video stops loading. */
    refreshClip: () => void clipQuery.refetch(),
    loading: analysisQuery.isPending || clipQuery.isPending || (trackUrl !== null && trackQuery.isPending),
    error: analysisQuery.error ?? clipQuery.error,
  };
}
