"use client";

import { signOut } from "next-auth/react";
import { useState } from "react";
import { buttonClass } from "@/components/ui/styles";

export function SignOutButton() {
  const [pending, setPending] = useState(false);
  return (
    <div className="flex justify-center gap-2">
      <a href="/" className={buttonClass("secondary")}>
        Stay signed in
      </a>
      <button
        type="button"
        className={buttonClass()}
        disabled={pending}
        onClick={() => {
          setPending(true);
          void signOut({ callbackUrl: "/signin" });
        }}
      >
        {pending ? "Signing out…" : "Sign out"}
      </button>
    </div>
  );
}
