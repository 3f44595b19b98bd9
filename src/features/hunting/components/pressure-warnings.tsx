import { Link } from 'react-router-dom';
import { usePressureWarnings } from '../api/pressure';

/** A warning for each stand sat more than the firm's weekly limit (Desk and portal); nothing when none. */
export function PressureWarnings({ linkTo }: { linkTo: (propertyId: number) => string }) {
  const warnings = usePressureWarnings();
  if (!warnings.data?.length) return null;
  return (
    <aside role="note" aria-label="Hunting pressure" className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm">
      <p className="mb-1 font-semibold text-[#8E3F2A]">Stands sat too often this week</p>
      <ul className="list-disc pl-5">
        {warnings.data.map((w) => (
          <li key={w.unitId}>
            {w.propertyName}: {w.message} <Link className="underline" to={linkTo(w.propertyId)}>Stands &amp; wind</Link>
          </li>
        ))}
      </ul>
    </aside>
  );
}
