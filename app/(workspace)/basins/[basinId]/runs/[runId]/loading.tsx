import { PageSkeleton, SkeletonCard, SkeletonLine, SkeletonMap, SkeletonTable } from "@/components/layout/skeleton";

/** A run's results while they load: the summary card, the DO map and the reach table. */
export default function RunLoading() {
  return (
    <PageSkeleton label="Loading the run's results…">
      <SkeletonLine className="h-6 w-1/2 max-w-sm" />
      <SkeletonCard lines={3} />
      <SkeletonMap />
      <SkeletonCard heading="Reaches">
        <SkeletonTable rows={6} columns={5} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
