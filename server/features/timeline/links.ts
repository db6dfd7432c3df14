/** Client paths of what the timeline links to, for mails and calendar events (the client's routes must match). */
import type { TimelineLink } from '../../../shared/schemas/timeline';

export const timelinePath = (buildId: string) => `/builds/${buildId}/timeline`;

export function linkPath(buildId: string, link: TimelineLink): string {
  const build = `/builds/${buildId}`;
  switch (link.to) {
    case 'target':
      return timelinePath(buildId);
    case 'milestone':
      return `${timelinePath(buildId)}#milestone-${link.milestoneId}`;
    case 'part':
      return `${build}/parts?part=${link.partId}`;
    case 'send-out':
      return `${build}/send-outs`;
    case 'step':
      return `${build}/install/steps/${link.stepId}`;
    case 'install':
      return `${build}/install`;
    case 'dyno-session':
      return `${build}/dyno/${link.sessionId}`;
  }
}
