import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Card, EmptyState } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { Button, buttonClasses } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { firmToday } from '../../../lib/firm-clock';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { useCreateSeasonDraft, useDecideSeasonChange, useWriteSeasonDraft } from '../../../features/seasons/api/season-drafts';
import type { SeasonDraftDto } from '../../../../shared/schemas/seasons';
import type { SeasonChangeKind } from '../../../../shared/domain/next-season';

const KIND_LABELS: Record<SeasonChangeKind, string> = { reseed: 'Re-seed', 'shift-mix': 'Shift the mix', lime: 'Lime and fertilizer', rotation: 'Rotation' };

/** Next season's plan of a property: the changes the evidence suggests, each accepted or rejected, then the draft proposal. */
export function NextSeasonPage() {
  const propertyId = parseId(useParams().id) ?? 0;
  const [season, setSeason] = useState(String(Number(firmToday().slice(0, 4)) + 1));
  const [draft, setDraft] = useState<SeasonDraftDto | null>(null);
  const create = useCreateSeasonDraft();
  const decide = useDecideSeasonChange();
  const write = useWriteSeasonDraft();
  const toast = useToast();
  const fail = (e: unknown) => toast('error', e instanceof ApiError ? e.message : 'Nothing changed. Try again.');

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Next season" crumbs={[{ label: 'Properties', to: paths.properties }, { label: 'Property', to: paths.property(propertyId) }]}>
        Carry the plan over and adjust it from the checks and soil tests
      </PageHeader>
      <Card title="Draft a season">
        <form
          className="flex items-end gap-3"
          aria-label="Draft a season"
          onSubmit={(e) => {
            e.preventDefault();
            create.mutate({ propertyId, season: Number(season) }, { onSuccess: setDraft, onError: fail });
          }}
        >
          <TextField label="Season (year)" inputMode="numeric" value={season} onChange={(e) => setSeason(e.target.value)} />
          <Button type="submit" busy={create.isPending}>
            Draft the plan
          </Button>
        </form>
      </Card>
      {draft ? (
        <Card title={`Changes for ${draft.season}`}>
          {draft.plan.changes.length === 0 ? (
            <EmptyState title="Nothing to change">The plan carries over as it is.</EmptyState>
          ) : (
            <ul className="flex flex-col gap-3">
              {draft.plan.changes.map((c) => (
                <li key={c.id} className="rounded border border-rule bg-card p-3 text-sm">
                  <p>
                    <strong>
                      {c.unitName} — {KIND_LABELS[c.kind]}
                    </strong>{' '}
                    <span className="text-slate">({c.decision})</span>
                  </p>
                  <p className="mt-1">{c.reason}</p>
                  {draft.status === 'draft' ? (
                    <div className="mt-2 flex gap-2">
                      <Button size="sm" variant={c.decision === 'accepted' ? 'primary' : 'secondary'} aria-pressed={c.decision === 'accepted'} onClick={() => decide.mutate({ draftId: draft.id, changeId: c.id, decision: 'accepted' }, { onSuccess: setDraft, onError: fail })}>
                        Accept: {c.unitName}, {KIND_LABELS[c.kind].toLowerCase()}
                      </Button>
                      <Button size="sm" variant={c.decision === 'rejected' ? 'primary' : 'secondary'} aria-pressed={c.decision === 'rejected'} onClick={() => decide.mutate({ draftId: draft.id, changeId: c.id, decision: 'rejected' }, { onSuccess: setDraft, onError: fail })}>
                        Reject: {c.unitName}, {KIND_LABELS[c.kind].toLowerCase()}
                      </Button>
                    </div>
                  ) : null}
                </li>
              ))}
            </ul>
          )}
          <div className="mt-4">
            {draft.status === 'written' && draft.proposalId ? (
              <Link to={paths.proposal(draft.proposalId)} className={buttonClasses('primary')}>
                Open the draft proposal for {draft.season}
              </Link>
            ) : (
              <Button busy={write.isPending} onClick={() => write.mutate({ draftId: draft.id }, { onSuccess: setDraft, onError: fail })}>
                Write the season and draft the proposal
              </Button>
            )}
          </div>
        </Card>
      ) : null}
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = NextSeasonPage;
