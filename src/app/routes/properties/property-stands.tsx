import { useParams } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { useProperty } from '../../../lib/resources/property';
import { StandsPage } from '../../../features/hunting/components/stands-page';
import { PageHeader } from '../../../components/ui/page-header';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

/** Stands & wind for the consultant: winds per stand with reasons, today's wind, sits, pressure, the wind record. */
export function PropertyStandsPage() {
  const id = parseId(useParams().id) ?? 0;
  const me = useMe();
  const property = useProperty(id);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Stands & wind" crumbs={[{ label: 'Properties', to: paths.properties }, { label: property.data?.name ?? '…', to: paths.property(id) }]}>
        Which winds suit each stand, the way to walk in, the sit log and hunting pressure
      </PageHeader>
      {me.data ? <StandsPage propertyId={id} userId={me.data.id} canEdit /> : null}
    </div>
  );
}
