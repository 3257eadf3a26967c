"use client";

import { useState } from "react";
import { useActionForm } from "./action-form";
import { buttonClass } from "./styles";

/**
 * A destructive submit in two steps: the first click only asks, in words, and the form is sent by
 * a second button that appears elsewhere; a page framed by another site (refused anyway by
 * frame-ancestors) or a stray click cannot revoke or deactivate anything in one go.
 */
export function ConfirmSubmitButton({
  children,
  question,
  confirmLabel,
  pendingLabel,
}: {
  children: React.ReactNode;
  question: string;
  confirmLabel: string;
  pendingLabel: string;
}) {
  const { pending } = useActionForm();
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <button type="button" className={buttonClass("danger")} onClick={() => setAsking(true)}>
        {children}
      </button>
    );
  }
  return (
    <span role="group" aria-label={question} className="inline-flex flex-wrap items-center gap-2">
      <span className="text-sm">{question}</span>
      <button type="button" className={buttonClass("secondary")} onClick={() => setAsking(false)} disabled={pending}>
        Cancel
      </button>
      <button type="submit" className={buttonClass("danger")} disabled={pending} aria-busy={pending}>
        {pending ? pendingLabel : confirmLabel}
      </button>
    </span>
  );
}
