import { CardGridSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function StructuresLoading() {
  return (
    <PageSkeleton label="Loading structures…">
      <CardGridSkeleton />
    </PageSkeleton>
  );
}
