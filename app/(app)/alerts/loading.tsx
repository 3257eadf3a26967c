import { TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function AlertsLoading() {
  return (
    <PageSkeleton label="Loading alerts…">
      <TableSkeleton rows={8} />
    </PageSkeleton>
  );
}
