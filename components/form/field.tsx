import type { InputHTMLAttributes, ReactNode } from "react";

/** Labelled input with its unit and an inline error that names the field. */
export function Field({
  label,
  unit,
  error,
  hint,
  id,
  inputClassName = "w-full py-1.5",
  ...input
}: InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  unit?: ReactNode;
  error?: string;
  hint?: string;
  id: string;
  /** Width and padding of the input (default full width); compact tables pass e.g. "w-24 py-1 text-right". */
  inputClassName?: string;
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-muted">
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
          className={`${inputClassName} rounded border bg-surface px-2 text-sm text-ink outline-none focus:border-accent ${error ? "border-danger" : "border-line"}`}
          {...input}
        />
        {unit ? <span className="min-w-10 text-xs text-muted">{unit}</span> : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs text-danger">
          ⚠ {error}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-xs text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
