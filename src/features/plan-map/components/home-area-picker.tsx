/**
 * The firm's home area picker: a county or town from the place search, shown as "Now: …" with a way
 * to clear it. Settings → Maps saves each pick; the sign-up form keeps it until the firm is created
 * (and searches through the public `GET /api/signup/places`).
 */
import type { HomeArea } from '../../../../shared/schemas/firm';
import type { PlaceDto } from '../../../../shared/schemas/places';
import { PlaceSearch } from './place-search';

/** A found place as a home area: a county's own box, or about 20 km around a town or point. */
export function homeAreaOf(place: PlaceDto): HomeArea {
  if (place.bbox) return { name: place.name, bbox: place.bbox };
  const [lon, lat] = place.center;
  const r = (v: number) => Math.round(v * 1e5) / 1e5;
  return { name: place.name, bbox: [r(lon - 0.12), r(lat - 0.09), r(lon + 0.12), r(lat + 0.09)] };
}

/** "Now: <home area> · Clear" above the place search; `onChange(null)` clears. */
export function HomeAreaPicker({ value, onChange, emptyText, source }: { value: HomeArea | null; onChange: (area: HomeArea | null, placeName?: string) => void; emptyText: string; source?: string }) {
  return (
    <>
      <p className="text-sm" data-testid="home-area">
        {value ? (
          <>
            Now: <strong>{value.name}</strong>{' '}
            <button type="button" className="text-moss-deep hover:underline" onClick={() => onChange(null)}>
              Clear
            </button>
          </>
        ) : (
          <span className="text-slate">{emptyText}</span>
        )}
      </p>
      <PlaceSearch source={source} onPick={(place) => onChange(homeAreaOf(place), place.name)} />
    </>
  );
}
