"use client";
// The new-set form: lift, variant, load and unit, reps, RPE, camera view, note, team and the clip. Saves
// the set, uploads the clip straight to storage with progress, then opens the set for analysis. A failed
// upload keeps the saved set and resumes on retry; the clip is only attached once storage checked it.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useId, useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch, applyApiError } from "@/lib/client/api";
import { createdSetSchema } from "@/lib/client/clip-responses";
import { uploadClip, type UploadProgress } from "@/lib/client/clip-upload";
import {
  CAMERA_VIEW_LABELS,
  LIFT_LABELS,
  SET_FORM_FIELDS,
  VARIANT_SUGGESTIONS,
  athleteChoice,
  defaultSetFormValues,
  setFormSchema,
  type SetFormValues,
} from "@/lib/client/set-form";
import { massToKg, parseDecimal } from "@/lib/client/units";
import { filmingWarnings } from "@/lib/clips/advice";
import { formatMegabytes } from "@/lib/clips/limits";
import type { Lift, UnitPreference } from "@/lib/validation/common";
import type { CreateSetData } from "@/lib/validation/set";
import { Button } from "@/components/ui/button";
import { Field, FormError, SelectField, TextField, Textarea } from "@/components/ui/field";
import { Segmented } from "@/components/ui/segmented";
import { ClipPicker, type PickedClip } from "./clip-picker";
import { FilmingAdvice, FilmingWarnings } from "./filming-warnings";
import { ProgressBar } from "./upload-progress";

/** An athlete of a team the viewer coaches, who the viewer may record a set for. */
export interface CoachedAthlete {
  teamId: string;
  teamName: string;
  userId: string;
  name: string;
  oneRepMaxesKg: Partial<Record<Lift, number>>;
}

export interface NewSetFormProps {
  teams: { id: string; name: string }[];
  /** Empty unless the viewer coaches: then the form asks whose set it is. */
  athletes: CoachedAthlete[];
  unit: UnitPreference;
  oneRepMaxesKg: Partial<Record<Lift, number>>;
}

type Stage = { kind: "editing" } | { kind: "saving" } | { kind: "uploading"; progress: UploadProgress } | { kind: "failed"; message: string };

export function NewSetForm({ teams, athletes, unit, oneRepMaxesKg }: NewSetFormProps) {
  const router = useRouter();
  const variantListId = useId();
  const [clip, setClip] = useState<PickedClip | null>(null);
  const [clipError, setClipError] = useState<string>();
  const [formError, setFormError] = useState<string>();
  const [stage, setStage] = useState<Stage>({ kind: "editing" });
  // The set saved by a first attempt: a retry uploads into it instead of filing the set twice.
  const [savedSetId, setSavedSetId] = useState<string | null>(null);
  const form = useForm<SetFormValues, unknown, CreateSetData>({
    resolver: zodResolver(setFormSchema),
    defaultValues: defaultSetFormValues(unit, teams[0]?.id ?? null),
  });
  const { errors } = form.formState;
  const [lift, load, chosenUnit, reps, athlete] = form.watch(["lift", "load", "unit", "reps", "athlete"]);
  const forAthlete = athletes.find((a) => athleteChoice(a.teamId, a.userId) === athlete) ?? null;
  const maxesKg = forAthlete ? forAthlete.oneRepMaxesKg : oneRepMaxesKg;

  const warnings = useMemo(() => {
    const typedLoad = parseDecimal(load);
    const typedReps = parseDecimal(reps);
    return filmingWarnings({
      loadKg: typedLoad === null || Number.isNaN(typedLoad) ? null : massToKg(typedLoad, chosenUnit),
      oneRepMaxKg: maxesKg[lift] ?? null,
      reps: typedReps === null || Number.isNaN(typedReps) ? null : typedReps,
      clip:
        clip?.facts.widthPx && clip.facts.heightPx && clip.facts.durationS !== null
          ? { widthPx: clip.facts.widthPx, heightPx: clip.facts.heightPx, durationS: clip.facts.durationS }
          : null,
    });
  }, [lift, load, chosenUnit, reps, clip, maxesKg]);

  const busy = stage.kind === "saving" || stage.kind === "uploading";

  const retry = () => {
    if (savedSetId && clip) void upload(savedSetId, clip);
  };

  const upload = async (setId: string, picked: PickedClip) => {
    setStage({ kind: "uploading", progress: { sentBytes: 0, totalBytes: picked.file.size } });
    try {
      await uploadClip({ setId, file: picked.file, onProgress: (progress) => setStage({ kind: "uploading", progress }) });
      router.push(`/app/sets/${setId}`);
    } catch (error) {
      setStage({ kind: "failed", message: error instanceof Error ? error.message : "The upload failed." });
    }
  };

  const onSubmit = form.handleSubmit(async (data) => {
    setFormError(undefined);
    if (!clip) {
      setClipError("Choose a clip or record one.");
      return;
    }
    setClipError(undefined);
    setStage({ kind: "saving" });
    try {
      const { set } = await apiFetch("/api/sets", { method: "POST", body: data, schema: createdSetSchema });
      setSavedSetId(set.id);
      await upload(set.id, clip);
    } catch (error) {
      setStage({ kind: "editing" });
      applyApiError(error, form.setError, SET_FORM_FIELDS, setFormError);
    }
  });

  const teamOptions = [...teams.map((t) => ({ value: t.id, label: t.name })), { value: "", label: "No team (only you see it)" }];
  const athleteOptions = [
    { value: "", label: "Me" },
    ...athletes.map((a) => ({ value: athleteChoice(a.teamId, a.userId), label: `${a.name} (${a.teamName})` })),
  ];

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-6">
      <FormError message={formError} />
      {/* Once the set is saved its details are fixed; only the clip upload can be retried. */}
      <fieldset disabled={busy || savedSetId !== null} className="grid gap-6">
        {athletes.length > 0 ? (
          <SelectField
            label="Athlete"
            hint="Whose set this is: yours, or one of your team's athletes (it is filed under their team)."
            options={athleteOptions}
            error={errors.athlete?.message}
            {...form.register("athlete")}
          />
        ) : null}
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField
            label="Lift"
            options={Object.entries(LIFT_LABELS).map(([value, label]) => ({ value, label }))}
            error={errors.lift?.message}
            {...form.register("lift")}
          />
          <TextField
            label="Variant"
            optional
            list={variantListId}
            placeholder="e.g. low bar, sumo, paused"
            error={errors.variant?.message}
            {...form.register("variant")}
          />
          <datalist id={variantListId}>
            {VARIANT_SUGGESTIONS[lift].map((v) => (
              <option key={v} value={v} />
            ))}
          </datalist>
        </div>
        <div className="grid items-end gap-4 sm:grid-cols-[1fr_auto]">
          <TextField label="Load" inputMode="decimal" suffix={chosenUnit} error={errors.load?.message} {...form.register("load")} />
          <Segmented
            legend="Unit"
            options={[
              { value: "kg", label: "kg" },
              { value: "lb", label: "lb" },
            ]}
            initialValue={unit}
            {...form.register("unit")}
          />
        </div>
        <div className="grid gap-4 sm:grid-cols-3">
          <TextField label="Reps" inputMode="numeric" error={errors.reps?.message} {...form.register("reps")} />
          <TextField label="RPE" optional inputMode="decimal" placeholder="1–10" error={errors.rpe?.message} {...form.register("rpe")} />
          <TextField label="Date" type="date" error={errors.sessionDate?.message} {...form.register("sessionDate")} />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Segmented
            legend="Camera view"
            options={Object.entries(CAMERA_VIEW_LABELS).map(([value, label]) => ({ value, label }))}
            initialValue="side"
            {...form.register("cameraView")}
          />
          {forAthlete ? null : <SelectField label="Team" options={teamOptions} error={errors.teamId?.message} {...form.register("teamId")} />}
        </div>
        <Field label="Note" optional error={errors.note?.message}>
          {(control) => <Textarea {...control} {...form.register("note")} />}
        </Field>
      </fieldset>
      <div className="grid gap-3 rounded-lg border border-line bg-surface p-4">
        <ClipPicker value={clip} onChange={setClip} error={clipError} disabled={busy} />
        <FilmingAdvice />
      </div>
      <FilmingWarnings warnings={warnings} />
      {stage.kind === "uploading" ? (
        <ProgressBar
          label="Uploading the clip"
          fraction={stage.progress.totalBytes > 0 ? stage.progress.sentBytes / stage.progress.totalBytes : null}
          detail={`${formatMegabytes(stage.progress.sentBytes)} of ${formatMegabytes(stage.progress.totalBytes)}`}
        />
      ) : null}
      {stage.kind === "failed" ? (
        <p role="alert" className="rounded border border-fault-line bg-fault-soft px-3 py-2 text-sm text-ink">
          {stage.message} The set is saved without its clip; retry to finish the upload.
        </p>
      ) : null}
      <div className="sticky bottom-[calc(var(--app-bottom-nav,0px)+0.75rem)] sm:static">
        {savedSetId && stage.kind === "failed" ? (
          <Button size="lg" block className="sm:w-auto" onClick={retry}>
            Retry the upload
          </Button>
        ) : (
          <Button type="submit" size="lg" block className="sm:w-auto" pending={busy} disabled={savedSetId !== null}>
            Save and upload
          </Button>
        )}
      </div>
    </form>
  );
}
