import type { Metadata } from "next";
import { UploadForm } from "@/components/upload/upload-form";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Upload readings · ${(await params).code}` };
}

export default async function UploadPage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  await pageGuard(requirePermission(user, "readings:ingest", structure));
  return (
    <>
      <PageHeader
        title="Upload a logger file"
        subtitle={
          <>
            <span className="font-mono">{structure.code}</span> · {structure.name}
          </>
        }
      />
      <UploadForm code={structure.code} structureTimezone={structure.timezone} />
    </>
  );
}
