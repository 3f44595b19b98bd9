import { PressureWarnings } from '../../../features/hunting/components/pressure-warnings';
import { Link } from 'react-router-dom';
import { useDesk } from '../../../features/desk/api/get-desk';
import { useMe } from '../../../features/auth/api/get-me';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { formatAcres, formatRelative } from '../../../lib/format';
import { describeAction } from '../../../features/desk/lib/action-words';
import { paths } from '../../../config/paths';
import { SeasonStrip } from '../../../features/desk/components/season-strip';
import { FirstSteps } from '../../../features/desk/components/first-steps';
import { formatCents } from '../../../../shared/domain/money';
import { formatDay } from '../../../lib/firm-clock';
import { RetestsDueCard } from '../../../features/checks/components/retests-due-card';
import { DuePullsCard } from '../../../features/cameras/components/due-pulls-card';

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-md border border-rule bg-card px-4 py-3">
      <p className="text-xs uppercase tracking-wide text-slate">{label}</p>
      <p className="figure text-2xl font-bold text-ink">{value}</p>
    </div>
  );
}

/** The consultant's home: the firm at a glance and what changed lately. */
export function DeskPage() {
  const me = useMe();
  const desk = useDesk();
  if (desk.isPending) return <Loading />;
  if (desk.isError) return <ErrorPanel error={desk.error} />;
  const d = desk.data;
  const firstName = me.data?.name.split(' ')[0] ?? '';
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-2xl font-bold">Desk</h1>
        <p className="text-slate">Good to see you, {firstName}. Here is {d.firm.name} this week.</p>
      </div>
      <FirstSteps steps={d.firstSteps} />
      <PressureWarnings linkTo={paths.propertyStands} />
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Figure label="Clients" value={String(d.counts.clients)} />
        <Figure label="Properties" value={String(d.counts.properties)} />
        <Figure label="Acres under plan" value={d.counts.totalAcres.toLocaleString('en-US')} />
        <Figure label="Crew members" value={String(d.counts.crew)} />
      </div>
      {d.depositDrafts.length > 0 ? (
        <section aria-labelledby="deposit-drafts-heading" className="rounded-md border-l-4 border-ochre bg-card px-4 py-3">
          <h2 id="deposit-drafts-heading" className="text-base font-bold">
            Deposit {d.depositDrafts.length === 1 ? 'invoice' : 'invoices'} to send
          </h2>
          <ul className="mt-2 flex flex-col gap-2">
            {d.depositDrafts.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 text-sm">
                <span>
                  {i.clientName} approved {i.proposalNumber ?? 'a proposal'}
                  {i.approvedAt ? ` ${formatRelative(i.approvedAt)}` : ''}; Browseline drafted deposit invoice <span className="font-semibold">{i.number}</span> for{' '}
                  <span className="figure">{formatCents(i.totalCents)}</span>
                  {i.propertyName ? ` (${i.propertyName})` : ''}.
                </span>
                <Link to={paths.invoice(i.id)} className="font-semibold text-moss-deep underline">
                  Review and send {i.number}
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <DuePullsCard linkTo={paths.propertyCameras} />
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Waiting on landowners" action={<Link to={paths.proposals} className="text-sm text-moss-deep hover:underline">All proposals</Link>}>
          {d.waiting.length === 0 ? (
            <EmptyState title="No proposals out">Write prescriptions on a property, then draft a proposal from its page.</EmptyState>
          ) : (
            <ul className="flex flex-col gap-2">
              {d.waiting.map((w) => (
                <li key={w.id} className="rounded border border-rule bg-paper/60 px-3 py-2 text-sm">
                  <Link to={paths.proposal(w.id)} className="font-semibold text-ink hover:underline">
                    {w.number}{w.version > 1 ? ` v${w.version}` : ''} · {w.propertyName}
                  </Link>
                  <span className="block text-slate">
                    {w.clientName} · <span className="figure text-ink">{formatCents(w.totalCents)}</span> · {w.firstViewedAt ? `opened ${formatRelative(w.firstViewedAt)}` : 'not opened yet'}
                    {w.expiresOn ? ` · valid until ${formatDay(w.expiresOn)}` : ''}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card title="In the window" action={<Link to={paths.schedule} className="text-sm text-moss-deep hover:underline">Open the schedule</Link>}>
          {d.inWindow.length === 0 ? (
            <EmptyState title="No step is in its window today">Steps of your prescriptions show here while their planting or work window is open.</EmptyState>
          ) : (
            <ul className="flex flex-col gap-2">
              {d.inWindow.map((s) => (
                <li key={`${s.prescriptionId}-${s.stepName}`} className="rounded border border-rule bg-paper/60 px-3 py-2 text-sm">
                  <span className="font-semibold text-ink">{s.stepName}</span> · {s.unitName}
                  <span className="block text-slate">
                    {s.propertyName} · {s.practiceName} · closes <span className="text-clay">{formatDay(s.latest)}</span>
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
      <Card title="Money in" action={<Link to={paths.invoices} className="text-sm text-moss-deep hover:underline">All invoices</Link>}>
        {d.moneyIn.length === 0 ? (
          <EmptyState title="No payments in the last two weeks">When a landowner pays an invoice in their portal, it shows here and you get an e-mail.</EmptyState>
        ) : (
          <ul className="flex flex-col gap-2" aria-label="Payments received">
            {d.moneyIn.map((m) => (
              <li key={m.id} className="rounded border border-rule bg-paper/60 px-3 py-2 text-sm">
                <span className="figure font-semibold text-ink">{formatCents(m.amountCents)}</span> from {m.clientName} on{' '}
                <Link to={paths.invoice(m.invoiceId)} className="text-moss-deep underline">
                  {m.number}
                </Link>
                <span className="block text-slate">
                  {formatRelative(m.receivedAt)} · {m.paidInFull ? 'paid in full' : 'part payment'}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <Card title="The season">
        <SeasonStrip season={d.season} />
      </Card>
      <RetestsDueCard />
      <div className="grid gap-4 lg:grid-cols-3">
        <Card title="Properties" className="lg:col-span-2" action={<Link to={paths.clients} className="text-sm text-moss-deep hover:underline">All clients</Link>}>
          {d.recentProperties.length === 0 ? (
            <EmptyState title="No properties yet">Add a client, then map their property boundary.</EmptyState>
          ) : (
            <table className="w-full text-sm">
              <thead>
                <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                  <th className="py-2 font-semibold">Property</th>
                  <th className="py-2 font-semibold">Client</th>
                  <th className="py-2 font-semibold">County</th>
                  <th className="py-2 text-right font-semibold">Acres</th>
                </tr>
              </thead>
              <tbody>
                {d.recentProperties.map((p) => (
                  <tr key={p.id} className="border-b border-rule/60 last:border-0">
                    <td className="py-2 font-semibold text-ink">{p.name}</td>
                    <td className="py-2 text-slate">{p.clientName}</td>
                    <td className="py-2 text-slate">{[p.county, p.state].filter(Boolean).join(', ') || '—'}</td>
                    <td className="py-2 text-right tabular-nums">{formatAcres(p.acres)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Card>
        <Card title="Lately">
          {d.activity.length === 0 ? (
            <EmptyState title="Nothing yet">Invite your crew and add clients from Settings and Clients.</EmptyState>
          ) : (
            <ul className="flex flex-col gap-2 text-sm">
              {d.activity.map((a) => (
                <li key={a.id} className="flex justify-between gap-2">
                  <span>
                    <span className="font-semibold">{a.actorName ?? 'Browseline'}</span> {describeAction(a.action)}
                  </span>
                  <span className="shrink-0 text-xs text-slate">{formatRelative(a.createdAt)}</span>
                </li>
              ))}
            </ul>
          )}
          {d.counts.pendingInvitations > 0 ? (
            <p className="mt-3 rounded bg-ochre/15 px-3 py-2 text-sm text-ink">
              {d.counts.pendingInvitations} invitation{d.counts.pendingInvitations === 1 ? '' : 's'} not yet accepted. <Link className="text-moss-deep underline" to={paths.team}>See the team</Link>
            </p>
          ) : null}
        </Card>
      </div>
    </div>
  );
}
