// Form fields: a label with its error beside it, an optional hint, and inputs wired for screen readers.
import { clsx } from "clsx";
import { useId, type ComponentProps, type ReactNode } from "react";

export interface FieldControlProps {
  id: string;
  "aria-invalid": boolean | undefined;
  "aria-describedby": string | undefined;
}

export interface FieldProps {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  optional?: boolean;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
}

export function Field({ label, error, hint, optional, className, children }: FieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const describedBy = [error ? errorId : null, hint ? hintId : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={clsx("grid gap-1.5", className)}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
          {optional ? <span className="ml-1.5 font-normal text-ink-faint">optional</span> : null}
        </label>
        {error ? (
          <p id={errorId} className="text-sm font-medium text-fault">
            {error}
          </p>
        ) : null}
      </div>
      {children({ id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy })}
      {hint ? (
        <p id={hintId} className="text-xs text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

const controlClasses =
  "w-full rounded border border-line-strong bg-surface px-3 text-base text-ink sm:text-sm " +
  "placeholder:text-ink-faint aria-invalid:border-fault disabled:opacity-60";

export function Input({ className, suffix, ...props }: ComponentProps<"input"> & { suffix?: ReactNode }) {
  if (!suffix) return <input className={clsx(controlClasses, "h-11 sm:h-10", className)} {...props} />;
  return (
    <div className="flex">
      <input className={clsx(controlClasses, "h-11 rounded-r-none sm:h-10", className)} {...props} />
      <span className="inline-flex items-center rounded-r border border-l-0 border-line-strong bg-sunken px-3 text-sm text-ink-muted">
        {suffix}
      </span>
    </div>
  );
}

export function Textarea({ className, ...props }: ComponentProps<"textarea">) {
  return <textarea className={clsx(controlClasses, "min-h-24 py-2", className)} {...props} />;
}

export interface SelectOption {
  value: string;
  label: string;
}

export function Select({ className, options, ...props }: ComponentProps<"select"> & { options: SelectOption[] }) {
  return (
    <select className={clsx(controlClasses, "h-11 sm:h-10", className)} {...props}>
      {options.map((option) => (
        <option key={option.value} value={option.value}>
          {option.label}
        </option>
      ))}
    </select>
  );
}

type TextFieldProps = ComponentProps<"input"> & Omit<FieldProps, "children" | "className"> & { suffix?: ReactNode };

/** A labelled text input: spread react-hook-form's `register(...)` into it. */
export function TextField({ label, error, hint, optional, className, ...input }: TextFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} optional={optional} className={className}>
      {(control) => <Input {...input} {...control} />}
    </Field>
  );
}

type SelectFieldProps = ComponentProps<"select"> & Omit<FieldProps, "children" | "className"> & { options: SelectOption[] };

export function SelectField({ label, error, hint, optional, className, ...select }: SelectFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} optional={optional} className={className}>
      {(control) => <Select {...select} {...control} />}
    </Field>
  );
}

/** A form-level message (an error that belongs to no single field). */
export function FormError({ message }: { message?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded border border-fault-line bg-fault-soft px-3 py-2 text-sm text-ink">
      {message}
    </p>
  );
}
