import { PageSkeleton, SkeletonCard, SkeletonLine, SkeletonTable } from "@/components/layout/skeleton";

/** A plan while it loads: its title and state, the allocations table and the comments. */
export default function PlanLoading() {
  return (
    <PageSkeleton label="Loading the plan…">
      <SkeletonLine className="h-6 w-2/3 max-w-md" />
      <SkeletonCard lines={3} />
      <SkeletonCard heading="Allocations">
        <SkeletonTable rows={5} columns={6} />
      </SkeletonCard>
      <SkeletonCard heading="Comments" lines={2} />
    </PageSkeleton>
  );
}
