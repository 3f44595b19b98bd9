/** The shared look of Browseline's e-mails: plain text first, with a simple HTML twin. */

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

const escape = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

interface LayoutInput {
  subject: string;
  firmName: string;
  /** The firm's address, phone · e-mail · website and licence numbers, printed under the sign-off. */
  firmContact?: string[];
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  footnote?: string;
}

/** Renders an e-mail with a greeting, paragraphs, one action link and a footnote. */
export function renderEmail(input: LayoutInput): RenderedEmail {
  const text = [
    input.greeting,
    '',
    ...input.paragraphs.flatMap((p) => [p, '']),
    ...(input.action ? [`${input.action.label}: ${input.action.url}`, ''] : []),
    ...(input.footnote ? [input.footnote, ''] : []),
    `— ${input.firmName}, via Browseline`,
    ...(input.firmContact ?? []),
  ].join('\n');
  const html = `<!doctype html><html><body style="margin:0;background:#F6F3EA;font-family:Helvetica,Arial,sans-serif;color:#1F2A24">
<div style="max-width:560px;margin:24px auto;background:#FFFDF7;border:1px solid #D9D3C3;border-radius:6px;padding:24px">
<p style="font-family:Georgia,serif;font-size:18px;color:#2E5029;margin:0 0 16px">${escape(input.firmName)}</p>
<p>${escape(input.greeting)}</p>
${input.paragraphs.map((p) => `<p style="line-height:1.5">${escape(p)}</p>`).join('\n')}
${input.action ? `<p><a href="${escape(input.action.url)}" style="display:inline-block;background:#3F6B3A;color:#fff;text-decoration:none;padding:10px 16px;border-radius:4px">${escape(input.action.label)}</a></p>` : ''}
${input.footnote ? `<p style="color:#5B6770;font-size:13px">${escape(input.footnote)}</p>` : ''}
<p style="color:#5B6770;font-size:13px">— ${escape(input.firmName)}, via Browseline${(input.firmContact ?? []).map((l) => `<br>${escape(l)}`).join('')}</p>
</div></body></html>`;
  return { subject: input.subject, text, html };
}
