import { PageSkeleton, SkeletonCard, SkeletonLine } from "@/components/layout/skeleton";

/** A scenario while it loads: the editor's cards, in its order. */
export default function ScenarioLoading() {
  return (
    <PageSkeleton label="Loading the scenario…">
      <SkeletonLine className="h-6 w-1/2 max-w-xs" />
      <SkeletonCard lines={2} />
      <SkeletonCard heading="Critical conditions" lines={3} />
      <SkeletonCard heading="Kinetics" lines={2} />
      <SkeletonCard heading="Headwater and tributary water" lines={2} />
      <SkeletonCard heading="Allocation" lines={2} />
    </PageSkeleton>
  );
}
