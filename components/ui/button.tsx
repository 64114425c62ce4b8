import type { ButtonHTMLAttributes } from "react";

const VARIANTS = {
  primary: "bg-tarn-600 text-white hover:bg-tarn-700 disabled:bg-tarn-300",
  secondary: "border border-rule-strong bg-paper-raised text-ink hover:bg-paper-sunk disabled:text-ink-faint",
  danger: "border border-clay-500 bg-paper-raised text-clay-700 hover:bg-clay-100 disabled:opacity-50",
  quiet: "text-tarn-700 hover:bg-tarn-50 disabled:text-ink-faint",
} as const;

export type ButtonVariant = keyof typeof VARIANTS;

export function Button({
  variant = "primary",
  className = "",
  type = "button",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed ${VARIANTS[variant]} ${className}`}
      {...props}
    />
  );
}
