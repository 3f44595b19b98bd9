import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import { waitForJob } from '../../../lib/wait-for-job';
import type { JobDto } from '../../../../shared/schemas/job';
import type { SeasonReportDto } from '../../../../shared/schemas/results';
import { resultsKeys } from './keys';

/**
 * Makes the season report PDF for a property (kept private until sent). A background job makes it:
 * a quick one answers the report at once (201); a slow one answers 202 and is polled to the end,
 * its progress reported on the way.
 */
export const createSeasonReport = async ({ propertyId, season, recommendations, onProgress }: { propertyId: number; season: number; recommendations: string | null; onProgress?: (job: JobDto) => void }): Promise<SeasonReportDto> => {
  const answer = await api.post<{ data: SeasonReportDto | null; job: JobDto }>(`/api/properties/${propertyId}/season-reports`, { season, recommendations });
  if (answer.data) return answer.data;
  const job = await waitForJob(answer.job.id, onProgress);
  const reports = await getData<SeasonReportDto[]>(`/api/properties/${propertyId}/season-reports`);
  const made = reports.find((r) => r.id === Number(job.result?.seasonReportId));
  if (!made) throw new Error('The report was made but is not in the list yet. Reload the page.');
  return made;
};

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
