import { lazy } from 'react';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { paths } from '@/config/paths';
import { RequireAuth } from '@/lib/auth';
import { RootLayout } from '@/app/layouts/root-layout';
import { BuildsLayout } from '@/app/layouts/builds-layout';
import { BuildSectionLayout } from '@/app/layouts/build-section-layout';
import { RouteErrorPage } from './routes/route-error';
import { NotFoundRoute } from './routes/not-found';

// Each page is its own chunk; the first screen loads only what it shows.
const LandingRoute = lazy(() =>
  import('./routes/landing').then((m) => ({ default: m.LandingRoute })),
);
const SignInRoute = lazy(() =>
  import('./routes/auth/sign-in').then((m) => ({ default: m.SignInRoute })),
);
const SignUpRoute = lazy(() =>
  import('./routes/auth/sign-up').then((m) => ({ default: m.SignUpRoute })),
);
const ForgotPasswordRoute = lazy(() =>
  import('./routes/auth/forgot-password').then((m) => ({ default: m.ForgotPasswordRoute })),
);
const ResetPasswordRoute = lazy(() =>
  import('./routes/auth/reset-password').then((m) => ({ default: m.ResetPasswordRoute })),
);
const InviteRoute = lazy(() =>
  import('./routes/auth/invite').then((m) => ({ default: m.InviteRoute })),
);
const ConfirmEmailRoute = lazy(() =>
  import('./routes/auth/confirm-email').then((m) => ({ default: m.ConfirmEmailRoute })),
);
const AccountRoute = lazy(() =>
  import('./routes/account/account').then((m) => ({ default: m.AccountRoute })),
);
const NoticesRoute = lazy(() =>
  import('./routes/builds/notices').then((m) => ({ default: m.NoticesRoute })),
);
const BuildsListRoute = lazy(() =>
  import('./routes/builds/builds-list').then((m) => ({ default: m.BuildsListRoute })),
);
const NewBuildRoute = lazy(() =>
  import('./routes/builds/new-build').then((m) => ({ default: m.NewBuildRoute })),
);
const BuildOverviewRoute = lazy(() =>
  import('./routes/builds/build-overview').then((m) => ({ default: m.BuildOverviewRoute })),
);
const EditBuildRoute = lazy(() =>
  import('./routes/builds/edit-build').then((m) => ({ default: m.EditBuildRoute })),
);

const EstimateRoute = lazy(() =>
  import('./routes/builds/estimate').then((m) => ({ default: m.EstimateRoute })),
);

const TimelineRoute = lazy(() =>
  import('./routes/builds/timeline').then((m) => ({ default: m.TimelineRoute })),
);

const PartsRoute = lazy(() =>
  import('./routes/builds/parts').then((m) => ({ default: m.PartsRoute })),
);
const BudgetRoute = lazy(() =>
  import('./routes/builds/budget').then((m) => ({ default: m.BudgetRoute })),
);
const SendOutsRoute = lazy(() =>
  import('./routes/builds/send-outs').then((m) => ({ default: m.SendOutsRoute })),
);

const InstallRoute = lazy(() =>
  import('./routes/builds/install').then((m) => ({ default: m.InstallRoute })),
);
const StepRoute = lazy(() =>
  import('./routes/builds/step').then((m) => ({ default: m.StepRoute })),
);
const PhotosRoute = lazy(() =>
  import('./routes/builds/photos').then((m) => ({ default: m.PhotosRoute })),
);
const BenchRoute = lazy(() =>
  import('./routes/builds/bench').then((m) => ({ default: m.BenchRoute })),
);
const BenchSheetRoute = lazy(() =>
  import('./routes/builds/bench-sheet').then((m) => ({ default: m.BenchSheetRoute })),
);
const BenchEntryRoute = lazy(() =>
  import('./routes/builds/bench-entry').then((m) => ({ default: m.BenchEntryRoute })),
);
const BenchCompareRoute = lazy(() =>
  import('./routes/builds/bench-compare').then((m) => ({ default: m.BenchCompareRoute })),
);
const DynoRoute = lazy(() =>
  import('./routes/builds/dyno').then((m) => ({ default: m.DynoRoute })),
);
const DynoSessionRoute = lazy(() =>
  import('./routes/builds/dyno-session').then((m) => ({ default: m.DynoSessionRoute })),
);
const ShareRoute = lazy(() =>
  import('./routes/builds/share').then((m) => ({ default: m.ShareRoute })),
);
const BuildSheetRoute = lazy(() =>
  import('./routes/builds/build-sheet').then((m) => ({ default: m.BuildSheetRoute })),
);
// A shared build's page and sheet: no sign-in, nothing writable.
const SharedBuildRoute = lazy(() =>
  import('./routes/shared/shared-build').then((m) => ({ default: m.SharedBuildRoute })),
);
const SharedSheetRoute = lazy(() =>
  import('./routes/shared/shared-sheet').then((m) => ({ default: m.SharedSheetRoute })),
);

const router = createBrowserRouter([
  {
    element: <RootLayout />,
    errorElement: <RouteErrorPage />,
    children: [
      {
        errorElement: <RouteErrorPage />,
        children: [
          { path: paths.home.path, element: <LandingRoute /> },
          { path: paths.auth.signIn.path, element: <SignInRoute /> },
          { path: paths.auth.signUp.path, element: <SignUpRoute /> },
          { path: paths.auth.forgotPassword.path, element: <ForgotPasswordRoute /> },
          { path: paths.auth.resetPassword.path, element: <ResetPasswordRoute /> },
          { path: paths.auth.invite.path, element: <InviteRoute /> },
          { path: paths.auth.confirmEmail.path, element: <ConfirmEmailRoute /> },
          { path: paths.shared.page.path, element: <SharedBuildRoute /> },
          { path: paths.shared.sheet.path, element: <SharedSheetRoute /> },
          {
            element: <RequireAuth />,
            children: [
              { path: paths.account.path, element: <AccountRoute /> },
              {
                path: paths.builds.list.path,
                element: <BuildsLayout />,
                children: [
                  { index: true, element: <BuildsListRoute /> },
                  { path: 'new', element: <NewBuildRoute /> },
                  {
                    path: ':buildId',
                    element: <BuildSectionLayout />,
                    children: [
                      { index: true, element: <BuildOverviewRoute /> },
                      { path: 'edit', element: <EditBuildRoute /> },
                      // Section pages (parts, budget, send-outs, estimate, install, photos, notices) go here.
                      { path: 'install', element: <InstallRoute /> },
                      { path: 'install/steps/:stepId', element: <StepRoute /> },
                      { path: 'photos', element: <PhotosRoute /> },
                      { path: 'timeline', element: <TimelineRoute /> },
                      { path: 'parts', element: <PartsRoute /> },
                      { path: 'budget', element: <BudgetRoute /> },
                      { path: 'send-outs', element: <SendOutsRoute /> },
                      { path: 'estimate', element: <EstimateRoute /> },
                      { path: 'notices', element: <NoticesRoute /> },
                      { path: 'bench', element: <BenchRoute /> },
                      { path: 'bench/new', element: <BenchEntryRoute /> },
                      { path: 'bench/compare', element: <BenchCompareRoute /> },
                      { path: 'bench/sheets/:sheetId', element: <BenchSheetRoute /> },
                      { path: 'bench/sheets/:sheetId/edit', element: <BenchEntryRoute /> },
                      { path: 'dyno', element: <DynoRoute /> },
                      { path: 'dyno/:sessionId', element: <DynoSessionRoute /> },
                      { path: 'share', element: <ShareRoute /> },
                      { path: 'sheet', element: <BuildSheetRoute /> },
                    ],
                  },
                ],
              },
            ],
          },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
