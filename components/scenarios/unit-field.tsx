"use client";
import { useState } from "react";
import { Controller, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import type { UnitSystem } from "@/lib/domain";
import { quantity, toSi, unitLabel, type QuantityKind } from "@/lib/format/quantities";

/**
 * A number input bound to an SI value in the form, shown and typed in the
 * basin's unit (e.g. °F or cfs in a US-customary basin). Blank → null when
 * `nullable`, so the schema can say what a missing value means.
 */
export function UnitField<T extends FieldValues>({
  control,
  name,
  label,
  kind,
  system,
  nullable = false,
  hint,
  plainUnit,
  compact = false,
  placeholder,
  alignBottom = false,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  /** A converted quantity; omit for values that have one unit everywhere (give plainUnit). */
  kind?: QuantityKind;
  system: UnitSystem;
  nullable?: boolean;
  hint?: string;
  plainUnit?: string;
  /** In a table cell: the label is for screen readers only and the input is narrow. */
  compact?: boolean;
  placeholder?: string;
  /**
   * In a row of fields whose labels may wrap: the field fills its cell's height and the
   * label sits just above the input, so inputs line up however many lines a label takes.
   */
  alignBottom?: boolean;
}) {
  const id = `f-${String(name).replace(/\W+/g, "-")}`;
  const unit = kind ? unitLabel(kind, system) : plainUnit;
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <div className={alignBottom ? "flex grow flex-col" : undefined}>
          <label htmlFor={id} className={compact ? "sr-only" : alignBottom ? "field-label mt-auto" : "field-label"}>
            {label}
            {unit ? ` (${unit})` : ""}
          </label>
          <NumberText
            id={id}
            si={field.value as number | null | undefined}
            toShown={(v) => (kind ? quantity(kind, v, system).value : v)}
            fromShown={(v) => (kind ? toSi(kind, v, system) : v)}
            nullable={nullable}
            onChange={field.onChange}
            onBlur={field.onBlur}
            invalid={!!fieldState.error}
            compact={compact}
            placeholder={placeholder}
          />
          {hint && !fieldState.error && <p className="mt-1 text-xs text-ink-faint">{hint}</p>}
          {fieldState.error && <p className="field-error">{fieldState.error.message}</p>}
        </div>
      )}
    />
  );
}

const tidy = (v: number) => String(+v.toFixed(6));

/** Keeps the text the planner types while the SI value follows it. */
function NumberText({
  id,
  si,
  toShown,
  fromShown,
  nullable,
  onChange,
  onBlur,
  invalid,
  compact,
  placeholder,
}: {
  compact: boolean;
  placeholder?: string;
  id: string;
  si: number | null | undefined;
  toShown: (v: number) => number;
  fromShown: (v: number) => number;
  nullable: boolean;
  onChange: (v: number | null) => void;
  onBlur: () => void;
  invalid: boolean;
}) {
  const shown = si === null || si === undefined || Number.isNaN(si) ? "" : tidy(toShown(si));
  const [text, setText] = useState(shown);
  const [lastShown, setLastShown] = useState(shown);
  if (shown !== lastShown) {
    // the value changed from outside (reset, reload): show it
    setLastShown(shown);
    if (Number(text) !== Number(shown) || text === "") setText(shown);
  }
  return (
    <input
      id={id}
      inputMode="decimal"
      aria-invalid={invalid || undefined}
      className={compact ? "w-20 rounded border border-rule-strong bg-paper-raised px-1.5 py-1 text-right text-sm" : "field-input"}
      placeholder={placeholder}
      value={text}
      onBlur={onBlur}
      onChange={(e) => {
        const t = e.target.value;
        setText(t);
        if (t.trim() === "") onChange(nullable ? null : Number.NaN);
        else {
          const n = Number(t.replace(",", "."));
          onChange(Number.isFinite(n) ? fromShown(n) : Number.NaN);
        }
      }}
    />
  );
}
