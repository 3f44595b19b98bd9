/** Every client route in one place. */
export const paths = {
  login: '/login',
  forgotPassword: '/forgot-password',
  signup: '/signup',
  verifyEmail: (token = ':token') => `/verify-email/${token}`,
  resetPassword: (token = ':token') => `/reset-password/${token}`,
  acceptInvite: (token = ':token') => `/invite/${token}`,
  desk: '/desk',
  clients: '/clients',
  client: (id: number | string = ':id') => `/clients/${id}`,
  properties: '/properties',
  property: (id: number | string = ':id') => `/properties/${id}`,
  planMap: (id: number | string = ':id') => `/properties/${id}/map`,
  planPrint: (id: number | string = ':id') => `/properties/${id}/print`,
  proposals: '/proposals',
  schedule: '/schedule',
  /** The schedule filtered to one property. */
  scheduleForProperty: (propertyId: number | string) => `/schedule?property=${propertyId}`,
  proposal: (id: number | string = ':id') => `/proposals/${id}`,
  invoices: '/invoices',
  invoice: (id: number | string = ':id') => `/invoices/${id}`,
  /** The signed-in "change password" page (every role). */
  changePassword: '/account/password',
  team: '/settings/team',
  mail: '/settings/mail',
  /** The link in the export-ready e-mail: keep this path. */
  firmExport: '/settings/export',
  library: '/library',
  libraryPractices: '/library/practices',
  practice: (id: number | string = ':id') => `/library/practices/${id}`,
  libraryMaterials: '/library/materials',
  libraryRates: '/library/rates',
  propertyPrescriptions: (id: number | string = ':id') => `/properties/${id}/prescriptions`,
  propertyResults: (id: number | string = ':id') => `/properties/${id}/results`,
  /** Next season's plan of a property: the changes the evidence suggests, then the draft proposal. */
  nextSeason: (id: number | string = ':id') => `/properties/${id}/next-season`,
  /** A unit's page: its checks and the re-seeding they draft. */
  unitChecks: (propertyId: number | string = ':id', unitId: number | string = ':unitId') => `/properties/${propertyId}/units/${unitId}`,
  /** A lab's soil-test results file for several units of a property. */
  propertySoilTests: (id: number | string = ':id') => `/properties/${id}/soil-tests`,
  /** The firm's spray records (7 CFR Part 110) by season and property; `task` marks one task's records. */
  sprayRecords: '/spray-records',
  propertyCameras: (id: number | string = ':id') => `/properties/${id}/cameras`,
  propertyStands: (id: number | string = ':id') => `/properties/${id}/stands`,
  field: '/field',
  fieldTask: (id: number | string = ':id') => `/field/tasks/${id}`,
  fieldLog: '/field/log',
  portal: '/portal',
  portalProposals: '/portal/proposals',
  portalResults: '/portal/results',
  /** The link in the season-report e-mail: keep this path. */
  portalPropertyResults: (id: number | string = ':id') => `/portal/properties/${id}/results`,
  portalPropertyStands: (id: number | string = ':id') => `/portal/properties/${id}/stands`,
  portalPropertySeasons: (id: number | string = ':id') => `/portal/properties/${id}/seasons`,
  /** The link in the proposal e-mail: keep this path. */
  portalProposal: (id: number | string = ':id') => `/portal/proposals/${id}`,
  portalInvoices: '/portal/invoices',
  /** The link in the invoice e-mails: keep this path. */
  portalInvoice: (id: number | string = ':id') => `/portal/invoices/${id}`,
  portalProperty: (id: number | string = ':id') => `/portal/properties/${id}`,
  portalPropertyProgress: (id: number | string = ':id') => `/portal/properties/${id}/progress`,
  portalProgress: '/portal/progress',
  portalFiles: '/portal/files',
  /** A consultant's read-only preview of a client's portal. */
  previewClient: (clientId: number | string = ':clientId') => `/preview/clients/${clientId}`,
  previewProperty: (clientId: number | string = ':clientId', id: number | string = ':id') => `/preview/clients/${clientId}/properties/${id}`,
  previewPropertySeasons: (clientId: number | string = ':clientId', id: number | string = ':id') => `/preview/clients/${clientId}/properties/${id}/seasons`,
  previewPropertyProgress: (clientId: number | string = ':clientId', id: number | string = ':id') => `/preview/clients/${clientId}/properties/${id}/progress`,
  previewProgress: (clientId: number | string = ':clientId') => `/preview/clients/${clientId}/progress`,
  previewFiles: (clientId: number | string = ':clientId') => `/preview/clients/${clientId}/files`,
  previewProposals: (clientId: number | string = ':clientId') => `/preview/clients/${clientId}/proposals`,
} as const;

/** The home of each role after sign-in. */
export function homeFor(role: string): string {
  if (role === 'crew') return paths.field;
  if (role === 'client') return paths.portal;
  return paths.desk;
}
