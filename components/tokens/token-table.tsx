import { formatDistanceToNow } from "date-fns";
import { ActionForm } from "@/components/ui/action-form";
import { ConfirmSubmitButton } from "@/components/ui/confirm-submit-button";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { revokeTokenAction } from "@/lib/actions/token-actions";
import type { TokenView } from "@/lib/services/tokens";

const ago = (date: Date | null) => (date ? formatDistanceToNow(date, { addSuffix: true }) : "never");

/** API tokens with their last use and a revoke button; the token itself is never shown again. */
export function TokenTable({ tokens }: { tokens: TokenView[] }) {
  return (
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
              <td className={tdClass}>{t.kind === "user" ? `user ${t.userEmail}` : `logger on ${t.structureCode}`}</td>
              <td className={`${tdClass} whitespace-nowrap`}>{ago(t.lastUsedAt)}</td>
              <td className={tdClass}>
                {t.revokedAt ? (
                  <span className="text-slate-500">revoked {ago(t.revokedAt)}</span>
                ) : (
                  <ActionForm action={revokeTokenAction} label={`Revoke ${t.name}`}>
                    <input type="hidden" name="tokenId" value={t.id} />
                    <ConfirmSubmitButton
                      question={`Revoke "${t.name}"? Whatever uses it is refused from then on.`}
                      confirmLabel="Yes, revoke"
                      pendingLabel="Revoking…"
                    >
                      Revoke
                    </ConfirmSubmitButton>
                  </ActionForm>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
