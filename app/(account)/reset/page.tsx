import type { Metadata } from "next";
import Link from "next/link";
import { ActionForm } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass } from "@/components/ui/styles";
import { requestPasswordResetAction } from "../actions";

export const metadata: Metadata = { title: "Forgot your password?" };

export default function ResetPage() {
  return (
    <ActionForm action={requestPasswordResetAction} className={`${cardClass} space-y-4 p-6`} label="Ask for a new password">
      <h1 className="text-lg font-semibold">Forgot your password?</h1>
      <p className="text-sm text-slate-600 dark:text-slate-400">Enter the e-mail address you sign in with; we send it a link to choose a new password.</p>
      <Field name="email" label="E-mail" type="email" autoComplete="username" required />
      <SubmitButton pendingLabel="Sending…">Send me a link</SubmitButton>
      <p className="text-sm">
        <Link href="/signin" className="font-medium text-accent underline">
          Back to sign in
        </Link>
      </p>
    </ActionForm>
  );
}
