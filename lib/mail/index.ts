/**
 * Outgoing mail through nodemailer. SMTP_URL picks the server; by default the local fake SMTP
 * server (scripts/fake-smtp.ts) on port 2525, which stores every message for the admin outbox.
 */
import nodemailer, { type Transporter } from "nodemailer";

export const DEFAULT_SMTP_URL = "smtp://127.0.0.1:2525";
export const MAIL_FROM = process.env.MAIL_FROM || "Wavesieve <no-reply@wavesieve.test>";

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

let transport: Transporter | null = null;
let transportUrl = "";

function getTransport(): Transporter {
  const url = process.env.SMTP_URL || DEFAULT_SMTP_URL;
  if (!transport || transportUrl !== url) {
    transport = url === "json" ? nodemailer.createTransport({ jsonTransport: true }) : nodemailer.createTransport(url, { connectionTimeout: 5000, greetingTimeout: 5000 });
    transportUrl = url;
  }
  return transport;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await getTransport().sendMail({ from: MAIL_FROM, ...mail });
}

/** The public base URL for links in mails. */
export function appBaseUrl(): string {
  return (process.env.NEXTAUTH_URL || "http://localhost:3000").replace(/\/$/, "");
}
