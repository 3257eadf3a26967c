import { ChartSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function CompareLoading() {
  return (
    <PageSkeleton label="Loading the comparison…">
      <ChartSkeleton />
    </PageSkeleton>
  );
}
