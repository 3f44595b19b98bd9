/** A new firm's first steps on the Desk, each ticked off by the firm's own data, never by hand. */

export const FIRST_STEP_KEYS = ['home-area', 'profile', 'first-client'] as const;
export type FirstStepKey = (typeof FIRST_STEP_KEYS)[number];

export interface FirstStepsInput {
  /** Whether the firm has chosen where it works (the home area its new maps open on). */
  homeAreaSet: boolean;
  address: string | null;
  phone: string | null;
  email: string | null;
  website: string | null;
  logoKey: string | null;
  clients: number;
}

/** The profile counts as filled once documents can print where the firm is and how to reach it. */
export function profileFilled(f: Pick<FirstStepsInput, 'address' | 'phone' | 'email' | 'website' | 'logoKey'>): boolean {
  const has = (s: string | null) => Boolean(s && s.trim());
  return has(f.address) && (has(f.phone) || has(f.email) || has(f.website) || has(f.logoKey));
}

/**
 * The three first steps in order with whether each is done; null once all are done, so the Desk
 * stops showing the list.
 */
export function firstSteps(input: FirstStepsInput): { key: FirstStepKey; done: boolean }[] | null {
  const steps = [
    { key: 'home-area' as const, done: input.homeAreaSet },
    { key: 'profile' as const, done: profileFilled(input) },
    { key: 'first-client' as const, done: input.clients > 0 },
  ];
  return steps.every((s) => s.done) ? null : steps;
}
