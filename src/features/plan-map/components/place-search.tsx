import { useEffect, useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PlaceDto } from '../../../../shared/schemas/places';

const KIND_WORD: Record<PlaceDto['kind'], string> = { county: 'county', town: 'town', coordinates: 'point' };

/**
 * One box that finds a county, a town or typed coordinates; choosing a result hands it to the map.
 * `source` is the search address (the signed-in `/api/places`, or the sign-up page's public one).
 */
export function PlaceSearch({ onPick, source = '/api/places' }: { onPick: (place: PlaceDto) => void; source?: string }) {
  const [text, setText] = useState('');
  const [query, setQuery] = useState('');
  const [open, setOpen] = useState(false);
  const listId = useId();
  useEffect(() => {
    const t = setTimeout(() => setQuery(text.trim()), 150);
    return () => clearTimeout(t);
  }, [text]);
  const places = useQuery({
    queryKey: ['places', source, query],
    queryFn: ({ signal }) => getData<PlaceDto[]>(`${source}?q=${encodeURIComponent(query)}`, signal),
    enabled: query.length >= 2,
    staleTime: Infinity,
  });
  const results = query.length >= 2 ? (places.data ?? []) : [];
  const pick = (p: PlaceDto) => {
    onPick(p);
    setText(p.name);
    setOpen(false);
  };
  return (
    <div className="relative max-w-full" style={{ width: '18rem' }}>
      <input
        type="search"
        aria-label="Find a place"
        aria-controls={listId}
        aria-expanded={open && results.length > 0}
        role="combobox"
        placeholder="Find a county, town or coordinates"
        maxLength={200}
        value={text}
        onChange={(e) => {
          setText(e.target.value);
          setOpen(true);
        }}
        onKeyDown={(e) => {
          if (e.key === 'Enter' && results[0]) {
            e.preventDefault();
            pick(results[0]);
          } else if (e.key === 'Escape') setOpen(false);
        }}
        className="w-full rounded border border-rule bg-card/95 px-3 py-1.5 text-sm text-ink shadow-sm placeholder:text-slate/70 focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30"
      />
      {open && query.length >= 2 ? (
        <ul id={listId} role="listbox" aria-label="Places found" className="absolute inset-x-0 mt-1 overflow-y-auto rounded border border-rule bg-card text-sm shadow-md" style={{ top: '100%', maxHeight: '18rem' }}>
          {places.isError ? (
            <li className="px-3 py-2 text-clay">{places.error.message}</li>
          ) : results.length === 0 ? (
            <li className="px-3 py-2 text-slate">{places.isPending ? 'Looking…' : 'No county, town or coordinates match.'}</li>
          ) : (
            results.map((p) => (
              <li key={`${p.kind}-${p.name}`} role="option" aria-selected={false} onMouseDown={(e) => e.preventDefault()} onClick={() => pick(p)} className="flex cursor-pointer justify-between gap-2 px-3 py-1.5 hover:bg-paper">
                <span className="text-ink">{p.name}</span>
                <span className="text-xs text-slate">{KIND_WORD[p.kind]}</span>
              </li>
            ))
          )}
          <li role="presentation" className="border-t border-rule px-3 py-1 text-[11px] text-slate">
            Towns from <a href="https://www.geonames.org/" target="_blank" rel="noreferrer" className="underline">GeoNames</a> (CC BY 4.0); counties from the U.S. Census Bureau.
          </li>
        </ul>
      ) : null}
    </div>
  );
}
