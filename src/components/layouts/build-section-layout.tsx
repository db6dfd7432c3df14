import { NavLink, Outlet, useParams } from 'react-router-dom';
import {
  Activity,
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
import { can, type Action } from '../../../shared/permissions';
import { paths } from '../../config/paths';
import { useBuild } from '../../features/builds/api/get-build';
import { cn } from '../ui/cn';

type Tab = {
  label: string;
  href: (id: string) => string;
  icon: LucideIcon;
  end?: boolean;
  needs?: Action;
};

/**
 * The sections of a build, in the order the work goes, then its sheet and sharing. Budget only
 * for roles that see money, the sheet not for a shop, sharing for the owner.
 */
const tabs: Tab[] = [
  { label: 'Overview', href: paths.builds.overview.getHref, icon: LayoutDashboard, end: true },
  { label: 'Timeline', href: paths.builds.timeline.getHref, icon: CalendarClock },
  { label: 'Parts', href: paths.builds.parts.getHref, icon: Package },
  { label: 'Send-outs', href: paths.builds.sendOuts.getHref, icon: Truck },
  { label: 'Budget', href: paths.builds.budget.getHref, icon: PiggyBank, needs: 'budget:read' },
  { label: 'Power estimate', href: paths.builds.estimate.getHref, icon: Gauge },
  { label: 'Bench', href: paths.builds.bench.getHref, icon: Droplets },
  { label: 'Install', href: paths.builds.install.getHref, icon: ClipboardList },
  { label: 'Photos', href: paths.builds.photos.getHref, icon: Camera },
  { label: 'Dyno', href: paths.builds.dyno.getHref, icon: Activity },
  { label: 'Build sheet', href: paths.builds.sheet.getHref, icon: Printer, needs: 'sheet:read' },
  { label: 'Share', href: paths.builds.share.getHref, icon: Share2, needs: 'share:manage' },
];

/**
 * Every /builds/:buildId/* page: a row of section tabs over the page. On a phone the row scrolls
 * sideways; from tablet width it wraps, so no tab is ever out of sight.
 */
export function BuildSectionLayout() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  const role = build.data?.myRole;
  const visible = tabs.filter((t) => !t.needs || (role && can(role, t.needs)));

  return (
    <>
      {build.isSuccess && (
        <nav
          aria-label="Build sections"
          className="-mx-4 mb-5 overflow-x-auto border-b border-rule px-4 sm:mx-0 sm:px-0 print:hidden"
        >
          <ul className="flex min-w-max sm:min-w-0 sm:flex-wrap">
            {visible.map((t) => (
              <li key={t.label}>
                <NavLink
                  to={t.href(buildId)}
                  end={t.end}
                  className={({ isActive }) =>
                    cn(
                      'flex min-h-11 items-center gap-1 border-b-[3px] px-2 text-[15px] font-semibold',
                      isActive
                        ? 'border-accent-500 text-ink'
                        : 'border-transparent text-muted hover:text-ink',
                    )
                  }
                >
                  <t.icon aria-hidden className="size-4" />
                  {t.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      )}
      <Outlet />
    </>
  );
}
