import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SeasonDraftDto } from '../../../../shared/schemas/seasons';

/** Query keys of season drafts. */
export const seasonKeys = {
  all: () => ['season-drafts'] as const,
  detail: (id: number) => ['season-drafts', id] as const,
};

/** POST /api/properties/:id/seasons { season }: drafts (or answers the existing draft of) that season. */
export const createSeasonDraft = async ({ propertyId, season }: { propertyId: number; season: number }) =>
  (await api.post<{ data: SeasonDraftDto }>(`/api/properties/${propertyId}/seasons`, { season })).data;

/** PATCH /api/season-drafts/:id/changes/:changeId { decision }. */
export const decideSeasonChange = async ({ draftId, changeId, decision }: { draftId: number; changeId: string; decision: 'accepted' | 'rejected' | 'proposed' }) =>
  (await api.patch<{ data: SeasonDraftDto }>(`/api/season-drafts/${draftId}/changes/${changeId}`, { decision })).data;

/** POST /api/season-drafts/:id/proposal: the season's prescriptions and a draft proposal. */
export const writeSeasonDraft = async ({ draftId }: { draftId: number }) => (await api.post<{ data: SeasonDraftDto }>(`/api/season-drafts/${draftId}/proposal`)).data;

/** Drafts a season; the draft is kept in the cache. */
export function useCreateSeasonDraft() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createSeasonDraft, onSuccess: (d) => qc.setQueryData(seasonKeys.detail(d.id), d) });
}

/** Accepts or rejects one change. */
export function useDecideSeasonChange() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: decideSeasonChange, onSuccess: (d) => qc.setQueryData(seasonKeys.detail(d.id), d) });
}

/** Writes the season; prescriptions and proposals refetch. */
export function useWriteSeasonDraft() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: writeSeasonDraft,
    onSuccess: (d) => {
      qc.setQueryData(seasonKeys.detail(d.id), d);
      void qc.invalidateQueries({ queryKey: ['prescriptions'] });
      void qc.invalidateQueries({ queryKey: ['proposals'] });
    },
  });
}
