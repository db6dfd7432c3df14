import { BookOpen, Bolt, Syringe, TriangleAlert, type LucideIcon } from 'lucide-react';
import type { Caution, CautionId } from '@shared/install-log/cautions';
import { cn } from '@/components/ui/cn';

const looks: Record<CautionId, { icon: LucideIcon; box: string; iconClass: string }> = {
  'high-pressure-fuel': {
    icon: Syringe,
    box: 'border-over bg-over-soft text-[#7d1f17]',
    iconClass: 'text-over',
  },
  lifting: {
    icon: TriangleAlert,
    box: 'border-tight bg-tight-soft text-[#6b4408]',
    iconClass: 'text-tight',
  },
  'critical-fastener': {
    icon: Bolt,
    box: 'border-tight bg-tight-soft text-[#6b4408]',
    iconClass: 'text-tight',
  },
  'service-information': {
    icon: BookOpen,
    box: 'border-rule-strong bg-sheet text-ink-2',
    iconClass: 'text-ink-3',
  },
};

/** The cautions a step carries (texts from shared/install-log/cautions), at the top of the page. */
export function CautionList({ cautions }: { cautions: Caution[] }) {
  if (cautions.length === 0) return null;
  return (
    <section aria-label="Cautions" className="flex flex-col gap-2">
      {cautions.map((c) => {
        const look = looks[c.id];
        return (
          <div
            key={c.id}
            className={cn('flex gap-3 rounded-lg border-2 px-4 py-3', look.box)}
            data-caution={c.id}
          >
            <look.icon aria-hidden className={cn('mt-0.5 size-6 shrink-0', look.iconClass)} />
            <div className="min-w-0">
              <p className="text-[17px] font-bold">{c.title}</p>
              <p className="mt-0.5 text-[15px]">{c.text}</p>
            </div>
          </div>
        );
      })}
    </section>
  );
}
