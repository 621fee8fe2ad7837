import { simpleParser, type AddressObject, type Attachment, type ParsedMail } from 'mailparser';
import type { HeaderLine, StoredMessage } from './types.js';

export interface Envelope {
  mailFrom: string | null;
  rcptTo: string[];
}

export interface AttachmentContent {
  filename: string;
  contentType: string;
  content: Buffer;
}

export async function parseMessage(
  id: string,
  raw: Buffer,
  envelope: Envelope,
  receivedAt: Date,
): Promise<StoredMessage> {
  const parsed = await simpleParser(raw);
  const to = addresses(parsed.to);
  const date = parsed.date && !Number.isNaN(parsed.date.getTime()) ? parsed.date : receivedAt;
  return {
    id,
    from: addresses(parsed.from)[0] ?? envelope.mailFrom ?? '',
    to: to.length > 0 ? to : envelope.rcptTo,
    subject: parsed.subject ?? '',
    date: date.toISOString(),
    receivedAt: receivedAt.toISOString(),
    fromText: parsed.from?.text ?? envelope.mailFrom ?? '',
    cc: addresses(parsed.cc),
    replyTo: addresses(parsed.replyTo),
    messageId: parsed.messageId ?? null,
    envelope,
    text: parsed.text ?? null,
    html: parsed.html || null,
    attachments: parsed.attachments.map((attachment, index) => ({
      filename: attachmentName(attachment, index),
      contentType: attachment.contentType,
      size: attachment.size,
    })),
    headers: headerLines(parsed),
    size: raw.length,
  };
}

/** Parses the raw message again: the .eml on disk is the one copy of attachment bytes. */
export async function readAttachment(
  raw: Buffer,
  index: number,
): Promise<AttachmentContent | undefined> {
  const parsed = await simpleParser(raw);
  const attachment = parsed.attachments[index];
  if (!attachment) return undefined;
  return {
    filename: attachmentName(attachment, index),
    contentType: attachment.contentType,
    content: attachment.content,
  };
}

function attachmentName(attachment: Attachment, index: number): string {
  return attachment.filename ?? `attachment-${index + 1}`;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const objects = Array.isArray(field) ? field : [field];
  const result: string[] = [];
  const visit = (entries: AddressObject['value']): void => {
    for (const entry of entries) {
      if (entry.address) result.push(entry.address);
      if (entry.group) visit(entry.group);
    }
  };
  for (const object of objects) visit(object.value);
  return result;
}

function headerLines(parsed: ParsedMail): HeaderLine[] {
  return parsed.headerLines.map(({ line }) => {
    const unfolded = line.replace(/\r?\n[ \t]+/g, ' ');
    const colon = unfolded.indexOf(':');
    return colon < 0
      ? { name: unfolded, value: '' }
      : { name: unfolded.slice(0, colon), value: unfolded.slice(colon + 1).trim() };
  });
}
