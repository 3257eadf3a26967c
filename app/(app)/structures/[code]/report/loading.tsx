import { TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function ReportLoading() {
  return (
    <PageSkeleton label="Loading the report…">
      <TableSkeleton rows={4} />
      <TableSkeleton />
    </PageSkeleton>
  );
}
