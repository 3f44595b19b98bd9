import { createBrowserRouter, Navigate, Outlet, RouterProvider } from 'react-router-dom';
import { useMe } from '../features/auth/api/get-me';
import { homeFor, paths } from '../config/paths';
import { RequireRole } from '../components/layouts/require-role';
import { ConsultantLayout } from '../components/layouts/consultant-layout';
import { FieldLayout } from '../components/layouts/field-layout';
import { PortalLayout } from '../components/layouts/portal-layout';
import { Loading } from '../components/ui/card';
import { LoginPage } from './routes/auth/login';
import { ForgotPasswordPage } from './routes/auth/forgot-password';
import { SignupPage } from './routes/auth/signup';
import { VerifyEmailPage } from './routes/auth/verify-email';
import { ResetPasswordPage } from './routes/auth/reset-password';
import { AcceptInvitePage } from './routes/auth/accept-invite';
import { DeskPage } from './routes/desk/desk';
import { ClientsPage } from './routes/clients/clients';
import { ClientPage } from './routes/clients/client';
import { PropertiesPage } from './routes/properties/properties';
import { PropertyPage } from './routes/properties/property';
import { TeamPage } from './routes/settings/team';
import { MailPage } from './routes/settings/mail';
import { FieldHomePage } from './routes/field/field-home';
import { FieldShell } from './routes/field/field-shell';
import { FieldTaskPage } from './routes/field/field-task';
import { PortalHomePage } from './routes/portal/portal-home';
import { PortalProposalsPage } from './routes/portal/portal-proposals';
import { PortalProposalPage } from './routes/portal/portal-proposal';
import { ProposalsPage } from './routes/proposals/proposals';
import { ProposalPage } from './routes/proposals/proposal';
import { NotFoundPage, RouteErrorPage } from './routes/not-found';
import { libraryRoutes } from './routes/library/library-routes';
import { PropertyPrescriptionsPage } from './routes/properties/property-prescriptions';
import { SchedulePage } from './routes/schedule/schedule';
import { InvoicesPage } from './routes/invoices/invoices';
import { InvoicePage } from './routes/invoices/invoice';
import { PortalInvoicesPage } from './routes/portal/portal-invoices';
import { PortalInvoicePage } from './routes/portal/portal-invoice';
import { PropertyResultsPage } from './routes/properties/property-results';
import { PortalPropertyResultsPage, PortalResultsPage } from './routes/portal/portal-results';
import { PortalPropertyPage } from './routes/portal/portal-property';
import { PortalProgressHomePage, PortalProgressPage } from './routes/portal/portal-progress';
import { PortalFilesPage } from './routes/portal/portal-files';
import { PreviewLayout } from './routes/portal/preview-layout';
import { PreviewProposalsPage } from './routes/portal/preview-proposals';

function RootRedirect() {
  const me = useMe();
  if (me.isPending) return <Loading />;
  return <Navigate to={me.data ? homeFor(me.data.role) : paths.login} replace />;
}

const STAFF = ['owner', 'consultant'] as const;

const router = createBrowserRouter([
  { path: '/', element: <RootRedirect />, errorElement: <RouteErrorPage /> },
  { path: paths.login, element: <LoginPage />, errorElement: <RouteErrorPage /> },
  { path: paths.forgotPassword, element: <ForgotPasswordPage />, errorElement: <RouteErrorPage /> },
  { path: paths.signup, element: <SignupPage />, errorElement: <RouteErrorPage /> },
  { path: paths.verifyEmail(), element: <VerifyEmailPage />, errorElement: <RouteErrorPage /> },
  { path: paths.resetPassword(), element: <ResetPasswordPage />, errorElement: <RouteErrorPage /> },
  { path: paths.acceptInvite(), element: <AcceptInvitePage />, errorElement: <RouteErrorPage /> },
  {
    element: (
      <RequireRole roles={STAFF}>
        <ConsultantLayout />
      </RequireRole>
    ),
    errorElement: <RouteErrorPage />,
    children: [
      { path: paths.desk, element: <DeskPage /> },
      { path: paths.clients, element: <ClientsPage /> },
      { path: paths.client(), element: <ClientPage /> },
      { path: paths.properties, element: <PropertiesPage /> },
      { path: paths.property(), element: <PropertyPage /> },
      { path: paths.proposals, element: <ProposalsPage /> },
      { path: paths.proposal(), element: <ProposalPage /> },
      { path: paths.schedule, element: <SchedulePage /> },
      { path: paths.invoices, element: <InvoicesPage /> },
      { path: paths.invoice(), element: <InvoicePage /> },
      { path: paths.team, element: <TeamPage /> },
      { path: paths.mail, element: <MailPage /> },
      libraryRoutes,
      { path: paths.propertyPrescriptions(), element: <PropertyPrescriptionsPage /> },
      { path: paths.propertyResults(), element: <PropertyResultsPage /> },
      {
        // Preview as client: the portal's pages with the client's scope, writes off.
        path: paths.previewClient(),
        element: <PreviewLayout />,
        children: [
          { index: true, element: <PortalHomePage /> },
          { path: 'properties/:id', element: <PortalPropertyPage /> },
          { path: 'properties/:id/progress', element: <PortalProgressPage /> },
          { path: 'progress', element: <PortalProgressHomePage /> },
          { path: 'files', element: <PortalFilesPage /> },
          { path: 'proposals', element: <PreviewProposalsPage /> },
        ],
      },
      // The plan map is its own chunk (maplibre, terra-draw) and takes the shell's full width.
      { path: paths.planMap(), lazy: () => import('./routes/properties/plan-map'), hydrateFallbackElement: <Loading />, handle: { fullBleed: true } },
    ],
  },
  {
    element: (
      <RequireRole roles={STAFF}>
        <Outlet />
      </RequireRole>
    ),
    errorElement: <RouteErrorPage />,
    children: [{ path: paths.planPrint(), lazy: () => import('./routes/properties/plan-print'), hydrateFallbackElement: <Loading /> }],
  },
  {
    element: (
      <RequireRole roles={['crew', 'owner', 'consultant']}>
        <FieldLayout />
      </RequireRole>
    ),
    errorElement: <RouteErrorPage />,
    children: [
      {
        element: <FieldShell />,
        children: [
          { path: paths.field, element: <FieldHomePage /> },
          { path: paths.fieldTask(), element: <FieldTaskPage /> },
        ],
      },
    ],
  },
  {
    element: (
      <RequireRole roles={['client']}>
        <PortalLayout />
      </RequireRole>
    ),
    errorElement: <RouteErrorPage />,
    children: [
      { path: paths.portal, element: <PortalHomePage /> },
      { path: paths.portalProposals, element: <PortalProposalsPage /> },
      { path: paths.portalProposal(), element: <PortalProposalPage /> },
      { path: paths.portalInvoices, element: <PortalInvoicesPage /> },
      { path: paths.portalInvoice(), element: <PortalInvoicePage /> },
      { path: paths.portalResults, element: <PortalResultsPage /> },
      { path: paths.portalPropertyResults(), element: <PortalPropertyResultsPage /> },
      { path: paths.portalProperty(), element: <PortalPropertyPage /> },
      { path: paths.portalPropertyProgress(), element: <PortalProgressPage /> },
      { path: paths.portalProgress, element: <PortalProgressHomePage /> },
      { path: paths.portalFiles, element: <PortalFilesPage /> },
    ],
  },
  { path: '*', element: <NotFoundPage /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
