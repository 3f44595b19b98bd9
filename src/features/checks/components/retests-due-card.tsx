import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import { formatDay } from '../../../lib/firm-clock';
import { paths } from '../../../config/paths';
import { useRetestsDue } from '../api/soil-tests';

/** The Desk's list of units whose soil test is due again (the firm's interval, default 3 years); nothing when none is. */
export function RetestsDueCard() {
  const due = useRetestsDue();
  if (!due.data || due.data.length === 0) return null;
  return (
    <Card title="Soil retests due">
      <ul className="flex flex-col gap-1.5 text-sm">
        {due.data.map((t) => (
          <li key={t.id} className="flex justify-between gap-2">
            <Link to={paths.unitChecks(t.propertyId, t.unitId)} className="text-moss-deep hover:underline">
              {t.unitName}
            </Link>
            <span className="text-slate">due {formatDay(t.retestDue)}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
