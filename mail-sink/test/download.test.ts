import { describe, expect, it } from 'vitest';
import { contentDisposition, safeContentType } from '../src/download.js';

describe('contentDisposition', () => {
  it.each([
    ['outcome.pdf', `attachment; filename="outcome.pdf"; filename*=UTF-8''outcome.pdf`],
    [
      'Résumé – SP27.pdf',
      `attachment; filename="R_sum_ _ SP27.pdf"; filename*=UTF-8''R%C3%A9sum%C3%A9%20%E2%80%93%20SP27.pdf`,
    ],
    [
      'say "hi"\r\nX-Injected: 1.txt',
      `attachment; filename="say _hi_X-Injected_ 1.txt"; filename*=UTF-8''say%20%22hi%22X-Injected%3A%201.txt`,
    ],
    ['../../etc/passwd', `attachment; filename="passwd"; filename*=UTF-8''passwd`],
    [
      "C:\\temp\\it's (1).txt",
      `attachment; filename="it_s (1).txt"; filename*=UTF-8''it%27s%20%281%29.txt`,
    ],
    ['..', `attachment; filename="download"; filename*=UTF-8''download`],
    ['', `attachment; filename="download"; filename*=UTF-8''download`],
  ])('makes a safe header for %j', (name, header) => {
    expect(contentDisposition('attachment', name)).toBe(header);
  });
});

describe('safeContentType', () => {
  it('keeps a well-formed type and replaces anything else', () => {
    expect(safeContentType('application/pdf')).toBe('application/pdf');
    expect(safeContentType('text/csv')).toBe('text/csv');
    expect(safeContentType('text/html\r\nX-Injected: 1')).toBe('application/octet-stream');
    expect(safeContentType('nonsense')).toBe('application/octet-stream');
  });
});
