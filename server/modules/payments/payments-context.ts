import type { AppDeps } from '../../deps';
import { ConflictError } from '../../lib/errors';
import { createPaymentsGateway, type PaymentsGateway } from '../../lib/payments/gateway';

export interface PaymentsContext {
  /** null when payments are switched off (production without keys) */
  gateway: PaymentsGateway | null;
  provider: 'service' | 'local' | 'off';
  /** origins the hosted checkout lives on, for the pages' form-action CSP */
  checkoutOrigins: string[];
  appUrl: string;
}

const cache = new WeakMap<object, PaymentsContext>();

/**
 * The payments gateway for these deps: `deps.payments` when given, else built once from the
 * checked configuration (`config.payments`, server/config/payments.ts).
 */
export function paymentsContext(deps: AppDeps): PaymentsContext {
  const hit = cache.get(deps);
  if (hit) return hit;
  const cfg = deps.config.payments;
  const gateway = (deps as AppDeps & { payments?: PaymentsGateway }).payments ?? (cfg ? createPaymentsGateway(cfg) : null);
  const origins = ['https://checkout.stripe.com'];
  if (cfg?.apiUrl) origins.push(new URL(cfg.apiUrl).origin);
  const ctx: PaymentsContext = {
    gateway,
    provider: cfg ? cfg.provider : 'off',
    checkoutOrigins: origins,
    // read when used: a test server may learn its port (and so its URL) after the app is built
    get appUrl() {
      return deps.config.appUrl;
    },
  };
  cache.set(deps, ctx);
  return ctx;
}

export class PaymentsOffError extends ConflictError {
  constructor() {
    super('card payments are not set up on this server (STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET)', 'payments_off');
  }
}
