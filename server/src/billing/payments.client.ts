// The official payments SDK, pointed at PAYMENTS_API_URL (the local fake in development/tests).
import Stripe from 'stripe';
import type { AppConfig } from '../config/config.js';

export const PAYMENTS = Symbol('PAYMENTS');
export type Payments = Stripe | null;

export function paymentsClient(config: AppConfig): Payments {
  if (!config.paymentsApiUrl) return null;
  const u = new URL(config.paymentsApiUrl);
  return new Stripe(config.paymentsSecretKey, {
    host: u.hostname,
    port: Number(u.port || (u.protocol === 'https:' ? 443 : 80)),
    protocol: u.protocol === 'https:' ? 'https' : 'http',
    maxNetworkRetries: 2,
    timeout: 10_000,
    telemetry: false,
  });
}
