import type { InputHTMLAttributes, ReactNode } from "react";
import { forwardRef } from "react";

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: ReactNode;
}

/** A labelled input with its validation message (works with react-hook-form's register). */
export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field({ label, error, hint, id, ...props }, ref) {
  const inputId = id ?? props.name;
  return (
    <div>
      <label htmlFor={inputId} className="field-label">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${inputId}-error` : undefined}
        className="field-input"
        {...props}
      />
      {hint && !error && <p className="mt-1 text-xs text-ink-faint">{hint}</p>}
      {error && (
        <p id={`${inputId}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
});
