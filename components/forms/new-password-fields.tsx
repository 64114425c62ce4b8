import type { UseFormRegisterReturn } from "react-hook-form";
import { Field } from "@/components/ui/field";
import { PASSWORD_MIN } from "@/lib/validation/account";

/** A new password typed twice (registration, reset, accepting an invitation). */
export function NewPasswordFields({
  label = "Password",
  password,
  confirm,
  errors,
}: {
  label?: string;
  password: UseFormRegisterReturn;
  confirm: UseFormRegisterReturn;
  errors: { password?: string; confirm?: string };
}) {
  return (
    <>
      <Field label={label} type="password" autoComplete="new-password" hint={`At least ${PASSWORD_MIN} characters.`} error={errors.password} {...password} />
      <Field label={`${label} again`} type="password" autoComplete="new-password" error={errors.confirm} {...confirm} />
    </>
  );
}
