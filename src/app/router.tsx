import { useEffect } from 'react';
import { createBrowserRouter, Navigate, Outlet, RouterProvider, type RouteObject } from 'react-router-dom';
import { useMe } from '../features/auth/api/get-me';
import { homeFor, paths } from '../config/paths';
import { RequireRole } from './layouts/require-role';
import { Loading } from '../components/ui/card';
import { NotFoundPage, RouteErrorPage } from './routes/not-found';
import { libraryRoutes } from './routes/library/library-routes';
import { page } from './lazy-page';
import { deskLoader, fieldHomeLoader, fieldTaskLoader, portalHomeLoader, portalPropertyLoader } from './route-loaders';

function RootRedirect() {
  const me = useMe();
  if (me.isPending) return <Loading />;
  return <Navigate to={me.data ? homeFor(me.data.role) : paths.login} replace />;
}

/** The sign-in page is its own page (index.html): leave the app for it, keeping ?next=. */
function LeaveForSignIn() {
  useEffect(() => {
    window.location.replace(`${paths.login}${window.location.search}`);
  }, []);
  return <Loading />;
}

const STAFF = ['owner', 'consultant'] as const;

/** Only the signed-in roles reach the children (the layout's code loads after the check). */
const gate = (roles: readonly ('owner' | 'consultant' | 'crew' | 'client')[], children: RouteObject[]): RouteObject => ({
  element: (
    <RequireRole roles={roles}>
      <Outlet />
    </RequireRole>
  ),
  errorElement: <RouteErrorPage />,
  hydrateFallbackElement: <Loading />,
  children,
});

const portalPages: RouteObject[] = [
  { path: 'properties/:id', ...page(() => import('./routes/portal/portal-property'), (m) => m.PortalPropertyPage) },
  { path: 'properties/:id/progress', ...page(() => import('./routes/portal/portal-progress'), (m) => m.PortalProgressPage) },
  { path: 'progress', ...page(() => import('./routes/portal/portal-progress'), (m) => m.PortalProgressHomePage) },
  { path: 'files', ...page(() => import('./routes/portal/portal-files'), (m) => m.PortalFilesPage) },
];

const routes: RouteObject[] = [
  { path: '/', element: <RootRedirect />, errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  { path: paths.login, element: <LeaveForSignIn />, errorElement: <RouteErrorPage /> },
  { path: paths.forgotPassword, ...page(() => import('./routes/auth/forgot-password'), (m) => m.ForgotPasswordPage), errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  { path: paths.signup, ...page(() => import('./routes/auth/signup'), (m) => m.SignupPage), errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  { path: paths.verifyEmail(), ...page(() => import('./routes/auth/verify-email'), (m) => m.VerifyEmailPage), errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  { path: paths.resetPassword(), ...page(() => import('./routes/auth/reset-password'), (m) => m.ResetPasswordPage), errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  { path: paths.acceptInvite(), ...page(() => import('./routes/auth/accept-invite'), (m) => m.AcceptInvitePage), errorElement: <RouteErrorPage />, hydrateFallbackElement: <Loading /> },
  gate(['owner', 'consultant', 'crew', 'client'], [{ path: paths.changePassword, ...page(() => import('./routes/account/change-password'), (m) => m.ChangePasswordPage) }]),
  gate(STAFF, [
    {
      ...page(() => import('./layouts/consultant-layout'), (m) => m.ConsultantLayout),
      children: [
        { path: paths.desk, loader: deskLoader, ...page(() => import('./routes/desk/desk'), (m) => m.DeskPage) },
        { path: paths.clients, ...page(() => import('./routes/clients/clients'), (m) => m.ClientsPage) },
        { path: paths.client(), ...page(() => import('./routes/clients/client'), (m) => m.ClientPage) },
        { path: paths.properties, ...page(() => import('./routes/properties/properties'), (m) => m.PropertiesPage) },
        { path: paths.property(), ...page(() => import('./routes/properties/property'), (m) => m.PropertyPage) },
        { path: paths.proposals, ...page(() => import('./routes/proposals/proposals'), (m) => m.ProposalsPage) },
        { path: paths.proposal(), ...page(() => import('./routes/proposals/proposal'), (m) => m.ProposalPage) },
        { path: paths.schedule, ...page(() => import('./routes/schedule/schedule'), (m) => m.SchedulePage) },
        { path: paths.invoices, ...page(() => import('./routes/invoices/invoices'), (m) => m.InvoicesPage) },
        { path: paths.invoice(), ...page(() => import('./routes/invoices/invoice'), (m) => m.InvoicePage) },
        { path: paths.team, ...page(() => import('./routes/settings/team'), (m) => m.TeamPage) },
        { path: paths.mail, ...page(() => import('./routes/settings/mail'), (m) => m.MailPage) },
        { path: paths.firmExport, ...page(() => import('./routes/settings/firm-export'), (m) => m.FirmExportPage) },
        libraryRoutes,
        { path: paths.propertyPrescriptions(), ...page(() => import('./routes/properties/property-prescriptions'), (m) => m.PropertyPrescriptionsPage) },
        { path: paths.propertyResults(), ...page(() => import('./routes/properties/property-results'), (m) => m.PropertyResultsPage) },
        { path: paths.unitChecks(), ...page(() => import('./routes/properties/unit-checks'), (m) => m.UnitChecksPage) },
        { path: paths.nextSeason(), ...page(() => import('./routes/properties/next-season'), (m) => m.NextSeasonPage) },
        { path: paths.propertySoilTests(), ...page(() => import('./routes/properties/soil-test-import'), (m) => m.SoilTestImportPage) },
        { path: paths.sprayRecords, ...page(() => import('./routes/spray-records/spray-records'), (m) => m.SprayRecordsPage) },
        { path: paths.propertyCameras(), ...page(() => import('./routes/properties/property-cameras'), (m) => m.PropertyCamerasPage) },
        { path: paths.propertyStands(), ...page(() => import('./routes/properties/property-stands'), (m) => m.PropertyStandsPage) },
        {
          // Preview as client: the portal's pages with the client's scope, writes off.
          path: paths.previewClient(),
          ...page(() => import('./routes/portal/preview-layout'), (m) => m.PreviewLayout),
          children: [
            { index: true, ...page(() => import('./routes/portal/portal-home'), (m) => m.PortalHomePage) },
            ...portalPages,
            { path: 'proposals', ...page(() => import('./routes/portal/preview-proposals'), (m) => m.PreviewProposalsPage) },
            { path: 'properties/:id/seasons', ...page(() => import('./routes/portal/portal-seasons'), (m) => m.PortalSeasonsPage) },
          ],
        },
        // The plan map is its own chunk (maplibre, terra-draw) and takes the shell's full width.
        { path: paths.planMap(), lazy: () => import('./routes/properties/plan-map'), handle: { fullBleed: true } },
      ],
    },
  ]),
  gate(STAFF, [{ path: paths.planPrint(), lazy: () => import('./routes/properties/plan-print') }]),
  gate(['crew', 'owner', 'consultant'], [
    {
      ...page(() => import('./layouts/field-layout'), (m) => m.FieldLayout),
      children: [
        {
          ...page(() => import('./routes/field/field-shell'), (m) => m.FieldShell),
          children: [
            { path: paths.field, loader: fieldHomeLoader, ...page(() => import('./routes/field/field-home'), (m) => m.FieldHomePage) },
            { path: paths.fieldTask(), loader: fieldTaskLoader, ...page(() => import('./routes/field/field-task').then(async (m) => (await m.taskFormsLoaded(), m)), (m) => m.FieldTaskPage) },
            { path: paths.fieldLog, ...page(() => import('./routes/observations/field-log'), (m) => m.FieldLogPage) },
          ],
        },
      ],
    },
  ]),
  gate(['client'], [
    {
      ...page(() => import('./layouts/portal-layout'), (m) => m.PortalLayout),
      children: [
        { path: paths.portal, loader: portalHomeLoader, ...page(() => import('./routes/portal/portal-home'), (m) => m.PortalHomePage) },
        { path: paths.portalProposals, ...page(() => import('./routes/portal/portal-proposals'), (m) => m.PortalProposalsPage) },
        { path: paths.portalProposal(), ...page(() => import('./routes/portal/portal-proposal'), (m) => m.PortalProposalPage) },
        { path: paths.portalInvoices, ...page(() => import('./routes/portal/portal-invoices'), (m) => m.PortalInvoicesPage) },
        { path: paths.portalInvoice(), ...page(() => import('./routes/portal/portal-invoice'), (m) => m.PortalInvoicePage) },
        { path: paths.portalResults, ...page(() => import('./routes/portal/portal-results'), (m) => m.PortalResultsPage) },
        { path: paths.portalPropertyResults(), ...page(() => import('./routes/portal/portal-results'), (m) => m.PortalPropertyResultsPage) },
        { path: paths.portalPropertyStands(), ...page(() => import('./routes/portal/portal-stands'), (m) => m.PortalStandsPage) },
        { path: paths.portalPropertySeasons(), ...page(() => import('./routes/portal/portal-seasons'), (m) => m.PortalSeasonsPage) },
        { path: paths.portalProperty(), loader: portalPropertyLoader, ...page(() => import('./routes/portal/portal-property'), (m) => m.PortalPropertyPage) },
        { path: paths.portalPropertyProgress(), ...page(() => import('./routes/portal/portal-progress'), (m) => m.PortalProgressPage) },
        { path: paths.portalProgress, ...page(() => import('./routes/portal/portal-progress'), (m) => m.PortalProgressHomePage) },
        { path: paths.portalFiles, ...page(() => import('./routes/portal/portal-files'), (m) => m.PortalFilesPage) },
      ],
    },
  ]),
  { path: '*', element: <NotFoundPage /> },
];

let router: ReturnType<typeof createBrowserRouter> | null = null;

/** The app's routes; the router starts on first render, after the kept query cache is restored (main.tsx). */
export function AppRouter() {
  router ??= createBrowserRouter(routes);
  return <RouterProvider router={router} />;
}
