import { Outlet, useParams } from 'react-router-dom';
import { PortalScopeProvider, previewScope } from '../../../features/portal/api/portal-scope';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { PortalNav } from '../../../features/portal/components/portal-nav';
import { PreviewBanner } from '../../../features/portal/components/preview-banner';
import { MissingRecord } from '../../../components/ui/missing-record';
import { paths } from '../../../config/paths';
import { parseId } from '../../../lib/route-params';
import { ApiError } from '../../../lib/api-client';

function PreviewFrame({ clientId }: { clientId: number }) {
  const home = usePortalProperties();
  if (home.error instanceof ApiError && home.error.status === 404) return <MissingRecord what="client" backTo={paths.clients} backLabel="Back to clients" />;
  return (
    <div className="-mx-4 -my-4 flex flex-col sm:-mx-6 sm:-my-6">
      <PreviewBanner clientName={home.data?.client.name ?? 'the client'} backTo={paths.client(clientId)} />
      <div className="border-b border-rule bg-card">
        <PortalNav />
      </div>
      <div className="mx-auto w-full max-w-4xl px-4 py-6">
        <Outlet />
      </div>
    </div>
  );
}

/** The consultant's "preview as client": the portal's pages with the client's scope, read through the staff preview API, writes off. */
export function PreviewLayout() {
  const clientId = parseId(useParams().clientId);
  if (clientId === null) return <MissingRecord what="client" backTo={paths.clients} backLabel="Back to clients" />;
  return (
    <PortalScopeProvider scope={previewScope(clientId)}>
      <PreviewFrame clientId={clientId} />
    </PortalScopeProvider>
  );
}
