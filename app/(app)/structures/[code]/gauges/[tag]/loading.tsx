import { ChartSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function GaugeLoading() {
  return (
    <PageSkeleton label="Loading the gauge…">
      <ChartSkeleton />
      <ChartSkeleton />
    </PageSkeleton>
  );
}
