import { Link } from 'react-router-dom';

/** The preview's constant reminder: what the client sees, nothing can be changed, and the way back. */
export function PreviewBanner({ clientName, backTo }: { clientName: string; backTo: string }) {
  return (
    <div role="region" aria-label="Preview" className="border-b-2 border-ochre bg-ochre/15 px-4 py-2 text-sm text-ink">
      <div className="mx-auto flex max-w-4xl flex-wrap items-center justify-between gap-2">
        <p>
          <strong className="font-serif">Preview: what {clientName} sees.</strong> Buttons that would change anything are turned off.
        </p>
        <Link to={backTo} className="font-semibold text-moss-deep underline">
          Back to the client
        </Link>
      </div>
    </div>
  );
}
