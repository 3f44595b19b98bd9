import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ClientCreateSchema } from '../../../../shared/schemas/client';
import { useClients, useCreateClient } from '../../../features/clients/api/clients';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatAcres } from '../../../lib/format';

function NewClientForm({ onDone }: { onDone: () => void }) {
  const create = useCreateClient();
  const toast = useToast();
  const form = useForm<z.input<typeof ClientCreateSchema>, unknown, z.output<typeof ClientCreateSchema>>({ resolver: zodResolver(ClientCreateSchema), defaultValues: { name: '', email: '', phone: '', address: '' } });
  const submit = form.handleSubmit((v) =>
    create.mutate(v, {
      onSuccess: () => {
        toast('success', `${v.name} added.`);
        onDone();
      },
      onError: (e) => toast('error', e.message),
    }),
  );
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" error={form.formState.errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail" type="email" error={form.formState.errors.email?.message} {...form.register('email')} />
      <TextField label="Phone" error={form.formState.errors.phone?.message} {...form.register('phone')} />
      <TextField label="Address" error={form.formState.errors.address?.message} {...form.register('address')} />
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" busy={create.isPending}>Add client</Button>
        <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}

/** The firm's clients. */
export function ClientsPage() {
  const clients = useClients();
  const [params] = useSearchParams();
  const [adding, setAdding] = useState(false);
  const q = (params.get('q') ?? '').toLowerCase();
  const rows = (clients.data ?? []).filter((c) => !q || c.name.toLowerCase().includes(q) || (c.email ?? '').includes(q));
  return (
    <div className="flex flex-col gap-4">
      <div className="flex items-center justify-between">
        <h1 className="text-2xl font-bold">Clients</h1>
        {!adding ? <Button onClick={() => setAdding(true)}>New client</Button> : null}
      </div>
      {adding ? (
        <Card title="New client">
          <NewClientForm onDone={() => setAdding(false)} />
        </Card>
      ) : null}
      <Card>
        {clients.isPending ? (
          <Loading />
        ) : clients.isError ? (
          <ErrorPanel error={clients.error} />
        ) : rows.length === 0 ? (
          <EmptyState title={q ? `No client matches “${q}”` : 'No clients yet'}>{q ? 'Try another name.' : 'Add your first client with “New client”.'}</EmptyState>
        ) : (
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                <th className="py-2 font-semibold">Name</th>
                <th className="py-2 font-semibold">E-mail</th>
                <th className="py-2 font-semibold">Phone</th>
                <th className="py-2 text-right font-semibold">Properties</th>
                <th className="py-2 text-right font-semibold">Acres</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((c) => (
                <tr key={c.id} className="border-b border-rule/60 last:border-0">
                  <td className="py-2 font-semibold">{c.name}</td>
                  <td className="py-2 text-slate">{c.email ?? '—'}</td>
                  <td className="py-2 text-slate">{c.phone ?? '—'}</td>
                  <td className="py-2 text-right tabular-nums">{c.propertyCount}</td>
                  <td className="py-2 text-right tabular-nums">{formatAcres(c.totalAcres)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
    </div>
  );
}
