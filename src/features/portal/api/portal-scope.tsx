/**
 * Whose portal a page shows: the signed-in client's own, or — for a consultant's "preview as client" —
 * a client of the firm read through the staff-only preview API. The same page components render both;
 * in preview every write control is disabled and links stay inside the preview.
 */
import { createContext, useContext, type ReactNode } from 'react';
import { paths } from '../../../config/paths';

export interface PortalScope {
  /** 'own' for the signed-in client; 'preview' for staff previewing client `clientId`. */
  mode: 'own' | 'preview';
  clientId: number | null;
  /** Base of the portal API for this scope. */
  apiBase: string;
  /** The files list of this scope. */
  filesUrl: string;
  /** Writes are disabled in preview. */
  readOnly: boolean;
  links: {
    home: string;
    property: (id: number) => string;
    progress: (id: number) => string;
    progressHome: string;
    files: string;
    proposals: string;
    proposal: (id: number) => string;
    /** A property's seasons side by side. */
    seasons: (id: number) => string;
  };
}

/** The signed-in client's own portal. */
export const OWN_SCOPE: PortalScope = {
  mode: 'own',
  clientId: null,
  apiBase: '/api/portal',
  filesUrl: '/api/files',
  readOnly: false,
  links: {
    home: paths.portal,
    property: (id) => paths.portalProperty(id),
    progress: (id) => paths.portalPropertyProgress(id),
    progressHome: paths.portalProgress,
    files: paths.portalFiles,
    proposals: paths.portalProposals,
    proposal: (id) => paths.portalProposal(id),
    seasons: (id) => paths.portalPropertySeasons(id),
  },
};

/** A consultant's read-only preview of client `clientId`'s portal. */
export function previewScope(clientId: number): PortalScope {
  return {
    mode: 'preview',
    clientId,
    apiBase: `/api/portal/preview/${clientId}`,
    filesUrl: `/api/portal/preview/${clientId}/files`,
    readOnly: true,
    links: {
      home: paths.previewClient(clientId),
      property: (id) => paths.previewProperty(clientId, id),
      progress: (id) => paths.previewPropertyProgress(clientId, id),
      progressHome: paths.previewProgress(clientId),
      files: paths.previewFiles(clientId),
      proposals: paths.previewProposals(clientId),
      // The consultant's own view of the document (the client's approval page needs a client session).
      proposal: (id) => paths.proposal(id),
      seasons: (id) => paths.previewPropertySeasons(clientId, id),
    },
  };
}

const PortalScopeContext = createContext<PortalScope>(OWN_SCOPE);

/** Provides the scope to the portal pages below. */
export function PortalScopeProvider({ scope, children }: { scope: PortalScope; children: ReactNode }) {
  return <PortalScopeContext.Provider value={scope}>{children}</PortalScopeContext.Provider>;
}

/** The scope of the portal page being rendered. */
export const usePortalScope = () => useContext(PortalScopeContext);

/** Query keys per scope, so a preview never shares a cache entry with a client's own portal. */
export const portalKeys = {
  all: ['portal'] as const,
  scope: (s: PortalScope) => ['portal', s.mode, s.clientId ?? 0] as const,
  properties: (s: PortalScope) => [...portalKeys.scope(s), 'properties'] as const,
  property: (s: PortalScope, id: number) => [...portalKeys.scope(s), 'properties', id] as const,
  files: (s: PortalScope) => [...portalKeys.scope(s), 'files'] as const,
};
