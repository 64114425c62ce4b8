"use client";
import { When } from "@/components/layout/basin-zone";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { RoleBadge } from "@/components/ui/role-badge";
import { BASIN_ROLES, ROLE_NAMES, type BasinRole } from "@/lib/domain";
import type { MemberDto } from "@/lib/services/dto";

const col = createColumnHelper<MemberDto>();

export function MembersTable({
  members,
  canManage,
  me,
  onRoleChange,
  onRemove,
}: {
  members: MemberDto[];
  canManage: boolean;
  me: string;
  onRoleChange: (userId: string, role: BasinRole) => void;
  onRemove: (member: MemberDto) => void;
}) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const columns = useMemo(
    () => [
      col.accessor("name", { header: "Name", cell: (c) => <span className="font-medium">{c.getValue()}</span> }),
      col.accessor("email", { header: "E-mail" }),
      col.accessor("role", {
        header: "Role",
        cell: (c) =>
          canManage ? (
            <select
              aria-label={`Role of ${c.row.original.name}`}
              className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
              value={c.getValue()}
              onChange={(e) => onRoleChange(c.row.original.userId, e.target.value as BasinRole)}
            >
              {BASIN_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_NAMES[r]}
                </option>
              ))}
            </select>
          ) : (
            <RoleBadge role={c.getValue()} />
          ),
      }),
      col.accessor("since", {
        header: "Member since",
        cell: (c) => <When at={c.getValue()} day />,
      }),
      ...(canManage
        ? [
            col.display({
              id: "actions",
              header: "",
              cell: (c) => (
                <Button variant="quiet" className="px-2 py-1" onClick={() => onRemove(c.row.original)}>
                  {c.row.original.userId === me ? "Leave" : "Remove"}
                </Button>
              ),
            }),
          ]
        : []),
    ],
    [canManage, me, onRoleChange, onRemove],
  );
  // eslint-disable-next-line react-hooks/incompatible-library -- react-table returns new functions each render by design
  const table = useReactTable({
    data: members,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return (
    <div className="overflow-x-auto">
    <table className="data-table" data-testid="members-table">
      <thead>
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => (
              <th key={h.id} aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : undefined}>
                {h.column.getCanSort() ? (
                  <button type="button" className="uppercase" onClick={h.column.getToggleSortingHandler()}>
                    {flexRender(h.column.columnDef.header, h.getContext())}
                    {{ asc: " ▲", desc: " ▼" }[h.column.getIsSorted() as string] ?? ""}
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
    </div>
  );
}
