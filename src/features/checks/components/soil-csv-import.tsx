import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { guessSoilCsvColumns, SOIL_CSV_FIELD_LABELS, SOIL_CSV_FIELDS, SOIL_CSV_REQUIRED, unmappedRequired, type SoilCsvColumns, type SoilCsvField } from '../../../../shared/domain/soil-csv';
import { SOIL_CSV_MAX_CHARS, type SoilCsvRowProblem } from '../../../../shared/schemas/soil-tests';
import { useImportSoilTests, useSoilTestContext } from '../api/soil-tests';
import { checkSoilCsvRows, parseSoilCsv, type ParsedCsv } from '../lib/soil-csv-rows';

/** The row problems a refused import carries in `details`. */
function serverRowProblems(error: unknown): SoilCsvRowProblem[] {
  if (!(error instanceof ApiError) || !Array.isArray(error.details)) return [];
  return (error.details as Partial<SoilCsvRowProblem>[]).filter((d): d is SoilCsvRowProblem => typeof d.row === 'number' && typeof d.field === 'string' && typeof d.message === 'string');
}

/**
 * A lab's results file for several units of a property: choose the file, say which column holds what
 * (guessed from the header), see every row's unit, recommendation or problems, then import all rows
 * in one transaction — or none, with the server's problems shown on their rows.
 */
export function SoilCsvImport({ propertyId, onImported }: { propertyId: number; onImported?: (count: number) => void }) {
  const context = useSoilTestContext(propertyId);
  const importTests = useImportSoilTests();
  const toast = useToast();
  const [text, setText] = useState('');
  const [fileName, setFileName] = useState('');
  const [parsed, setParsed] = useState<ParsedCsv | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const [columns, setColumns] = useState<SoilCsvColumns>({});
  const [serverProblems, setServerProblems] = useState<SoilCsvRowProblem[]>([]);
  const [serverError, setServerError] = useState<string | null>(null);

  const rows = useMemo(() => (parsed && context.data ? checkSoilCsvRows(parsed, columns, context.data) : []), [parsed, columns, context.data]);
  const missing = unmappedRequired(columns);
  const rowsWithProblems = rows.filter((r) => r.problems.length > 0).length;

  const choose = async (file: File | null) => {
    setParsed(null);
    setReadError(null);
    setServerProblems([]);
    setServerError(null);
    if (!file) return;
    setFileName(file.name);
    if (file.size > SOIL_CSV_MAX_CHARS) {
      setReadError(`${file.name} is larger than ${Math.round(SOIL_CSV_MAX_CHARS / 1000)} kB: split it into smaller files.`);
      return;
    }
    try {
      const content = await file.text();
      const result = await parseSoilCsv(content);
      if (result.records.length === 0) throw new Error('The file has a header row but no results under it.');
      setText(content);
      setParsed(result);
      setColumns(guessSoilCsvColumns(result.headers));
    } catch (error) {
      setReadError(`${file.name} could not be read as CSV: ${(error as Error).message} Save it from the spreadsheet as “CSV UTF-8” with a header row.`);
    }
  };

  const submit = () => {
    setServerProblems([]);
    setServerError(null);
    importTests.mutate(
      { propertyId, input: { csv: text, columns } },
      {
        onSuccess: (saved) => {
          toast('success', `${saved.length} soil ${saved.length === 1 ? 'test' : 'tests'} imported with their recommendations.`);
          setParsed(null);
          setText('');
          onImported?.(saved.length);
        },
        onError: (error) => {
          setServerProblems(serverRowProblems(error));
          setServerError(error.message);
        },
      },
    );
  };

  if (context.isPending) return <Loading label="Loading the property’s units…" />;
  if (context.isError) return <ErrorPanel error={context.error} onRetry={() => void context.refetch()} />;

  return (
    <div className="flex flex-col gap-4">
      <Card title="1. Choose the lab’s file">
        <div className="flex flex-col gap-1">
          <label htmlFor="soil-csv-file" className="text-sm font-semibold text-ink">
            Results file (CSV)
          </label>
          <input
            id="soil-csv-file"
            type="file"
            accept=".csv,text/csv,text/plain"
            aria-describedby="soil-csv-help"
            onChange={(e) => void choose(e.target.files?.[0] ?? null)}
            className="rounded border border-rule bg-white px-3 py-2 text-sm file:mr-3 file:rounded file:border-0 file:bg-moss/10 file:px-3 file:py-1 file:font-semibold file:text-moss-deep"
          />
          <p id="soil-csv-help" className={`text-sm ${readError ? 'text-clay' : 'text-slate'}`}>
            {readError ?? `One row per sample with a header row; each row names a unit of this property as on the plan map. Lime is worked by the ${context.data.methodLabel}.`}
          </p>
        </div>
      </Card>

      {parsed ? (
        <Card title={`2. Say which column holds what (${fileName})`}>
          <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
            {SOIL_CSV_FIELDS.map((field: SoilCsvField) => (
              <SelectField
                key={field}
                label={`${SOIL_CSV_FIELD_LABELS[field]}${SOIL_CSV_REQUIRED.includes(field) ? '' : ' (optional)'}`}
                value={columns[field] ?? ''}
                error={missing.includes(field) ? 'Pick the column' : undefined}
                onChange={(e) => setColumns((c) => ({ ...c, [field]: e.target.value || undefined }))}
              >
                <option value="">Not in the file</option>
                {parsed.headers.map((h) => (
                  <option key={h} value={h}>
                    {h}
                  </option>
                ))}
              </SelectField>
            ))}
          </div>
        </Card>
      ) : null}

      {parsed && missing.length === 0 ? (
        <Card title={`3. Check the rows (${rows.length})`}>
          {rows.length === 0 ? (
            <EmptyState title="No rows under the header" />
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm tabular-nums">
                <thead className="text-left text-slate">
                  <tr>
                    <th className="py-1 pr-3">Row</th>
                    <th className="py-1 pr-3">Unit</th>
                    <th className="py-1 pr-3">pH</th>
                    <th className="py-1">Recommendation or what to change</th>
                  </tr>
                </thead>
                <tbody>
                  {rows.map((r) => {
                    const fromServer = serverProblems.filter((p) => p.row === r.row);
                    const problems = [...r.problems, ...fromServer.filter((p) => !r.problems.some((q) => q.field === p.field))];
                    return (
                      <tr key={r.row} className={`border-t border-rule align-top ${problems.length ? 'bg-clay/5' : ''}`} data-testid={`soil-csv-row-${r.row}`}>
                        <td className="py-1 pr-3">{r.row}</td>
                        <td className="py-1 pr-3">{r.unitName || '—'}</td>
                        <td className="py-1 pr-3">{r.ph || '—'}</td>
                        <td className="py-1">
                          {problems.length ? (
                            <ul className="text-[#8E3F2A]">
                              {problems.map((p, i) => (
                                <li key={i}>
                                  <strong>{p.field}</strong>: {p.message}
                                </li>
                              ))}
                            </ul>
                          ) : (
                            r.recommendation
                          )}
                        </td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          )}
          <div className="mt-3 flex flex-wrap items-center gap-3">
            <Button onClick={submit} busy={importTests.isPending} disabled={rowsWithProblems > 0 || rows.length === 0}>
              Import {rows.length} {rows.length === 1 ? 'row' : 'rows'}
            </Button>
            <p className={`text-sm ${rowsWithProblems || serverError ? 'text-clay' : 'text-slate'}`} role={serverError ? 'alert' : undefined}>
              {serverError ??
                (rowsWithProblems
                  ? `${rowsWithProblems} of ${rows.length} rows need changes: correct them in the file and choose it again. Nothing is saved until every row is right.`
                  : 'All rows are saved together, or none.')}
            </p>
          </div>
        </Card>
      ) : null}
    </div>
  );
}
