import { PageSkeleton, SkeletonCard, SkeletonTable } from "@/components/layout/skeleton";

/** The plans list while it loads. */
export default function PlansLoading() {
  return (
    <PageSkeleton label="Loading the plans…">
      <SkeletonCard>
        <SkeletonTable rows={3} columns={5} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
