// A row of radio buttons that looks like a switch between a few options (kg | lb). Native radios keep
// arrow-key movement and screen-reader announcements.
import { clsx } from "clsx";
import type { ComponentProps } from "react";

export function Segmented({
  legend,
  options,
  initialValue,
  className,
  ...radio
}: Omit<ComponentProps<"input">, "type" | "defaultChecked"> & {
  legend: string;
  options: { value: string; label: string }[];
  /** Checked in the server-rendered page, before the form library takes over. */
  initialValue?: string;
}) {
  return (
    <fieldset className={clsx("grid gap-1.5", className)}>
      <legend className="mb-1.5 text-sm font-medium text-ink">{legend}</legend>
      <div className="inline-flex w-fit rounded border border-line-strong bg-surface p-0.5">
        {options.map((option) => (
          <label
            key={option.value}
            className={clsx(
              "relative inline-flex min-h-10 min-w-14 cursor-pointer items-center justify-center rounded-sm px-4 text-sm font-medium text-ink-muted",
              "has-[:checked]:bg-action has-[:checked]:text-on-action",
              "has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-focus",
            )}
          >
            <input
              type="radio"
              value={option.value}
              defaultChecked={option.value === initialValue}
              className="sr-only"
              {...radio}
            />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
