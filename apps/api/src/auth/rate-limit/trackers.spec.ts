import { clientTracker, emailTracker } from './trackers.js';

describe('rate-limit trackers', () => {
  it('keeps an IPv4 address, and unwraps an IPv4-mapped IPv6 one', () => {
    expect(clientTracker('203.0.113.7')).toBe('203.0.113.7');
    expect(clientTracker('::ffff:203.0.113.7')).toBe('203.0.113.7');
  });

  it('counts IPv6 addresses of one /64 as one client, and other /64s apart', () => {
    // 2001:db8::/32 is the documentation prefix (RFC 3849).
    const a = clientTracker('2001:db8:1:2:aaaa::1');
    expect(a).toBe('2001:db8:1:2::/64');
    expect(clientTracker('2001:0db8:0001:0002:ffff:ffff:ffff:ffff')).toBe(a);
    expect(clientTracker('2001:db8:1:3::1')).not.toBe(a);
    expect(clientTracker('::1')).toBe('0:0:0:0::/64');
    expect(clientTracker('2001:db8:1:2::192.0.2.1')).toBe(a);
  });

  it('names a missing address and reads the e-mail of a body in lower case', () => {
    expect(clientTracker(undefined)).toBe('unknown');
    expect(emailTracker({ email: ' Ada@Example.ORG ' })).toBe('ada@example.org');
    expect(emailTracker({ email: 42 })).toBe('');
    expect(emailTracker(undefined)).toBe('');
  });
});
