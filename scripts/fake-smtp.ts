// Starts the local fake SMTP server that stores mail for the admin outbox (development and demo).
import { startFakeSmtp } from "@/lib/mail/fake-smtp-server";

const port = Number(process.env.FAKE_SMTP_PORT || 2525);
startFakeSmtp(port)
  .then(({ port: p }) => console.log(`[fake-smtp] listening on 127.0.0.1:${p}`))
  .catch((err) => {
    console.error("[fake-smtp] could not start:", err);
    process.exit(1);
  });
