import { AppHeader } from "@/components/shell/app-header";
import { requireUser } from "@/lib/auth/session";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  return (
    <>
      <AppHeader user={user} />
      <main className="mx-auto max-w-6xl px-4 py-6 sm:py-8">{children}</main>
    </>
  );
}
