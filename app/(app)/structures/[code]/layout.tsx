import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getVisibleStructure } from "@/lib/services/structures";

/**
 * Looks the structure up before any loading screen below it streams: once a loading screen is sent
 * the answer's status is fixed at 200, so an unknown or hidden code must be refused here to answer 404.
 */
export default async function StructureLayout({ children, params }: { children: React.ReactNode; params: Promise<{ code: string }> }) {
  const user = await requireUser();
  await pageGuard(getVisibleStructure(user, (await params).code));
  return children;
}
