import type { ComponentType } from 'react';
import type { RouteObject } from 'react-router-dom';

/**
 * A route whose component is its own chunk: sign-in, the field sheet, the portal and the
 * consultant's pages each load only their own code (charts, tables and the map with the pages that
 * show them). A static `loader` beside it starts the page's data while the code downloads.
 */
export function page<M>(load: () => Promise<M>, pick: (m: M) => ComponentType): Pick<RouteObject, 'lazy'> {
  return { lazy: async () => ({ Component: pick(await load()) }) };
}
