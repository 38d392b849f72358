import Stripe from 'stripe';
import type { AppConfig } from '../core/config';

/** The payment provider's SDK, pointed at the local fake unless real keys are configured. */
export function createPaymentProvider(config: AppConfig): Stripe {
  const api = config.payments.apiUrl ? new URL(config.payments.apiUrl) : null;
  return new Stripe(config.payments.secretKey, {
    maxNetworkRetries: api ? 0 : 2,
    timeout: 10_000,
    ...(api ? { host: api.hostname, port: Number(api.port || (api.protocol === 'https:' ? 443 : 80)), protocol: api.protocol.replace(':', '') as 'http' | 'https' } : {}),
  });
}
