import { cardClass } from "./styles";

/**
 * Grey placeholders in the shape of what is loading, so the page keeps its layout while the
 * server reads. Hidden from assistive technology; the wrapper announces the wait once.
 */
export function SkeletonBar({ className = "" }: { className?: string }) {
  return <span aria-hidden className={`block animate-pulse rounded bg-slate-200 dark:bg-slate-800 ${className}`} />;
}

export function LoadingRegion({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div role="status" aria-live="polite" aria-busy="true" data-testid="loading">
      <span className="sr-only">{label}</span>
      {children}
    </div>
  );
}

export function HeaderSkeleton() {
  return (
    <div className="mb-6 space-y-2">
      <SkeletonBar className="h-7 w-56" />
      <SkeletonBar className="h-4 w-80 max-w-full" />
    </div>
  );
}

export function CardGridSkeleton({ cards = 6 }: { cards?: number }) {
  return (
    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {Array.from({ length: cards }, (_, index) => (
        <li key={index} className={`${cardClass} space-y-2 p-4`}>
          <SkeletonBar className="h-3 w-16" />
          <SkeletonBar className="h-5 w-40" />
          <SkeletonBar className="h-4 w-full" />
          <SkeletonBar className="h-4 w-2/3" />
        </li>
      ))}
    </ul>
  );
}

export function TableSkeleton({ rows = 6 }: { rows?: number }) {
  return (
    <div className={`${cardClass} space-y-3 p-4`}>
      <SkeletonBar className="h-4 w-1/3" />
      {Array.from({ length: rows }, (_, index) => (
        <SkeletonBar key={index} className="h-5 w-full" />
      ))}
    </div>
  );
}

export function ChartSkeleton() {
  return (
    <div className={`${cardClass} p-4`}>
      <SkeletonBar className="mb-3 h-4 w-32" />
      <SkeletonBar className="h-64 w-full" />
    </div>
  );
}

/** The usual page while it loads: its title, then `children` (cards, tables, charts). */
export function PageSkeleton({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <LoadingRegion label={label}>
      <HeaderSkeleton />
      <div className="space-y-6">{children}</div>
    </LoadingRegion>
  );
}
