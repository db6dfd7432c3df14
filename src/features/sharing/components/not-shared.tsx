import { NotFoundState } from '@/components/ui/states';

/** What an address that was switched off, renewed or never made shows (the API says 404 to all). */
export function NotShared() {
  return (
    <div className="py-6">
      <title>Build not shared · Headroom</title>
      <NotFoundState title="This build is not shared" titleAs="h1">
        Its owner has switched the public page off, or given it a new address. Ask them for the
        current link.
      </NotFoundState>
    </div>
  );
}
