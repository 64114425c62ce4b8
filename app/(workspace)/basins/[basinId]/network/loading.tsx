import { PageSkeleton, SkeletonCard, SkeletonMap, SkeletonTable } from "@/components/layout/skeleton";

/** The network page while it loads: its map panel and the reach and outfall tables. */
export default function NetworkLoading() {
  return (
    <PageSkeleton label="Loading the network…">
      <SkeletonCard lines={1} />
      <SkeletonMap />
      <SkeletonCard>
        <SkeletonTable rows={6} columns={5} />
      </SkeletonCard>
      <SkeletonCard>
        <SkeletonTable rows={3} columns={5} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
