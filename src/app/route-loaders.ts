/**
 * Route loaders: each starts its page's data through the same TanStack Query options the page's
 * hooks use (`ensureQueryData`), so the data and the page's lazily loaded code arrive in parallel.
 * A loader never waits and never fails: the page's own query shows loading, errors and — with no
 * signal — the last data this person saw (restored from the persisted cache).
 */
import type { LoaderFunctionArgs } from 'react-router-dom';
import type { FetchQueryOptions, QueryKey } from '@tanstack/react-query';
import { queryClient } from '../lib/query-client';
import { getMeQueryOptions } from '../features/auth/api/get-me';
import { getFieldHomeQueryOptions } from '../features/field/api/get-field-home';
import { getMyTasksQueryOptions } from '../features/field/api/get-my-tasks';
import { getTaskQueryOptions } from '../lib/resources/task';
import { getPortalPropertiesQueryOptions } from '../features/portal/api/get-portal-properties';
import { getPortalPropertyQueryOptions } from '../features/portal/api/get-portal-property';
import { OWN_SCOPE } from '../features/portal/api/portal-scope';
import { getDeskQueryOptions } from '../features/desk/api/get-desk';
import { parseId } from '../lib/route-params';

/** Starts a query in the background unless it is cached; errors are left to the page's hook. */
function prefetch<T, K extends QueryKey>(options: FetchQueryOptions<T, Error, T, K>): void {
  void queryClient.ensureQueryData(options as never).catch(() => undefined);
}

/** The signed-in person, from the cache or the server (null when signed out or unreachable). */
const me = () => queryClient.ensureQueryData(getMeQueryOptions()).catch(() => null);

export function fieldHomeLoader() {
  prefetch(getFieldHomeQueryOptions());
  void me().then((user) => user && prefetch(getMyTasksQueryOptions(user)));
  return null;
}

export function fieldTaskLoader({ params }: LoaderFunctionArgs) {
  const id = parseId(params.id);
  if (id && !queryClient.getQueryData(getTaskQueryOptions(id).queryKey)) prefetch(getTaskQueryOptions(id));
  return null;
}

export function portalHomeLoader() {
  prefetch(getPortalPropertiesQueryOptions(OWN_SCOPE));
  return null;
}

export function portalPropertyLoader({ params }: LoaderFunctionArgs) {
  const id = parseId(params.id);
  if (id) prefetch(getPortalPropertyQueryOptions(OWN_SCOPE, id));
  return null;
}

export function deskLoader() {
  prefetch(getDeskQueryOptions());
  return null;
}
