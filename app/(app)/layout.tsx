import { AppHeader } from "@/components/shell/app-header";
import { requireUser } from "@/lib/auth/session";
import { unitsOf } from "@/lib/services/users";
import { UnitsProvider } from "@/components/units/units-context";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  const units = await unitsOf(user.id);
  return (
    <UnitsProvider units={units}>
      <AppHeader user={user} units={units} />
      <main className="mx-auto max-w-6xl px-4 py-6 sm:py-8">{children}</main>
    </UnitsProvider>
  );
}
