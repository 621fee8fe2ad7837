import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { MailSink, MessageSummary, StoredMessage } from '../src/index.js';
import { getJson, makeTempDir, removeDir, request, send, startTestSink } from './helpers.js';

let dir: string;
let sink: MailSink;

beforeEach(async () => {
  dir = await makeTempDir();
  sink = await startTestSink(dir);
});

afterEach(async () => {
  await sink.close();
  await removeDir(dir);
});

async function page(pathname = '/'): Promise<{ status: number; body: string; csp: string }> {
  const response = await request(sink, pathname);
  expect(response.headers.get('content-type')).toBe('text/html; charset=utf-8');
  return {
    status: response.status,
    body: await response.text(),
    csp: response.headers.get('content-security-policy') ?? '',
  };
}

function decodeAttribute(value: string): string {
  return value
    .replaceAll('&quot;', '"')
    .replaceAll('&#39;', "'")
    .replaceAll('&lt;', '<')
    .replaceAll('&gt;', '>')
    .replaceAll('&amp;', '&');
}

async function onlyMessageId(): Promise<string> {
  const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');
  return summary?.id ?? '';
}

describe('the inbox page', () => {
  it('shows the product name and an empty state when there is no mail', async () => {
    const { status, body } = await page();
    expect(status).toBe(200);
    expect(body).toContain('<h1>Skyhours mail sink</h1>');
    expect(body).toContain('No messages yet');
    expect(body).toContain(`127.0.0.1:${sink.smtpPort}`);
    expect(body).not.toContain('class="item"');
  });

  it('allows only its own script, by a nonce that changes per request', async () => {
    const first = await page();
    const second = await page();
    const nonce = /script-src 'nonce-([^']+)'/.exec(first.csp)?.[1];
    expect(nonce).toBeDefined();
    expect(first.csp).toContain("default-src 'none'");
    expect(first.body).toContain(`<script nonce="${nonce}">`);
    expect(second.csp).not.toContain(`'nonce-${nonce}'`);
    expect(first.body.match(/<script/g)).toHaveLength(1);
  });

  it('lists messages newest first with sender, recipients, subject and a UTC date', async () => {
    await send(sink, { to: 'pi@example.org', subject: 'Call SP27 is open', text: '.' });
    await send(sink, {
      to: ['referee@example.org', 'chair@skyhours.test'],
      subject: 'Review due for SP27-0003',
      text: '.',
    });

    const { body } = await page();
    const older = body.indexOf('Call SP27 is open');
    const newer = body.indexOf('Review due for SP27-0003');
    expect(newer).toBeGreaterThan(0);
    expect(older).toBeGreaterThan(newer);
    expect(body).toContain('To referee@example.org, chair@skyhours.test');
    expect(body).toContain('noreply@skyhours.test');
    expect(body).toMatch(
      /<time datetime="\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.000Z" data-format="short" title="[^"]+ UTC">\d{4}-\d\d-\d\d \d\d:\d\d UTC<\/time>/,
    );
    expect(body).toContain('<p id="message-count">2 messages</p>');
  });

  it('escapes HTML in the subject and the sender, in the list and the message view', async () => {
    await send(sink, {
      from: '"<img src=x onerror=alert(2)>" <pi@example.org>',
      to: 'chair@skyhours.test',
      subject: '<script>alert("subject")</script> & <b>bold</b>',
      text: 'Plain <text> & "quotes"',
    });
    const id = await onlyMessageId();

    for (const pathname of ['/', `/?id=${id}`]) {
      const { body } = await page(pathname);
      expect(body).toContain(
        '&lt;script&gt;alert(&quot;subject&quot;)&lt;/script&gt; &amp; &lt;b&gt;bold&lt;/b&gt;',
      );
      expect(body).not.toContain('<script>alert');
      expect(body).not.toContain('<b>bold</b>');
      expect(body.match(/<script/g)).toHaveLength(1);
    }
    const { body } = await page(`/?id=${id}`);
    expect(body).toContain('&quot;&lt;img src=x onerror=alert(2)&gt;&quot; &lt;pi@example.org&gt;');
    expect(body).not.toContain('<img src=x');
    expect(body).toContain('Plain &lt;text&gt; &amp; &quot;quotes&quot;');
  });

  it('renders the HTML part escaped inside a sandboxed frame that runs no script', async () => {
    const htmlPart =
      '<p onclick="steal()">Dear PI, "Tier 1" &amp; more</p><script>steal()</script>';
    await send(sink, { to: 'pi@example.org', subject: 'Outcome', html: htmlPart });
    const id = await onlyMessageId();

    const { body, csp } = await page(`/?id=${id}`);
    const frame = /<iframe class="html-part"[^>]*>/.exec(body)?.[0] ?? '';
    expect(frame).toContain('sandbox="allow-popups allow-popups-to-escape-sandbox"');
    expect(frame).not.toMatch(/allow-scripts|allow-same-origin/);
    const srcdoc = /srcdoc="([^"]*)"/.exec(frame)?.[1];
    expect(srcdoc).toBeDefined();
    const { html } = await getJson<StoredMessage>(sink, `/api/messages/${id}`);
    expect(html?.trim()).toBe(htmlPart);
    expect(decodeAttribute(srcdoc ?? '')).toBe(`<base target="_blank">${html}`);
    expect(body).not.toContain('<script>steal()');
    expect(body).not.toContain('<p onclick');
    // The frame inherits the page's policy, whose only script source is the page's nonce.
    const scriptSources = csp
      .split(';')
      .find((directive) => directive.trim().startsWith('script-src'));
    expect(scriptSources?.trim()).toMatch(/^script-src 'nonce-[A-Za-z0-9+/=]+'$/);
  });

  it('shows the headers, the text part with links, and the attachments of a message', async () => {
    await send(sink, {
      to: 'coi@example.org',
      cc: 'pi@example.org',
      subject: 'Invitation to SP27-0014',
      text: 'Accept here: https://skyhours.test/invitations/abc?x=1&y=2.',
      attachments: [{ filename: 'cover page.pdf', content: 'pdf', contentType: 'application/pdf' }],
    });
    const id = await onlyMessageId();

    const { status, body } = await page(`/?id=${id}`);
    expect(status).toBe(200);
    expect(body).toContain('<h2 id="message-subject">Invitation to SP27-0014</h2>');
    expect(body).toContain('<dt>Cc</dt><dd>pi@example.org</dd>');
    expect(body).toContain(`aria-current="page"`);
    expect(body).toContain(
      'Accept here: <a href="https://skyhours.test/invitations/abc?x=1&amp;y=2" target="_blank" rel="noopener noreferrer">https://skyhours.test/invitations/abc?x=1&amp;y=2</a>.',
    );
    expect(body).toContain(`<a href="/api/messages/${id}/attachments/0">cover page.pdf</a>`);
    expect(body).toContain('<span>application/pdf, 3 B</span>');
    expect(body).toContain(`<a href="/api/messages/${id}/raw">`);
    expect(body).toMatch(/<b>Subject:<\/b> Invitation to SP27-0014/);
  });

  it('answers 404 with a notice for a message that is not there', async () => {
    const { status, body } = await page('/?id=<b>gone</b>');
    expect(status).toBe(404);
    expect(body).toContain('Message <code>&lt;b&gt;gone&lt;/b&gt;</code> is not in the inbox');
  });

  it('filters the list by recipient and keeps the filter in the links', async () => {
    await send(sink, { to: 'pi@example.org', subject: 'For the PI', text: '.' });
    await send(sink, { to: 'referee@example.org', subject: 'For the referee', text: '.' });

    const { body } = await page('/?to=referee%40example.org');
    expect(body).toContain('For the referee');
    expect(body).not.toContain('For the PI');
    expect(body).toContain('value="referee@example.org"');
    expect(body).toContain('1 of 2 to referee@example.org');
    expect(body).toMatch(/href="\/\?id=\d{13}-\d{4}&amp;to=referee%40example.org"/);

    const none = await page('/?to=nobody%40example.org');
    expect(none.body).toContain('No messages to nobody@example.org');
  });

  it('offers an Empty inbox button with a confirmation dialog', async () => {
    const { body } = await page();
    expect(body).toContain(
      '<button type="button" id="empty-inbox" class="danger" hidden>Empty inbox</button>',
    );
    expect(body).toMatch(/<dialog id="confirm-empty" aria-labelledby="confirm-title"/);
    expect(body).toContain('<button value="confirm" class="danger">Empty inbox</button>');
    expect(body).toContain('<label for="filter-to">Recipient</label>');
  });
});
