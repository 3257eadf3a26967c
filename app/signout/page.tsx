import type { Metadata } from "next";
import { SignOutButton } from "./sign-out-button";
import { cardClass } from "@/components/ui/styles";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  return (
    <main className="flex min-h-dvh items-center justify-center px-4">
      <div className={`${cardClass} w-full max-w-sm space-y-4 p-6 text-center`}>
        <h1 className="text-lg font-semibold">Sign out of Hookeline?</h1>
        <p className="text-sm text-slate-600 dark:text-slate-400">Alerts keep going out by e-mail while you are signed out.</p>
        <SignOutButton />
      </div>
    </main>
  );
}
