import { Link } from 'react-router-dom';

/** Shown when the address names a record that does not exist in the firm (deleted, or a mistyped link). */
export function MissingRecord({ what, backTo, backLabel }: { what: string; backTo: string; backLabel: string }) {
  return (
    <div role="alert" className="mx-auto mt-8 flex max-w-lg flex-col items-center gap-2 rounded-md border border-rule bg-card px-6 py-8 text-center">
      <h1 className="text-xl font-bold">This {what} is not in your firm’s records</h1>
      <p className="text-sm text-slate">It may have been deleted, or the link is mistyped.</p>
      <Link to={backTo} className="mt-2 font-semibold text-moss-deep underline">
        {backLabel}
      </Link>
    </div>
  );
}
