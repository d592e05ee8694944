import { startMailCatcher } from './mail/mail-catcher';

/** `npm start` runs this: the local fakes on loopback (SMTP now; payments join with billing). */
async function main() {
  const smtpPort = Number(process.env.SMTP_PORT ?? 1025);
  const apiPort = Number(process.env.MAIL_API_PORT ?? 1080);
  const mail = await startMailCatcher({ smtpPort, apiPort });
  console.log(`  Mail fake: SMTP 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${apiPort}/messages`);
  const stop = () => mail.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error(`spinyard: the local fakes could not start: ${err.code === 'EADDRINUSE' ? `port in use (${err.port}); set SMTP_PORT / MAIL_API_PORT` : err.message}`);
  process.exit(1);
});
