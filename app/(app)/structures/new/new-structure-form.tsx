import { ActionForm } from "@/components/ui/action-form";
import { Field } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { cardClass, inputClass } from "@/components/ui/styles";
import { createStructureAction } from "../actions";

export function NewStructureForm() {
  return (
    <ActionForm action={createStructureAction} className={`${cardClass} max-w-xl space-y-4 p-4 sm:p-6`} label="New structure">
      <Field name="code" label="Code" required maxLength={32} hint="2–32 letters, digits, - or _. Loggers and the API use it." />
      <Field name="name" label="Name" required hint="As the owner calls it." />
      <Field name="location" label="Location" hint="Town, road, grid reference — whatever finds it on site." />
      <Field name="timezone" label="Time zone" defaultValue="UTC" hint="IANA name, e.g. Europe/Berlin. Readings without an offset are read in it." />
      <Field name="description" label="Description">
        <textarea id="description" name="description" rows={3} className={inputClass} />
      </Field>
      <SubmitButton pendingLabel="Creating…">Create structure</SubmitButton>
    </ActionForm>
  );
}
