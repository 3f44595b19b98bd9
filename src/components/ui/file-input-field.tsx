import { chosenFileProblem, FILE_LIMITS, UPLOAD_ACCEPT } from '../../../shared/schemas/file';

/** The file picker of both upload forms (staff sharing and the client's own): label, accepted kinds, size limit and the problem with the chosen file. */
export function FileInputField({ id, value, onChange, errorMessage, disabled }: { id: string; value: File | null; onChange: (file: File | null) => void; errorMessage?: string; disabled?: boolean }) {
  const help = `${id}-help`;
  return (
    <div className="flex flex-col gap-1 sm:col-span-2">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        File
      </label>
      <input
        id={id}
        type="file"
        accept={UPLOAD_ACCEPT}
        disabled={disabled}
        aria-describedby={help}
        aria-invalid={errorMessage ? true : undefined}
        onChange={(e) => onChange(e.target.files?.[0] ?? null)}
        className="rounded border border-rule bg-white px-3 py-2 text-sm file:mr-3 file:rounded file:border-0 file:bg-moss/10 file:px-3 file:py-1 file:font-semibold file:text-moss-deep"
      />
      <p id={help} className={`text-sm ${errorMessage ? 'text-clay' : 'text-slate'}`}>
        {errorMessage ? (chosenFileProblem(value) ?? errorMessage) : `PDF, PNG, JPEG, WebP, CSV or plain text, up to ${FILE_LIMITS.maxBytes / 1048576} MB.`}
      </p>
    </div>
  );
}
