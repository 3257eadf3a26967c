import { ChartSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function RosetteLoading() {
  return (
    <PageSkeleton label="Loading the rosette…">
      <ChartSkeleton />
      <ChartSkeleton />
    </PageSkeleton>
  );
}
