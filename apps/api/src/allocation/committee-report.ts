import PDFDocument from 'pdfkit';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import type { PdfFonts } from '../documents/pdf-fonts.js';
import { type TextStyle, Typesetter } from '../documents/pdf-typesetter.js';
import type { LstPressure, Standing, StandingRow, Tier } from './standing-contract.js';

type Doc = InstanceType<typeof PDFDocument>;

/** A4 landscape in points: the ranked table needs the width. */
const PAGE = { width: 841.89, height: 595.28 };
const MARGIN = { top: 48, bottom: 50, left: 40, right: 40 };
const WIDTH = PAGE.width - MARGIN.left - MARGIN.right;
const BOTTOM = PAGE.height - MARGIN.bottom;

/** Skyhours' own palette (as the proposal cover: apps/web/src/theme.ts). */
const COLOR = {
  ink: '#1a1f28',
  body: '#2a303b',
  muted: '#535b6a',
  faint: '#8f98a8',
  rule: '#dadee6',
  zebra: '#f6f7f9',
  brand: '#2a3f71',
  brandSoft: '#eef2fa',
  warn: '#8a4b00',
};
/** Granted hours per tier in the pressure charts: darker is surer; the legend names each. */
const TIER_FILL: Record<Exclude<Tier, 'not_allocated'>, string> = {
  tier1: '#2a3f71',
  tier2: '#5f7bb8',
  tier3: '#a9bbe0',
};

const STYLE = {
  kicker: { size: 7.5, weight: 600, color: COLOR.brand, characterSpacing: 0.5 },
  title: { size: 17, weight: 600, color: COLOR.ink, lineGap: 2 },
  subtitle: { size: 9, weight: 400, color: COLOR.muted },
  section: { size: 7.5, weight: 700, color: COLOR.brand, characterSpacing: 0.5 },
  label: { size: 6.6, weight: 600, color: COLOR.muted, characterSpacing: 0.4 },
  value: { size: 11, weight: 500, color: COLOR.ink },
  head: { size: 6.8, weight: 600, color: COLOR.muted },
  cell: { size: 7.8, weight: 400, color: COLOR.ink },
  mono: { size: 7.8, mono: true, color: COLOR.ink },
  small: { size: 6.8, weight: 400, color: COLOR.muted },
} satisfies Record<string, TextStyle>;

const VERDICTS: Record<string, string> = {
  feasible: 'feasible',
  feasible_with_changes: 'with changes',
  not_feasible: 'not feasible',
};
const TIER_SHORT: Record<Tier, string> = {
  tier1: 'Tier 1',
  tier2: 'Tier 2',
  tier3: 'Tier 3',
  not_allocated: 'not allocated',
};

const fixed = (value: number | null, digits: number) =>
  value === null ? '—' : value.toFixed(digits).replace(/^-(0\.0*)$/, '$1');
const h = (value: number | null) => (value === null ? '—' : `${Math.round(value * 10) / 10}`);

export interface ReportOptions {
  /** When the report is made: printed in UTC and in the call's zone. */
  now: Date;
}

/**
 * The committee report of a call: key figures, each configuration's offer against what was asked
 * and granted with its LST pressure, then the ranked list with scores, grants and tiers.
 */
export async function drawCommitteeReport(
  standing: Standing,
  fonts: PdfFonts,
  options: ReportOptions,
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    layout: 'landscape',
    margins: MARGIN,
    bufferPages: true,
    lang: 'en',
    pdfVersion: '1.7',
    info: {
      Title: `Committee report ${standing.call.code}`,
      Author: 'Skyhours',
      CreationDate: options.now,
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });
  const report = new Report(doc, new Typesetter(doc, fonts), standing, options);
  report.draw();
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right';
  mono?: boolean;
}

class Report {
  private y = MARGIN.top;

  constructor(
    private readonly doc: Doc,
    private readonly ts: Typesetter,
    private readonly s: Standing,
    private readonly options: ReportOptions,
  ) {}

  draw(): void {
    this.masthead();
    this.figures();
    this.configurations();
    this.pressure();
    this.ranked();
    this.frames();
  }

  private masthead(): void {
    const { ts, s } = this;
    ts.text('SKYHOURS  ·  COMMITTEE REPORT', MARGIN.left, this.y, STYLE.kicker);
    ts.text(
      `Call ${s.call.code}  ·  ${s.call.status.replace(/_/g, ' ')}`,
      MARGIN.left,
      this.y,
      { ...STYLE.kicker, color: COLOR.muted, align: 'right' },
      WIDTH,
    );
    this.y += 12;
    this.rule(this.y, COLOR.brand, 1.2);
    this.y += 12;
    this.y += ts.text(`${s.call.code} — ${s.call.title}`, MARGIN.left, this.y, STYLE.title, WIDTH);
    this.y += 3;
    const published = s.call.publishedAt
      ? `published ${stamp(new Date(s.call.publishedAt), s.call.timeZone)}`
      : 'not published yet';
    this.y += ts.text(
      `Made ${stamp(this.options.now, s.call.timeZone)}  ·  ${published}  ·  scores ${s.call.scoreMin}–${s.call.scoreMax}, ${s.call.scoreHigherIsBetter ? 'higher' : 'lower'} is better`,
      MARGIN.left,
      this.y,
      STYLE.subtitle,
      WIDTH,
    );
    this.y += 12;
  }

  /** The key figures in a tinted band. */
  private figures(): void {
    const { s } = this;
    const scores = s.rows.flatMap((r) => r.reviews.map((v) => v.score));
    const asked = s.rows.reduce((sum, r) => sum + r.hoursAsked, 0);
    const granted = s.rows.reduce((sum, r) => sum + (r.hoursGranted ?? 0), 0);
    const offered = s.configurations.reduce((sum, c) => sum + c.hoursOffered, 0);
    const reviewsIn = s.rows.reduce((sum, r) => sum + r.reviewsIn, 0);
    const reviewsExpected = s.rows.reduce((sum, r) => sum + r.reviewsExpected, 0);
    const count = (tier: Tier) => s.rows.filter((r) => r.tier === tier).length;
    const facts: Array<[string, string]> = [
      ['Proposals', String(s.rows.length)],
      ['Reviews in', `${reviewsIn} of ${reviewsExpected}`],
      [
        'Score mean ± sd',
        scores.length >= 2
          ? `${fixed(mean(scores), 2)} ± ${fixed(sampleStandardDeviation(scores), 2)}`
          : scores.length === 1
            ? fixed(scores[0]!, 2)
            : '—',
      ],
      ['Disagreements', String(s.rows.filter((r) => r.disagreement).length)],
      ['Hours offered', h(offered)],
      ['Hours asked', `${h(asked)}${offered > 0 ? `  (×${fixed(asked / offered, 2)})` : ''}`],
      ['Hours granted', h(granted)],
      [
        'Tier 1 · 2 · 3 · none',
        `${count('tier1')} · ${count('tier2')} · ${count('tier3')} · ${count('not_allocated')}`,
      ],
      ['Undecided', String(s.undecided.length)],
    ];
    const pad = 10;
    const cell = (WIDTH - 2 * pad) / facts.length;
    const height = 2 * pad + 28;
    this.doc.roundedRect(MARGIN.left, this.y, WIDTH, height, 4).fill(COLOR.brandSoft);
    facts.forEach(([label, value], i) => {
      const x = MARGIN.left + pad + i * cell;
      this.ts.text(label.toUpperCase(), x, this.y + pad, STYLE.label, cell - 6);
      this.ts.text(value, x, this.y + pad + 13, STYLE.value);
    });
    this.y += height + 16;
  }

  private configurations(): void {
    const { s } = this;
    this.section('Configurations: offer, requests and grants');
    const columns: Column[] = [
      { header: 'Configuration', width: 150 },
      { header: 'In use', width: 150 },
      { header: 'Offered h', width: 70, align: 'right' },
      { header: 'Asked h', width: 70, align: 'right' },
      { header: 'Granted h', width: 70, align: 'right' },
      { header: 'Oversubscription', width: 90, align: 'right' },
      { header: 'Offer runs out at', width: 110, align: 'right', mono: true },
    ];
    const rows = s.totals.map((t) => {
      const c = s.configurations.find((x) => x.id === t.configurationId)!;
      return [
        c.name,
        `${c.inUseFrom} to ${c.inUseTo ?? 'open end'}`,
        h(t.hoursOffered),
        h(t.hoursAsked),
        h(t.hoursGranted),
        t.oversubscription === null ? 'nothing offered' : `×${fixed(t.oversubscription, 2)}`,
        t.offerRunsOutAt ?? 'within the offer',
      ];
    });
    this.table(columns, rows);
    this.y += 14;
  }

  /** Per configuration, a bar per LST hour: asked (outline), granted by tier, the capacity line. */
  private pressure(): void {
    const { s } = this;
    const charts = s.pressure.filter((p) => p.bins.some((b) => b.asked > 0 || b.capacity > 0));
    if (charts.length === 0) return;
    const perRow = Math.min(3, charts.length);
    const gap = 18;
    const width = (WIDTH - gap * (perRow - 1)) / perRow;
    const height = 110;
    this.ensure(height + 60);
    this.section('LST pressure per configuration (hours per LST hour)');
    this.legend();
    for (let i = 0; i < charts.length; i += perRow) {
      this.ensure(height + 26);
      charts.slice(i, i + perRow).forEach((p, k) => {
        this.chart(p, MARGIN.left + k * (width + gap), this.y, width, height);
      });
      this.y += height + 26;
    }
    this.y += 4;
  }

  private legend(): void {
    const { doc, ts } = this;
    let x = MARGIN.left;
    const y = this.y;
    const item = (draw: () => void, label: string) => {
      draw();
      ts.text(label, x + 13, y - 1, STYLE.small);
      x += 13 + ts.widthOf(label, STYLE.small) + 16;
    };
    item(() => doc.rect(x, y, 9, 7).lineWidth(0.8).stroke(COLOR.faint), 'asked');
    for (const tier of ['tier1', 'tier2', 'tier3'] as const)
      item(() => doc.rect(x, y, 9, 7).fill(TIER_FILL[tier]), `granted, ${TIER_SHORT[tier]}`);
    item(
      () =>
        doc
          .moveTo(x, y + 3.5)
          .lineTo(x + 9, y + 3.5)
          .lineWidth(1)
          .dash(2, { space: 1.5 })
          .stroke(COLOR.warn)
          .undash(),
      'capacity',
    );
    this.y += 16;
  }

  private chart(p: LstPressure, x: number, y: number, width: number, height: number): void {
    const { doc, ts, s } = this;
    const name = s.configurations.find((c) => c.id === p.configurationId)?.name ?? '';
    ts.text(name, x, y, { ...STYLE.cell, weight: 600 });
    const top = y + 14;
    const plotH = height - 26;
    const axisW = 24;
    const plotX = x + axisW;
    const plotW = width - axisW;
    const max = Math.max(
      1e-9,
      ...p.bins.map((b) =>
        Math.max(b.asked, b.capacity, b.granted.tier1 + b.granted.tier2 + b.granted.tier3),
      ),
    );
    const scale = plotH / max;
    const base = top + plotH;
    doc.lineWidth(0.5);
    for (const frac of [0, 0.5, 1]) {
      const gy = base - frac * plotH;
      doc
        .moveTo(plotX, gy)
        .lineTo(plotX + plotW, gy)
        .stroke(COLOR.rule);
      ts.text(h(frac * max), x, gy - 3.5, { ...STYLE.small, align: 'right' }, axisW - 3);
    }
    const barW = plotW / 24;
    for (const b of p.bins) {
      const bx = plotX + b.lstHour * barW + 1;
      const bw = barW - 2;
      let stack = base;
      for (const tier of ['tier1', 'tier2', 'tier3'] as const) {
        const hh = b.granted[tier] * scale;
        if (hh <= 0) continue;
        doc.rect(bx, stack - hh, bw, hh).fill(TIER_FILL[tier]);
        stack -= hh;
      }
      if (b.asked > 0)
        doc
          .rect(bx, base - b.asked * scale, bw, b.asked * scale)
          .lineWidth(0.6)
          .stroke(COLOR.faint);
    }
    const capacity = p.bins[0]?.capacity ?? 0;
    if (capacity > 0) {
      const cy = base - capacity * scale;
      doc
        .moveTo(plotX, cy)
        .lineTo(plotX + plotW, cy)
        .lineWidth(1)
        .dash(3, { space: 2 })
        .stroke(COLOR.warn)
        .undash();
    }
    for (const hour of [0, 6, 12, 18, 24])
      ts.text(
        `${hour}h`,
        plotX + hour * barW - 10,
        base + 3,
        { ...STYLE.small, align: 'center' },
        20,
      );
  }

  private ranked(): void {
    const { s } = this;
    this.ensure(80);
    this.section('Ranked list');
    const columns: Column[] = [
      { header: 'Rank', width: 28, align: 'right' },
      { header: 'Reference', width: 84, mono: true },
      { header: 'Title', width: 140 },
      { header: 'PI', width: 86 },
      { header: 'Reviews', width: 40, align: 'right' },
      { header: 'Raw mean', width: 42, align: 'right' },
      { header: 'Normalised', width: 48, align: 'right' },
      { header: 'Spread', width: 50, align: 'right' },
      { header: 'Technical', width: 58 },
      { header: 'Asked h', width: 40, align: 'right' },
      { header: 'Granted h', width: 44, align: 'right' },
      { header: 'Tier', width: 56 },
      { header: 'Cumulative h', width: WIDTH - 716, align: 'right' },
    ];
    const rows = s.rows.map((r) => this.rankedCells(r));
    this.table(columns, rows, 'Ranked list, continued');
    this.y += 8;
    this.ensure(24);
    this.ts.text(
      'Normalised: the mean of each review’s z value against its referee’s own scores, higher is better. Spread: the sample standard deviation of the raw scores; “disagree” marks a spread above 20 % of the scale. Cumulative: hours granted in this row and every row above it, all configurations.',
      MARGIN.left,
      this.y,
      STYLE.small,
      WIDTH,
    );
  }

  private rankedCells(r: StandingRow): string[] {
    const cumulative = Object.values(r.cumulativeGranted).reduce((a, b) => a + b, 0);
    return [
      r.rank === null ? '—' : String(r.rank),
      r.reference,
      r.title,
      r.piName,
      `${r.reviewsIn}/${r.reviewsExpected}`,
      fixed(r.rawMean, 2),
      fixed(r.normalisedScore, 2),
      r.spread === null ? '—' : `${r.disagreement ? 'disagree ' : ''}${fixed(r.spread, 2)}`,
      r.technical ? (VERDICTS[r.technical.verdict] ?? r.technical.verdict) : '—',
      h(r.hoursAsked),
      h(r.hoursGranted),
      r.tier ? TIER_SHORT[r.tier] : 'undecided',
      r.tier === null ? '' : h(cumulative),
    ];
  }

  /** One-line cells, cut with an ellipsis to fit; the header repeats on each page. */
  private table(columns: Column[], rows: string[][], continued?: string): void {
    const rowH = 14;
    const header = () => {
      let x = MARGIN.left;
      for (const c of columns) {
        this.ts.text(
          c.header,
          x + 3,
          this.y,
          { ...STYLE.head, align: c.align ?? 'left' },
          c.width - 6,
        );
        x += c.width;
      }
      this.y += 11;
      this.rule(this.y, COLOR.muted, 0.6);
      this.y += 3;
    };
    header();
    rows.forEach((cells, i) => {
      if (this.y + rowH > BOTTOM) {
        this.doc.addPage();
        this.y = MARGIN.top;
        if (continued) this.section(continued);
        header();
      }
      if (i % 2 === 1) this.doc.rect(MARGIN.left, this.y - 1, WIDTH, rowH).fill(COLOR.zebra);
      let x = MARGIN.left;
      cells.forEach((text, k) => {
        const c = columns[k]!;
        const style: TextStyle = {
          ...(c.mono ? STYLE.mono : STYLE.cell),
          align: c.align ?? 'left',
          ...(text.startsWith('disagree') || text === 'not feasible'
            ? { color: COLOR.warn, weight: 600 }
            : {}),
        };
        this.ts.text(this.fit(text, c.width - 6, style), x + 3, this.y + 2, style, c.width - 6);
        x += c.width;
      });
      this.y += rowH;
    });
    this.rule(this.y, COLOR.rule, 0.6);
  }

  private fit(text: string, width: number, style: TextStyle): string {
    if (this.ts.widthOf(text, style) <= width) return text;
    let cut = text;
    while (cut.length > 1 && this.ts.widthOf(`${cut}…`, style) > width) cut = cut.slice(0, -1);
    return `${cut.trimEnd()}…`;
  }

  private section(title: string): void {
    this.ts.text(title.toUpperCase(), MARGIN.left, this.y, STYLE.section);
    this.y += 14;
  }

  private ensure(space: number): void {
    if (this.y + space <= BOTTOM) return;
    this.doc.addPage();
    this.y = MARGIN.top;
  }

  private rule(y: number, color: string, width: number): void {
    this.doc
      .moveTo(MARGIN.left, y)
      .lineTo(MARGIN.left + WIDTH, y)
      .lineWidth(width)
      .stroke(color);
  }

  /** The footer on every page, once the page count is known. */
  private frames(): void {
    const { doc, ts, s } = this;
    const { start, count } = doc.bufferedPageRange();
    for (let i = start; i < start + count; i++) {
      doc.switchToPage(i);
      const saved = doc.page.margins;
      doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
      const footerY = PAGE.height - 32;
      this.rule(footerY - 6, COLOR.rule, 0.6);
      ts.text(
        `Committee report ${s.call.code}  ·  made ${stamp(this.options.now, 'UTC')}  ·  confidential to the committee and staff`,
        MARGIN.left,
        footerY,
        STYLE.small,
      );
      ts.text(
        `Page ${i - start + 1} of ${count}`,
        MARGIN.left,
        footerY,
        { ...STYLE.small, align: 'right' },
        WIDTH,
      );
      doc.page.margins = saved;
    }
  }
}

/** An instant in UTC and, when it differs, in the call's zone. */
function stamp(at: Date, timeZone: string): string {
  const utc = `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  if (timeZone === 'UTC') return utc;
  try {
    const local = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'short',
    }).format(at);
    return `${utc} (${local})`;
  } catch {
    return utc;
  }
}
