/** Markup that is already safe to place in a page; anything else interpolated into `markup` is escaped. */
export class SafeHtml {
  constructor(readonly value: string) {}

  toString(): string {
    return this.value;
  }
}

export type HtmlPart = SafeHtml | string | number | null | undefined | false | readonly HtmlPart[];

const ENTITIES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (char) => ENTITIES[char] ?? char);
}

/** Template tag: every interpolated value is escaped unless it is SafeHtml (or a list of parts). */
export function markup(strings: TemplateStringsArray, ...values: HtmlPart[]): SafeHtml {
  let out = strings[0] ?? '';
  values.forEach((value, index) => {
    out += renderPart(value) + (strings[index + 1] ?? '');
  });
  return new SafeHtml(out);
}

function renderPart(part: HtmlPart): string {
  if (part === null || part === undefined || part === false) return '';
  if (part instanceof SafeHtml) return part.value;
  if (Array.isArray(part)) return part.map(renderPart).join('');
  return escapeHtml(String(part));
}
