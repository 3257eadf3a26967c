"use client";

import Link from "next/link";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { Field } from "@/components/ui/field";
import { buttonClass, cardClass } from "@/components/ui/styles";

export function SignInForm() {
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    const result = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    });
    if (result?.ok && !result.error) {
      const next = new URLSearchParams(window.location.search).get("callbackUrl");
      // Only follow same-site paths, never an address someone put in a link.
      window.location.assign(next?.startsWith("/") && !next.startsWith("//") ? next : "/");
      return;
    }
    setPending(false);
    setError(
      result?.error === "locked"
        ? "Signing in is paused for a quarter hour after repeated wrong passwords. Wait, or choose a new password with “Forgot your password?”."
        : "That e-mail and password do not match an active account. Check both and try again.",
    );
  }

  return (
    <form onSubmit={submit} className={`${cardClass} space-y-4 p-6`}>
      <h1 className="text-lg font-semibold">Sign in</h1>
      {error && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-critical dark:bg-red-950/50 dark:text-red-200">
          {error}
        </p>
      )}
      <Field name="email" label="E-mail" type="email" autoComplete="username" required />
      <Field name="password" label="Password" type="password" autoComplete="current-password" required />
      <button type="submit" className={`${buttonClass()} w-full`} disabled={pending} aria-busy={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
      <Link href="/reset" className="block text-center text-sm font-medium text-accent underline">
        Forgot your password?
      </Link>
    </form>
  );
}
