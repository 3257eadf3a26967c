import { CardGridSkeleton, TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function StructureLoading() {
  return (
    <PageSkeleton label="Loading the structure…">
      <CardGridSkeleton cards={3} />
      <TableSkeleton />
    </PageSkeleton>
  );
}
