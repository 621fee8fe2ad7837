/** Half a surrogate pair cannot be encoded as UTF-8 (encodeURIComponent would throw). */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/**
 * A Content-Disposition header value for a download (RFC 6266): a plain ASCII `filename` for old
 * clients and, when the name has other characters, `filename*` in RFC 5987's UTF-8 encoding,
 * which current browsers prefer. Nothing of the name can end the header or add a parameter.
 */
export function contentDisposition(
  filename: string,
  disposition: 'attachment' | 'inline' = 'attachment',
): string {
  const name = filename.replace(LONE_SURROGATE, '\uFFFD');
  const fallback = name
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    // Outside printable ASCII, and the quote, backslash and percent sign (which some clients
    // decode inside a quoted filename), become "_".
    .replace(/[^\x20-\x7e]|["\\%]/g, '_');
  if (fallback === name) return `${disposition}; filename="${fallback}"`;
  return `${disposition}; filename="${fallback}"; filename*=UTF-8''${encodeRfc5987(name)}`;
}

/** encodeURIComponent leaves ' ( ) * unencoded, which RFC 5987's attr-char does not allow. */
const encodeRfc5987 = (value: string) =>
  encodeURIComponent(value).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
