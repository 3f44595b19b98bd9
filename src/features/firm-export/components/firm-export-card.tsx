import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button, buttonClasses } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatRelative } from '../../../lib/format';
import { useCreateFirmExport, useFirmExports } from '../api/firm-exports';
import type { FirmExportDto } from '../../../../shared/schemas/firm-export';

const size = (bytes: number | null) => (bytes === null ? '' : bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / (1024 * 1024)).toFixed(1)} MB`);

function ExportRow({ e }: { e: FirmExportDto }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm">
      <div className="min-w-0 flex-1">
        <p className="font-semibold">Export of {formatRelative(e.createdAt)}</p>
        {e.status === 'building' ? (
          <>
            <progress className="mt-1 h-2 w-full max-w-sm" max={100} value={e.progress} aria-label="Export progress" />
            <p className="text-slate">
              {e.progress} %{e.step ? ` · ${e.step}` : ''}
            </p>
          </>
        ) : e.status === 'ready' ? (
          <p className="text-slate">
            Ready · {size(e.byteSize)} · {e.fileCount} files
          </p>
        ) : (
          <p className="text-clay">{e.error}</p>
        )}
      </div>
      {e.status === 'ready' && e.downloadUrl ? (
        <a className={buttonClasses('secondary', '', 'sm')} href={e.downloadUrl} download>
          Download zip
        </a>
      ) : null}
    </li>
  );
}

/** Take your data with you: the owner starts a whole-firm export, watches it build and downloads the zip. */
export function FirmExportCard() {
  const exports = useFirmExports();
  const create = useCreateFirmExport();
  const toast = useToast();
  const building = exports.data?.some((e) => e.status === 'building') ?? false;
  return (
    <Card
      title="Take your data with you"
      action={
        <Button
          size="sm"
          busy={create.isPending}
          disabled={building}
          onClick={() =>
            create.mutate(undefined, {
              onSuccess: () => toast('success', 'The export has started. We will e-mail you when the zip is ready.'),
              onError: (err) => toast('error', `The export did not start: ${err.message}`),
            })
          }
        >
          Export everything
        </Button>
      }
    >
      <p className="mb-3 text-sm text-slate">
        One zip file with everything your firm keeps here: a CSV file per table (clients, properties, units, prescriptions, proposals, invoices, payments…), a
        GeoJSON map file per property, the PDF of every proposal and invoice, and every uploaded file and photo. It is built in the background; you get an
        e-mail when it is ready.
      </p>
      {exports.isPending ? (
        <Loading />
      ) : exports.isError ? (
        <ErrorPanel error={exports.error} onRetry={() => void exports.refetch()} />
      ) : exports.data.length === 0 ? (
        <p className="text-sm text-slate">No export yet.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-rule" aria-label="Exports">
          {exports.data.map((e) => (
            <ExportRow key={e.id} e={e} />
          ))}
        </ul>
      )}
    </Card>
  );
}
