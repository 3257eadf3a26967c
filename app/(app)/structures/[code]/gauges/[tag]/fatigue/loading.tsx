import { ChartSkeleton, TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function FatigueLoading() {
  return (
    <PageSkeleton label="Loading the fatigue figures…">
      <TableSkeleton rows={4} />
      <ChartSkeleton />
    </PageSkeleton>
  );
}
