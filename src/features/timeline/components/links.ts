import type { TimelineLink } from '@shared/schemas/timeline';
import { paths } from '@/config/paths';

/** The element id of a milestone's row on the timeline page, for links that pick it out. */
export const milestoneElementId = (id: string) => `milestone-${id}`;

/** Where a timeline item or threat leads. A part opens in the ledger, as the estimate's links do. */
export function timelineHref(buildId: string, link: TimelineLink): string {
  switch (link.to) {
    case 'target':
      return paths.builds.timeline.getHref(buildId);
    case 'milestone':
      return `${paths.builds.timeline.getHref(buildId)}#${milestoneElementId(link.milestoneId)}`;
    case 'part':
      return paths.builds.part.getHref(buildId, link.partId);
    case 'send-out':
      return paths.builds.sendOuts.getHref(buildId);
    case 'step':
      return paths.builds.step.getHref(buildId, link.stepId);
    case 'install':
      return paths.builds.install.getHref(buildId);
    case 'dyno-session':
      return paths.builds.dynoSession.getHref(buildId, link.sessionId);
  }
}
