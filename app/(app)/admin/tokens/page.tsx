import type { Metadata } from "next";
import { formatDistanceToNow } from "date-fns";
import { ActionForm, SecretOnce } from "@/components/ui/action-form";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listStructuresFor } from "@/lib/services/structures";
import { listAllTokens } from "@/lib/services/tokens";
import { listUsers } from "@/lib/services/users";
import { createTokenAction, revokeTokenAction } from "../actions";
import { TokenOwnerFields } from "./token-owner-fields";

export const metadata: Metadata = { title: "API tokens" };

const ago = (date: Date | null) => (date ? formatDistanceToNow(date, { addSuffix: true }) : "never");

export default async function TokensPage() {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "users:manage"));
  const [tokens, users, structures] = await Promise.all([listAllTokens(me), listUsers(), listStructuresFor(me)]);
  return (
    <>
      <PageHeader
        title="API tokens"
        subtitle="User tokens act with their user's role; logger tokens may only send readings to one structure."
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        {tokens.length === 0 ? (
          <EmptyState title="No API tokens yet">
            <p>Create one for each data logger and for each script that reads data.</p>
          </EmptyState>
        ) : (
          <div className={`${cardClass} overflow-x-auto`}>
            <table className={tableClass}>
              <thead>
                <tr>
                  <th className={thClass}>Name</th>
                  <th className={thClass}>Acts for</th>
                  <th className={thClass}>Last used</th>
                  <th className={thClass}>State</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
                {tokens.map((t) => (
                  <tr key={t.id} data-testid="token-row">
                    <td className={tdClass}>
                      <p className="font-medium">{t.name}</p>
                      <p className="font-mono text-xs text-slate-500">{t.hint}</p>
                    </td>
                    <td className={tdClass}>
                      {t.kind === "user" ? `user ${t.userEmail}` : `logger on ${t.structureCode}`}
                    </td>
                    <td className={`${tdClass} whitespace-nowrap`}>{ago(t.lastUsedAt)}</td>
                    <td className={tdClass}>
                      {t.revokedAt ? (
                        <span className="text-slate-500">revoked {ago(t.revokedAt)}</span>
                      ) : (
                        <ActionForm action={revokeTokenAction} label={`Revoke ${t.name}`}>
                          <input type="hidden" name="tokenId" value={t.id} />
                          <SubmitButton variant="danger" pendingLabel="Revoking…">Revoke</SubmitButton>
                        </ActionForm>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
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

