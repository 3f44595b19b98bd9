import { Card } from '../../../components/ui/card';
import { AGE_CLASS_LABELS } from '../../../../shared/schemas/results';
import { formatDay } from '../../../lib/firm-clock';
import { useBucks } from '../api/cameras';

/** The landowner's view of the buck roster: the best photos the consultant chose (never a person), with each buck's age by season. */
export function PortalBuckPhotos({ propertyId }: { propertyId: number }) {
  const bucks = useBucks(propertyId);
  const shown = (bucks.data ?? []).filter((b) => b.photos.length > 0);
  if (shown.length === 0) return null;
  return (
    <Card title="Bucks on your cameras">
      <ul className="grid gap-4 sm:grid-cols-2" aria-label="Bucks on your cameras">
        {shown.map((b) => (
          <li key={b.id} className="flex flex-col gap-1">
            <img src={b.photos[0].url} alt={`${b.name} on a trail camera`} loading="lazy" className="aspect-[4/3] w-full rounded object-cover" />
            <span className="font-semibold">{b.name}</span>
            <span className="text-sm text-slate">
              {b.ageEstimates.length ? `Age ${b.ageEstimates.map((a) => `${a.season}: ${AGE_CLASS_LABELS[a.ageClass]}`).join(', ')}` : 'Age not estimated yet'}
              {b.photos[0].takenAt ? ` · seen ${formatDay(b.photos[0].takenAt)}` : ''}
            </span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
