"use client";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { RoleBadge } from "@/components/ui/role-badge";
import { useBasinsQuery } from "@/lib/queries/basins";

export function BasinList() {
  const { data, error, isPending } = useBasinsQuery();
  if (isPending) return <p className="text-ink-faint">Loading basins…</p>;
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (data.length === 0) {
    return (
      <div className="card text-ink-soft">
        You are not a member of any basin yet. A basin lead can add you once an administrator has created your account.
      </div>
    );
  }
  return (
    <ul className="grid gap-4 sm:grid-cols-2" data-testid="basin-list">
      {data.map((b) => (
        <li key={b.id} className="card">
          <div className="mb-1 flex items-start justify-between gap-3">
            <Link href={`/basins/${b.id}`} className="text-lg font-semibold">
              {b.name}
            </Link>
            {b.myRole && <RoleBadge role={b.myRole} />}
          </div>
          <p className="mb-3 line-clamp-2 text-sm text-ink-soft">{b.description || "No description yet."}</p>
          <dl className="flex gap-6 text-xs text-ink-faint">
            <div>
              <dt className="inline">DO criterion </dt>
              <dd className="inline font-semibold text-ink-soft">{b.doCriterionMgL.toFixed(1)} mg/L</dd>
            </div>
            <div>
              <dt className="inline">Units </dt>
              <dd className="inline font-semibold text-ink-soft">{b.unitSystem === "SI" ? "SI" : "US customary"}</dd>
            </div>
            <div>
              <dt className="inline">Members </dt>
              <dd className="inline font-semibold text-ink-soft">{b.memberCount ?? "—"}</dd>
            </div>
          </dl>
        </li>
      ))}
    </ul>
  );
}
