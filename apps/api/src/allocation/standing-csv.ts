import { stringify } from 'csv-stringify/sync';
import type { Standing } from './standing-contract.js';

/**
 * A cell a spreadsheet would read as a formula (OWASP "CSV Injection": starting with =, +, -, @,
 * tab or carriage return) gets a leading apostrophe, so it shows as the text it is. Only text
 * that people typed goes through this; the numbers we write stay numbers (a negative z is -0.5,
 * not a formula).
 */
export function defuseCell(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

const TIER_LABELS: Record<string, string> = {
  tier1: 'Tier 1',
  tier2: 'Tier 2',
  tier3: 'Tier 3',
  not_allocated: 'not allocated',
};

const number = (value: number | null, digits: number) =>
  value === null ? '' : String(Math.round(value * 10 ** digits) / 10 ** digits);

/**
 * The ranked table as CSV (RFC 4180: comma-separated, CRLF line ends, fields quoted when they
 * hold a comma, quote or line break, quotes doubled; csv-stringify does the quoting): a header row,
 * then one line per proposal in rank order, with the granted hours and the running total per
 * configuration.
 */
export function standingCsv(standing: Standing): string {
  const perConfiguration = standing.configurations.flatMap((c) => [
    { key: `granted:${c.id}`, header: `granted h ${c.name}` },
    { key: `cumulative:${c.id}`, header: `cumulative granted h ${c.name}` },
  ]);
  const columns = [
    { key: 'rank', header: 'rank' },
    { key: 'reference', header: 'reference' },
    { key: 'title', header: 'title' },
    { key: 'category', header: 'category' },
    { key: 'kind', header: 'kind' },
    { key: 'pi', header: 'PI' },
    { key: 'reviewsIn', header: 'reviews in' },
    { key: 'reviewsExpected', header: 'reviews expected' },
    { key: 'rawMean', header: 'raw mean' },
    { key: 'normalisedScore', header: 'normalised score' },
    { key: 'spread', header: 'spread' },
    { key: 'disagreement', header: 'disagreement' },
    { key: 'technical', header: 'technical verdict' },
    { key: 'hoursAsked', header: 'hours asked' },
    { key: 'hoursGranted', header: 'hours granted' },
    { key: 'tier', header: 'tier' },
    ...perConfiguration,
  ].map((c) => ({ ...c, header: defuseCell(c.header) }));

  const records = standing.rows.map((row) => {
    const record: Record<string, string> = {
      rank: row.rank === null ? '' : String(row.rank),
      reference: defuseCell(row.reference),
      title: defuseCell(row.title),
      category: defuseCell(row.category ?? ''),
      kind: row.kind,
      pi: defuseCell(row.piName),
      reviewsIn: String(row.reviewsIn),
      reviewsExpected: String(row.reviewsExpected),
      rawMean: number(row.rawMean, 3),
      normalisedScore: number(row.normalisedScore, 3),
      spread: number(row.spread, 3),
      disagreement: row.disagreement ? 'yes' : 'no',
      technical: row.technical?.verdict.replace(/_/g, ' ') ?? '',
      hoursAsked: number(row.hoursAsked, 2),
      hoursGranted: number(row.hoursGranted, 2),
      tier: row.tier ? (TIER_LABELS[row.tier] ?? row.tier) : 'undecided',
    };
    for (const c of standing.configurations) {
      const granted = row.observations
        .filter((o) => o.configurationId === c.id)
        .reduce((sum, o) => sum + (o.hoursGranted ?? 0), 0);
      record[`granted:${c.id}`] = row.hoursGranted === null ? '' : number(granted, 2);
      record[`cumulative:${c.id}`] = number(row.cumulativeGranted[c.id] ?? 0, 2);
    }
    return record;
  });

  return stringify(records, { header: true, columns, record_delimiter: 'windows' });
}
