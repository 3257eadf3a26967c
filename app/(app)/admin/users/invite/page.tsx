import type { Metadata } from "next";
import Link from "next/link";
import { ActionForm } from "@/components/ui/action-form";
import { PageHeader } from "@/components/ui/page-header";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass } from "@/components/ui/styles";
import { NewUserFields } from "@/components/users/new-user-fields";
import { LINK_LIFETIME_MS } from "@/lib/auth/account-links";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { inviteUserAction } from "../../actions";

export const metadata: Metadata = { title: "Invite a user" };

export default async function InviteUserPage() {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "users:manage"));
  const days = LINK_LIFETIME_MS.invitation / (24 * 3600_000);
  return (
    <>
      <PageHeader
        title="Invite a user"
        subtitle={`The person gets an e-mail with a link to choose their own password; the link works once, within ${days} days. Until then the account cannot be used.`}
      />
      <ActionForm action={inviteUserAction} className={`${cardClass} max-w-md space-y-3 p-4`} label="Invite by e-mail">
        <NewUserFields defaultRole="owner" />
        <SubmitButton pendingLabel="Inviting…">Send invitation</SubmitButton>
      </ActionForm>
      <p className="mt-4 text-sm">
        <Link href="/admin/users" className="font-medium text-accent underline">
          Back to users
        </Link>{" "}
        · the invitation shows on{" "}
        <Link href="/admin/mail" className="font-medium text-accent underline">
          Mail
        </Link>{" "}
        once sent.
      </p>
    </>
  );
}
