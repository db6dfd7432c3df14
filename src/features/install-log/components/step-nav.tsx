import { ChevronLeft, ChevronRight } from 'lucide-react';
import { paths } from '@/config/paths';
import { ButtonLink } from '@/components/ui/button';

type StepLink = { id: string; title: string };

/** The previous and next steps of the job, as two large buttons for a thumb. */
export function StepNav({
  buildId,
  prev,
  next,
}: {
  buildId: string;
  prev: StepLink | undefined;
  next: StepLink | undefined;
}) {
  if (!prev && !next) return null;
  return (
    <nav aria-label="Other steps of this job" className="grid grid-cols-2 gap-2">
      {prev ? (
        <ButtonLink
          to={paths.builds.step.getHref(buildId, prev.id)}
          variant="secondary"
          className="min-h-14! justify-start! text-left whitespace-normal!"
          icon={<ChevronLeft aria-hidden className="size-5 shrink-0" />}
        >
          <span className="min-w-0">
            <span className="block text-sm font-normal text-muted">Previous step</span>
            <span className="line-clamp-2">{prev.title}</span>
          </span>
        </ButtonLink>
      ) : (
        <span />
      )}
      {next && (
        <ButtonLink
          to={paths.builds.step.getHref(buildId, next.id)}
          variant="secondary"
          className="min-h-14! justify-end! text-right whitespace-normal!"
        >
          <span className="min-w-0">
            <span className="block text-sm font-normal text-muted">Next step</span>
            <span className="line-clamp-2">{next.title}</span>
          </span>
          <ChevronRight aria-hidden className="size-5 shrink-0" />
        </ButtonLink>
      )}
    </nav>
  );
}
