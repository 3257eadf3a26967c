import { Suspense } from "react";
import Link from "next/link";
import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass, cardClass } from "@/components/ui/styles";
import { MonitoringCaution } from "@/components/ui/caution";
import { roleAllows, seesAllStructures } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";
import { listStructuresFor } from "@/lib/services/structures";
import { structureSummaries } from "@/lib/services/status";
import { CardGridSkeleton } from "@/components/ui/skeleton";
import type { Structure } from "@/db/schema";
import { StructureGlance } from "@/components/alerts/structure-glance";

export const metadata: Metadata = { title: "Structures" };

/** The cards with each structure's state: the part of the page that reads readings and alerts. */
async function StructureCards({ structures }: { structures: Structure[] }) {
  const summaries = await structureSummaries(structures);
  return (
    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-label="Structures">
      {structures.map((structure, index) => (
        <li key={structure.id}>
          <Link
            href={`/structures/${structure.code}`}
            className={`${cardClass} block h-full p-4 transition hover:border-accent hover:shadow-md`}
            data-testid="structure-card"
          >
            <p className="font-mono text-xs text-slate-500 dark:text-slate-400">{structure.code}</p>
            <p className="mt-1 font-semibold">{structure.name}</p>
            {structure.location && <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">{structure.location}</p>}
            <StructureGlance summary={summaries[index]!} timeZone={structure.timezone} />
          </Link>
        </li>
      ))}
    </ul>
  );
}

export default async function StructuresPage() {
  const user = await requireUser();
  const structures = await listStructuresFor(user);
  const canCreate = roleAllows(user.role, "structure:create");
  return (
    <>
      <PageHeader
        title="Structures"
        subtitle={seesAllStructures(user.role) ? "Every structure in this installation." : "The structures you are a member of."}
        actions={
          canCreate && (
            <Link href="/structures/new" className={buttonClass()}>
              New structure
            </Link>
          )
        }
      />
      {structures.length === 0 ? (
        <EmptyState title="No structures to show yet">
          {canCreate ? (
            <p>
              Create the first structure, then register its gauges and give its data logger a token. Readings,
              stress and alerts appear here once data arrives.
            </p>
          ) : (
            <p>You are not a member of any structure. Ask an administrator to add you to the structures you work on.</p>
          )}
        </EmptyState>
      ) : (
        <Suspense fallback={<CardGridSkeleton cards={structures.length} />}>
          <StructureCards structures={structures} />
        </Suspense>
      )}
      <div className="mt-8">
        <MonitoringCaution />
      </div>
    </>
  );
}
