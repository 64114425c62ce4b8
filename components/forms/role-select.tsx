import type { UseFormRegisterReturn } from "react-hook-form";
import { BASIN_ROLES, ROLE_NAMES } from "@/lib/domain";

/** The basin-role picker of the add-member and invitation forms. */
export function RoleSelect({ id, field }: { id: string; field: UseFormRegisterReturn }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        Role
      </label>
      <select id={id} className="field-input" {...field}>
        {BASIN_ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_NAMES[r]}
          </option>
        ))}
      </select>
    </div>
  );
}
