/** The events an endpoint can ask for (a ping is sent only on request). Free of the database: the contract imports it. */
export const WEBHOOK_EVENTS = ['version.approved', 'version.superseded', 'version.withdrawn', 'calculation.flagged'] as const;
export type WebhookEvent = (typeof WEBHOOK_EVENTS)[number] | 'ping';
