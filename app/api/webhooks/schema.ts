// The webhook routes' schemas live with the rest of the contract (lib/api/contract.ts), which the API description is generated from.
export { registerWebhookBody, webhookIdParams, deliveryParams, listWebhooksQuery, allowlistBody } from '@/lib/api/contract';
