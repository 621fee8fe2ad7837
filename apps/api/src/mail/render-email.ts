/** A plain e-mail in Skyhours' voice, as text and as escaped HTML. */
export interface EmailContent {
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Extra lines after the action, e.g. an expiry notice. */
  after?: string[];
}

export const escapeHtml = (value: string): string =>
  value.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );

export function renderEmail(content: EmailContent): { text: string; html: string } {
  const { greeting, paragraphs, action, after = [] } = content;
  const text = [
    greeting,
    '',
    ...paragraphs.flatMap((p) => [p, '']),
    ...(action ? [`${action.label}: ${action.url}`, ''] : []),
    ...after.flatMap((p) => [p, '']),
    '— Skyhours',
  ].join('\n');
  const para = (p: string) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`;
  const html = `<!doctype html><html><body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#17223b;line-height:1.5">
<p style="margin:0 0 14px">${escapeHtml(greeting)}</p>
${paragraphs.map(para).join('\n')}
${action ? `<p style="margin:18px 0"><a href="${escapeHtml(action.url)}" style="background:#23407a;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>` : ''}
${after.map(para).join('\n')}
<p style="margin:18px 0 0;color:#5b6785">— Skyhours</p>
</body></html>`;
  return { text, html };
}
