import { Link } from 'react-router-dom';
import { Package } from 'lucide-react';
import { partCategoryLabels, partStatusLabels } from '@shared/schemas/parts';
import type { PartCategory, PartStatus } from '@shared/schemas/parts';
import type { StepPart } from '@shared/schemas/install-log';
import { paths } from '@/config/paths';

/** The parts this step fits, each a link to it in the ledger. */
export function LinkedParts({ buildId, parts }: { buildId: string; parts: StepPart[] }) {
  if (parts.length === 0) return null;
  return (
    <section aria-labelledby="step-parts-title" className="rounded-lg border border-rule bg-sheet">
      <h2
        id="step-parts-title"
        className="flex items-center gap-2 border-b border-rule px-4 py-2.5 text-lg font-bold sm:px-5"
      >
        <Package aria-hidden className="size-5 text-ink-3" />
        Parts
      </h2>
      <ul className="divide-y divide-rule">
        {parts.map((p) => (
          <li key={p.id}>
            <Link
              to={`${paths.builds.parts.getHref(buildId)}?q=${encodeURIComponent(p.name)}`}
              className="flex min-h-12 flex-col justify-center px-4 py-2 hover:bg-ink/[0.03] sm:px-5"
            >
              <span className="font-semibold text-accent-700 underline-offset-2 hover:underline">
                {p.name}
              </span>
              <span className="text-sm text-muted">
                {partCategoryLabels[p.category as PartCategory] ?? p.category} ·{' '}
                {partStatusLabels[p.status as PartStatus] ?? p.status}
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
