import { lazy, Suspense } from 'react';
import { Navigate } from 'react-router-dom';
import { Gauge, ReceiptText, Users, Wrench } from 'lucide-react';
import { paths } from '@/config/paths';
import { useMe } from '@/lib/me';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';

// The calculator carries the estimator; the rest of the landing page does not wait for it.
const TryItCalculator = lazy(() =>
  import('@/features/estimate/components/try-it-calculator').then((m) => ({
    default: m.TryItCalculator,
  })),
);

const points = [
  {
    icon: Gauge,
    title: 'Aim at a number',
    text: 'Set the target in crank or wheel horsepower, the date and the event, and see the days left.',
  },
  {
    icon: Wrench,
    title: 'Find the weak link first',
    text: 'Parts, ratings and headroom side by side, so the bottom end or the transmission is not the surprise.',
  },
  {
    icon: ReceiptText,
    title: 'Keep the money straight',
    text: 'A budget only the owner sees: parts, labor, shipping, cores and their refunds.',
  },
  {
    icon: Users,
    title: 'Bring the crew',
    text: 'Crew, shops and viewers each see what their role allows, and nothing more.',
  },
];

/** "/" — the builds list for a signed-in user, otherwise a short word on what Headroom does. */
export function LandingRoute() {
  const me = useMe();
  if (me.data) return <Navigate to={paths.builds.list.getHref()} replace />;
  if (me.isPending) return <PageSpinner />;

  return (
    <div className="flex flex-col gap-10">
      <title>Headroom · plan and prove a diesel power build</title>
      <section className="overflow-hidden rounded-xl bg-ink px-5 py-10 text-white sm:px-10 sm:py-14">
        <p className="mb-3 text-sm font-semibold tracking-[0.18em] text-accent-100 uppercase">
          For diesel pickup builds
        </p>
        <h1 className="max-w-2xl text-4xl leading-[1.1] font-bold tracking-tight sm:text-5xl">
          Know how much headroom the build has before the dyno tells you.
        </h1>
        <p className="mt-4 max-w-xl text-lg text-white/80">
          Headroom keeps a power build in one place: the target and the date, the parts and what
          each is rated for, the money, and the people doing the work.
        </p>
        <div className="mt-7 flex flex-col gap-3 sm:flex-row">
          <ButtonLink to={paths.auth.signUp.getHref()} className="sm:min-w-44">
            Create account
          </ButtonLink>
          <ButtonLink to={paths.auth.signIn.getHref()} variant="on-ink" className="sm:min-w-32">
            Sign in
          </ButtonLink>
        </div>
      </section>
      <ul className="grid gap-4 sm:grid-cols-2">
        {points.map(({ icon: Icon, title, text }) => (
          <li key={title} className="flex gap-3 rounded-lg border border-rule bg-sheet p-4">
            <Icon aria-hidden className="mt-0.5 size-6 shrink-0 text-accent-600" />
            <div>
              <h2 className="font-bold">{title}</h2>
              <p className="text-ink-2">{text}</p>
            </div>
          </li>
        ))}
      </ul>
      <Suspense fallback={<PageSpinner label="Loading the calculator…" />}>
        <TryItCalculator />
      </Suspense>
    </div>
  );
}
