"use client";
import { useState } from "react";

/**
 * A table value that turns into an input on click. Enter or leaving the field
 * saves; Escape cancels. `onSave` returns an error message to show, or null.
 */
export function EditableCell({
  display,
  initial,
  label,
  numeric = true,
  onSave,
}: {
  display: string;
  initial: string;
  label: string;
  numeric?: boolean;
  onSave: (text: string) => Promise<string | null>;
}) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const commit = async () => {
    if (text === initial) {
      setEditing(false);
      setError(null);
      return;
    }
    setBusy(true);
    const problem = await onSave(text);
    setBusy(false);
    setError(problem);
    if (!problem) setEditing(false);
  };

  if (!editing) {
    return (
      <button
        type="button"
        className="w-full rounded px-1 text-inherit hover:bg-tarn-50 hover:outline hover:outline-1 hover:outline-tarn-300"
        style={{ textAlign: numeric ? "right" : "left" }}
        title={`Edit ${label}`}
        aria-label={`Edit ${label}`}
        onClick={(e) => {
          e.stopPropagation();
          setText(initial);
          setEditing(true);
        }}
      >
        {display}
      </button>
    );
  }
  return (
    <span className="block" onClick={(e) => e.stopPropagation()}>
      <input
        autoFocus
        aria-label={label}
        aria-invalid={error ? true : undefined}
        disabled={busy}
        inputMode={numeric ? "decimal" : undefined}
        className={`w-24 rounded border px-1 py-0.5 text-sm ${numeric ? "text-right" : ""} ${error ? "border-clay-500" : "border-tarn-500"}`}
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === "Enter") void commit();
          if (e.key === "Escape") {
            setEditing(false);
            setError(null);
          }
        }}
      />
      {error && (
        <span role="alert" className="mt-0.5 block text-left text-xs text-clay-700">
          {error}
        </span>
      )}
    </span>
  );
}
