import { PageSkeleton, SkeletonCard, SkeletonTable } from "@/components/layout/skeleton";

/** A basin section while it loads: the basin's name and tabs stay, the section's cards fill in. */
export default function BasinSectionLoading() {
  return (
    <PageSkeleton label="Loading this section of the basin…">
      <div className="grid gap-4 md:grid-cols-2">
        <SkeletonCard lines={3} />
        <SkeletonCard lines={3} />
      </div>
      <SkeletonCard>
        <SkeletonTable rows={4} />
      </SkeletonCard>
    </PageSkeleton>
  );
}
