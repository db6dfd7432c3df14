import { Link } from 'react-router-dom';
import { TriangleAlert } from 'lucide-react';
import type { Threat } from '@shared/schemas/timeline';
import { Badge } from '@/components/ui/badge';
import { timelineHref } from './links';
import { missLabel, threatRuleLabels } from './words';

/** Each threat: what it is (a link to it), the rule it breaks, what is wrong and by how much. */
export function ThreatsList({ buildId, threats }: { buildId: string; threats: Threat[] }) {
  return (
    <ul aria-label="What threatens the date" className="flex flex-col divide-y divide-rule">
      {threats.map((t) => (
        <li key={t.key} className="flex items-start gap-3 py-3 first:pt-0 last:pb-0">
          <TriangleAlert aria-hidden className="mt-1 size-5 shrink-0 text-over" />
          <div className="min-w-0 flex-1">
            <p className="text-sm font-semibold tracking-wide text-muted uppercase">
              {threatRuleLabels[t.rule]}
            </p>
            <Link
              to={timelineHref(buildId, t.link)}
              className="text-lg font-bold break-words text-accent-700 underline"
            >
              {t.title}
            </Link>
            <p className="text-ink-2">{t.words}</p>
          </div>
          <Badge tone={t.missesByDays === null ? 'tight' : 'over'} className="mt-1 shrink-0">
            {missLabel(t.missesByDays)}
          </Badge>
        </li>
      ))}
    </ul>
  );
}
