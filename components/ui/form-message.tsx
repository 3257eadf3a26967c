import type { ActionState } from "@/lib/actions/action-state";

export function FormMessage({ state }: { state: ActionState }) {
  if (!state.message) return null;
  const ok = state.status === "ok";
  return (
    <p
      role={ok ? "status" : "alert"}
      className={`rounded-md px-3 py-2 text-sm ${ok ? "bg-emerald-50 text-emerald-900 dark:bg-emerald-950/50 dark:text-emerald-100" : "bg-red-50 text-critical dark:bg-red-950/50 dark:text-red-200"}`}
    >
      {state.message}
    </p>
  );
}
