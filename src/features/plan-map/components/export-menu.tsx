import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';

const FORMATS = [
  { format: 'geojson', label: 'GeoJSON', hint: 'for GIS software' },
  { format: 'kml', label: 'KML', hint: 'for Google Earth' },
  { format: 'gpx', label: 'GPX', hint: 'for GPS units' },
  { format: 'csv', label: 'CSV', hint: 'a table of units' },
] as const;

/** Export links (the server answers a file to download) and the print view. */
export function ExportMenu({ propertyId }: { propertyId: number }) {
  const ref = useRef<HTMLDetailsElement>(null);
  // Close the menu on a click elsewhere or Escape, as menus do.
  useEffect(() => {
    const close = (e: Event) => {
      const el = ref.current;
      if (!el?.open) return;
      if (e instanceof KeyboardEvent ? e.key === 'Escape' : !el.contains(e.target as Node)) el.open = false;
    };
    document.addEventListener('pointerdown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('pointerdown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);
  return (
    <details ref={ref} className="relative">
      <summary className="inline-flex cursor-pointer list-none items-center gap-1 rounded border border-rule bg-card px-3 py-1.5 text-sm font-semibold text-ink hover:border-moss hover:text-moss-deep">
        Export <span aria-hidden>▾</span>
      </summary>
      <ul className="absolute right-0 z-20 mt-1 w-56 rounded border border-rule bg-card py-1 text-sm shadow-md">
        {FORMATS.map((f) => (
          <li key={f.format}>
            <a className="flex justify-between gap-2 px-3 py-1.5 hover:bg-rule/40" href={`/api/properties/${propertyId}/export?format=${f.format}`} download>
              <span className="font-semibold">{f.label}</span>
              <span className="text-slate">{f.hint}</span>
            </a>
          </li>
        ))}
        <li className="border-t border-rule">
          <Link className="flex justify-between gap-2 px-3 py-1.5 hover:bg-rule/40" to={paths.planPrint(propertyId)}>
            <span className="font-semibold">Print</span>
            <span className="text-slate">map, legend, units</span>
          </Link>
        </li>
      </ul>
    </details>
  );
}
