import { FILE_CATEGORY_LABELS, type SharedFileDto } from '../../../../shared/schemas/file';
import { formatMomentDay } from './moment';

/** "1.2 MB", "340 KB" for people. */
export function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toLocaleString('en-US', { maximumFractionDigits: 1 })} MB`;
  return `${Math.max(1, Math.round(bytes / 1024)).toLocaleString('en-US')} KB`;
}

const kindText = (contentType: string) =>
  contentType.startsWith('application/pdf') ? 'PDF' : contentType.startsWith('image/') ? 'Image' : contentType.startsWith('text/csv') ? 'CSV table' : 'Text';

/** The files as a list of documents, each with one clear action: download. */
export function FilesList({ files, emptyText }: { files: SharedFileDto[]; emptyText: string }) {
  if (files.length === 0) return <p className="rounded border border-dashed border-rule px-4 py-6 text-center text-sm text-slate">{emptyText}</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule rounded-md border border-rule bg-card">
      {files.map((f) => (
        <li key={f.id} className="flex flex-col gap-2 p-3 sm:flex-row sm:items-center sm:justify-between">
          <div className="min-w-0">
            <p className="break-words font-semibold">{f.title}</p>
            <p className="text-sm text-slate">
              {FILE_CATEGORY_LABELS[f.category]} · {kindText(f.contentType)}, {sizeText(f.byteSize)} · {f.propertyName ?? 'All properties'} · {formatMomentDay(f.createdAt)}
              {f.uploadedByRole === 'client' && f.uploadedByName ? ` · uploaded by ${f.uploadedByName}` : ''}
            </p>
          </div>
          <a href={f.url} download className="inline-flex min-h-11 shrink-0 items-center justify-center rounded border border-moss px-4 py-2 text-sm font-semibold text-moss-deep hover:bg-moss/10 focus:outline-none focus:ring-2 focus:ring-moss sm:min-h-0 sm:py-1.5">
            Download<span className="sr-only"> {f.title}</span>
          </a>
        </li>
      ))}
    </ul>
  );
}
