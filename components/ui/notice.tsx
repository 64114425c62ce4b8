import type { ReactNode } from "react";

const TONES = {
  info: "border-tarn-300 bg-tarn-50 text-tarn-900",
  success: "border-reed-500 bg-reed-100 text-reed-700",
  warning: "border-ochre-500 bg-ochre-100 text-ochre-700",
  error: "border-clay-500 bg-clay-100 text-clay-700",
} as const;

export function Notice({
  tone = "info",
  title,
  children,
}: {
  tone?: keyof typeof TONES;
  title?: string;
  children?: ReactNode;
}) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-md border-l-4 px-4 py-3 text-sm ${TONES[tone]}`}>
      {title && <p className="font-semibold">{title}</p>}
      {children}
    </div>
  );
}
