import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { FILE_CATEGORY_LABELS, FILE_LIMITS, STAFF_FILE_CATEGORIES, StaffFileUploadFormSchema, type SharedFileDto } from '../../../../shared/schemas/file';
import { FileInputField } from '../../../components/ui/file-input-field';
import { useDeleteFile, useFiles, useShareFile, useUpdateFile } from '../api/files';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';

type Values = z.input<typeof StaffFileUploadFormSchema>;

function ShareFileForm({ clientId, properties, onDone }: { clientId: number; properties: { id: number; name: string }[]; onDone: () => void }) {
  const share = useShareFile();
  const toast = useToast();
  const form = useForm<Values, unknown, z.output<typeof StaffFileUploadFormSchema>>({
    resolver: zodResolver(StaffFileUploadFormSchema),
    defaultValues: { clientId, propertyId: '', category: 'soil-test', title: '', visibleToClient: true, file: null },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((v) =>
    share.mutate(
      { clientId, propertyId: v.propertyId, category: v.category, title: v.title, visibleToClient: v.visibleToClient, file: v.file as File },
      {
        onSuccess: (f) => {
          toast('success', f.visibleToClient ? `“${f.title}” shared; the client sees it in their portal.` : `“${f.title}” saved, kept private.`);
          onDone();
        },
        onError: (e) => toast('error', `The file was not uploaded: ${e.message}`),
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Share a file" className="grid gap-3 rounded border border-rule bg-paper/60 p-3 sm:grid-cols-2">
      <Controller
        control={form.control}
        name="file"
        render={({ field }) => <FileInputField id="share-file-input" value={field.value as File | null} onChange={field.onChange} errorMessage={errors.file?.message} />}
      />
      <TextField label="Title" hint="Left empty, the file name is used." maxLength={FILE_LIMITS.titleMax} error={errors.title?.message} {...form.register('title')} />
      <SelectField label="Category" error={errors.category?.message} {...form.register('category')}>
        {STAFF_FILE_CATEGORIES.map((c) => (
          <option key={c} value={c}>
            {FILE_CATEGORY_LABELS[c]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Property" error={errors.propertyId?.message} {...form.register('propertyId')}>
        <option value="">All properties</option>
        {properties.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <label className="flex items-center gap-2 self-end text-sm">
        <input type="checkbox" className="h-4 w-4 accent-moss" {...form.register('visibleToClient')} /> Share with the client now
      </label>
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <Button type="submit" busy={share.isPending}>
          Upload
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function FileRow({ file }: { file: SharedFileDto }) {
  const update = useUpdateFile();
  const remove = useDeleteFile();
  const toast = useToast();
  const [confirming, setConfirming] = useState(false);
  const toggle = () =>
    update.mutate(
      { id: file.id, input: { visibleToClient: !file.visibleToClient } },
      { onSuccess: (f) => toast('success', f.visibleToClient ? `“${f.title}” is shared with the client.` : `“${f.title}” is private again.`), onError: (e) => toast('error', e.message) },
    );
  return (
    <li className="flex flex-col gap-2 py-2 sm:flex-row sm:items-center sm:justify-between">
      <div className="min-w-0">
        <a href={file.url} download className="break-words font-semibold text-moss-deep hover:underline">
          {file.title}
        </a>
        <p className="text-sm text-slate">
          {file.category === 'client-upload' ? 'Client upload' : FILE_CATEGORY_LABELS[file.category]} · {file.propertyName ?? 'All properties'}
          {file.uploadedByRole === 'client' ? ` · from ${file.uploadedByName ?? 'the client'}` : ''} · {file.visibleToClient ? 'Shared' : 'Private'}
        </p>
      </div>
      <div className="flex shrink-0 gap-2">
        {file.uploadedByRole === 'staff' ? (
          <Button size="sm" variant="secondary" busy={update.isPending} onClick={toggle} aria-label={`${file.visibleToClient ? 'Unshare' : 'Share'} ${file.title}`}>
            {file.visibleToClient ? 'Unshare' : 'Share'}
          </Button>
        ) : null}
        <Button size="sm" variant="danger-outline" onClick={() => setConfirming(true)} aria-label={`Delete ${file.title}`}>
          Delete
        </Button>
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Delete “${file.title}”?`}
        confirmLabel="Delete file"
        destructive
        busy={remove.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(file.id, {
            onSuccess: () => {
              setConfirming(false);
              toast('success', `“${file.title}” deleted.`);
            },
            onError: (e) => toast('error', e.message),
          })
        }
      >
        The file goes from the firm’s records and from the client’s portal. This cannot be undone.
      </ConfirmDialog>
    </li>
  );
}

/** A client's files on the client page: upload, share or unshare, delete. */
export function ClientFiles({ clientId, properties }: { clientId: number; properties: { id: number; name: string }[] }) {
  const files = useFiles({ clientId });
  const [adding, setAdding] = useState(false);
  return (
    <div className="flex flex-col gap-3">
      {adding ? (
        <ShareFileForm clientId={clientId} properties={properties} onDone={() => setAdding(false)} />
      ) : (
        <Button size="sm" className="self-start" onClick={() => setAdding(true)}>
          Upload a file
        </Button>
      )}
      {files.isPending ? (
        <Loading label="Loading files…" />
      ) : files.isError ? (
        <ErrorPanel error={files.error} onRetry={() => void files.refetch()} />
      ) : files.data.length === 0 ? (
        <EmptyState title="No files yet">Upload a soil test, a map or a season report to share it in the client’s portal.</EmptyState>
      ) : (
        <ul className="divide-y divide-rule">
          {files.data.map((f) => (
            <FileRow key={f.id} file={f} />
          ))}
        </ul>
      )}
    </div>
  );
}
