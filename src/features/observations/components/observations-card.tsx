/** The property page's card: log a sign (tap the map or use the phone's position), the map of observations, and the counts. */
import { lazy, Suspense, useState } from 'react';
import type { MultiPolygon, Polygon } from 'geojson';
import { Card, Loading } from '../../../components/ui/card';
import { LogSignLauncher } from './log-sign-launcher';
import { ObservationSummary } from './observation-summary';

const ObservationMap = lazy(() => import('./observation-map'));

export function ObservationsCard({ userId, propertyId, propertyName, boundary }: { userId: number; propertyId: number; propertyName: string; boundary?: Polygon | MultiPolygon | null }) {
  const [logging, setLogging] = useState(false);
  const [tapped, setTapped] = useState<{ lon: number; lat: number } | null>(null);
  return (
    <div className="flex flex-col gap-3">
      <LogSignLauncher userId={userId} properties={[{ id: propertyId, name: propertyName }]} defaultPropertyId={propertyId} mapPosition={tapped} onOpenChange={setLogging} />
      <Card title="Field observations">
        <Suspense fallback={<Loading label="Loading the map…" />}>
          <ObservationMap propertyId={propertyId} boundary={boundary} onTap={logging ? setTapped : undefined} />
        </Suspense>
        <div className="mt-3">
          <ObservationSummary propertyId={propertyId} />
        </div>
      </Card>
    </div>
  );
}
