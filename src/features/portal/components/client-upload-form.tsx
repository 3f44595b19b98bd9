import { useState } from 'react';
import { useForm, Controller } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ClientFileUploadFormSchema, FILE_LIMITS } from '../../../../shared/schemas/file';
import { FileInputField } from '../../../components/ui/file-input-field';
import type { PortalPropertyRow } from '../../../../shared/schemas/portal';
import { useUploadPortalFile } from '../api/upload-portal-file';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';

type Values = z.input<typeof ClientFileUploadFormSchema>;

/** The client's own upload: a file, an optional title and property. `disabled` in preview. */
export function ClientUploadForm({ properties, disabled = false }: { properties: PortalPropertyRow[]; disabled?: boolean }) {
  const upload = useUploadPortalFile();
  // A new key empties the file input after an upload (a file input cannot be set from code).
  const [inputKey, setInputKey] = useState(0);
  const toast = useToast();
  const form = useForm<Values, unknown, z.output<typeof ClientFileUploadFormSchema>>({
    resolver: zodResolver(ClientFileUploadFormSchema),
    defaultValues: { title: '', propertyId: '', file: null },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((v) =>
    upload.mutate(
      { file: v.file as File, title: v.title, propertyId: v.propertyId },
      {
        onSuccess: (f) => {
          toast('success', `“${f.title}” uploaded. Your consultant can see it now.`);
          form.reset({ title: '', propertyId: '', file: null });
          setInputKey((k) => k + 1);
        },
        onError: (e) => toast('error', `The file was not uploaded: ${e.message}`),
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Upload a file" className="grid gap-3 sm:grid-cols-2">
      <Controller
        control={form.control}
        name="file"
        render={({ field }) => <FileInputField key={inputKey} id="portal-upload-file" value={field.value as File | null} onChange={field.onChange} errorMessage={errors.file?.message} disabled={disabled} />}
      />
      <TextField label="Title (optional)" disabled={disabled} maxLength={FILE_LIMITS.titleMax} error={errors.title?.message} {...form.register('title')} />
      <SelectField label="Property" disabled={disabled} error={errors.propertyId?.message} {...form.register('propertyId')}>
        <option value="">All properties</option>
        {properties.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <div className="sm:col-span-2">
        <Button type="submit" busy={upload.isPending} disabled={disabled} className="w-full sm:w-auto">
          Upload
        </Button>
      </div>
    </form>
  );
}
