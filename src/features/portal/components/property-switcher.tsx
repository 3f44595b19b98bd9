import { useId } from 'react';
import { useNavigate } from 'react-router-dom';
import type { PortalPropertyRow } from '../../../../shared/schemas/portal';

/** Switches between the client's properties, keeping the page (plan or progress); hidden with a single property. */
export function PropertySwitcher({ properties, currentId, linkFor }: { properties: PortalPropertyRow[]; currentId: number; linkFor: (id: number) => string }) {
  const navigate = useNavigate();
  const id = useId();
  if (properties.length < 2) return null;
  return (
    <div className="flex flex-col gap-1 text-sm sm:flex-row sm:items-center sm:gap-2">
      <label htmlFor={id} className="font-semibold text-ink">
        Property
      </label>
      <select
        id={id}
        value={currentId}
        onChange={(e) => navigate(linkFor(Number(e.target.value)))}
        className="min-h-11 rounded border border-rule bg-card px-3 py-2 text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/40 sm:min-h-0 sm:py-1.5"
      >
        {properties.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </select>
    </div>
  );
}
