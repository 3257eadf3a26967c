import { Field } from "@/components/ui/field";
import { inputClass } from "@/components/ui/styles";
import { ROLES, type Role } from "@/lib/auth/roles";

/** Name, e-mail and role of a new account: the same whether it gets a first password or an invitation. */
export function NewUserFields({ defaultRole }: { defaultRole: Role }) {
  return (
    <>
      <Field name="name" label="Name" required />
      <Field name="email" label="E-mail" type="email" required />
      <Field name="role" label="Role">
        <select id="role" name="role" className={inputClass} defaultValue={defaultRole}>
          {ROLES.map((role) => (
            <option key={role}>{role}</option>
          ))}
        </select>
      </Field>
    </>
  );
}
