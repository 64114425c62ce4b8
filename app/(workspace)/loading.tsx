import { PageSkeleton, SkeletonCard, SkeletonLine, SkeletonTable } from "@/components/layout/skeleton";

/** The workspace's pages (basins, plans under review, users) while their data loads. */
export default function WorkspaceLoading() {
  return (
    <PageSkeleton label="Loading the page…">
      <SkeletonLine className="h-7 w-1/2 max-w-sm" />
      <SkeletonCard>
        <SkeletonTable rows={4} columns={3} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
