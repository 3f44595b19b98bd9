import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { cameraKeys, knownPhotoHashes, uploadCardBatch } from '../api/cameras';
import { sha256OfFile, uploadCard, type CardUploadProgress } from '../lib/card-upload';

/** Brings a card in: pick its photos, see progress; after a lost connection, "Send again" continues where it stopped. */
export function CardUpload({ deploymentId }: { deploymentId: number }) {
  const qc = useQueryClient();
  const [files, setFiles] = useState<File[]>([]);
  const [progress, setProgress] = useState<CardUploadProgress | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function run() {
    setBusy(true);
    setError(null);
    try {
      await uploadCard<File>(files, { hash: sha256OfFile, known: (h) => knownPhotoHashes(deploymentId, h), send: (batch) => uploadCardBatch(deploymentId, batch) }, setProgress);
    } catch (e) {
      setError(`${(e as Error).message} What arrived is kept: press “Send again” to continue.`);
    } finally {
      setBusy(false);
      void qc.invalidateQueries({ queryKey: cameraKeys.all() });
    }
  }

  const done = progress ? progress.alreadyThere + progress.sent : 0;
  return (
    <div className="flex flex-col gap-2">
      <label className="text-sm font-semibold text-ink" htmlFor={`card-${deploymentId}`}>
        Photos from the card
      </label>
      <input id={`card-${deploymentId}`} type="file" multiple accept="image/jpeg,image/png,image/heic" onChange={(e) => { setFiles([...(e.target.files ?? [])]); setProgress(null); setError(null); }} />
      <div className="flex items-center gap-3">
        <Button onClick={() => void run()} disabled={files.length === 0} busy={busy}>
          {error ? 'Send again' : `Send ${files.length || ''} photo${files.length === 1 ? '' : 's'}`}
        </Button>
        {progress ? (
          <progress className="h-2 w-48" max={progress.total} value={done} aria-label="Card upload progress">
            {done} of {progress.total}
          </progress>
        ) : null}
      </div>
      {progress ? (
        <p role="status" className="text-sm text-slate">
          {done} of {progress.total} photos handled: {progress.added} added, {progress.skipped + progress.alreadyThere} skipped
          {progress.alreadyThere ? ` (${progress.alreadyThere} were already here)` : ''}.
        </p>
      ) : null}
      {error ? <p className="text-sm text-clay">{error}</p> : null}
      {progress && progress.messages.length ? (
        <details className="text-sm text-slate">
          <summary>{progress.messages.length} note{progress.messages.length === 1 ? '' : 's'} on the photos</summary>
          <ul className="list-disc pl-5">
            {progress.messages.slice(0, 50).map((m, i) => (
              <li key={i}>{m}</li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}
