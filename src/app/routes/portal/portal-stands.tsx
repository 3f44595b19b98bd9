import { useParams } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { usePortalProperty } from '../../../features/portal/api/get-portal-property';
import { StandsPage } from '../../../features/hunting/components/stands-page';
import { PageHeader } from '../../../components/ui/page-header';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

/** Stands & wind for the landowner's hunters: pick today's wind, see the stands that suit it, log the sit (offline-safe). */
export function PortalStandsPage() {
  const id = parseId(useParams().id) ?? 0;
  const me = useMe();
  const property = usePortalProperty(id);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Stands & wind" crumbs={[{ label: 'Your land', to: paths.portal }, { label: property.data?.property.name ?? '…', to: paths.portalProperty(id) }]}>
        Pick the wind now to see which stands suit it and how to walk in
      </PageHeader>
      {me.data ? <StandsPage propertyId={id} userId={me.data.id} canEdit={false} /> : null}
    </div>
  );
}
