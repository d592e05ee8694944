import { startMailCatcher } from './mail/mail-catcher';
import { startPaymentFake } from './payments/payment-fake';

/** `npm start` runs this: the local fakes on loopback (SMTP and payments). */
async function main() {
  const smtpPort = Number(process.env.SMTP_PORT ?? 1025);
  const apiPort = Number(process.env.MAIL_API_PORT ?? 1080);
  const mail = await startMailCatcher({ smtpPort, apiPort });
  console.log(`  Mail fake: SMTP 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${apiPort}/messages`);
  const paymentsPort = Number(process.env.PAYMENTS_PORT ?? 12111);
  const appUrl = process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`;
  const payments = await startPaymentFake({ port: paymentsPort, webhookUrl: `${appUrl}/api/billing/webhook`, webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_spinyard_local_fake' });
  console.log(`  Payment fake: API and test payment pages at ${payments.url}, events to ${appUrl}/api/billing/webhook`);
  const stop = () => Promise.all([mail.close(), payments.close()]).then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error(`spinyard: the local fakes could not start: ${err.code === 'EADDRINUSE' ? `port in use (${err.port}); set SMTP_PORT / MAIL_API_PORT / PAYMENTS_PORT` : err.message}`);
  process.exit(1);
});
