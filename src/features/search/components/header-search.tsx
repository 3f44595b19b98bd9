import { useEffect, useId, useState, type KeyboardEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSearch } from '../api/search';
import { SEARCH_MAX_CHARS, searchText, type SearchKind } from '../../../../shared/schemas/search';

const KIND_LABEL: Record<SearchKind, string> = { client: 'Client', property: 'Property', proposal: 'Proposal', invoice: 'Invoice', contact: 'Contact' };

/** The text after the person stops typing for a moment. */
function useSettled(value: string, ms: number): string {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

/** The header's search box: clients, properties, proposals and invoices by number, contacts; typos forgiven. */
export function HeaderSearch() {
  const navigate = useNavigate();
  const listId = useId();
  const [text, setText] = useState('');
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const q = useSettled(text, 150);
  const searchable = searchText(q) !== null;
  const results = useSearch(q);
  const hits = searchable ? (results.data ?? []) : [];
  const show = open && searchable && (results.isSuccess || results.isError);

  const go = (href: string) => {
    setOpen(false);
    setText('');
    navigate(href);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'ArrowDown') {
      e.preventDefault();
      setActive((i) => Math.min(i + 1, hits.length - 1));
    } else if (e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((i) => Math.max(i - 1, 0));
    } else if (e.key === 'Enter') {
      e.preventDefault();
      const hit = hits[active];
      if (hit) go(hit.href);
    } else if (e.key === 'Escape') {
      setOpen(false);
    }
  };

  return (
    <div role="search" className="relative ml-auto hidden sm:block">
      <label className="sr-only" htmlFor="global-search">
        Search clients, properties, proposals, invoices and contacts
      </label>
      <input
        id="global-search"
        type="search"
        role="combobox"
        aria-expanded={show}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={show && hits[active] ? `${listId}-${active}` : undefined}
        autoComplete="off"
        maxLength={SEARCH_MAX_CHARS}
        value={text}
        onChange={(e) => {
          setText(e.target.value);
          setActive(0);
          setOpen(true);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => setTimeout(() => setOpen(false), 150)}
        onKeyDown={onKeyDown}
        placeholder="Search clients, numbers…"
        className="w-64 rounded border border-rule bg-paper px-3 py-1.5 text-sm focus:border-moss focus:outline-none"
      />
      {show ? (
        <ul id={listId} role="listbox" aria-label="Search results" className="absolute right-0 z-50 mt-1 max-h-96 w-96 overflow-y-auto rounded border border-rule bg-card py-1 shadow-lg">
          {results.isError ? (
            <li className="px-3 py-2 text-sm text-slate">Search is not answering just now. Try again in a moment.</li>
          ) : hits.length === 0 ? (
            <li className="px-3 py-2 text-sm text-slate">Nothing matches “{q.trim()}”. Try part of a name, or a proposal or invoice number.</li>
          ) : (
            hits.map((h, i) => (
              <li
                key={`${h.kind}-${h.id}`}
                id={`${listId}-${i}`}
                role="option"
                aria-selected={i === active}
                onMouseDown={(e) => {
                  e.preventDefault();
                  go(h.href);
                }}
                onMouseEnter={() => setActive(i)}
                className={`flex cursor-pointer items-baseline gap-2 px-3 py-1.5 text-sm ${i === active ? 'bg-moss/10' : ''}`}
              >
                <span className="w-16 shrink-0 text-xs uppercase tracking-wide text-slate">{KIND_LABEL[h.kind]}</span>
                <span className="min-w-0 flex-1">
                  <span className="block truncate font-semibold text-ink">{h.label}</span>
                  {h.sublabel ? <span className="block truncate text-xs text-slate">{h.sublabel}</span> : null}
                </span>
              </li>
            ))
          )}
        </ul>
      ) : null}
    </div>
  );
}
