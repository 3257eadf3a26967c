import { PageSkeleton, TableSkeleton } from "@/components/ui/skeleton";

export default function SiteVisitsLoading() {
  return (
    <PageSkeleton label="Loading the site visits…">
      <TableSkeleton rows={4} />
    </PageSkeleton>
  );
}
