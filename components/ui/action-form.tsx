"use client";

import { createContext, useActionState, useContext } from "react";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { FormMessage } from "./form-message";

type FormActionFn = (previous: ActionState, formData: FormData) => Promise<ActionState>;

const ActionFormState = createContext<ActionState>(IDLE);

/** The outcome of the enclosing ActionForm's last submission. */
export function useActionFormState(): ActionState {
  return useContext(ActionFormState);
}

/**
 * A form bound to a server action. Fields inside it pick their errors from its state,
 * and the outcome message shows at the end of the form.
 */
export function ActionForm({
  action,
  children,
  className,
  label,
}: {
  action: FormActionFn;
  children: React.ReactNode;
  className?: string;
  label?: string;
}) {
  const [state, formAction] = useActionState(action, IDLE);
  return (
    <ActionFormState.Provider value={state}>
      <form action={formAction} className={className} aria-label={label} noValidate>
        {children}
        <FormMessage state={state} />
      </form>
    </ActionFormState.Provider>
  );
}

/** A value the server shows once (a new token), with a copy button. */
export function SecretOnce({ label }: { label: string }) {
  const { secret } = useActionFormState();
  if (!secret) return null;
  return (
    <div className="space-y-1 rounded-md border border-accent/40 bg-accent/5 p-3">
      <p className="text-sm font-medium">{label}</p>
      <code data-testid="new-secret" className="block break-all font-mono text-sm">
        {secret}
      </code>
      <button type="button" className="text-sm font-medium text-accent underline" onClick={() => void navigator.clipboard?.writeText(secret)}>
        Copy
      </button>
    </div>
  );
}
