import { ChartSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function DrawingLoading() {
  return (
    <PageSkeleton label="Loading the drawing…">
      <ChartSkeleton />
    </PageSkeleton>
  );
}
