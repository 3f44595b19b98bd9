import { Link } from 'react-router-dom';

/** Shown for a property that is not the client's (or does not exist): the same words either way. */
export function PortalMissing({ backTo }: { backTo: string }) {
  return (
    <div role="alert" className="mx-auto mt-6 flex max-w-lg flex-col items-center gap-2 rounded-md border border-rule bg-card px-6 py-8 text-center">
      <h1 className="text-xl font-bold">This property is not in your portal</h1>
      <p className="text-sm text-slate">The link may be mistyped, or the property belongs to another account. Your own land is listed under Your land.</p>
      <Link to={backTo} className="mt-2 font-semibold text-moss-deep underline">
        Back to your land
      </Link>
    </div>
  );
}
