// The local payments stand-in as its own process, for `npm start` when no real keys are set:
//   tsx scripts/fake-payments.ts   (FAKE_PAYMENTS_PORT default 12111, PAYMENTS_WEBHOOK_URL = our webhook)
// It moves no money. The app finds it through PAYMENTS_API_URL (default http://127.0.0.1:12111).
import { createFakePaymentService } from '../server/lib/payments/fake-service';
import { LOCAL_PAYMENTS_PORT, localDataDir, localWebhookSecret } from '../server/config/payments';

const port = Number(process.env.FAKE_PAYMENTS_PORT ?? LOCAL_PAYMENTS_PORT);
const webhookUrl = process.env.PAYMENTS_WEBHOOK_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}/api/payments/webhook`;
if (process.env.STRIPE_SECRET_KEY) {
  console.error('[payments] STRIPE_SECRET_KEY is set: the real service is used, the local stand-in is not needed');
  process.exit(1);
}
const fake = createFakePaymentService({ webhookSecret: localWebhookSecret(localDataDir()), webhookUrl });
fake
  .listen(port)
  .then((h) => {
    console.log(`[payments] local checkout stand-in on ${h.url} (no money moves); webhooks to ${webhookUrl}`);
    const stop = () => h.close().finally(() => process.exit(0));
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  })
  .catch((e: Error) => {
    console.error(`[payments] cannot start the local stand-in on 127.0.0.1:${port}: ${e.message}`);
    process.exit(1);
  });
