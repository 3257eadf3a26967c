import { PageSkeleton, TableSkeleton } from "@/components/ui/skeleton";

export default function LoadTestsLoading() {
  return (
    <PageSkeleton label="Loading the load tests…">
      <TableSkeleton rows={4} />
    </PageSkeleton>
  );
}
