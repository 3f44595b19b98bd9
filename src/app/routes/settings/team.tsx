import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router-dom';
import { InviteCreateSchema } from '../../../../shared/schemas/auth';
import { useInviteMember, useSetMemberActive, useTeam } from '../../../features/team/api/team';
import { useClients } from '../../../features/clients/api/get-clients';
import { useMe } from '../../../features/auth/api/get-me';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatRelative } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { FirmProfileForm } from '../../../features/firm/components/firm-profile-form';
import { JobsCard } from '../../../features/jobs/components/jobs-card';
import { FirmSettingsForm } from '../../../features/firm/components/firm-settings-form';
import { SoilSettingsForm } from '../../../features/firm/components/soil-settings-form';
import { MapSettingsCard } from './map-settings-card';
import { UndeliveredMailCard } from '../../../features/outbox/components/undelivered-mail-card';

const ROLE_LABEL: Record<string, string> = { owner: 'Owner', consultant: 'Consultant', crew: 'Crew', client: 'Client contact' };
const STATUS_STYLE: Record<string, string> = { active: 'bg-moss/10 text-moss-deep', invited: 'bg-ochre/20 text-ink', disabled: 'bg-rule text-slate' };

function InviteForm({ isOwner }: { isOwner: boolean }) {
  const invite = useInviteMember();
  const clients = useClients();
  const toast = useToast();
  const form = useForm<z.input<typeof InviteCreateSchema>, unknown, z.output<typeof InviteCreateSchema>>({ resolver: zodResolver(InviteCreateSchema), defaultValues: { email: '', name: '', role: 'crew' } });
  const role = form.watch('role');
  const submit = form.handleSubmit((v) =>
    invite.mutate(v, {
      onSuccess: () => {
        toast('success', `Invitation sent to ${v.email}.`);
        form.reset({ email: '', name: '', role: v.role });
      },
      onError: (e) => toast('error', e.message),
    }),
  );
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 md:grid-cols-2">
      <TextField label="Name" error={form.formState.errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail" type="email" error={form.formState.errors.email?.message} {...form.register('email')} />
      <div className="flex flex-col gap-1">
        <label htmlFor="invite-role" className="text-sm font-semibold">Role</label>
        <select id="invite-role" className="rounded border border-rule bg-white px-3 py-2" {...form.register('role')}>
          <option value="crew">Crew — sees only their own field tasks</option>
          <option value="client">Client contact — read-only portal</option>
          {isOwner ? <option value="consultant">Consultant — plans, prices and schedules</option> : null}
        </select>
      </div>
      {role === 'client' ? (
        <div className="flex flex-col gap-1">
          <label htmlFor="invite-client" className="text-sm font-semibold">Client</label>
          <select
            id="invite-client"
            className="rounded border border-rule bg-white px-3 py-2"
            {...form.register('clientId', { setValueAs: (v) => (v === '' || v === undefined ? undefined : Number(v)) })}
          >
            <option value="">Choose a client…</option>
            {(clients.data ?? []).map((c) => (
              <option key={c.id} value={c.id}>{c.name}</option>
            ))}
          </select>
          {form.formState.errors.clientId ? <p className="text-sm text-clay">{form.formState.errors.clientId.message}</p> : null}
        </div>
      ) : null}
      <div className="md:col-span-2">
        <Button type="submit" busy={invite.isPending}>Send invitation</Button>
      </div>
    </form>
  );
}

/** The firm's people and invitations. */
export function TeamPage() {
  const me = useMe();
  const team = useTeam();
  const setActive = useSetMemberActive();
  const toast = useToast();
  const isOwner = me.data?.role === 'owner';
  return (
    <div className="flex flex-col gap-4">
      <div className="flex items-baseline justify-between">
        <h1 className="text-2xl font-bold">Settings · Team</h1>
        {isOwner ? <Link className="text-sm text-moss-deep hover:underline" to={paths.mail}>Captured mail (development)</Link> : null}
        {isOwner ? <Link className="text-sm text-moss-deep hover:underline" to={paths.firmExport}>Export all your data</Link> : null}
      </div>
      {isOwner ? (
        <Card title="Firm profile">
          <FirmProfileForm />
        </Card>
      ) : null}
      {isOwner ? (
        <Card title="Firm settings">
          <FirmSettingsForm />
        </Card>
      ) : null}
      {isOwner ? (
        <Card title="Soil tests">
          <SoilSettingsForm />
        </Card>
      ) : null}
      {isOwner ? <MapSettingsCard /> : null}
      {isOwner ? <UndeliveredMailCard /> : null}
      <Card title="Invite someone">
        <InviteForm isOwner={isOwner} />
      </Card>
      <Card title="People">
        {team.isPending ? (
          <Loading />
        ) : team.isError ? (
          <ErrorPanel error={team.error} />
        ) : (
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                <th className="py-2 font-semibold">Name</th>
                <th className="py-2 font-semibold">E-mail</th>
                <th className="py-2 font-semibold">Role</th>
                <th className="py-2 font-semibold">Status</th>
                <th className="py-2 font-semibold">Last sign-in</th>
                {isOwner ? <th className="py-2" /> : null}
              </tr>
            </thead>
            <tbody>
              {team.data.map((u) => (
                <tr key={u.id} className="border-b border-rule/60 last:border-0">
                  <td className="py-2 font-semibold">{u.name}</td>
                  <td className="py-2 text-slate">{u.email}</td>
                  <td className="py-2">{ROLE_LABEL[u.role]}</td>
                  <td className="py-2"><span className={`rounded px-2 py-0.5 text-xs ${STATUS_STYLE[u.status]}`}>{u.status}</span></td>
                  <td className="py-2 text-slate">{u.lastSignInAt ? formatRelative(u.lastSignInAt) : '—'}</td>
                  {isOwner ? (
                    <td className="py-2 text-right">
                      {u.id !== me.data?.id ? (
                        <Button
                          variant="ghost"
                          className="px-2 py-1 text-xs"
                          onClick={() => setActive.mutate({ id: u.id, active: u.status === 'disabled' }, { onError: (e) => toast('error', e.message) })}
                        >
                          {u.status === 'disabled' ? 'Enable' : 'Disable'}
                        </Button>
                      ) : null}
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
      <JobsCard />
    </div>
  );
}
