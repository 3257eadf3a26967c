"use client";

import { createContext, startTransition, useActionState, useContext, useEffect, useRef } from "react";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { FormMessage } from "./form-message";

export type FormActionFn = (previous: ActionState, formData: FormData) => Promise<ActionState>;

const ActionFormContext = createContext<{ state: ActionState; pending: boolean }>({ state: IDLE, pending: false });

/** The outcome of the enclosing ActionForm's last submission, and whether one is under way. */
export function useActionForm() {
  return useContext(ActionFormContext);
}

/**
 * A form bound to a server action. Fields inside it pick their errors from its state and the
 * outcome message shows at the end. Before the page's JavaScript has loaded (or without it) the
 * browser posts the form natively to the action and the page comes back with its outcome. Once
 * loaded, the submit is taken over so that what was typed stays after an error (React clears a
 * form after its `action` runs), and the form is cleared after a success.
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
  const [state, dispatch, pending] = useActionState(action, IDLE);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state.status === "ok") form.current?.reset();
  }, [state]);

  function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    startTransition(() => dispatch(data));
  }

  return (
    <ActionFormContext.Provider value={{ state, pending }}>
      <form ref={form} action={dispatch} onSubmit={submit} className={className} aria-label={label} aria-busy={pending} noValidate>
        {children}
        <FormMessage state={state} />
      </form>
    </ActionFormContext.Provider>
  );
}

/** A value the server shows once (a new token), with a copy button. */
export function SecretOnce({ label }: { label: string }) {
  const { secret } = useActionForm().state;
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
