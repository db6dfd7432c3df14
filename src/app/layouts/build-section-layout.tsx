import { NavLink, Outlet, useParams } from 'react-router-dom';
import { can } from '@shared/permissions';
import { useBuild } from '@/features/builds/api/get-build';
import { cn } from '@/components/ui/cn';
import { buildSections } from './build-sections';

/**
 * Every /builds/:buildId/* page: the build's sections over the page.
 *
 * Laid out as a grid, never a row that scrolls sideways: at phone width four to a row (a
 * dozen sections is three rows), six on a tablet, and one row on a desktop. Every section
 * is one tap away, the current one is always in view (filled in ink), and nothing clips a
 * tab's focus ring.
 */
export function BuildSectionLayout() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  const role = build.data?.myRole;
  const visible = buildSections.filter((s) => !s.needs || (role && can(role, s.needs)));

  return (
    <>
      {build.isSuccess && (
        <nav aria-label="Build sections" className="mb-5 border-b border-rule pb-3 print:hidden">
          <ul className="grid grid-cols-4 gap-1.5 sm:grid-cols-6 lg:auto-cols-fr lg:gap-1 lg:grid-flow-col lg:grid-cols-none">
            {visible.map((s) => (
              <li key={s.label} className="min-w-0">
                <NavLink
                  to={s.href(buildId)}
                  end={s.end}
                  className={({ isActive }) =>
                    cn(
                      'flex min-h-12 flex-col items-center justify-center gap-0.5 rounded-md border px-1 py-1 text-center text-[13px] leading-tight font-semibold sm:text-sm lg:px-0.5 lg:text-[13px]',
                      isActive
                        ? 'border-ink bg-ink text-white'
                        : 'border-rule bg-sheet text-ink-2 hover:border-rule-strong hover:text-ink',
                    )
                  }
                >
                  <s.icon aria-hidden className="size-[18px] shrink-0" />
                  <span className="max-w-full truncate">{s.label}</span>
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
