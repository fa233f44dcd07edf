import { lazy } from 'react';
import type { RouteObject } from 'react-router-dom';
import { AppShell } from '@/components/layout/app-shell';
import { paths } from '@/config/paths';
import { SessionGate, UserMenu } from '@/features/auth/shell';
import { ApiStatus } from '@/features/health';
import { AuthLayout } from './routes/auth-layout';
import NotFoundRoute from './routes/not-found';

// Each section is its own chunk; the shell, the status badge and the 404 ship in the first load.
const OverviewRoute = lazy(() => import('./routes/overview'));
const KeysRoute = lazy(() => import('./routes/keys'));
const UsageRoute = lazy(() => import('./routes/usage'));
const PlaygroundRoute = lazy(() => import('./routes/playground'));
const SetupsRoute = lazy(() => import('./routes/setups'));
const GearRoute = lazy(() => import('./routes/gear'));
const TeamRoute = lazy(() => import('./routes/team'));
const BillingRoute = lazy(() => import('./routes/billing'));
const SignInRoute = lazy(() => import('./routes/sign-in'));
const SignUpRoute = lazy(() => import('./routes/sign-up'));
const ForgotPasswordRoute = lazy(() => import('./routes/forgot-password'));
const ResetPasswordRoute = lazy(() => import('./routes/reset-password'));
const AcceptInviteRoute = lazy(() => import('./routes/accept-invite'));
const ConfirmEmailRoute = lazy(() => import('./routes/confirm-email'));
const AuditRoute = lazy(() => import('./routes/audit'));
const FramesRoute = lazy(() => import('./routes/frames'));
const AccountRoute = lazy(() => import('./routes/account'));
const StudioRoute = lazy(() => import('./routes/studio'));

export const routes: RouteObject[] = [
  {
    element: <AuthLayout />,
    children: [
      { path: paths.signIn, element: <SignInRoute /> },
      { path: paths.signUp, element: <SignUpRoute /> },
      { path: paths.forgotPassword, element: <ForgotPasswordRoute /> },
      { path: paths.resetPassword, element: <ResetPasswordRoute /> },
      { path: paths.acceptInvite, element: <AcceptInviteRoute /> },
      { path: paths.confirmEmail, element: <ConfirmEmailRoute /> },
    ],
  },
  {
    element: (
      <SessionGate>
        <AppShell status={<ApiStatus />} userMenu={<UserMenu />} />
      </SessionGate>
    ),
    children: [
      { index: true, element: <OverviewRoute /> },
      { path: paths.keys, element: <KeysRoute /> },
      { path: paths.usage, element: <UsageRoute /> },
      { path: paths.playground, element: <PlaygroundRoute /> },
      { path: paths.setups, element: <SetupsRoute /> },
      { path: paths.gear, element: <GearRoute /> },
      { path: paths.team, element: <TeamRoute /> },
      { path: paths.billing, element: <BillingRoute /> },
      { path: paths.audit, element: <AuditRoute /> },
      { path: paths.frames, element: <FramesRoute /> },
      { path: paths.account, element: <AccountRoute /> },
      { path: paths.studio, element: <StudioRoute /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
];
