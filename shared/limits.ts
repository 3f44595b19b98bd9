/** Limits shared by the server's validation and the client's forms. */
export const LIMITS = {
  nameMax: 120,
  emailMax: 254,
  passwordMin: 10,
  passwordMax: 200,
  textMax: 4000,
  jsonBodyBytes: 2 * 1024 * 1024,
  inviteTtlHours: 72,
  resetTtlMinutes: 60,
} as const;
