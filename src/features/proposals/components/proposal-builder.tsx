/**
 * The proposal builder: a draft's fields, its lines grouped by unit, live totals computed in the
 * browser by the server's own rule, Save (the full lines array), Send, PDF preview and Withdraw.
 */
import { useEffect, useId, useMemo, useRef, useState, type ReactNode } from 'react';
import { Link, useBlocker } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { formatCents } from '../../../../shared/domain/money';
import type { OrderDiscount } from '../../../../shared/domain/proposal-totals';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { PageHeader } from '../../../components/ui/page-header';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { ApiError } from '../../../lib/api-client';
import { useSendProposal } from '../api/send-proposal';
import { useUpdateProposal } from '../api/update-proposal';
import { useWithdrawProposal } from '../api/withdraw-proposal';
import { proposalLabel, proposalPdfUrl, type LineCategory, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import {
  CATEGORY_LABELS,
  LINE_CATEGORIES,
  LINE_LIMITS,
  checkDraft,
  draftFormFrom,
  groupDraftLines,
  insertIntoGroup,
  lineField,
  newDraftLine,
  serverFieldErrors,
  type DiscountKind,
  type DraftForm,
  type DraftLine,
  type FieldErrors,
} from '../utils/draft-form';
import { formatDay } from '../utils/dates';
import { KindSwatch, TotalsList, groupSize } from './document-parts';
import { StatusChip } from './status-chip';
import { VersionsList } from './versions-list';

const cellInput = (invalid: boolean, extra = '') =>
  `w-full rounded border bg-white px-2 py-1.5 text-sm text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${invalid ? 'border-clay' : 'border-rule'} ${extra}`;

/** One input of a line, labelled for screen readers, its problem under it. */
function LineInput({ label, value, error, onChange, onBlur, className = '', inputClassName = '', autoFocus, inputMode, prefix, title }: {
  label: string;
  title?: string;
  value: string;
  error?: string;
  onChange: (v: string) => void;
  onBlur: () => void;
  className?: string;
  inputClassName?: string;
  autoFocus?: boolean;
  inputMode?: 'decimal' | 'text';
  prefix?: string;
}) {
  const id = useId();
  return (
    <div className={`flex min-w-0 flex-col gap-0.5 ${className}`}>
      <label htmlFor={id} className="text-xs font-semibold text-slate lg:sr-only">
        {label}
      </label>
      <div className="relative">
        {prefix ? <span aria-hidden className="pointer-events-none absolute left-2 top-1/2 -translate-y-1/2 text-sm text-slate">{prefix}</span> : null}
        <input
          id={id}
          value={value}
          autoFocus={autoFocus}
          inputMode={inputMode}
          title={title}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => onChange(e.target.value)}
          onBlur={onBlur}
          className={cellInput(!!error, `${prefix ? 'pl-5' : ''} ${inputClassName}`)}
        />
      </div>
      {error ? (
        <p id={`${id}-error`} className="text-xs text-clay">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function LineCheckbox({ label, checked, onChange }: { label: string; checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <label className="flex items-center gap-1.5 py-1.5 text-sm text-ink lg:justify-center">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="size-4 accent-moss" />
      <span className="lg:sr-only">{label}</span>
    </label>
  );
}

const ROW_GRID = 'grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-[minmax(0,1fr)_7rem_5rem_6rem_6.5rem_3rem_3.5rem_6.5rem_2rem] lg:items-start';

interface LineRowProps {
  line: DraftLine;
  number: number;
  /** The line's amount in cents, when its quantity and price parse. */
  amountCents: number | undefined;
  errorOf: (key: string) => string | undefined;
  onChange: (patch: Partial<DraftLine>) => void;
  onTouch: (key: string) => void;
  onRemove: () => void;
  autoFocus: boolean;
  currency: string;
}

/** One editable line: description, category, quantity, unit, unit price, taxable, optional, amount. */
function LineRow({ line, number, amountCents, errorOf, onChange, onTouch, onRemove, autoFocus, currency }: LineRowProps) {
  const categoryId = useId();
  const f = (field: keyof DraftLine) => lineField(line.key, field);
  const lineError = errorOf(lineField(line.key, 'line'));
  return (
    <div role="group" aria-label={`Line ${number}: ${line.description.trim() || 'new line'}`} className={`${ROW_GRID} border-b border-rule/70 py-2 last:border-0`}>
      <LineInput
        label="Description"
        value={line.description}
        error={errorOf(f('description'))}
        onChange={(description) => onChange({ description })}
        onBlur={() => onTouch(f('description'))}
        autoFocus={autoFocus}
        title={line.description}
        className="col-span-2 sm:col-span-4 lg:col-span-1"
      />
      <div className="flex min-w-0 flex-col gap-0.5">
        <label htmlFor={categoryId} className="text-xs font-semibold text-slate lg:sr-only">
          Category
        </label>
        <select id={categoryId} value={line.category} onChange={(e) => onChange({ category: e.target.value as LineCategory })} className={cellInput(false, 'pr-1')}>
          {LINE_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {CATEGORY_LABELS[c]}
            </option>
          ))}
        </select>
      </div>
      <LineInput label="Quantity" value={line.quantity} inputMode="decimal" inputClassName="text-right tabular-nums" error={errorOf(f('quantity'))} onChange={(quantity) => onChange({ quantity })} onBlur={() => onTouch(f('quantity'))} />
      <LineInput label="Unit" value={line.unit} error={errorOf(f('unit'))} onChange={(unit) => onChange({ unit })} onBlur={() => onTouch(f('unit'))} />
      <LineInput label="Unit price" prefix="$" value={line.unitPrice} inputMode="decimal" inputClassName="text-right tabular-nums" error={errorOf(f('unitPrice'))} onChange={(unitPrice) => onChange({ unitPrice })} onBlur={() => onTouch(f('unitPrice'))} />
      <LineCheckbox label="Taxable" checked={line.taxable} onChange={(taxable) => onChange({ taxable })} />
      <LineCheckbox label="Optional" checked={line.optional} onChange={(optional) => onChange({ optional })} />
      <p className="figure self-center py-1.5 text-right text-sm tabular-nums" aria-label="Amount">
        {amountCents !== undefined ? (
          line.optional ? (
            <span className="text-slate" title="An option: counts once the client chooses it">
              ({formatCents(amountCents, currency)})
            </span>
          ) : (
            formatCents(amountCents, currency)
          )
        ) : (
          <span className="text-slate">—</span>
        )}
      </p>
      <button type="button" onClick={onRemove} aria-label={`Delete line ${number}`} title="Delete this line" className="self-center justify-self-end rounded px-2 py-1 text-lg leading-none text-slate hover:bg-clay/10 hover:text-clay">
        ×
      </button>
      {lineError ? <p className="col-span-full text-xs text-clay">{lineError}</p> : null}
    </div>
  );
}

function ColumnHeads() {
  return (
    <div aria-hidden className={`${ROW_GRID} hidden border-b border-rule pb-1 text-xs uppercase tracking-wide text-slate lg:grid`}>
      <span>Description</span>
      <span>Category</span>
      <span className="text-right">Qty</span>
      <span>Unit</span>
      <span className="text-right">Unit price</span>
      <span className="text-center">Tax</span>
      <span className="text-center">Option</span>
      <span className="text-right">Amount</span>
      <span />
    </div>
  );
}

function Notice({ children, tone = 'clay' }: { children: ReactNode; tone?: 'clay' | 'sky' }) {
  return (
    <div role={tone === 'clay' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-sm ${tone === 'clay' ? 'border-clay bg-clay/5' : 'border-sky bg-sky/5'}`}>
      {children}
    </div>
  );
}

/** The form's own fields that show an error beside them. */
const SHOWN_FIELDS = new Set(['title', 'expiresOn', 'introduction', 'terms', 'taxRatePct', 'depositPct', 'discount', 'lines']);

const countFields = (n: number) => `${n} marked ${n === 1 ? 'field' : 'fields'}`;

/** The builder of one draft proposal. */
export function ProposalBuilder({ proposal }: { proposal: ProposalDto }) {
  const toast = useToast();
  const qc = useQueryClient();
  const update = useUpdateProposal();
  const send = useSendProposal();
  const withdraw = useWithdrawProposal();
  const [form, setForm] = useState<DraftForm>(() => draftFormFrom(proposal));
  const [baseline, setBaseline] = useState(() => JSON.stringify(draftFormFrom(proposal)));
  const [serverErrors, setServerErrors] = useState<FieldErrors>({});
  const [touched, setTouched] = useState<ReadonlySet<string>>(new Set());
  const [attempted, setAttempted] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [dialog, setDialog] = useState<null | 'send' | 'withdraw'>(null);
  const [focusKey, setFocusKey] = useState<string | null>(null);
  const [newGroup, setNewGroup] = useState('');
  const [newGroupError, setNewGroupError] = useState<string | undefined>();
  const nextKey = useRef(1);

  const check = useMemo(() => checkDraft(form), [form]);
  const dirty = JSON.stringify(form) !== baseline;
  const groups = useMemo(() => groupDraftLines(form.lines), [form.lines]);
  const label = proposalLabel(proposal);

  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const errorOf = (key: string): string | undefined => serverErrors[key] ?? (attempted || touched.has(key) ? check.errors[key] : undefined);
  const touch = (key: string) => setTouched((prev) => (prev.has(key) ? prev : new Set(prev).add(key)));
  const clearServer = (...keys: string[]) =>
    setServerErrors((prev) => {
      if (!keys.some((k) => k in prev)) return prev;
      const next = { ...prev };
      for (const k of keys) delete next[k];
      return next;
    });
  const setField = <K extends keyof DraftForm>(name: K, value: DraftForm[K]) => {
    setForm((f) => ({ ...f, [name]: value }));
    clearServer(name === 'discountPercent' || name === 'discountDollars' || name === 'discountKind' ? 'discount' : name);
  };
  const setLine = (key: string, patch: Partial<DraftLine>) => {
    setForm((f) => ({ ...f, lines: f.lines.map((l) => (l.key === key ? { ...l, ...patch } : l)) }));
    clearServer(...Object.keys(patch).map((k) => lineField(key, k as keyof DraftLine)), lineField(key, 'line'));
  };
  const removeLine = (key: string) => setForm((f) => ({ ...f, lines: f.lines.filter((l) => l.key !== key) }));
  const addLine = (groupLabel: string, unitId: number | null) => {
    const key = `new-${nextKey.current++}`;
    setForm((f) => ({ ...f, lines: insertIntoGroup(f.lines, newDraftLine(key, groupLabel, unitId)) }));
    setFocusKey(key);
  };
  const addGroup = () => {
    const name = newGroup.trim();
    if (!name) return setNewGroupError('Name the group first, e.g. “Fencing” or “Site visit”.');
    if (name.length > LINE_LIMITS.groupLabelMax) return setNewGroupError(`Keep the group name to ${LINE_LIMITS.groupLabelMax} characters.`);
    if (groups.some((g) => g.label === name)) return setNewGroupError(`“${name}” is a group already; use its “Add a line”.`);
    setNewGroupError(undefined);
    setNewGroup('');
    addLine(name, null);
  };

  const showError = (e: unknown, what: string) => {
    const message = e instanceof Error ? e.message : 'Something went wrong.';
    if (e instanceof ApiError && e.status === 409) void qc.invalidateQueries({ queryKey: ['proposals', 'detail', proposal.id] });
    const fieldErrors = e instanceof ApiError && e.status === 422 ? serverFieldErrors(form, e.message, e.details) : {};
    setServerErrors(fieldErrors);
    const keys = Object.keys(fieldErrors);
    const marked = keys.every((k) => k.startsWith('lines.') || SHOWN_FIELDS.has(k)) ? keys.length : 0;
    const text = marked ? `${what}. Fix the ${countFields(marked)} and try again.` : `${what}: ${message}`;
    setNotice(text);
    toast('error', text);
  };

  /** Saves the draft; the answer (re-priced by the server) becomes the form. */
  const save = async (): Promise<boolean> => {
    setAttempted(true);
    if (!check.input) {
      setNotice(`Fix the ${countFields(Object.keys(check.errors).length)} before saving.`);
      return false;
    }
    try {
      const saved = await update.mutateAsync({ id: proposal.id, input: check.input });
      const next = draftFormFrom(saved);
      setForm(next);
      setBaseline(JSON.stringify(next));
      setServerErrors({});
      setTouched(new Set());
      setAttempted(false);
      setNotice(null);
      toast('success', `${label} saved. Total ${formatCents(saved.totalCents, saved.currency)}.`);
      return true;
    } catch (e) {
      showError(e, 'The draft was not saved');
      return false;
    }
  };

  const confirmSend = async () => {
    if (dirty && !(await save())) return setDialog(null);
    send.mutate(proposal.id, {
      onSuccess: (p) => {
        setDialog(null);
        toast('success', `${label} sent to ${p.clientName}. It is read-only now.`);
      },
      onError: (e) => {
        setDialog(null);
        showError(e, 'The proposal was not sent');
      },
    });
  };
  const confirmWithdraw = () =>
    withdraw.mutate(proposal.id, {
      onSuccess: () => {
        setDialog(null);
        setBaseline(JSON.stringify(form));
        toast('success', `${label} withdrawn.`);
      },
      onError: (e) => {
        setDialog(null);
        showError(e, 'The proposal was not withdrawn');
      },
    });

  const discountForLabels: OrderDiscount =
    form.discountKind === 'percent' ? { kind: 'percent', percent: form.discountPercent || '0' } : form.discountKind === 'fixed' ? { kind: 'fixed', amountCents: 0 } : { kind: 'none' };
  const pricedByKey = new Map((check.totals?.lines ?? []).map((l) => [l.key, l]));
  const options = check.totals?.lines.filter((l) => l.optional) ?? [];
  const savedTotalDiffers = dirty && check.totals && check.totals.totalCents !== proposal.totalCents;
  const errorCount = Object.keys(check.errors).length;
  const busy = update.isPending || send.isPending || withdraw.isPending;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={form.title.trim() || proposal.title}
        crumbs={[
          { label: 'Proposals', to: paths.proposals },
          { label: proposal.propertyName, to: paths.property(proposal.propertyId) },
        ]}
        actions={
          <>
            <Button onClick={() => void save()} busy={update.isPending} disabled={!dirty && !attempted}>
              Save draft
            </Button>
            <Button variant="secondary" onClick={() => setDialog('send')} disabled={busy}>
              Send to client…
            </Button>
            <a href={proposalPdfUrl(proposal.id)} target="_blank" rel="noopener" className={buttonClasses('secondary')}>
              PDF preview
            </a>
            <Button variant="danger-outline" onClick={() => setDialog('withdraw')} disabled={busy}>
              Withdraw
            </Button>
          </>
        }
      >
        <span className="flex flex-wrap items-center gap-2">
          <span className="font-semibold text-ink">{label}</span>
          <StatusChip status="draft" />
          <span>
            for {proposal.clientName} ·{' '}
            <Link to={paths.property(proposal.propertyId)} className="text-moss-deep underline">
              {proposal.propertyName}
            </Link>
          </span>
        </span>
      </PageHeader>

      {notice ? <Notice>{notice}</Notice> : null}

      <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <Card title="The proposal">
          <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_12rem]">
            <TextField label="Title" value={form.title} maxLength={160} error={errorOf('title')} onChange={(e) => setField('title', e.target.value)} onBlur={() => touch('title')} />
            <TextField
              label="Valid until"
              type="date"
              value={form.expiresOn}
              error={errorOf('expiresOn')}
              hint={form.expiresOn ? `Expires after ${formatDay(form.expiresOn)}.` : 'No expiry date.'}
              onChange={(e) => setField('expiresOn', e.target.value)}
              onBlur={() => touch('expiresOn')}
            />
            <TextAreaField
              label="Introduction"
              className="sm:col-span-2"
              rows={3}
              value={form.introduction}
              error={errorOf('introduction')}
              hint="A few sentences to the landowner: what the plan does for their land."
              onChange={(e) => setField('introduction', e.target.value)}
            />
            <TextAreaField label="Terms" className="sm:col-span-2" rows={6} value={form.terms} error={errorOf('terms')} onChange={(e) => setField('terms', e.target.value)} />
          </div>
        </Card>
        <Card title="Tax, deposit and discount">
          <div className="flex flex-col gap-3">
            <div className="grid grid-cols-2 gap-3">
              <TextField label="Sales tax (%)" inputMode="decimal" value={form.taxRatePct} error={errorOf('taxRatePct')} hint="On lines marked taxable." onChange={(e) => setField('taxRatePct', e.target.value)} onBlur={() => touch('taxRatePct')} />
              <TextField label="Deposit (%)" inputMode="decimal" value={form.depositPct} error={errorOf('depositPct')} hint="Due on approval." onChange={(e) => setField('depositPct', e.target.value)} onBlur={() => touch('depositPct')} />
            </div>
            <fieldset className="flex flex-col gap-2">
              <legend className="mb-1 text-sm font-semibold text-ink">Discount</legend>
              <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
                {(
                  [
                    ['none', 'None'],
                    ['percent', 'Percent'],
                    ['fixed', 'Fixed amount'],
                  ] as [DiscountKind, string][]
                ).map(([kind, text]) => (
                  <label key={kind} className="flex items-center gap-1.5">
                    <input type="radio" name="discount-kind" value={kind} checked={form.discountKind === kind} onChange={() => setField('discountKind', kind)} className="accent-moss" />
                    {text}
                  </label>
                ))}
              </div>
              {form.discountKind === 'percent' ? (
                <TextField label="Discount (%)" inputMode="decimal" value={form.discountPercent} error={errorOf('discount')} hint="Of the subtotal of included lines." onChange={(e) => setField('discountPercent', e.target.value)} onBlur={() => touch('discount')} />
              ) : form.discountKind === 'fixed' ? (
                <TextField label="Discount ($)" inputMode="decimal" value={form.discountDollars} error={errorOf('discount')} hint="Spread over the lines in proportion to their amounts." onChange={(e) => setField('discountDollars', e.target.value)} onBlur={() => touch('discount')} />
              ) : errorOf('discount') ? (
                <p className="text-sm text-clay">{errorOf('discount')}</p>
              ) : null}
            </fieldset>
          </div>
        </Card>
      </div>

      <section aria-labelledby="lines-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="lines-heading" className="text-lg font-bold">
            Lines by unit
          </h2>
          <p className="text-sm text-slate">
            {form.lines.length} {form.lines.length === 1 ? 'line' : 'lines'} in {groups.length} {groups.length === 1 ? 'group' : 'groups'}. Optional lines are offered to the client and count once chosen.
          </p>
        </div>
        {errorOf('lines') ? <Notice>{errorOf('lines')}</Notice> : null}
        {groups.length === 0 ? (
          <p className="rounded border border-dashed border-rule px-4 py-6 text-center text-sm text-slate">
            No lines yet. Write prescriptions on the plan map and draft a new proposal, or add a group below and price it by hand.
          </p>
        ) : null}
        {groups.map((g) => {
          const meta = proposal.groups.find((x) => x.label === g.label);
          const size = groupSize(meta);
          const groupSum = g.items.reduce((s, { line }) => {
            const p = pricedByKey.get(line.key);
            return p && p.included ? s + p.amountCents : s;
          }, 0);
          return (
            <section key={g.label} aria-label={g.label} className="rounded-md border border-rule bg-card px-4 py-3">
              <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="flex items-center gap-2 text-base font-bold">
                  <KindSwatch kind={meta?.kind ?? null} />
                  {g.label}
                  {size ? <span className="font-sans text-sm font-normal text-slate">{size}</span> : null}
                </h3>
                <span className="figure text-sm">{check.totals ? formatCents(groupSum, proposal.currency) : '—'}</span>
              </header>
              <ColumnHeads />
              {g.items.map(({ line, index }) => (
                <LineRow
                  key={line.key}
                  line={line}
                  number={index + 1}
                  amountCents={check.lineAmounts.get(line.key)}
                  errorOf={errorOf}
                  onChange={(patch) => setLine(line.key, patch)}
                  onTouch={touch}
                  onRemove={() => removeLine(line.key)}
                  autoFocus={line.key === focusKey}
                  currency={proposal.currency}
                />
              ))}
              <Button variant="ghost" size="sm" className="mt-2" onClick={() => addLine(g.label, g.unitId)}>
                + Add a line
              </Button>
            </section>
          );
        })}
        <div className="flex flex-wrap items-end gap-2 rounded-md border border-dashed border-rule px-4 py-3">
          <TextField
            label="New group"
            className="min-w-0 flex-1 basis-60"
            placeholder="e.g. Site visit and soil tests"
            value={newGroup}
            error={newGroupError}
            onChange={(e) => setNewGroup(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                addGroup();
              }
            }}
          />
          <Button variant="secondary" onClick={addGroup}>
            Add group
          </Button>
        </div>
      </section>

      <div className="grid items-start gap-4 lg:grid-cols-2">
        <Card title="Totals">
          {check.totals ? (
            <>
              <TotalsList totals={check.totals} taxRatePct={form.taxRatePct} depositPct={form.depositPct} discount={discountForLabels} currency={proposal.currency} label="Totals of this draft" />
              {options.length ? (
                <p className="mt-2 text-sm text-slate">
                  {options.length} {options.length === 1 ? 'option' : 'options'} offered, {formatCents(options.reduce((s, l) => s + l.amountCents, 0), proposal.currency)} before tax, not in the total until the client chooses.
                </p>
              ) : null}
              {savedTotalDiffers ? <p className="mt-2 text-sm text-slate">Saved total: {formatCents(proposal.totalCents, proposal.currency)}. Save to keep the new figures.</p> : null}
            </>
          ) : (
            <p className="text-sm text-slate">Totals appear when every quantity, price and percentage is a number. Fix the fields marked in clay.</p>
          )}
        </Card>
        <VersionsList proposalId={proposal.id} />
      </div>

      <div className="sticky bottom-0 z-10 -mx-4 flex flex-wrap items-center justify-between gap-3 border-t border-rule bg-card/95 px-4 py-2 backdrop-blur sm:-mx-6 sm:px-6">
        <p className="text-sm">
          <span className="text-slate">Total </span>
          <span className="figure text-lg font-bold" data-testid="sticky-total">
            {check.totals ? formatCents(check.totals.totalCents, proposal.currency) : '—'}
          </span>
          <span className="text-slate"> · deposit </span>
          <span className="figure">{check.totals ? formatCents(check.totals.depositCents, proposal.currency) : '—'}</span>
          <span className="ml-3 text-slate">{dirty ? (attempted && errorCount ? `${countFields(errorCount)} to fix` : 'Unsaved changes') : 'All changes saved'}</span>
        </p>
        <Button size="sm" onClick={() => void save()} busy={update.isPending} disabled={!dirty && !attempted}>
          Save draft
        </Button>
      </div>

      <ConfirmDialog
        open={dialog === 'send'}
        title={`Send ${label} to ${proposal.clientName}?`}
        confirmLabel={dirty ? 'Save and send' : 'Send proposal'}
        busy={send.isPending || update.isPending}
        onConfirm={() => void confirmSend()}
        onCancel={() => setDialog(null)}
      >
        <p>
          They get an e-mail with the PDF and a link to review and approve it in their portal
          {check.totals ? `: ${formatCents(check.totals.totalCents, proposal.currency)}, deposit ${formatCents(check.totals.depositCents, proposal.currency)}` : ''}.
        </p>
        <p className="mt-2 text-slate">
          {dirty ? 'Your unsaved changes are saved first. ' : ''}Once sent, this version cannot change; revise it to make a new version.
        </p>
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog === 'withdraw'}
        title={`Withdraw ${label}?`}
        confirmLabel="Withdraw"
        destructive
        busy={withdraw.isPending}
        onConfirm={confirmWithdraw}
        onCancel={() => setDialog(null)}
      >
        <p>The draft is kept for the record but can no longer be edited or sent.{dirty ? ' Unsaved changes are dropped.' : ''}</p>
      </ConfirmDialog>
      <ConfirmDialog
        open={blocker.state === 'blocked'}
        title="Leave without saving?"
        confirmLabel="Leave and drop changes"
        destructive
        onConfirm={() => blocker.proceed?.()}
        onCancel={() => blocker.reset?.()}
      >
        <p>This draft has changes that are not saved.</p>
      </ConfirmDialog>
    </div>
  );
}
