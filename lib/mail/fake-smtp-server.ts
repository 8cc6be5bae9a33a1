/**
 * A local stand-in for a hosted mail service: the smtp-server package accepts every message and
 * we store it in mail_messages, where admins read it on the Outbox page. Never expose it publicly.
 */
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { MailMessage } from "@/models";

export const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(", ");
}

export function startFakeSmtp(port: number, host = "127.0.0.1"): Promise<{ server: SMTPServer; port: number }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          await MailMessage.create({
            fromAddress: addresses(parsed.from),
            toAddresses: addresses(parsed.to),
            subject: parsed.subject ?? "(no subject)",
            textBody: parsed.text ?? "",
            htmlBody: typeof parsed.html === "string" ? parsed.html : null,
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      const addr = server.server.address();
      resolve({ server, port: typeof addr === "object" && addr ? addr.port : port });
    });
  });
}
