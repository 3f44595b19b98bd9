import { useState } from 'react';
import { coordinatesText, directionsLink, platformOf } from '../lib/directions';

/** "Open in maps" for this phone (Apple Maps on an iPhone, the geo URI elsewhere) and "Copy coordinates". */
export function Directions({ location, label }: { location: [number, number] | null; label: string }) {
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  const href = directionsLink(location, label, platformOf(navigator.userAgent, navigator.maxTouchPoints));
  const text = coordinatesText(location);
  if (!href || !text) return null;
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setCopied('yes');
    } catch {
      setCopied('failed');
    }
  };
  return (
    <div className="flex flex-col gap-2">
      <a href={href} target={href.startsWith('https:') ? '_blank' : undefined} rel="noreferrer" className="inline-flex min-h-12 items-center justify-center gap-2 rounded border border-moss bg-card px-4 py-2 text-base font-semibold text-moss-deep">
        Open in maps
        <span className="text-xs font-normal text-slate">({text})</span>
      </a>
      <div className="flex items-center gap-2 text-sm">
        <button type="button" onClick={() => void copy()} className="min-h-11 rounded border border-rule bg-card px-3 py-2 font-semibold">
          Copy coordinates
        </button>
        <output aria-live="polite" className="text-slate">
          {copied === 'yes' ? `Copied ${text}` : copied === 'failed' ? `Copy by hand: ${text}` : null}
        </output>
      </div>
    </div>
  );
}
