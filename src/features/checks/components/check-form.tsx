import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { ApiError } from '../../../lib/api-client';
import { firmToday } from '../../../lib/firm-clock';
import { formatNumber } from '../../../lib/format';
import { browseResult, establishmentResult, timberResult, WEED_PRESSURES, type WeedPressure } from '../../../../shared/domain/plot-checks';
import { CHECK_KIND_LABELS, UnitCheckCreateSchema, type CheckKind, type UnitCheckCreateInput, type UnitCheckDto } from '../../../../shared/schemas/checks';
import { describeIssues } from '../lib/describe-issues';

interface Row {
  species: string;
  a: string;
  b: string;
}

const num = (text: string): number => (text.trim() === '' ? Number.NaN : Number(text));

/** The body a form's fields make, or null when a row is still blank. */
function bodyOf(kind: CheckKind, fields: { checkedOn: string; frameSqFt: string; groundCoverPct: string; weedPressure: WeedPressure; baf: string; target: string; rows: Row[] }): UnitCheckCreateInput {
  const rows = fields.rows.filter((r) => r.species.trim() !== '' || r.a.trim() !== '' || r.b.trim() !== '');
  if (kind === 'establishment') {
    return { kind, checkedOn: fields.checkedOn, frameSqFt: num(fields.frameSqFt), groundCoverPct: num(fields.groundCoverPct), weedPressure: fields.weedPressure, samples: rows.map((r) => ({ species: r.species, plants: num(r.a) })) };
  }
  if (kind === 'browse') return { kind, checkedOn: fields.checkedOn, pairs: rows.map((r) => ({ species: r.species, caged: num(r.a), open: num(r.b) })) };
  return {
    kind,
    checkedOn: fields.checkedOn,
    baf: num(fields.baf),
    ...(fields.target.trim() ? { targetResidualBaSqFtPerAcre: num(fields.target) } : {}),
    points: rows.map((r) => ({ inTrees: num(r.a), ...(r.b.trim() ? { dbhIn: num(r.b) } : {}) })),
  };
}

/** A preview line computed in the browser with the same shared functions the server uses; null until the fields make sense. */
function previewOf(body: UnitCheckCreateInput): string | null {
  try {
    if (body.kind === 'establishment') {
      const r = establishmentResult({ frameSqFt: body.frameSqFt, samples: body.samples, groundCoverPct: body.groundCoverPct, weedPressure: body.weedPressure });
      return `${r.status[0]!.toUpperCase()}${r.status.slice(1)}: ${r.species.map((s) => `${s.species} ${formatNumber(s.plantsPerSqFt, 1)}/ft²${s.targetPlantsPerSqFt ? ` of ${s.targetPlantsPerSqFt}` : ''}`).join(' · ')}`;
    }
    if (body.kind === 'browse') {
      const r = browseResult(body.pairs);
      return `Use ${formatNumber(r.overallUsePct)} %: ${r.species.map((s) => `${s.species} ${formatNumber(s.usePct)} %${s.jacobsD === null ? '' : ` (D ${s.jacobsD.toFixed(2)})`}`).join(' · ')}`;
    }
    const r = timberResult({ baf: body.baf, points: body.points.map((p) => ({ inTrees: p.inTrees, dbhIn: typeof p.dbhIn === 'number' ? p.dbhIn : undefined })), targetResidualBaSqFtPerAcre: body.targetResidualBaSqFtPerAcre });
    return `${formatNumber(r.basalAreaSqFtPerAcre)} ft²/acre basal area${r.treesPerAcre === null ? '' : `, ${formatNumber(r.treesPerAcre)} trees/acre`}${r.excessBaSqFtPerAcre ? `, ${formatNumber(r.excessBaSqFtPerAcre)} over the target` : ''}`;
  } catch {
    return null;
  }
}

const COLUMNS: Record<CheckKind, [string, string | null]> = {
  establishment: ['Plants in the frame', null],
  browse: ['Caged', 'Open'],
  timber: ['In-trees', 'Mean DBH, in (optional)'],
};

/** One form for the three kinds of check, with a live preview; `onSubmit` sends it (the page directly, the field sheet through its queue). */
export function CheckForm({ kinds, saving, onSubmit }: { kinds: readonly CheckKind[]; saving: boolean; onSubmit: (input: UnitCheckCreateInput) => Promise<UnitCheckDto | void> }) {
  const [kind, setKind] = useState<CheckKind>(kinds[0]!);
  const [checkedOn, setCheckedOn] = useState(firmToday());
  const [frameSqFt, setFrameSqFt] = useState('1');
  const [groundCoverPct, setGroundCoverPct] = useState('');
  const [weedPressure, setWeedPressure] = useState<WeedPressure>('low');
  const [baf, setBaf] = useState('10');
  const [target, setTarget] = useState('');
  const [rows, setRows] = useState<Row[]>([{ species: '', a: '', b: '' }]);
  const [error, setError] = useState<string | null>(null);
  const body = bodyOf(kind, { checkedOn, frameSqFt, groundCoverPct, weedPressure, baf, target, rows });
  const preview = useMemo(() => previewOf(body), [JSON.stringify(body)]); // eslint-disable-line react-hooks/exhaustive-deps
  const [a, b] = COLUMNS[kind];
  const setRow = (i: number, patch: Partial<Row>) => setRows((old) => old.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    const parsed = UnitCheckCreateSchema.safeParse(body);
    if (!parsed.success) return setError(describeIssues(parsed.error.issues));
    setError(null);
    try {
      await onSubmit(body);
      setRows([{ species: '', a: '', b: '' }]);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'The check was not saved. Try again.');
    }
  }

  return (
    <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-3" noValidate aria-label="Record a check">
      {kinds.length > 1 ? (
        <SelectField label="Kind of check" value={kind} onChange={(e) => setKind(e.target.value as CheckKind)}>
          {kinds.map((k) => (
            <option key={k} value={k}>
              {CHECK_KIND_LABELS[k]}
            </option>
          ))}
        </SelectField>
      ) : null}
      <TextField label="Checked on" type="date" value={checkedOn} onChange={(e) => setCheckedOn(e.target.value)} />
      {kind === 'establishment' ? (
        <div className="grid grid-cols-3 gap-2">
          <TextField label="Frame area, ft²" inputMode="decimal" value={frameSqFt} onChange={(e) => setFrameSqFt(e.target.value)} />
          <TextField label="Ground cover, %" inputMode="decimal" value={groundCoverPct} onChange={(e) => setGroundCoverPct(e.target.value)} />
          <SelectField label="Weed pressure" value={weedPressure} onChange={(e) => setWeedPressure(e.target.value as WeedPressure)}>
            {WEED_PRESSURES.map((w) => (
              <option key={w} value={w}>
                {w}
              </option>
            ))}
          </SelectField>
        </div>
      ) : null}
      {kind === 'timber' ? (
        <div className="grid grid-cols-2 gap-2">
          <TextField label="Basal area factor (BAF)" inputMode="decimal" value={baf} onChange={(e) => setBaf(e.target.value)} />
          <TextField label="Target residual basal area, ft²/acre" inputMode="decimal" value={target} onChange={(e) => setTarget(e.target.value)} hint="Leave empty to use the prescription's" />
        </div>
      ) : null}
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-ink">{kind === 'establishment' ? 'One line per frame tossed' : kind === 'browse' ? 'One line per cage and its open twin' : 'One line per prism point'}</legend>
        {rows.map((row, i) => (
          <div key={i} className="grid grid-cols-[1fr_7rem_7rem] items-end gap-2">
            {kind === 'timber' ? (
              <span className="pb-2 text-sm text-slate">Point {i + 1}</span>
            ) : (
              <TextField label={`Species, line ${i + 1}`} value={row.species} onChange={(e) => setRow(i, { species: e.target.value })} />
            )}
            <TextField label={`${a}, line ${i + 1}`} inputMode="decimal" value={row.a} onChange={(e) => setRow(i, { a: e.target.value })} />
            {b ? <TextField label={`${b}, line ${i + 1}`} inputMode="decimal" value={row.b} onChange={(e) => setRow(i, { b: e.target.value })} /> : <span />}
          </div>
        ))}
        <Button type="button" variant="ghost" size="sm" className="self-start" onClick={() => setRows((old) => [...old, { species: kind === 'timber' ? '' : (old[old.length - 1]?.species ?? ''), a: '', b: '' }])}>
          Add a line
        </Button>
      </fieldset>
      <p className="rounded bg-paper px-3 py-2 text-sm text-ink" aria-live="polite">
        {preview ?? 'Fill in the lines to see the result.'}
      </p>
      {error ? (
        <p role="alert" className="text-sm text-clay">
          {error}
        </p>
      ) : null}
      <Button type="submit" busy={saving} className="self-start">
        Save the check
      </Button>
    </form>
  );
}
