import { TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function AdminLoading() {
  return (
    <PageSkeleton label="Loading…">
      <TableSkeleton rows={8} />
    </PageSkeleton>
  );
}
