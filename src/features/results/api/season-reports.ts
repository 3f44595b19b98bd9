import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SeasonReportDto } from '../../../../shared/schemas/results';
import { resultsKeys } from './keys';

/** Makes the season report PDF for a property (kept private until sent). */
export const createSeasonReport = async ({ propertyId, season, recommendations }: { propertyId: number; season: number; recommendations: string | null }) =>
  (await api.post<{ data: SeasonReportDto }>(`/api/properties/${propertyId}/season-reports`, { season, recommendations })).data;

/** E-mails a season report to the landowner and opens it in their portal. */
export const sendSeasonReport = async (id: number) => (await api.post<{ data: SeasonReportDto }>(`/api/season-reports/${id}/send`)).data;

/** Makes a season report; the property's results refetch. */
export function useCreateSeasonReport(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createSeasonReport, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}

/** Sends a season report; the property's results refetch. */
export function useSendSeasonReport(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: sendSeasonReport, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}

/** Takes a sent season report back out of the landowner's portal (the firm keeps it). */
export const withdrawSeasonReport = async (id: number) => (await api.post<{ data: SeasonReportDto }>(`/api/season-reports/${id}/withdraw`)).data;

/** Withdraws a sent season report from the portal; the property's results refetch. */
export function useWithdrawSeasonReport(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: withdrawSeasonReport, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}
