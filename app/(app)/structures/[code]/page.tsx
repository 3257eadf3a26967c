import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass, cardClass } from "@/components/ui/styles";
import Link from "next/link";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: (await params).code };
}

export default async function StructurePage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  return (
    <>
      <PageHeader
        title={structure.name}
        actions={(await may(user, "readings:ingest", structure)) && <Link href={`/structures/${structure.code}/upload`} className={buttonClass("secondary")}>Upload logger file</Link>}
        subtitle={
          <>
            <span className="font-mono">{structure.code}</span>
            {structure.location && <> · {structure.location}</>} · times shown in {structure.timezone}
          </>
        }
      />
      {structure.description && <p className="mb-6 max-w-prose text-sm">{structure.description}</p>}
      <section className={`${cardClass} p-4`} aria-labelledby="gauges-heading">
        <h2 id="gauges-heading" className="mb-3 font-semibold">
          Gauges
        </h2>
        <EmptyState title="No gauges registered on this structure yet">
          <p>Once gauges are registered and their logger sends readings, their strain, stress and state show here.</p>
        </EmptyState>
      </section>
      <div className="mt-6">
        <MonitoringCaution />
      </div>
    </>
  );
}
