import { forwardRef, type SelectHTMLAttributes } from "react";

/** Which reach of the newest network a record was measured on (optional), for a form's `reachId` (works with react-hook-form's register). */
export const ReachChoice = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement> & { id: string; label: string; reachIds: string[]; error?: string }>(function ReachChoice(
  { id, label, reachIds, error, ...props },
  ref,
) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <select ref={ref} id={id} className="field-input" {...props}>
        <option value="">Not placed</option>
        {reachIds.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </select>
      {error && <p className="field-error">{error}</p>}
    </div>
  );
});
