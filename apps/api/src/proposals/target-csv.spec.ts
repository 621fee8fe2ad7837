import Papa from 'papaparse';
import { parseDeclination, parseRightAscension } from '@skyhours/calc';
import { AppError } from '../common/errors/app-error.js';
import { parseTargetCsv } from './target-csv.js';

describe('parseTargetCsv', () => {
  it('numbers rows by the line they start on, across quoted line breaks, blank lines and CRLF', () => {
    const csv = '\uFEFFname,ra,dec\r\n"Two\nline name",1,2\r\n\r\n   \r\nNext,3,4\r\nLast,5,6';
    const rows = parseTargetCsv(csv);
    expect(rows.map((r) => [r.line, r.cells.name])).toEqual([
      [2, 'Two\nline name'],
      [6, 'Next'],
      [7, 'Last'],
    ]);
    // Same cells as papaparse itself reads (RFC 4180).
    const reference = Papa.parse<string[]>(csv.slice(1).replace(/\r\n/g, '\n'), {
      skipEmptyLines: 'greedy',
    }).data.slice(1);
    expect(rows.map((r) => [r.cells.name, r.cells.ra, r.cells.dec])).toEqual(reference);
  });

  it('converts with the library parsers and reads optional numbers strictly', () => {
    const [good, bad] = parseTargetCsv(
      'name,ra,dec,extent_arcsec,flux_mjy\nA,10:00:24,-05:04:03.2,1e2, 0.5 \nB,1,2,12 arcsec,',
    );
    expect(good!.values).toEqual({
      name: 'A',
      raDeg: parseRightAscension('10:00:24'),
      decDeg: parseDeclination('-05:04:03.2'),
      extentArcsec: 100,
      fluxDensityMJy: 0.5,
      lineRestGHz: null,
      lineVelocityKmS: null,
      lineConvention: null,
      lineRedshift: null,
    });
    expect(bad!.values).toBeNull();
    expect(bad!.errors).toEqual([
      { column: 'extent_arcsec', message: 'extent_arcsec must be a number, got "12 arcsec"' },
    ]);
    // What could be read is still there for the preview.
    expect(bad!.read).toMatchObject({ name: 'B', raDeg: 1, decDeg: 2 });
  });

  it('marks a row with more cells than the header', () => {
    const [row] = parseTargetCsv('name,ra,dec\nA,1,2,3');
    expect(row!.errors).toEqual([
      { column: 'row', message: 'The row has 4 cells; the header has 3 columns' },
    ]);
  });

  it('refuses an unusable header as a whole, on the field csv', () => {
    const refusal = (csv: string) => {
      try {
        parseTargetCsv(csv);
      } catch (error) {
        return error instanceof AppError ? error.getResponse() : error;
      }
      return null;
    };
    expect(refusal('ra,dec\n1,2')).toMatchObject({
      code: 'VALIDATION_FAILED',
      issues: [{ path: 'csv', message: 'The header lacks name' }],
    });
    const many = `name,ra,dec\n${'A,1,2\n'.repeat(1001)}`;
    expect(refusal(many)).toMatchObject({ issues: [{ path: 'csv' }] });
  });
});
