/**
 * The sections of a build, in the order the work goes: the one list the section navigation
 * draws. Adding a section is one entry here (plus its route in app/router.tsx and its URL in
 * config/paths.ts). The navigation lays out any number of them so every one is one tap
 * away at phone width, and the current one is always in view.
 */
import {
  Activity,
  BellRing,
  CalendarClock,
  Camera,
  ClipboardList,
  Droplets,
  Gauge,
  LayoutDashboard,
  Package,
  PiggyBank,
  Printer,
  Share2,
  Truck,
  type LucideIcon,
} from 'lucide-react';
import type { Action } from '@shared/permissions';
import { paths } from '@/config/paths';

export type BuildSection = {
  /** The tab's words: short, one or two words (the page's own heading may say more). */
  label: string;
  href: (buildId: string) => string;
  icon: LucideIcon;
  /** Active only on its own URL, not on the pages below it (the overview). */
  end?: boolean;
  /** Shown only to roles that may do this (e.g. the budget: money). */
  needs?: Action;
};

export const buildSections: BuildSection[] = [
  { label: 'Overview', href: paths.builds.overview.getHref, icon: LayoutDashboard, end: true },
  { label: 'Timeline', href: paths.builds.timeline.getHref, icon: CalendarClock },
  { label: 'Parts', href: paths.builds.parts.getHref, icon: Package },
  { label: 'Send-outs', href: paths.builds.sendOuts.getHref, icon: Truck },
  { label: 'Budget', href: paths.builds.budget.getHref, icon: PiggyBank, needs: 'budget:read' },
  { label: 'Estimate', href: paths.builds.estimate.getHref, icon: Gauge },
  { label: 'Bench', href: paths.builds.bench.getHref, icon: Droplets },
  { label: 'Install', href: paths.builds.install.getHref, icon: ClipboardList },
  { label: 'Photos', href: paths.builds.photos.getHref, icon: Camera },
  { label: 'Dyno', href: paths.builds.dyno.getHref, icon: Activity },
  { label: 'Notices', href: paths.builds.notices.getHref, icon: BellRing },
  // The printable sheet (not for a shop) and the public page's settings (the owner's).
  { label: 'Sheet', href: paths.builds.sheet.getHref, icon: Printer, needs: 'sheet:read' },
  { label: 'Share', href: paths.builds.share.getHref, icon: Share2, needs: 'share:manage' },
];
