import { Link } from 'react-router-dom';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { usePractices } from '../../../features/library/api/get-practices';
import { PLANTING_WINDOWS } from '../../../../shared/domain/planting-windows';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { paths } from '../../../config/paths';

const MEASURE_WORDS = { acres: 'per acre', feet: 'per foot', each: 'per item' } as const;

/** The firm's practices: what each fits, its season window and how many steps it has. */
export function PracticesPage() {
  const practices = usePractices();
  return (
    <Card>
      {practices.isPending ? (
        <Loading />
      ) : practices.isError ? (
        <ErrorPanel error={practices.error} />
      ) : practices.data.length === 0 ? (
        <EmptyState title="No practices yet">Every firm starts with a starter library; duplicate a practice to make your own.</EmptyState>
      ) : (
        <table className="w-full text-sm">
          <thead>
            <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
              <th className="py-2 font-semibold">Practice</th>
              <th className="py-2 font-semibold">Fits</th>
              <th className="py-2 font-semibold">Season window</th>
              <th className="py-2 text-right font-semibold">Steps</th>
            </tr>
          </thead>
          <tbody>
            {practices.data.map((p) => (
              <tr key={p.id} className="border-b border-rule/60 align-top last:border-0">
                <th scope="row" className="py-2 pr-3 text-left font-semibold">
                  <Link to={paths.practice(p.id)} className="text-moss-deep hover:underline">
                    {p.name}
                  </Link>
                  <span className="block text-xs font-normal text-slate">Priced {MEASURE_WORDS[p.measure]}</span>
                </th>
                <td className="py-2 pr-3">
                  <ul className="flex flex-wrap gap-1">
                    {p.unitKinds.map((k) => (
                      <li key={k} className="inline-flex items-center gap-1 rounded border border-rule bg-paper px-1.5 py-0.5 text-xs">
                        <span aria-hidden className="inline-block size-2.5 rounded-sm" style={{ backgroundColor: KIND_STYLES[k].fill }} />
                        {KIND_STYLES[k].label}
                      </li>
                    ))}
                  </ul>
                </td>
                <td className="py-2 pr-3 text-slate">{PLANTING_WINDOWS[p.windowKey].label}</td>
                <td className="py-2 text-right tabular-nums">{p.steps.length}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Card>
  );
}
