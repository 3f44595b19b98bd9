/** The proposal builder's lines, grouped by unit: each group's lines and sum, "Add a line", and a new group by hand. */
import { useState } from 'react';
import { formatCents } from '../../../../shared/domain/money';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { LINE_LIMITS } from '../utils/draft-form';
import type { DraftFormState } from '../hooks/use-draft-form';
import { KindSwatch, groupSize } from './document-parts';
import { ColumnHeads, LineRow, Notice } from './builder-line-row';

/** The lines of a draft by group, editable. */
export function BuilderLines({ proposal, draft }: { proposal: ProposalDto; draft: DraftFormState }) {
  const { form, groups, check, errorOf, touch, setLine, removeLine, addLine, focusKey } = draft;
  const [newGroup, setNewGroup] = useState('');
  const [newGroupError, setNewGroupError] = useState<string | undefined>();
  const pricedByKey = new Map((check.totals?.lines ?? []).map((l) => [l.key, l]));

  const addGroup = () => {
    const name = newGroup.trim();
    if (!name) return setNewGroupError('Name the group first, e.g. “Fencing” or “Site visit”.');
    if (name.length > LINE_LIMITS.groupLabelMax) return setNewGroupError(`Keep the group name to ${LINE_LIMITS.groupLabelMax} characters.`);
    if (groups.some((g) => g.label === name)) return setNewGroupError(`“${name}” is a group already; use its “Add a line”.`);
    setNewGroupError(undefined);
    setNewGroup('');
    addLine(name, null);
  };

  return (
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
  );
}
