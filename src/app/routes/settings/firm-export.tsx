import { Link } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { FirmExportCard } from '../../../features/firm-export/components/firm-export-card';
import { Card } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

/** Settings · Export: the owner downloads the whole firm as one zip. */
export function FirmExportPage() {
  const me = useMe();
  return (
    <div className="flex flex-col gap-4">
      <div className="flex items-baseline justify-between">
        <h1 className="text-2xl font-bold">Settings · Export</h1>
        <Link className="text-sm text-moss-deep hover:underline" to={paths.team}>
          Back to settings
        </Link>
      </div>
      {me.data?.role === 'owner' ? (
        <FirmExportCard />
      ) : (
        <Card title="Take your data with you">
          <p className="text-sm text-slate">Only the firm’s owner can export the firm’s data. Ask them for a copy.</p>
        </Card>
      )}
    </div>
  );
}
