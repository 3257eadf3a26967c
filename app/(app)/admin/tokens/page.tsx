import type { Metadata } from "next";
import Link from "next/link";
import { ActionForm, SecretOnce } from "@/components/ui/action-form";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass } from "@/components/ui/styles";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listStructuresFor } from "@/lib/services/structures";
import { listAllTokens } from "@/lib/services/tokens";
import { listUsers } from "@/lib/services/users";
import { createTokenAction } from "@/lib/actions/token-actions";
import { TokenTable } from "@/components/tokens/token-table";
import { TokenOwnerFields } from "./token-owner-fields";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "users:manage"));
  const [tokens, users, structures] = await Promise.all([listAllTokens(me), listUsers(), listStructuresFor(me)]);
  return (
    <>
      <PageHeader
        title="API tokens"
        subtitle={
          <>
            User tokens act with their user&apos;s role; logger tokens may only send readings to one structure. What a token can call:{" "}
            <Link className="text-accent underline" href="/api-reference">
              API reference
            </Link>
            .
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        {tokens.length === 0 ? (
          <EmptyState title="No API tokens yet">
            <p>Create one for each data logger and for each script that reads data.</p>
          </EmptyState>
        ) : (
          <TokenTable tokens={tokens} />
        )}
        <ActionForm action={createTokenAction} className={`${cardClass} h-fit space-y-3 p-4`} label="Create a token">
          <h2 className="font-semibold">Create a token</h2>
          <TokenOwnerFields
            users={users.filter((u) => u.active).map((u) => ({ value: u.email, label: `${u.name} (${u.role})` }))}
            structures={structures.map((s) => ({ value: s.code, label: `${s.code} — ${s.name}` }))}
          />
          <Field name="name" label="Token name" required hint="What uses it, e.g. “logger at pier 2”." />
          <SubmitButton pendingLabel="Creating…">Create token</SubmitButton>
          <SecretOnce label="The new token (shown only now):" />
        </ActionForm>
      </div>
    </>
  );
}

