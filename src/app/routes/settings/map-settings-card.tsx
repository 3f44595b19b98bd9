/**
 * The owner's map choices: the firm's home area (where a new property's map opens), and imagery in
 * one choice — none (the offline state and county lines), the public-domain national imagery, or
 * the firm's own XYZ/WMTS address with its credit line.
 */
import { useState } from 'react';
import { TileUrlTemplateSchema, type FirmDto } from '../../../../shared/schemas/firm';
import { PUBLIC_IMAGERY, imageryPresetOf } from '../../../../shared/domain/imagery';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { useFirm, useUpdateFirmSettings } from '../../../features/firm/api/firm';
import { HomeAreaPicker } from '../../../features/plan-map/components/home-area-picker';

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
        <HomeAreaPicker
          value={s.homeArea}
          emptyText="Not set: new maps open on the whole country."
          onChange={(area, placeName) => save({ homeArea: area }, area ? `Home area: ${placeName ?? area.name}.` : 'Home area cleared.')}
        />
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
