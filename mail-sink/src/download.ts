/**
 * A Content-Disposition header that cannot be broken out of: an ASCII fallback name with
 * everything outside a small set replaced, and the real name percent-encoded (RFC 6266, 8187).
 */
export function contentDisposition(kind: 'attachment' | 'inline', filename: string): string {
  const base = filename.split(/[/\\]/).pop() ?? '';
  const clean = [...base]
    .filter((char) => char >= ' ' && char !== '\u007f')
    .join('')
    .trim();
  const name = clean === '' || clean === '.' || clean === '..' ? 'download' : clean;
  const fallback = name.replace(/[^A-Za-z0-9 ._()+-]/g, '_');
  const encoded = encodeURIComponent(name).replace(
    /['()*]/g,
    (char) => `%${char.charCodeAt(0).toString(16).toUpperCase()}`,
  );
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}

/** The attachment's own type when it is a well-formed `type/subtype`, else a neutral one. */
export function safeContentType(contentType: string): string {
  return /^[a-z0-9!#$&^_.+-]+\/[a-z0-9!#$&^_.+-]+$/i.test(contentType)
    ? contentType
    : 'application/octet-stream';
}
