"use client";

import { useId } from "react";
import { useActionForm } from "./action-form";
import { inputClass } from "./styles";

type FieldProps = {
  name: string;
  label: string;
  hint?: string;
  children?: React.ReactNode;
} & Omit<React.InputHTMLAttributes<HTMLInputElement>, "name">;

/**
 * A labelled input with its hint and its errors, tied together for screen readers.
 * Inside an ActionForm the errors come from the form's last answer.
 */
export function Field({ name, label, hint, children, id, ...inputProps }: FieldProps) {
  const fieldErrors = useActionForm().state.fieldErrors?.[name];
  // Several forms on one page may have a field of the same name: ids must stay unique.
  const unique = useId();
  const inputId = id ?? (children ? name : `${name}-${unique}`);
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = fieldErrors?.length ? `${inputId}-error` : undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={inputId} className="block text-sm font-medium">
        {label}
      </label>
      {children ?? (
        <input
          id={inputId}
          name={name}
          className={inputClass}
          aria-invalid={errorId ? true : undefined}
          aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined}
          {...inputProps}
        />
      )}
      {hint && (
        <p id={hintId} className="text-xs text-slate-500 dark:text-slate-400">
          {hint}
        </p>
      )}
      {errorId && (
        <p id={errorId} className="text-xs font-medium text-critical" role="alert">
          {fieldErrors!.join(" ")}
        </p>
      )}
    </div>
  );
}
