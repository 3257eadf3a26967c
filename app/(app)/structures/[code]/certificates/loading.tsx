import { PageSkeleton, TableSkeleton } from "@/components/ui/skeleton";

export default function CertificatesLoading() {
  return (
    <PageSkeleton label="Loading the certificates…">
      <TableSkeleton rows={4} />
    </PageSkeleton>
  );
}
