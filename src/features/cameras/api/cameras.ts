/** The camera fleet's reads and writes: one query-options module for cameras, deployments, photos, events, the roster and due pulls. */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import { buckKeys } from '../../../lib/resources/bucks';
import type { BuckCreateInput, BuckDto, BuckUpdateInput, CameraCreateInput, CameraDto, CameraPhotoDto, CameraPhotoTagInput, CameraSitesAnswer, CardPullCreateInput, CardUploadResult, DeploymentCreateInput, DeploymentDto, DeploymentEventsDto, DuePullDto, SurveyFromPhotosInput } from '../../../../shared/schemas/cameras';
import type { SurveyDto } from '../../../../shared/schemas/results';

/** Query keys, hierarchical so that a prefix invalidates a family. */
export const cameraKeys = {
  all: () => ['cameras'] as const,
  list: () => ['cameras', 'list'] as const,
  due: () => ['cameras', 'due'] as const,
  propertyDeployments: (propertyId: number) => ['cameras', 'deployments', { propertyId }] as const,
  photos: (deploymentId: number) => ['cameras', 'photos', { deploymentId }] as const,
  events: (deploymentId: number) => ['cameras', 'events', { deploymentId }] as const,
  bucks: buckKeys.roster,
  sites: (propertyId: number) => ['cameras', 'sites', { propertyId }] as const,
};

export const getCamerasQueryOptions = () => queryOptions({ queryKey: cameraKeys.list(), queryFn: ({ signal }) => getData<CameraDto[]>('/api/cameras', signal) });
export const useCameras = () => useQuery(getCamerasQueryOptions());

export const getDuePullsQueryOptions = () => queryOptions({ queryKey: cameraKeys.due(), queryFn: ({ signal }) => getData<DuePullDto[]>('/api/deployments/due', signal) });
/** Deployments whose card is due for a pull, with the access route to walk in on. */
export const useDuePulls = () => useQuery(getDuePullsQueryOptions());

export const getPropertyDeploymentsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: cameraKeys.propertyDeployments(propertyId), queryFn: ({ signal }) => getData<DeploymentDto[]>(`/api/properties/${propertyId}/deployments`, signal) });
export const usePropertyDeployments = (propertyId: number) => useQuery({ ...getPropertyDeploymentsQueryOptions(propertyId), enabled: propertyId > 0 });

export const getDeploymentPhotosQueryOptions = (deploymentId: number) =>
  queryOptions({ queryKey: cameraKeys.photos(deploymentId), queryFn: ({ signal }) => getData<CameraPhotoDto[]>(`/api/deployments/${deploymentId}/photos?limit=1000`, signal) });
export const useDeploymentPhotos = (deploymentId: number | null) => useQuery({ ...getDeploymentPhotosQueryOptions(deploymentId ?? 0), enabled: !!deploymentId });

export const getDeploymentEventsQueryOptions = (deploymentId: number) =>
  queryOptions({ queryKey: cameraKeys.events(deploymentId), queryFn: ({ signal }) => getData<DeploymentEventsDto>(`/api/deployments/${deploymentId}/events`, signal) });
export const useDeploymentEvents = (deploymentId: number | null) => useQuery({ ...getDeploymentEventsQueryOptions(deploymentId ?? 0), enabled: !!deploymentId });

export const getCameraSitesQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: cameraKeys.sites(propertyId), queryFn: ({ signal }) => api.get<CameraSitesAnswer>(`/api/properties/${propertyId}/camera-sites`, signal) });
/** The property's camera sites with camera-nights, events and activity by hour summed over their deployments. */
export const useCameraSites = (propertyId: number) => useQuery({ ...getCameraSitesQueryOptions(propertyId), enabled: propertyId > 0 });

/** The roster's one query-options module lives in src/lib/resources (the hunting feature reads it too). */
export { getBucksQueryOptions, useBucks } from '../../../lib/resources/bucks';

function useInvalidatingMutation<A, R>(fn: (a: A) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: cameraKeys.all() }) });
}

export const useCreateCamera = () => useInvalidatingMutation((input: CameraCreateInput) => api.post<{ data: CameraDto }>('/api/cameras', input).then((r) => r.data));
export const useCreateDeployment = () =>
  useInvalidatingMutation(({ cameraId, input }: { cameraId: number; input: DeploymentCreateInput }) => api.post<{ data: DeploymentDto }>(`/api/cameras/${cameraId}/deployments`, input).then((r) => r.data));
export const useEndDeployment = () => useInvalidatingMutation(({ id, endedOn }: { id: number; endedOn: string }) => api.patch<{ data: DeploymentDto }>(`/api/deployments/${id}`, { endedOn }).then((r) => r.data));
export const useCreatePull = () => useInvalidatingMutation(({ deploymentId, input }: { deploymentId: number; input: CardPullCreateInput }) => api.post(`/api/deployments/${deploymentId}/pulls`, input));
export const useCreateBuck = (propertyId: number) => useInvalidatingMutation((input: BuckCreateInput) => api.post<{ data: BuckDto }>(`/api/properties/${propertyId}/bucks`, input).then((r) => r.data));
/** Changes a roster buck's name, notes or age class per season. */
export const useUpdateBuck = (propertyId: number) =>
  useInvalidatingMutation(({ buckId, input }: { buckId: number; input: BuckUpdateInput }) => api.patch<{ data: BuckDto }>(`/api/properties/${propertyId}/bucks/${buckId}`, input).then((r) => r.data));

/** Tags one photo; the grid's cached list is updated in place (no refetch per key press). */
export function useTagPhoto(deploymentId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: CameraPhotoTagInput }) => api.patch<{ data: CameraPhotoDto }>(`/api/camera-photos/${id}`, input).then((r) => r.data),
    onSuccess: (photo) => {
      qc.setQueryData<CameraPhotoDto[]>(cameraKeys.photos(deploymentId), (list) => list?.map((p) => (p.id === photo.id ? photo : p)));
      void qc.invalidateQueries({ queryKey: cameraKeys.events(deploymentId) });
      void qc.invalidateQueries({ queryKey: ['cameras', 'bucks'] });
    },
  });
}

/** Which of these SHA-256 hashes the deployment already holds. */
export const knownPhotoHashes = (deploymentId: number, hashes: string[]) => api.post<{ data: { known: string[] } }>(`/api/deployments/${deploymentId}/photos/known`, { hashes }).then((r) => r.data.known);

/** Sends one batch of a card's photos. */
export function uploadCardBatch(deploymentId: number, files: File[]): Promise<CardUploadResult> {
  const form = new FormData();
  for (const f of files) form.append('photos', f, f.name);
  return api.upload<{ data: CardUploadResult }>(`/api/deployments/${deploymentId}/photos`, form).then((r) => r.data);
}

/** Makes a camera survey from tagged photos; the property's results refetch. */
export function useCreateSurveyFromPhotos(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SurveyFromPhotosInput) => api.post<{ data: SurveyDto }>(`/api/properties/${propertyId}/surveys`, input).then((r) => r.data),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['results'] }),
  });
}
