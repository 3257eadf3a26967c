import type { Metadata } from "next";
import Link from "next/link";
import { ActionForm } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { ConfirmSubmitButton } from "@/components/ui/confirm-submit-button";
import { SubmitButton } from "@/components/ui/submit-button";
import { NewUserFields } from "@/components/users/new-user-fields";
import { buttonClass, cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { ROLES } from "@/db/schema";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listUsers } from "@/lib/services/users";
import { addUserAction, changeRoleAction, setActiveAction } from "../actions";
import { dayOf } from "@/lib/time-format";
import { defaultTimeZone } from "@/lib/time-zone-config";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "users:manage"));
  const users = await listUsers();
  return (
    <>
      <PageHeader
        title="Users"
        subtitle="Who can sign in, and with which role. Deactivating an account stops its sessions and API tokens at once."
        actions={<Link href="/admin/users/invite" className={buttonClass("secondary")}>Invite by e-mail</Link>}
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <div className={`${cardClass} overflow-x-auto`}>
          <table className={tableClass}>
            <thead>
              <tr>
                <th className={thClass}>Name</th>
                <th className={thClass}>Role</th>
                <th className={thClass}>Status</th>
                <th className={thClass}>Since ({defaultTimeZone()})</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
              {users.map((user) => (
                <tr key={user.id} data-testid="user-row">
                  <td className={tdClass}>
                    <p className="font-medium">{user.name}</p>
                    <p className="text-xs text-slate-500 dark:text-slate-400">{user.email}</p>
                  </td>
                  <td className={tdClass}>
                    {user.id === me.id ? (
                      <span>{user.role} (you)</span>
                    ) : (
                      <ActionForm action={changeRoleAction} className="flex items-center gap-2" label={`Role of ${user.email}`}>
                        <input type="hidden" name="userId" value={user.id} />
                        <select name="role" defaultValue={user.role} className={`${inputClass} w-36`} aria-label={`Role of ${user.name}`}>
                          {ROLES.map((role) => (
                            <option key={role}>{role}</option>
                          ))}
                        </select>
                        <SubmitButton variant="secondary" pendingLabel="Saving…">Save</SubmitButton>
                      </ActionForm>
                    )}
                  </td>
                  <td className={tdClass}>
                    {user.id === me.id ? (
                      "active"
                    ) : (
                      <ActionForm action={setActiveAction} className="flex items-center gap-2" label={`Status of ${user.email}`}>
                        <input type="hidden" name="userId" value={user.id} />
                        <input type="hidden" name="active" value={String(!user.active)} />
                        <span className={user.active ? "" : "font-medium text-critical"}>{user.active ? "active" : "deactivated"}</span>
                        {user.active ? (
                          <ConfirmSubmitButton
                            question={`Deactivate ${user.email}? Their sessions and tokens stop working.`}
                            confirmLabel="Yes, deactivate"
                            pendingLabel="…"
                          >
                            Deactivate
                          </ConfirmSubmitButton>
                        ) : (
                          <SubmitButton variant="secondary" pendingLabel="…">
                            Reactivate
                          </SubmitButton>
                        )}
                      </ActionForm>
                    )}
                  </td>
                  <td className={`${tdClass} whitespace-nowrap text-slate-500`}>{dayOf(user.createdAt, defaultTimeZone())}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <ActionForm action={addUserAction} className={`${cardClass} h-fit space-y-3 p-4`} label="Add a user">
              <h2 className="font-semibold">Add a user</h2>
              <NewUserFields defaultRole="technician" />
              <Field name="password" label="First password" type="password" required hint="At least 8 characters; tell it to the person privately." />
              <SubmitButton pendingLabel="Adding…">Add user</SubmitButton>
        </ActionForm>
      </div>
    </>
  );
}
