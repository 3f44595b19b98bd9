/** The portal's Results: the map of sign logged on the client's land, the counts, and — when the consultant allows it — "Log sign". */
import { lazy, Suspense, useState } from 'react';
import type { MultiPolygon, Polygon } from 'geojson';
import { Card, Loading } from '../../../components/ui/card';
import { LogSignLauncher } from './log-sign-launcher';
import { ObservationSummary } from './observation-summary';

const ObservationMap = lazy(() => import('./observation-map'));

export function PortalObservations({ propertyId, propertyName, boundary, logAs }: { propertyId: number; propertyName: string; boundary?: Polygon | MultiPolygon | null; logAs?: number | null }) {
  const [logging, setLogging] = useState(false);
  const [tapped, setTapped] = useState<{ lon: number; lat: number } | null>(null);
  return (
    <section aria-labelledby="portal-observations" className="flex flex-col gap-3">
      <h2 id="portal-observations" className="text-lg font-bold">
        Sign on the ground
      </h2>
      {logAs ? <LogSignLauncher userId={logAs} properties={[{ id: propertyId, name: propertyName }]} defaultPropertyId={propertyId} mapPosition={tapped} onOpenChange={setLogging} /> : null}
      <Card>
        <Suspense fallback={<Loading label="Loading the map…" />}>
          <ObservationMap propertyId={propertyId} boundary={boundary} onTap={logging ? setTapped : undefined} />
        </Suspense>
        <div className="mt-3">
          <ObservationSummary propertyId={propertyId} />
        </div>
      </Card>
    </section>
  );
}
