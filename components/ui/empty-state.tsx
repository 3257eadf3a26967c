export function EmptyState({ title, children }: { title: string; children?: React.ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-slate-300 px-6 py-10 text-center dark:border-slate-700">
      <p className="font-semibold">{title}</p>
      {children && <div className="mx-auto mt-2 max-w-prose text-sm text-slate-600 dark:text-slate-400">{children}</div>}
    </div>
  );
}
