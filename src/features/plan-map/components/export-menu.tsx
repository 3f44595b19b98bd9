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
  return (
    <details className="relative">
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
