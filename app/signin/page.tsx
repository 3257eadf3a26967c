import type { Metadata } from "next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <main className="flex min-h-dvh items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-6 text-center">
          <p className="text-2xl font-semibold tracking-tight">Hookeline</p>
          <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">Strain-gauge monitoring of structures</p>
        </div>
        <SignInForm />
      </div>
    </main>
  );
}
