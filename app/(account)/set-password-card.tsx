import Link from "next/link";
import { setPasswordAction } from "./actions";
import { ActionForm } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass } from "@/components/ui/styles";
import type { LinkPurpose } from "@/lib/auth/account-links";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/roles";
import { checkAccountLink, LINK_UNUSABLE } from "@/lib/services/accounts";

/**
 * The page an e-mailed link opens: whose account it is and a password field, or, when the link
 * has expired or was used, a way to ask for a new one. It says the same for every reason a link
 * fails, so the page tells a stranger nothing.
 */
export async function SetPasswordCard({ token, purpose, title }: { token: string | undefined; purpose: LinkPurpose; title: string }) {
  const holder = token ? await checkAccountLink(token, purpose) : null;
  if (!token || !holder) {
    return (
      <div className={`${cardClass} space-y-3 p-6`}>
        <h1 className="text-lg font-semibold">{title}</h1>
        <p role="alert" className="text-sm">
          {LINK_UNUSABLE}
        </p>
        <p className="text-sm">
          <Link href="/reset" className="font-medium text-accent underline">
            Ask for a new link
          </Link>{" "}
          or{" "}
          <Link href="/signin" className="font-medium text-accent underline">
            sign in
          </Link>
          .
        </p>
      </div>
    );
  }
  return (
    <ActionForm action={setPasswordAction} className={`${cardClass} space-y-4 p-6`} label="Choose a password">
      <h1 className="text-lg font-semibold">{title}</h1>
      <p className="text-sm text-slate-600 dark:text-slate-400">
        {holder.name}, choose the password you will sign in with as <span className="font-medium">{holder.email}</span>.
      </p>
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="purpose" value={purpose} />
      <Field name="password" label="New password" type="password" autoComplete="new-password" required hint={`At least ${MIN_PASSWORD_LENGTH} characters.`} />
      <SubmitButton pendingLabel="Saving…">Save password</SubmitButton>
      <p className="text-sm">
        <Link href="/signin" className="font-medium text-accent underline">
          Go to sign in
        </Link>
      </p>
    </ActionForm>
  );
}
