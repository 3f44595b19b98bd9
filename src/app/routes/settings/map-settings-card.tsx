/**
 * The owner's map choices: the firm's home area (where a new property's map opens), and imagery in
 * one choice — none (the offline state and county lines), the public-domain national imagery, or
 * the firm's own XYZ/WMTS address with its credit line.
 */
import { useState } from 'react';
import { TileUrlTemplateSchema, type FirmDto, type HomeArea } from '../../../../shared/schemas/firm';
import type { PlaceDto } from '../../../../shared/schemas/places';
import { PUBLIC_IMAGERY, imageryPresetOf } from '../../../../shared/domain/imagery';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { useFirm, useUpdateFirmSettings } from '../../../features/firm/api/firm';
import { PlaceSearch } from '../../../features/plan-map/components/place-search';

/** A found place as a home area: a county's own box, or about 20 km around a town or point. */
export function homeAreaOf(place: PlaceDto): HomeArea {
  if (place.bbox) return { name: place.name, bbox: place.bbox };
  const [lon, lat] = place.center;
  const r = (v: number) => Math.round(v * 1e5) / 1e5;
  return { name: place.name, bbox: [r(lon - 0.12), r(lat - 0.09), r(lon + 0.12), r(lat + 0.09)] };
}

/** Home area and imagery, for the firm's owner. */
export function MapSettingsCard() {
  const firm = useFirm();
  return (
    <Card title="Maps">
      {firm.isPending ? <Loading /> : firm.isError ? <ErrorPanel error={firm.error} /> : <MapSettingsFields firm={firm.data} />}
    </Card>
  );
}

function MapSettingsFields({ firm }: { firm: FirmDto }) {
  const update = useUpdateFirmSettings();
  const toast = useToast();
  const s = firm.settings;
  const preset = imageryPresetOf(s.tileUrlTemplate);
  const [own, setOwn] = useState({ url: preset ? '' : (s.tileUrlTemplate ?? ''), credit: preset ? '' : (s.tileAttribution ?? '') });
  const [ownError, setOwnError] = useState<string | undefined>();
  const save = (input: Parameters<typeof update.mutate>[0], done: string) => update.mutate(input, { onSuccess: () => toast('success', done), onError: (e) => toast('error', e.message) });

  const saveOwn = () => {
    const parsed = TileUrlTemplateSchema.safeParse(own.url);
    if (!parsed.success) return setOwnError(parsed.error.issues[0]?.message);
    setOwnError(undefined);
    save({ tileUrlTemplate: parsed.data, tileAttribution: own.credit.trim() || null }, 'The firm’s own imagery is on.');
  };

  return (
    <div className="grid gap-5 md:grid-cols-2">
      <section aria-label="Home area" className="flex flex-col gap-2">
        <h3 className="text-sm font-semibold text-ink">Home area</h3>
        <p className="text-sm text-slate">A new property’s map opens here. Find a county or town where the firm works.</p>
        <p className="text-sm" data-testid="home-area">
          {s.homeArea ? (
            <>
              Now: <strong>{s.homeArea.name}</strong>{' '}
              <button type="button" className="text-moss-deep hover:underline" onClick={() => save({ homeArea: null }, 'Home area cleared.')}>
                Clear
              </button>
            </>
          ) : (
            <span className="text-slate">Not set: new maps open on the whole country.</span>
          )}
        </p>
        <PlaceSearch onPick={(place) => save({ homeArea: homeAreaOf(place) }, `Home area: ${place.name}.`)} />
      </section>
      <section aria-label="Imagery" className="flex flex-col gap-2">
        <h3 className="text-sm font-semibold text-ink">Imagery under the plan</h3>
        <p className="text-sm text-slate">
          Now: <strong data-testid="imagery-choice">{!s.tileUrlTemplate ? 'None — state and county lines only (works offline)' : preset ? preset.label : 'The firm’s own service'}</strong>
        </p>
        <div className="flex flex-wrap gap-2">
          <Button type="button" variant={preset ? 'secondary' : 'primary'} disabled={!!preset} busy={update.isPending} onClick={() => save({ tileUrlTemplate: PUBLIC_IMAGERY.tileUrlTemplate, tileAttribution: PUBLIC_IMAGERY.attribution }, 'USGS imagery is on.')}>
            Use USGS imagery (public domain)
          </Button>
          {s.tileUrlTemplate ? (
            <Button type="button" variant="secondary" onClick={() => save({ tileUrlTemplate: null, tileAttribution: null }, 'Imagery is off.')}>
              No imagery
            </Button>
          ) : null}
        </div>
        <details className="text-sm">
          <summary className="cursor-pointer text-moss-deep">Use the firm’s own imagery service</summary>
          <div className="mt-2 flex flex-col gap-2">
            <TextField
              label="Tile address (XYZ or WMTS)"
              placeholder="https://tiles.example.com/{z}/{x}/{y}.jpg"
              hint="https only. An XYZ address with {z}, {x} and {y}, or a WMTS address with {TileMatrix}, {TileRow} and {TileCol} in Web Mercator."
              error={ownError}
              value={own.url}
              onChange={(e) => setOwn({ ...own, url: e.target.value })}
            />
            <TextField label="Credit line" placeholder="Imagery © your provider" value={own.credit} maxLength={200} onChange={(e) => setOwn({ ...own, credit: e.target.value })} />
            <div>
              <Button type="button" busy={update.isPending} onClick={saveOwn}>
                Use this service
              </Button>
            </div>
          </div>
        </details>
        <p className="text-xs text-slate">Only the chosen service’s address is allowed to load images in the firm’s pages.</p>
      </section>
    </div>
  );
}
