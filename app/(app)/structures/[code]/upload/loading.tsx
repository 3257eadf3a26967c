import { TableSkeleton, PageSkeleton } from "@/components/ui/skeleton";

export default function UploadLoading() {
  return (
    <PageSkeleton label="Loading the upload page…">
      <TableSkeleton rows={4} />
    </PageSkeleton>
  );
}
