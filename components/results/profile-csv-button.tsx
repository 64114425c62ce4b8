"use client";
import { CsvButton, downloadCsv } from "@/components/tables/sortable-table";
import { profileCsv } from "@/lib/results/csv-rows";
import type { ProfileSeries } from "@/lib/results/profile-series";

/** Downloads the DO profile along the shown path as CSV, with the planning caution first. */
export function ProfileCsvButton({ series, fileName, about = [], condition }: { series: ProfileSeries; fileName?: string; about?: string[]; condition?: string }) {
  return (
    <CsvButton
      label="Download profile CSV"
      onClick={() => {
        const t = profileCsv(series, about, condition);
        downloadCsv(fileName ?? `do-profile-${series.path[0]}.csv`, t.rows, t.columns, t.notes);
      }}
    />
  );
}
