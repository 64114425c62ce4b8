import { PageSkeleton, SkeletonCard, SkeletonTable } from "@/components/layout/skeleton";

/** The scenarios page while it loads: the Scenarios and Runs cards. */
export default function ScenariosLoading() {
  return (
    <PageSkeleton label="Loading the scenarios…">
      <SkeletonCard heading="Scenarios">
        <SkeletonTable rows={3} />
      </SkeletonCard>
      <SkeletonCard heading="Runs">
        <SkeletonTable rows={4} columns={5} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
