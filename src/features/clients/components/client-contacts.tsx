import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { InviteCreateSchema } from '../../../../shared/schemas/auth';
import { useClientContacts } from '../api/get-client-contacts';
import { useInviteClientContact } from '../api/invite-client-contact';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatRelative } from '../../../lib/format';

const STATUS: Record<string, { label: string; className: string }> = {
  active: { label: 'Active', className: 'bg-moss/10 text-moss-deep' },
  invited: { label: 'Invited', className: 'bg-ochre/20 text-ink' },
  disabled: { label: 'Disabled', className: 'bg-rule text-slate' },
};

/** Invites a landowner to the client's read-only portal. */
function InviteContactForm({ clientId, clientName }: { clientId: number; clientName: string }) {
  const invite = useInviteClientContact();
  const toast = useToast();
  const form = useForm<z.input<typeof InviteCreateSchema>, unknown, z.output<typeof InviteCreateSchema>>({
    resolver: zodResolver(InviteCreateSchema),
    defaultValues: { name: '', email: '', role: 'client', clientId },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((v) =>
    invite.mutate(
      { clientId, name: v.name, email: v.email },
      {
        onSuccess: () => {
          toast('success', `Invitation sent to ${v.email}. They choose a password from the e-mail.`);
          form.reset({ name: '', email: '', role: 'client', clientId });
        },
        onError: (e) => toast('error', `The invitation was not sent: ${e.message}`),
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Invite a contact" className="flex flex-col gap-3 border-t border-rule pt-3">
      <h3 className="text-sm font-bold">Invite a contact</h3>
      <p className="text-sm text-slate">They get an e-mail with a link to set a password, then see {clientName}’s land, proposals and invoices, read-only.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Contact name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
        <TextField label="Contact e-mail" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      </div>
      {errors.clientId ? <p className="text-sm text-clay">{errors.clientId.message}</p> : null}
      <div>
        <Button type="submit" variant="secondary" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}

/** A client's portal contacts and the form to invite one more. */
export function ClientContacts({ clientId, clientName }: { clientId: number; clientName: string }) {
  const contacts = useClientContacts(clientId);
  return (
    <div className="flex flex-col gap-3">
      {contacts.isPending ? (
        <Loading label="Loading contacts…" />
      ) : contacts.isError ? (
        <ErrorPanel error={contacts.error} onRetry={() => void contacts.refetch()} />
      ) : contacts.data.length === 0 ? (
        <EmptyState title="No portal contacts yet">Invite the landowner below; they will see their plan, proposals and invoices.</EmptyState>
      ) : (
        <ul className="flex flex-col divide-y divide-rule/60" aria-label="Portal contacts">
          {contacts.data.map((c) => {
            const status = STATUS[c.status] ?? { label: c.status, className: 'bg-rule text-slate' };
            return (
              <li key={c.id} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1 py-2 text-sm">
                <span className="min-w-0">
                  <span className="block font-semibold text-ink">{c.name}</span>
                  <span className="block break-all text-slate">{c.email}</span>
                </span>
                <span className="flex items-center gap-2">
                  <span className={`rounded px-2 py-0.5 text-xs font-semibold ${status.className}`}>{status.label}</span>
                  <span className="text-xs text-slate">{c.lastSignInAt ? `signed in ${formatRelative(c.lastSignInAt)}` : c.status === 'invited' ? 'not signed in yet' : ''}</span>
                </span>
              </li>
            );
          })}
        </ul>
      )}
      <InviteContactForm clientId={clientId} clientName={clientName} />
    </div>
  );
}
