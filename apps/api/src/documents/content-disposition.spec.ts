import { contentDisposition } from './content-disposition.js';

describe('contentDisposition', () => {
  it('gives a plain ASCII name as a quoted filename only', () => {
    expect(contentDisposition('science-case.pdf')).toBe('attachment; filename="science-case.pdf"');
    expect(contentDisposition('case.pdf', 'inline')).toBe('inline; filename="case.pdf"');
  });

  it('adds the RFC 5987 UTF-8 form for other characters, with an ASCII fallback', () => {
    expect(contentDisposition('Zoë Ngũgĩ-Łukasik (v2).pdf')).toBe(
      'attachment; filename="Zoe Ngugi-_ukasik (v2).pdf"; ' +
        "filename*=UTF-8''Zo%C3%AB%20Ng%C5%A9g%C4%A9-%C5%81ukasik%20%28v2%29.pdf",
    );
  });

  it('cannot be made to end the header or add a parameter', () => {
    expect(contentDisposition('a"; filename*=x\r\nSet-Cookie: y=1\\%.pdf')).toBe(
      'attachment; filename="a_; filename*=x__Set-Cookie: y=1__.pdf"; ' +
        "filename*=UTF-8''a%22%3B%20filename%2A%3Dx%0D%0ASet-Cookie%3A%20y%3D1%5C%25.pdf",
    );
  });

  it('encodes the characters RFC 5987 does not allow that encodeURIComponent leaves alone', () => {
    expect(contentDisposition("it's (really) *this* ✓.pdf")).toContain(
      "filename*=UTF-8''it%27s%20%28really%29%20%2Athis%2A%20%E2%9C%93.pdf",
    );
  });

  it('survives half a surrogate pair, which UTF-8 cannot encode', () => {
    expect(contentDisposition('bad\uD800name.pdf')).toContain(
      "filename*=UTF-8''bad%EF%BF%BDname.pdf",
    );
  });
});
