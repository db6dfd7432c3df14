import { Outlet } from 'react-router-dom';
import { Wrench } from 'lucide-react';

/** The build pages, with the standing caution underneath. */
export function BuildsLayout() {
  return (
    <>
      <Outlet />
      <footer className="mt-10 flex items-start gap-2 border-t border-rule pt-4 text-sm text-muted">
        <Wrench aria-hidden className="mt-0.5 size-4 shrink-0" />
        <p>
          Torque specs and procedures come from the maker's service information. Estimates are
          estimates.
        </p>
      </footer>
    </>
  );
}
