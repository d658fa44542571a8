"use client";

import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";
import { cx } from "./cx";

const control =
  "block w-full min-h-tap rounded-xl border-2 bg-surface-raised px-3 text-body text-fg placeholder:text-fg-faint " +
  "focus:border-tide-600 dark:focus:border-tide-300 disabled:opacity-60";

export interface FieldProps {
  label: ReactNode;
  /** Id of the control inside; Field wires the label, hint and error to it. */
  htmlFor: string;
  hint?: ReactNode;
  error?: ReactNode;
  className?: string;
  children: ReactNode;
}

/** Label above, control, then hint or error text. Use Input/Select/Textarea unless you need a custom control. */
export function Field({ label, htmlFor, hint, error, className, children }: FieldProps) {
  return (
    <div className={cx("flex flex-col gap-1.5", className)}>
      <label htmlFor={htmlFor} className="text-body font-medium text-fg">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${htmlFor}-error`} className="text-caption font-medium text-verdict-leak dark:text-flare-300">
          {error}
        </p>
      ) : hint ? (
        <p id={`${htmlFor}-hint`} className="text-caption text-fg-soft">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

interface Common {
  label: ReactNode;
  hint?: ReactNode;
  error?: ReactNode;
  /** Class for the wrapper (the control keeps its own look). */
  className?: string;
}

function useFieldIds(id: string | undefined, hint: ReactNode, error: ReactNode) {
  const auto = useId();
  const fid = id ?? auto;
  const describedBy = error ? `${fid}-error` : hint ? `${fid}-hint` : undefined;
  return { fid, describedBy };
}

export type InputProps = Common & Omit<InputHTMLAttributes<HTMLInputElement>, "className">;

/** A labelled text input; `error` turns the border red and is announced with the field. */
export function Input({ label, hint, error, className, id, ...rest }: InputProps) {
  const { fid, describedBy } = useFieldIds(id, hint, error);
  return (
    <Field label={label} htmlFor={fid} hint={hint} error={error} className={className}>
      <input
        id={fid}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cx(control, error ? "border-verdict-leak" : "border-fg-faint")}
        {...rest}
      />
    </Field>
  );
}

export type SelectProps = Common & Omit<SelectHTMLAttributes<HTMLSelectElement>, "className"> & {
  options?: ReadonlyArray<{ value: string; label: string }>;
};

/** A labelled select; pass `options` or <option> children. */
export function Select({ label, hint, error, className, id, options, children, ...rest }: SelectProps) {
  const { fid, describedBy } = useFieldIds(id, hint, error);
  return (
    <Field label={label} htmlFor={fid} hint={hint} error={error} className={className}>
      <select
        id={fid}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cx(control, "pr-8", error ? "border-verdict-leak" : "border-fg-faint")}
        {...rest}
      >
        {options?.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
        {children}
      </select>
    </Field>
  );
}

export type TextareaProps = Common & Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "className">;

export function Textarea({ label, hint, error, className, id, rows = 4, ...rest }: TextareaProps) {
  const { fid, describedBy } = useFieldIds(id, hint, error);
  return (
    <Field label={label} htmlFor={fid} hint={hint} error={error} className={className}>
      <textarea
        id={fid}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cx(control, "py-2", error ? "border-verdict-leak" : "border-fg-faint")}
        {...rest}
      />
    </Field>
  );
}
