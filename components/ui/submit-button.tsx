"use client";

import { useActionForm } from "./action-form";
import { buttonClass, type ButtonVariant } from "./styles";

export function SubmitButton({
  children,
  pendingLabel,
  variant = "primary",
}: {
  children: React.ReactNode;
  pendingLabel: string;
  variant?: ButtonVariant;
}) {
  const { pending } = useActionForm();
  return (
    <button type="submit" className={buttonClass(variant)} disabled={pending} aria-busy={pending}>
      {pending ? pendingLabel : children}
    </button>
  );
}
