"use client";

import Link from "next/link";
import { signOut } from "next-auth/react";
import { useState } from "react";
import { buttonClass } from "@/components/ui/styles";
import { signOutEverywhereAction } from "./actions";

export function SignOutButton() {
  const [pending, setPending] = useState<"here" | "everywhere" | null>(null);
  async function signOutFrom(where: "here" | "everywhere") {
    setPending(where);
    if (where === "everywhere") await signOutEverywhereAction();
    await signOut({ callbackUrl: "/signin" });
  }
  return (
    <div className="space-y-3">
      <div className="flex justify-center gap-2">
        <Link href="/" className={buttonClass("secondary")}>
          Stay signed in
        </Link>
        <button type="button" className={buttonClass()} disabled={pending !== null} onClick={() => void signOutFrom("here")}>
          {pending === "here" ? "Signing out…" : "Sign out"}
        </button>
      </div>
      <button
        type="button"
        className="text-sm font-medium text-accent underline disabled:opacity-60"
        disabled={pending !== null}
        onClick={() => void signOutFrom("everywhere")}
      >
        {pending === "everywhere" ? "Signing out everywhere…" : "Sign out on every device"}
      </button>
    </div>
  );
}
