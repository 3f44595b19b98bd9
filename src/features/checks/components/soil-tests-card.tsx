import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { formatDay } from '../../../lib/firm-clock';
import { useApplySoilTest, useUnitSoilTests } from '../api/soil-tests';

/** A unit's soil tests with the lime and P and K each recommends, its source, and "Use in the prescription". */
export function SoilTestsCard({ unitId }: { unitId: number }) {
  const tests = useUnitSoilTests(unitId);
  const apply = useApplySoilTest();
  const toast = useToast();
  if (!tests.data || tests.data.length === 0) return null;
  return (
    <Card title="Soil tests">
      <ul className="flex flex-col gap-3 text-sm">
        {tests.data.map((t) => (
          <li key={t.id}>
            <p>
              <strong>{formatDay(t.sampledOn)}</strong>, {t.lab}: pH {t.ph}
              {t.pPpm !== null ? `, P ${t.pPpm} ppm` : ''}
              {t.kPpm !== null ? `, K ${t.kPpm} ppm` : ''}
              {t.labMethod === 'mehlich-3' && (t.pPpm !== null || t.kPpm !== null) ? ' (Mehlich-3)' : ''}. Retest due {formatDay(t.retestDue)}.
            </p>
            <p>
              Lime {t.lime.tonsPerAcre} t/acre to pH {t.lime.targetPh}; P2O5 {t.nutrients.p2o5LbPerAcre}, K2O {t.nutrients.k2oLbPerAcre} lb/acre.
            </p>
            <p className="text-xs text-slate">
              {t.lime.working}. Source: {t.lime.source}; P and K {t.nutrients.source}.
            </p>
            {t.appliedPrescriptionId ? (
              <p className="text-xs text-moss-deep">Written into the prescription.</p>
            ) : (
              <Button size="sm" variant="secondary" className="mt-1" busy={apply.isPending} onClick={() => apply.mutate(t.id, { onSuccess: () => toast('success', 'Lime and fertilizer written into the prescription; edit them there if needed.'), onError: (e) => toast('error', e instanceof ApiError ? e.message : 'Nothing changed. Try again.') })}>
                Use in the prescription
              </Button>
            )}
          </li>
        ))}
      </ul>
    </Card>
  );
}
