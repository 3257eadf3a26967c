import type { Metadata } from "next";
import { ActionForm } from "@/components/ui/action-form";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { requirePermission } from "@/lib/auth/authorize";
import { seesAllStructures } from "@/lib/auth/permissions";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listMemberships } from "@/lib/services/memberships";
import { listStructuresFor } from "@/lib/services/structures";
import { listUsers } from "@/lib/services/users";
import { addMemberAction, removeMemberAction } from "../actions";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage() {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "members:manage"));
  const [memberships, users, structures] = await Promise.all([listMemberships(), listUsers(), listStructuresFor(me)]);
  return (
    <>
      <PageHeader
        title="Structure members"
        subtitle="Engineers, technicians and owners see only the structures they are members of. Administrators see all."
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        {memberships.length === 0 ? (
          <EmptyState title="No memberships yet">
            <p>Add people to the structures they work on or own.</p>
          </EmptyState>
        ) : (
          <div className={`${cardClass} overflow-x-auto`}>
            <table className={tableClass}>
              <thead>
                <tr>
                  <th className={thClass}>Structure</th>
                  <th className={thClass}>Person</th>
                  <th className={thClass}>Role</th>
                  <th className={thClass}>
                    <span className="sr-only">Remove</span>
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
                {memberships.map((m) => (
                  <tr key={`${m.structureCode}/${m.userId}`} data-testid="membership-row">
                    <td className={tdClass}>
                      <span className="font-mono text-xs">{m.structureCode}</span> {m.structureName}
                    </td>
                    <td className={tdClass}>
                      {m.name} <span className="text-xs text-slate-500">{m.email}</span>
                    </td>
                    <td className={tdClass}>{m.role}</td>
                    <td className={tdClass}>
                      <ActionForm action={removeMemberAction} label={`Remove ${m.email} from ${m.structureCode}`}>
                        <input type="hidden" name="email" value={m.email} />
                        <input type="hidden" name="structure" value={m.structureCode} />
                        <SubmitButton variant="danger" pendingLabel="Removing…">Remove</SubmitButton>
                      </ActionForm>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        <ActionForm action={addMemberAction} className={`${cardClass} h-fit space-y-3 p-4`} label="Add a member">
          <h2 className="font-semibold">Add a member</h2>
          <Field name="email" label="Person">
            <select id="email" name="email" className={inputClass}>
              {users.filter((u) => !seesAllStructures(u.role) && u.active).map((u) => (
                <option key={u.id} value={u.email}>
                  {u.name} ({u.role})
                </option>
              ))}
            </select>
          </Field>
          <Field name="structure" label="Structure">
            <select id="structure" name="structure" className={inputClass}>
              {structures.map((s) => (
                <option key={s.id} value={s.code}>
                  {s.code} — {s.name}
                </option>
              ))}
            </select>
          </Field>
          <SubmitButton pendingLabel="Adding…">Add member</SubmitButton>
        </ActionForm>
      </div>
    </>
  );
}
