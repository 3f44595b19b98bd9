/** The lines a document or e-mail prints under the firm's name, from its profile. */

export interface FirmContact {
  phone?: string | null;
  email?: string | null;
  address?: string | null;
  website?: string | null;
  licenceNumbers?: string | null;
}

/**
 * Up to three lines, blanks left out: the postal address on one line, then phone · e-mail · website
 * (without https://), then the licence or certification numbers.
 */
export function firmContactLines(firm: FirmContact): string[] {
  const oneLine = (s: string | null | undefined, joiner: string) =>
    (s ?? '')
      .split(/\r?\n/)
      .map((l) => l.trim())
      .filter(Boolean)
      .join(joiner);
  const website = firm.website ? firm.website.replace(/^https?:\/\//, '').replace(/\/$/, '') : null;
  const reach = [firm.phone, firm.email, website].map((s) => (s ?? '').trim()).filter(Boolean).join('  ·  ');
  return [oneLine(firm.address, ', '), reach, oneLine(firm.licenceNumbers, '  ·  ')].filter(Boolean);
}
