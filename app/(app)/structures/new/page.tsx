import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { NewStructureForm } from "./new-structure-form";

export const metadata: Metadata = { title: "New structure" };

export default async function NewStructurePage() {
  const user = await requireUser();
  await pageGuard(requirePermission(user, "structure:create"));
  return (
    <>
      <PageHeader title="New structure" subtitle="The bridge, deck, frame or tank whose gauges you will monitor." />
      <NewStructureForm />
    </>
  );
}
