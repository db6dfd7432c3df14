/** Client paths of what the timeline links to, for mails and calendar events (shared/paths). */
import { paths } from '@shared/paths';
import type { TimelineLink } from '@shared/schemas/timeline';

export function linkPath(buildId: string, link: TimelineLink): string {
  const b = paths.builds;
  switch (link.to) {
    case 'target':
      return b.timeline.getHref(buildId);
    case 'milestone':
      return `${b.timeline.getHref(buildId)}#milestone-${link.milestoneId}`;
    case 'part':
      return b.part.getHref(buildId, link.partId);
    case 'send-out':
      return b.sendOuts.getHref(buildId);
    case 'step':
      return b.step.getHref(buildId, link.stepId);
    case 'install':
      return b.install.getHref(buildId);
    case 'dyno-session':
      return b.dynoSession.getHref(buildId, link.sessionId);
  }
}
