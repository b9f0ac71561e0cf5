import nodemailer, { type Transporter } from 'nodemailer';
import { Op, type Transaction } from 'sequelize';
import { db } from '@/models';

export interface MailMessage {
  to: string;
  subject: string;
  body: string;
  kind: string;
  versionId?: number | null;
}

let transporter: Transporter | undefined;
let deferred = false;

/** Batch jobs (seeding) queue mail and deliver once at the end instead of after every change. */
export function deferMailDelivery(on: boolean) {
  deferred = on;
}
export const isMailDeferred = () => deferred;

function transport(): Transporter {
  transporter ??= nodemailer.createTransport({
    // A pool reuses connections: every new SMTP session costs a greeting delay on the server side.
    pool: true,
    maxConnections: 4,
    host: process.env.SMTP_HOST ?? '127.0.0.1',
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure: process.env.SMTP_SECURE === 'true',
    ignoreTLS: process.env.SMTP_SECURE !== 'true' && (process.env.SMTP_HOST ?? '127.0.0.1') === '127.0.0.1',
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return transporter;
}

/** Queues messages in the outbox inside the caller's transaction: they leave only if it commits. */
export async function enqueueMail({ transaction, messages }: { transaction: Transaction; messages: MailMessage[] }) {
  const { Notification } = db();
  const unique = new Map(messages.map((m) => [`${m.to}\u0000${m.subject}`, m]));
  if (unique.size === 0) return;
  await Notification.bulkCreate([...unique.values()].map((m) => ({
    toEmail: m.to, subject: m.subject, body: m.body, kind: m.kind, versionId: m.versionId ?? null,
    status: 'pending' as const, error: null, sentAt: null,
  })), { transaction });
}

/** A claim older than this belongs to a delivery that died mid-send; the message may be taken again. */
const STALE_CLAIM_MS = 10 * 60_000;

/**
 * Sends every pending (or earlier failed) message over SMTP; failures stay in the outbox with the error. Each message
 * is claimed first with a conditional UPDATE, so deliveries running at once (two approvals committing together, two
 * app instances) send it exactly once between them.
 */
export async function deliverPendingMail(): Promise<{ sent: number; failed: number }> {
  const { Notification } = db();
  const stale = () => new Date(Date.now() - STALE_CLAIM_MS);
  const open = () => ({ [Op.or]: [{ status: { [Op.in]: ['pending', 'failed'] } }, { status: 'sending', claimedAt: { [Op.lt]: stale() } }] });
  const pending = await Notification.findAll({ where: open(), order: [['id', 'ASC']], limit: 200 });
  let sent = 0;
  let failed = 0;
  const from = process.env.SMTP_FROM ?? 'Correlary <no-reply@correlary.local>';
  const deliver = async (n: (typeof pending)[number]) => {
    const [claimed] = await Notification.update({ status: 'sending', claimedAt: new Date() }, { where: { id: n.id, ...open() } });
    if (claimed !== 1) return; // another delivery has it
    try {
      await transport().sendMail({ from, to: n.toEmail, subject: n.subject, text: n.body });
      await Notification.update({ status: 'sent', sentAt: new Date(), error: null }, { where: { id: n.id } });
      sent++;
    } catch (err) {
      await Notification.update({ status: 'failed', error: (err as Error).message.slice(0, 2000) }, { where: { id: n.id } });
      failed++;
    }
  };
  for (let i = 0; i < pending.length; i += 4) await Promise.all(pending.slice(i, i + 4).map(deliver));
  return { sent, failed };
}

/** Closes pooled SMTP connections (command-line tools call this before exiting). */
export function closeMail() {
  transporter?.close();
  transporter = undefined;
}

export async function listSentMail({ limit = 200 }: { limit?: number } = {}) {
  const { Notification } = db();
  return Notification.findAll({ order: [['id', 'DESC']], limit });
}
