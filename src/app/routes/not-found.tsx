import { useMe } from '@/lib/me';
import { paths } from '@/config/paths';
import { ButtonLink } from '@/components/ui/button';
import { NotFoundState } from '@/components/ui/states';

export function NotFoundRoute() {
  const me = useMe();
  return (
    <div className="py-6">
      <title>Page not found · Headroom</title>
      <NotFoundState
        title="Page not found"
        titleAs="h1"
        actions={
          me.data ? (
            <ButtonLink to={paths.builds.list.getHref()}>Go to My builds</ButtonLink>
          ) : (
            <ButtonLink to={paths.home.getHref()}>Go to the start</ButtonLink>
          )
        }
      >
        The address may be mistyped, or the page has moved.
      </NotFoundState>
    </div>
  );
}
