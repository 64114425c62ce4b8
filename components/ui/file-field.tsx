"use client";

/** A labelled file input with its validation message, handing the chosen file (or null) to `onFile`. */
export function FileField({ id, label, accept, error, onFile }: { id: string; label: string; accept: string; error?: string; onFile: (file: File | null) => void }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} type="file" accept={accept} className="field-input" aria-invalid={error ? true : undefined} onChange={(e) => onFile(e.target.files?.[0] ?? null)} />
      {error && <p className="field-error">{error}</p>}
    </div>
  );
}
