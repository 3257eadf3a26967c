import Link from "next/link";
import type { UserActor } from "@/lib/auth/actor";
import { roleAllows } from "@/lib/auth/permissions";
import type { UnitSystem } from "@/lib/units";
import { UnitsSwitch } from "@/components/units/units-switch";

const ROLE_NAMES = { admin: "Administrator", engineer: "Engineer", technician: "Technician", owner: "Owner" } as const;

export function AppHeader({ user, units }: { user: UserActor; units: UnitSystem }) {
  const links = [
    { href: "/", label: "Structures" },
    { href: "/alerts", label: "Alerts" },
    ...(roleAllows(user.role, "users:manage")
      ? [
          { href: "/admin/users", label: "Users" },
          { href: "/admin/members", label: "Members" },
          { href: "/admin/tokens", label: "API tokens" },
        ]
      : []),
    ...(roleAllows(user.role, "mail:read") ? [{ href: "/admin/mail", label: "Mail" }] : []),
  ];
  return (
    <header className="border-b border-slate-200 bg-white print:hidden dark:border-slate-800 dark:bg-slate-900">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
          <svg aria-hidden viewBox="0 0 32 32" className="size-7">
            <rect width="32" height="32" rx="6" className="fill-accent" />
            <path d="M6 22 L12 10 L16 18 L20 12 L26 22" fill="none" stroke="#fff" strokeWidth="2.5" strokeLinejoin="round" strokeLinecap="round" />
          </svg>
          Hookeline
        </Link>
        <nav aria-label="Main" className="order-3 -mx-1 flex w-full gap-1 overflow-x-auto sm:order-none sm:w-auto">
          {links.map((link) => (
            <Link
              key={link.href}
              href={link.href}
              className="whitespace-nowrap rounded-md px-2.5 py-1.5 text-sm font-medium text-slate-700 hover:bg-slate-100 dark:text-slate-300 dark:hover:bg-slate-800"
            >
              {link.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <UnitsSwitch units={units} />
          <span className="hidden text-right leading-tight sm:block">
            <span className="block font-medium" data-testid="signed-in-name">{user.name}</span>
            <span className="block text-xs text-slate-500 dark:text-slate-400">{ROLE_NAMES[user.role]}</span>
          </span>
          <Link href="/signout" className="rounded-md px-2.5 py-1.5 font-medium text-accent hover:bg-slate-100 dark:hover:bg-slate-800">
            Sign out
          </Link>
        </div>
      </div>
    </header>
  );
}
