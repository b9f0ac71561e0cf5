/**
 * Runs once when the Next.js server starts (not at build time): the webhook dispatcher sends queued deliveries
 * from this process. Every instance runs one; they share the queue safely (lib/webhooks/dispatcher.ts).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || process.env.WEBHOOKS_DISABLED === '1') return;
  const { startWebhookDispatcher } = await import('./lib/webhooks/dispatcher');
  startWebhookDispatcher();
}
