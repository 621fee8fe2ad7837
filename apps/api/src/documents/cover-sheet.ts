import { formatDeclination, formatRightAscension } from '@skyhours/calc';
import PDFDocument from 'pdfkit';
import type {
  ProposalSnapshot,
  SnapshotObservation,
  SnapshotTarget,
} from '../proposals/proposal-snapshot.js';
import type { PdfFonts } from './pdf-fonts.js';
import { type TextStyle, Typesetter } from './pdf-typesetter.js';

/** A4 in points. */
const PAGE = { width: 595.28, height: 841.89 };
const MARGIN = { top: 60, bottom: 66, left: 54, right: 54 };
const WIDTH = PAGE.width - MARGIN.left - MARGIN.right;
const BOTTOM = PAGE.height - MARGIN.bottom;

/** Skyhours' own palette (apps/web/src/theme.ts): night-sky blue and its cool grey. */
const COLOR = {
  ink: '#1a1f28',
  body: '#2a303b',
  muted: '#535b6a',
  faint: '#8f98a8',
  rule: '#dadee6',
  zebra: '#f6f7f9',
  brand: '#2a3f71',
  brandSoft: '#eef2fa',
  brandLine: '#8fa6d6',
};

const STYLE = {
  kicker: { size: 7.5, weight: 600, color: COLOR.brand, characterSpacing: 0.5 },
  reference: { size: 21, mono: true, color: COLOR.ink },
  title: { size: 16.5, weight: 600, color: COLOR.ink, lineGap: 2 },
  subtitle: { size: 9.5, weight: 400, color: COLOR.muted },
  label: { size: 6.6, weight: 600, color: COLOR.muted, characterSpacing: 0.4 },
  value: { size: 9.5, weight: 500, color: COLOR.ink, lineGap: 1 },
  section: { size: 7.5, weight: 700, color: COLOR.brand, characterSpacing: 0.5 },
  body: { size: 9.5, weight: 400, color: COLOR.body, lineGap: 2.6 },
  head: { size: 6.8, weight: 600, color: COLOR.muted, lineGap: 0.5 },
  // IBM Plex Sans' figures are tabular by default, so numbers line up in columns as they are.
  cell: { size: 8.2, weight: 400, color: COLOR.ink, lineGap: 0.8 },
  small: { size: 7, weight: 400, color: COLOR.muted },
} satisfies Record<string, TextStyle>;

const KINDS: Record<ProposalSnapshot['kind'], string> = {
  standard: 'Standard',
  large: 'Large programme',
  target_of_opportunity: 'Target of opportunity',
  discretionary: "Director's discretionary time",
};

interface Column {
  header: string;
  /** Drawn under the header in a lighter tone. */
  unit?: string;
  width: number;
  align?: 'left' | 'right';
  style?: Partial<TextStyle>;
}

interface Row {
  cells: string[];
  /** Per cell, a style over the column's. */
  styles?: Array<Partial<TextStyle> | undefined>;
  total?: boolean;
}

export interface CoverOptions {
  /** Pages of the science case that will follow the cover (0 when there is none). */
  scienceCasePages: number;
}

/**
 * Draws the cover of a compiled proposal: what a referee needs before the science case. In an
 * anonymous call the team is left out entirely. Returns the PDF bytes and its page count.
 */
export async function drawCover(
  snapshot: ProposalSnapshot,
  fonts: PdfFonts,
  options: CoverOptions,
): Promise<{ bytes: Buffer; pages: number }> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: MARGIN,
    bufferPages: true,
    lang: 'en',
    pdfVersion: '1.7',
    // The file's identifier derives from its creation date: the submission time makes the same
    // snapshot give the same bytes.
    info: { CreationDate: validDate(snapshot.submittedAt) ?? new Date(0) },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });
  const cover = new Cover(doc, new Typesetter(doc, fonts), snapshot);
  cover.draw(options);
  const pages = doc.bufferedPageRange().count;
  cover.drawFrames(pages + options.scienceCasePages);
  doc.end();
  await ended;
  return { bytes: Buffer.concat(chunks), pages };
}

class Cover {
  private y = MARGIN.top;
  private readonly anonymous: boolean;

  constructor(
    private readonly doc: InstanceType<typeof PDFDocument>,
    private readonly ts: Typesetter,
    private readonly s: ProposalSnapshot,
  ) {
    this.anonymous = s.call.anonymous;
  }

  draw({ scienceCasePages }: CoverOptions): void {
    this.masthead();
    this.facts(scienceCasePages);
    this.abstract();
    if (!this.anonymous) this.team();
    this.observations();
    this.hoursByConfiguration();
    this.targets();
    this.findings();
    this.closingNote(scienceCasePages);
  }

  private masthead(): void {
    const { ts, s } = this;
    ts.text('SKYHOURS  ·  PROPOSAL COVER', MARGIN.left, this.y, STYLE.kicker);
    ts.text(
      `Call ${s.call.code}  ·  version ${s.version}`,
      MARGIN.left,
      this.y,
      { ...STYLE.kicker, color: COLOR.muted, align: 'right' },
      WIDTH,
    );
    this.y += 13;
    this.rule(this.y, COLOR.brand, 1.2);
    this.y += 16;
    ts.text(s.reference, MARGIN.left - 1, this.y, STYLE.reference);
    this.y += 30;
    this.y += ts.text(s.title, MARGIN.left, this.y, STYLE.title, WIDTH) + 3;
    this.y += ts.text(
      `${s.call.code} — ${s.call.title}`,
      MARGIN.left,
      this.y,
      STYLE.subtitle,
      WIDTH,
    );
    this.y += 14;
  }

  /** The key facts in a tinted box, four to a row. */
  private facts(scienceCasePages: number): void {
    const { s } = this;
    const facts: Array<[string, string]> = [
      ['Kind', KINDS[s.kind] ?? s.kind],
      ['Science category', s.scienceCategory],
      ['Hours asked', `${hours(s.totalHours)} h`],
      ['Submitted (UTC)', utc(s.submittedAt)],
      [
        'Science case',
        scienceCasePages
          ? `${scienceCasePages} ${scienceCasePages === 1 ? 'page' : 'pages'}`
          : 'None attached',
      ],
      ['Observations', String(s.observations.length)],
      [
        'Team',
        this.anonymous
          ? 'Not shown (anonymous review)'
          : `${s.team.length} ${s.team.length === 1 ? 'person' : 'people'}`,
      ],
    ];
    if (s.continues) facts.push(['Continues', s.continues]);
    const pad = 11;
    const columns = 4;
    const gap = 12;
    const cellWidth = (WIDTH - 2 * pad - gap * (columns - 1)) / columns;
    const rows: Array<Array<[string, string]>> = [];
    for (let i = 0; i < facts.length; i += columns) rows.push(facts.slice(i, i + columns));
    const heights = rows.map((row) =>
      Math.max(...row.map(([, value]) => this.ts.heightOf(value, cellWidth, STYLE.value))),
    );
    const labelHeight = 11;
    const rowGap = 9;
    const boxHeight =
      2 * pad + heights.reduce((a, h) => a + labelHeight + h, 0) + rowGap * (rows.length - 1);
    this.doc.roundedRect(MARGIN.left, this.y, WIDTH, boxHeight, 4).fill(COLOR.brandSoft);
    let y = this.y + pad;
    rows.forEach((row, r) => {
      row.forEach(([label, value], c) => {
        const x = MARGIN.left + pad + c * (cellWidth + gap);
        this.ts.text(label.toUpperCase(), x, y, STYLE.label);
        this.ts.text(value, x, y + labelHeight, STYLE.value, cellWidth);
      });
      y += labelHeight + (heights[r] ?? 0) + rowGap;
    });
    this.y += boxHeight + 20;
  }

  private abstract(): void {
    this.section('Abstract', 40);
    const paragraphs = this.s.abstract
      .split(/\n\s*\n/)
      .map((p) => p.replace(/\s+/g, ' ').trim())
      .filter(Boolean);
    for (const paragraph of paragraphs) {
      this.ensure(this.ts.heightOf('x\nx', WIDTH, STYLE.body));
      // pdfkit carries a long paragraph over to the next page by itself.
      this.ts.text(paragraph, MARGIN.left, this.y, STYLE.body, WIDTH);
      this.y = this.doc.y + 5;
    }
    this.y += 12;
  }

  private team(): void {
    const columns: Column[] = [
      { header: 'Name', width: 160 },
      { header: 'Role', width: 40 },
      { header: 'Affiliation', width: WIDTH - 160 - 40 - 64 },
      { header: 'Country', width: 64 },
    ];
    // The PI first, then the Co-Is in the order the proposer gave.
    const team = [...this.s.team].sort((a, b) => Number(b.role === 'pi') - Number(a.role === 'pi'));
    const pi = { weight: 600, color: COLOR.brand } as const;
    this.table(
      'Team',
      columns,
      team.map((m) => ({
        cells: [m.name, m.role === 'pi' ? 'PI' : 'Co-I', m.affiliation, m.country],
        styles: m.role === 'pi' ? [{ weight: 600 }, pi] : [undefined, { color: COLOR.muted }],
      })),
    );
  }

  private observations(): void {
    const columns: Column[] = [
      { header: '#', width: 18 },
      { header: 'Target', width: 76 },
      { header: 'Band', width: 40 },
      { header: 'Configuration', width: 58 },
      { header: 'Frequency', unit: 'GHz', width: 44, align: 'right' },
      { header: 'Bandwidth', unit: 'MHz', width: 45, align: 'right' },
      { header: 'Resolution', unit: '″', width: 45, align: 'right' },
      { header: 'rms goal', unit: 'µJy', width: 38, align: 'right' },
      { header: 'rms reached', unit: 'µJy', width: 48, align: 'right' },
      { header: 'Pointings', unit: 'mosaic', width: 39, align: 'right' },
      { header: 'Hours', unit: 'asked', width: WIDTH - 451, align: 'right' },
    ];
    const rows: Row[] = this.s.observations.map((o, i) => ({
      cells: observationCells(o, i + 1),
      styles: [{ color: COLOR.faint }],
    }));
    rows.push({
      cells: ['', 'Total', '', '', '', '', '', '', '', '', hours(this.s.totalHours)],
      total: true,
    });
    this.table('Observations', columns, rows);
  }

  private hoursByConfiguration(): void {
    const entries = Object.entries(this.s.hoursByConfiguration);
    if (entries.length === 0) return;
    const count = (name: string) =>
      this.s.observations.filter((o) => o.configurationName === name).length;
    this.table(
      'Hours asked per configuration',
      [
        { header: 'Configuration', width: 150 },
        { header: 'Observations', width: 70, align: 'right' },
        { header: 'Hours', unit: 'asked', width: 70, align: 'right' },
      ],
      [
        ...entries.map(([name, h]) => ({ cells: [name, String(count(name)), hours(h)] })),
        {
          cells: ['Total', String(this.s.observations.length), hours(this.s.totalHours)],
          total: true,
        },
      ],
    );
  }

  private targets(): void {
    if (this.s.targets.length === 0) return;
    this.table(
      'Targets',
      [
        { header: 'Name', width: 118 },
        { header: 'RA', unit: 'ICRS, h:m:s', width: 62, align: 'right' },
        { header: 'Dec', unit: 'ICRS, d:m:s', width: 62, align: 'right' },
        { header: 'Extent', unit: '″', width: 40, align: 'right' },
        { header: 'Flux density', unit: 'mJy', width: 52, align: 'right' },
        { header: 'Line', unit: 'rest frequency, velocity', width: WIDTH - 334 - 6 },
      ],
      this.s.targets.map((t) => ({ cells: targetCells(t) })),
      8,
    );
  }

  /**
   * The calculator's blockers and warnings, each tied to its observation's row number. Notes are
   * left out: they repeat what the table shows (a mosaic's pointings).
   */
  private findings(): void {
    const items = this.s.observations.flatMap((o, i) =>
      o.checks.filter((c) => c.level !== 'note').map((check) => ({ n: i + 1, check })),
    );
    if (items.length === 0) return;
    this.section('Calculator findings', 30);
    const note = 'The numbers are rows of the Observations table.';
    this.ts.text(note, MARGIN.left, this.y, { ...STYLE.cell, color: COLOR.muted }, WIDTH);
    this.y += this.ts.heightOf(note, WIDTH, STYLE.cell) + 5;
    const labelWidth = 78;
    for (const { n, check } of items) {
      const level = check.level.charAt(0).toUpperCase() + check.level.slice(1);
      const h = this.ts.heightOf(check.message, WIDTH - labelWidth, STYLE.cell);
      this.ensure(h + 4);
      this.ts.text(`#${n}  ${level}`, MARGIN.left, this.y, { ...STYLE.cell, weight: 600 });
      this.ts.text(check.message, MARGIN.left + labelWidth, this.y, STYLE.cell, WIDTH - labelWidth);
      this.y += h + 4;
    }
    this.y += 12;
  }

  private closingNote(scienceCasePages: number): void {
    const first = this.doc.bufferedPageRange().count + 1;
    const text = scienceCasePages
      ? `The science case follows on ${
          scienceCasePages === 1
            ? `page ${first}`
            : `pages ${first}–${first + scienceCasePages - 1}`
        }.`
      : 'No science case was attached to this version.';
    this.ensure(20);
    this.y += 4;
    this.ts.text(text, MARGIN.left, this.y, { ...STYLE.body, color: COLOR.muted }, WIDTH);
  }

  /** Running header on later pages and the footer on every page, once the page count is known. */
  drawFrames(totalPages: number): void {
    const { doc, ts, s } = this;
    const { start, count } = doc.bufferedPageRange();
    for (let i = start; i < start + count; i++) {
      doc.switchToPage(i);
      // Writing below the bottom margin would make pdfkit open a page.
      const saved = doc.page.margins;
      doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
      if (i > start) {
        ts.text(`${s.reference}  ·  cover, continued`, MARGIN.left, 32, STYLE.small);
      }
      const footerY = PAGE.height - 44;
      this.rule(footerY - 7, COLOR.rule, 0.6);
      ts.text(
        `${s.reference}  ·  version ${s.version}  ·  submitted ${utc(s.submittedAt)}  ·  compiled by Skyhours`,
        MARGIN.left,
        footerY,
        STYLE.small,
      );
      ts.text(
        `Page ${i - start + 1} of ${totalPages}`,
        MARGIN.left,
        footerY,
        { ...STYLE.small, weight: 500, align: 'right' },
        WIDTH,
      );
      doc.page.margins = saved;
    }
  }

  /** A table with a header row, repeated (with its section title) on each page it runs onto. */
  private table(title: string, columns: Column[], rows: Row[], gapBefore = 0): void {
    const padX = 3.5;
    const padY = 3.6;
    const cellStyle = (c: number, row?: Row): TextStyle => ({
      ...STYLE.cell,
      ...columns[c]?.style,
      ...row?.styles?.[c],
      ...(row?.total ? { weight: 600 } : {}),
      align: columns[c]?.align ?? 'left',
    });
    const heightOf = (cells: string[], style: (c: number) => TextStyle) =>
      2 * padY +
      Math.max(
        ...cells.map((text, c) =>
          this.ts.heightOf(text || ' ', (columns[c]?.width ?? 0) - 2 * padX, style(c)),
        ),
      );
    const headStyle = (c: number): TextStyle => ({
      ...STYLE.head,
      align: columns[c]?.align ?? 'left',
    });
    const unitStyle = (c: number): TextStyle => ({
      ...headStyle(c),
      weight: 400,
      color: COLOR.faint,
    });
    const labelHeight = Math.max(
      ...columns.map((col, c) => this.ts.heightOf(col.header, col.width - 2 * padX, headStyle(c))),
    );
    const unitHeight = columns.some((col) => col.unit) ? this.ts.heightOf('x', 100, STYLE.head) : 0;
    const headHeight = 2 * padY + labelHeight + unitHeight;

    const drawRow = (cells: string[], style: (c: number) => TextStyle, height: number) => {
      let x = MARGIN.left;
      cells.forEach((text, c) => {
        const width = columns[c]?.width ?? 0;
        this.ts.text(text, x + padX, this.y + padY, style(c), width - 2 * padX);
        x += width;
      });
      this.y += height;
    };
    const drawHead = (continued: boolean) => {
      this.section(continued ? `${title} (continued)` : title, 0);
      let x = MARGIN.left;
      columns.forEach((col, c) => {
        const width = col.width - 2 * padX;
        // Labels sit on a common baseline at the bottom of the header, units under them.
        const y = this.y + padY + labelHeight - this.ts.heightOf(col.header, width, headStyle(c));
        this.ts.text(col.header, x + padX, y, headStyle(c), width);
        if (col.unit)
          this.ts.text(col.unit, x + padX, this.y + padY + labelHeight, unitStyle(c), width);
        x += col.width;
      });
      this.y += headHeight;
      this.rule(this.y, COLOR.faint, 0.7);
    };

    this.y += gapBefore;
    const first = rows[0] ? heightOf(rows[0].cells, (c) => cellStyle(c, rows[0])) : 0;
    this.ensure(24 + headHeight + first);
    drawHead(false);
    rows.forEach((row, r) => {
      const height = heightOf(row.cells, (c) => cellStyle(c, row));
      if (this.y + height > BOTTOM) {
        this.newPage();
        drawHead(true);
      }
      if (row.total) this.rule(this.y, COLOR.faint, 0.7);
      else if (r % 2 === 1) this.doc.rect(MARGIN.left, this.y, WIDTH, height).fill(COLOR.zebra);
      drawRow(row.cells, (c) => cellStyle(c, row), height);
    });
    this.rule(this.y, COLOR.rule, 0.6);
    this.y += 20;
  }

  /** A section title: small capitals in the brand colour, a hairline to the right edge. */
  private section(title: string, keepWithNext: number): void {
    this.ensure(24 + keepWithNext);
    const label = title.toUpperCase();
    this.ts.text(label, MARGIN.left, this.y, STYLE.section);
    const end = MARGIN.left + this.ts.widthOf(label, STYLE.section) + 8;
    this.doc
      .moveTo(end, this.y + 4.5)
      .lineTo(MARGIN.left + WIDTH, this.y + 4.5)
      .lineWidth(0.6)
      .stroke(COLOR.brandLine);
    this.y += 17;
  }

  private rule(y: number, color: string, width: number): void {
    this.doc
      .moveTo(MARGIN.left, y)
      .lineTo(MARGIN.left + WIDTH, y)
      .lineWidth(width)
      .stroke(color);
  }

  private ensure(height: number): void {
    if (this.y + height > BOTTOM) this.newPage();
  }

  private newPage(): void {
    this.doc.addPage();
    this.y = MARGIN.top;
  }
}

function observationCells(o: SnapshotObservation, n: number): string[] {
  const r = o.result;
  return [
    String(n),
    o.targetName,
    o.bandName,
    o.configurationName,
    significant(r.skyFrequencyGHz ?? o.frequencyGHz, 6, 4),
    significant(o.bandwidthMHz, 4),
    significant(r.resolutionArcsec, 3),
    o.rmsGoalMicroJy == null ? '—' : significant(o.rmsGoalMicroJy, 3),
    r.rmsMicroJy == null ? '—' : significant(r.rmsMicroJy, 3),
    String(r.pointings),
    hours(o.hoursAsked),
  ];
}

function targetCells(t: SnapshotTarget): string[] {
  const line = t.line
    ? [
        `${significant(t.line.restGHz, 7, 4)} GHz rest`,
        t.line.redshift != null ? `z = ${significant(t.line.redshift, 4)}` : null,
        t.line.velocityKmS != null
          ? `${significant(t.line.velocityKmS, 6, 1)} km/s${t.line.convention ? ` (${t.line.convention})` : ''}`
          : null,
      ]
        .filter(Boolean)
        .join(', ')
    : 'Continuum';
  return [
    t.name,
    safely(() => formatRightAscension(t.raDeg, 1), `${t.raDeg}°`),
    safely(() => formatDeclination(t.decDeg, 0), `${t.decDeg}°`).replace('-', '−'),
    t.extentArcsec ? significant(t.extentArcsec, 3) : 'point',
    t.fluxDensityMJy == null ? '—' : significant(t.fluxDensityMJy, 3),
    line,
  ];
}

/** A cover must not fail over the formatting of one figure of a snapshot. */
function safely(format: () => string, fallback: string): string {
  try {
    return format();
  } catch {
    return fallback;
  }
}

const numberFormats = new Map<string, Intl.NumberFormat>();
/** `digits` significant digits, at most `maxDecimals` decimals, minus as U+2212. */
function significant(x: number, digits: number, maxDecimals = 6): string {
  if (!Number.isFinite(x)) return '—';
  const key = `${digits}/${maxDecimals}`;
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat('en-GB', {
      maximumSignificantDigits: digits,
      maximumFractionDigits: maxDecimals,
      roundingPriority: 'lessPrecision',
    } as Intl.NumberFormatOptions);
    numberFormats.set(key, format);
  }
  return format.format(x).replace('-', '−');
}

const hoursFormat = new Intl.NumberFormat('en-GB', {
  minimumFractionDigits: 1,
  maximumFractionDigits: 2,
});
const hours = (h: number) => (Number.isFinite(h) ? hoursFormat.format(h) : '—');

function validDate(iso: string): Date | null {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? null : d;
}

/** "2027-03-14 16:05 UTC". */
function utc(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
