import { markup, SafeHtml, type HtmlPart } from './html.js';
import { INBOX_SCRIPT } from './inbox-script.js';
import { INBOX_STYLES } from './inbox-styles.js';
import type { MessageSummary, StoredMessage } from './types.js';

export interface InboxPageModel {
  messages: MessageSummary[];
  /** Messages in the sink, whatever the filter. */
  total: number;
  /** The `to` filter as typed, or '' for none. */
  filterTo: string;
  selected: StoredMessage | undefined;
  /** An id that was asked for but is not in the inbox. */
  missingId: string | undefined;
  smtpAddress: string;
  nonce: string;
}

const SCRIPT = new SafeHtml(INBOX_SCRIPT);
const STYLES = new SafeHtml(INBOX_STYLES);

export function renderInboxPage(model: InboxPageModel): string {
  const { messages, total, filterTo, selected, nonce } = model;
  const title = total === 0 ? 'Skyhours mail sink' : `(${total}) Skyhours mail sink`;
  return markup`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title>
<link rel="icon" href="data:,">
<style>${STYLES}</style>
</head>
<body>
<a class="skip-link" href="#message">Skip to the message</a>
<header class="bar">
  <div class="brand"><span class="brand-mark" aria-hidden="true"></span><h1>Skyhours mail sink</h1></div>
  <p class="bar-note">SMTP <code>${model.smtpAddress}</code> · refreshes every 3 s</p>
  <form class="filter" method="get" action="/" role="search" aria-label="Filter by recipient">
    <label for="filter-to">Recipient</label>
    <input id="filter-to" name="to" type="search" value="${filterTo}" placeholder="someone@skyhours.test" autocomplete="off">
    <button type="submit">Filter</button>
    ${filterTo ? markup`<a href="/">Show all</a>` : ''}
  </form>
  <button type="button" id="empty-inbox" class="danger" hidden>Empty inbox</button>
</header>
<div class="layout">
  <nav class="list-pane" aria-labelledby="list-heading">
    <div class="list-head">
      <h2 id="list-heading">Messages</h2>
      <p id="message-count">${countLabel(messages.length, total, filterTo)}</p>
    </div>
    ${renderList(model)}
  </nav>
  <main id="message" class="detail-pane" tabindex="-1">
    ${selected ? renderMessage(selected) : renderPlaceholder(model)}
  </main>
</div>
<dialog id="confirm-empty" aria-labelledby="confirm-title" aria-describedby="confirm-text">
  <form method="dialog">
    <h2 id="confirm-title">Empty the inbox?</h2>
    <p id="confirm-text">Every message in the sink is deleted, also from disk, including any the recipient filter hides. This cannot be undone.</p>
    <div class="actions">
      <button value="cancel" autofocus>Keep messages</button>
      <button value="confirm" class="danger">Empty inbox</button>
    </div>
  </form>
</dialog>
<p id="live-status" class="visually-hidden" role="status" aria-live="polite"></p>
<script nonce="${nonce}">${SCRIPT}</script>
</body>
</html>
`.value;
}

function countLabel(shown: number, total: number, filterTo: string): string {
  if (filterTo) return `${shown} of ${total} to ${filterTo}`;
  return total === 1 ? '1 message' : `${total} messages`;
}

function renderList(model: InboxPageModel): SafeHtml {
  const { messages, filterTo, selected } = model;
  const signature = messages.map((message) => message.id).join(',');
  if (messages.length === 0) {
    return markup`<div id="message-list" data-signature="">
      <div class="empty">
        <strong>${filterTo ? `No messages to ${filterTo}` : 'No messages yet'}</strong>
        <p>Mail sent to SMTP <code>${model.smtpAddress}</code> shows up here.</p>
      </div>
    </div>`;
  }
  return markup`<div id="message-list" data-signature="${signature}">
    <ol class="messages">
      ${messages.map(
        (message) => markup`<li>
        <a class="item" href="${messageHref(message.id, filterTo)}" data-id="${message.id}"${
          selected?.id === message.id ? markup` aria-current="page"` : ''
        }>
          <span class="item-top"><span class="item-from">${message.from || '(no sender)'}</span>${time(message.date, 'short')}</span>
          <span class="item-subject">${message.subject || '(no subject)'}</span>
          <span class="item-to">To ${message.to.join(', ') || '(no recipients)'}</span>
        </a>
      </li>`,
      )}
    </ol>
  </div>`;
}

function renderPlaceholder(model: InboxPageModel): SafeHtml {
  if (model.missingId) {
    return markup`<p class="notice">Message <code>${model.missingId}</code> is not in the inbox; it may have been deleted.</p>`;
  }
  return markup`<p class="placeholder">${
    model.messages.length > 0 ? 'Choose a message to read it.' : 'Nothing to read yet.'
  }</p>`;
}

function renderMessage(message: StoredMessage): SafeHtml {
  const base = `/api/messages/${message.id}`;
  return markup`<article aria-labelledby="message-subject">
    <h2 id="message-subject">${message.subject || '(no subject)'}</h2>
    <dl class="meta">
      <dt>From</dt><dd>${message.fromText || message.from || '(no sender)'}</dd>
      <dt>To</dt><dd>${message.to.join(', ') || '(none)'}</dd>
      ${message.cc.length > 0 ? markup`<dt>Cc</dt><dd>${message.cc.join(', ')}</dd>` : ''}
      ${message.replyTo.length > 0 ? markup`<dt>Reply-To</dt><dd>${message.replyTo.join(', ')}</dd>` : ''}
      <dt>Date</dt><dd>${time(message.date, 'long')}</dd>
      <dt>Received</dt><dd>${time(message.receivedAt, 'long')}</dd>
      <dt>Envelope</dt><dd>from ${message.envelope.mailFrom ?? '(null sender)'} to ${message.envelope.rcptTo.join(', ')}</dd>
      <dt>Size</dt><dd>${formatBytes(message.size)}</dd>
    </dl>
    <ul class="links">
      <li><a href="${base}/raw">Download raw message (.eml)</a></li>
      <li><a href="${base}">View as JSON</a></li>
    </ul>
    ${message.attachments.length > 0 ? renderAttachments(message) : ''}
    ${
      message.html !== null
        ? markup`<h3>HTML part</h3>
    <iframe class="html-part" title="HTML part of the message"
      sandbox="allow-popups allow-popups-to-escape-sandbox" referrerpolicy="no-referrer"
      srcdoc="${htmlPartDocument(message.html)}"></iframe>`
        : ''
    }
    <h3>Text part</h3>
    ${
      message.text !== null && message.text !== ''
        ? markup`<pre class="text-part">${linkify(message.text)}</pre>`
        : markup`<p class="placeholder">This message has no text part.</p>`
    }
    <details>
      <summary>All headers (${message.headers.length})</summary>
      <pre class="headers">${message.headers.map((header) => markup`<b>${header.name}:</b> ${header.value}\n`)}</pre>
    </details>
  </article>`;
}

function renderAttachments(message: StoredMessage): SafeHtml {
  return markup`<h3>Attachments</h3>
    <ul class="attachments">
      ${message.attachments.map(
        (attachment, index) => markup`<li>
        <a href="/api/messages/${message.id}/attachments/${index}">${attachment.filename}</a>
        <span>${attachment.contentType}, ${formatBytes(attachment.size)}</span>
      </li>`,
      )}
    </ul>`;
}

/**
 * The HTML part as the iframe's document. The frame is sandboxed without scripts and without
 * our origin; links open in a new tab, since the page's policy forbids navigating the frame.
 */
function htmlPartDocument(body: string): string {
  return `<base target="_blank">${body}`;
}

function messageHref(id: string, filterTo: string): string {
  const query = new URLSearchParams({ id });
  if (filterTo) query.set('to', filterTo);
  return `/?${query.toString()}`;
}

/** Server-side text is UTC; the page's script rewrites it in the viewer's zone. */
function time(iso: string, format: 'short' | 'long'): SafeHtml {
  const date = new Date(iso);
  const utc = Number.isNaN(date.getTime())
    ? iso
    : `${date
        .toISOString()
        .slice(0, format === 'long' ? 19 : 16)
        .replace('T', ' ')} UTC`;
  return markup`<time datetime="${iso}" data-format="${format}" title="${utc}">${utc}</time>`;
}

function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MiB`;
}

/** Escapes the text and turns http(s) addresses into links, so e-mailed links can be followed. */
function linkify(text: string): HtmlPart[] {
  const parts: HtmlPart[] = [];
  let last = 0;
  for (const match of text.matchAll(/https?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]]/g)) {
    const start = match.index;
    parts.push(text.slice(last, start));
    parts.push(
      markup`<a href="${match[0]}" target="_blank" rel="noopener noreferrer">${match[0]}</a>`,
    );
    last = start + match[0].length;
  }
  parts.push(text.slice(last));
  return parts;
}
