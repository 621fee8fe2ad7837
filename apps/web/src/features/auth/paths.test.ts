import { describe, expect, it } from 'vitest';
import { safeNext } from './paths';

describe('safeNext', () => {
  it('keeps a path inside the app, with its query', () => {
    expect(safeNext('/accounts?tab=audit')).toBe('/accounts?tab=audit');
  });

  it.each([
    [null],
    [''],
    ['https://elsewhere.example.org/'],
    ['//elsewhere.example.org/path'],
    ['/\\elsewhere.example.org'],
    ['javascript:alert(1)'],
    ['/sign-in?next=/accounts'],
  ])('sends %s to the Desk instead', (next) => {
    expect(safeNext(next)).toBe('/');
  });
});
