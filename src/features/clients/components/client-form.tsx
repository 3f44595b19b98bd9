import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ClientCreateSchema, ClientUpdateSchema, type ClientDto } from '../../../../shared/schemas/client';
import { LIMITS } from '../../../../shared/limits';
import { useCreateClient } from '../api/create-client';
import { useUpdateClient } from '../api/update-client';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';

type CreateValues = z.input<typeof ClientCreateSchema>;
type UpdateValues = z.input<typeof ClientUpdateSchema>;

/** The form for a new client; `onCreated` gets the saved client. */
export function NewClientForm({ onCreated, onCancel }: { onCreated: (client: ClientDto) => void; onCancel: () => void }) {
  const create = useCreateClient();
  const toast = useToast();
  const form = useForm<CreateValues, unknown, z.output<typeof ClientCreateSchema>>({
    resolver: zodResolver(ClientCreateSchema),
    defaultValues: { name: '', email: '', phone: '', address: '', notes: '' },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: (client) => {
        toast('success', `${client.name} added. Add their first property next.`);
        onCreated(client);
      },
      onError: (e) => toast('error', `The client was not added: ${e.message}`),
    }),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="New client" className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" autoComplete="off" maxLength={LIMITS.nameMax} hint="A person, a family or a club." error={errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      <TextField label="Phone" type="tel" autoComplete="off" error={errors.phone?.message} {...form.register('phone')} />
      <TextField label="Address" autoComplete="off" error={errors.address?.message} {...form.register('address')} />
      <TextAreaField label="Notes" className="sm:col-span-2" error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <Button type="submit" busy={create.isPending}>
          Add client
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** The form that changes a client's details. */
export function EditClientForm({ client, onDone }: { client: ClientDto; onDone: () => void }) {
  const update = useUpdateClient();
  const toast = useToast();
  const form = useForm<UpdateValues, unknown, z.output<typeof ClientUpdateSchema>>({
    resolver: zodResolver(ClientUpdateSchema),
    defaultValues: { name: client.name, email: client.email ?? '', phone: client.phone ?? '', address: client.address ?? '', notes: client.notes ?? '' },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((input) =>
    update.mutate(
      { id: client.id, input },
      {
        onSuccess: (saved) => {
          toast('success', `${saved.name} saved.`);
          onDone();
        },
        onError: (e) => toast('error', `The changes were not saved: ${e.message}`),
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Edit client" className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" maxLength={LIMITS.nameMax} error={errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail" type="email" error={errors.email?.message} {...form.register('email')} />
      <TextField label="Phone" type="tel" error={errors.phone?.message} {...form.register('phone')} />
      <TextField label="Address" error={errors.address?.message} {...form.register('address')} />
      <TextAreaField label="Notes" className="sm:col-span-2" error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <Button type="submit" busy={update.isPending}>
          Save changes
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
