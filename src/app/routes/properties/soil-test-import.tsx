import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../../components/ui/page-header';
import { MissingRecord } from '../../../components/ui/missing-record';
import { SoilCsvImport } from '../../../features/checks/components/soil-csv-import';
import { useProperty } from '../../../lib/resources/property';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

/** A property's soil tests from a lab's file: map the columns, see every row, import all or none. */
export function SoilTestImportPage() {
  const propertyId = parseId(useParams().id) ?? 0;
  const property = useProperty(propertyId);
  if (propertyId === 0 || (property.error instanceof ApiError && property.error.status === 404)) return <MissingRecord what="property" backTo={paths.properties} backLabel="Back to properties" />;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Soil tests from a lab’s file"
        crumbs={[
          { label: 'Properties', to: paths.properties },
          { label: property.data?.name ?? 'Property', to: paths.property(propertyId) },
        ]}
      >
        Each row becomes a soil test of the unit it names, with its lime and P and K worked by the firm’s state method. To type in one result, open the unit from the{' '}
        <Link to={paths.planMap(propertyId)} className="text-moss underline">
          plan map
        </Link>
        .
      </PageHeader>
      <SoilCsvImport propertyId={propertyId} />
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = SoilTestImportPage;
