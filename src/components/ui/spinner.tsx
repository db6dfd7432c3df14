import { LoaderCircle } from 'lucide-react';

export function Spinner({ className = 'size-6' }: { className?: string }) {
  return <LoaderCircle aria-hidden className={`${className} animate-spin text-accent-600`} />;
}

/** A centred loading state for a whole page or panel; announced politely. */
export function PageSpinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex min-h-48 items-center justify-center gap-3 text-muted">
      <Spinner />
      <span>{label}</span>
    </div>
  );
}
