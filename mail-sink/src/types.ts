/** One line of the summary list: what `GET /api/messages` returns per message. */
export interface MessageSummary {
  /** Sortable by arrival: milliseconds since the epoch, a dash, a per-millisecond counter. */
  id: string;
  /** Address of the From header, or the SMTP sender when the header is missing. */
  from: string;
  /** Addresses of the To header, or the SMTP recipients when the header is missing. */
  to: string[];
  subject: string;
  /** ISO 8601 in UTC: the Date header, or the arrival time when the header is missing. */
  date: string;
}

export interface AttachmentSummary {
  filename: string;
  contentType: string;
  /** Decoded size in bytes. */
  size: number;
}

export interface HeaderLine {
  name: string;
  /** The header as written in the message, unfolded but not decoded. */
  value: string;
}

/** Everything the sink keeps about one message; `GET /api/messages/:id` returns it. */
export interface StoredMessage extends MessageSummary {
  /** ISO 8601 in UTC. */
  receivedAt: string;
  /** The From header as displayed, with the name: `"Skyhours" <noreply@skyhours.test>`. */
  fromText: string;
  cc: string[];
  replyTo: string[];
  messageId: string | null;
  /** What the SMTP client said, which includes Bcc recipients the headers do not show. */
  envelope: { mailFrom: string | null; rcptTo: string[] };
  text: string | null;
  html: string | null;
  attachments: AttachmentSummary[];
  headers: HeaderLine[];
  /** Size of the raw message in bytes. */
  size: number;
}

export interface MessageFilter {
  /** Case-insensitive; matches the To and Cc headers and the SMTP recipients. */
  to?: string;
}
