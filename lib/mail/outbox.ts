import { MailMessage } from "@/models";

export async function listOutbox(limit: number) {
  const rows = await MailMessage.findAll({ order: [["createdAt", "DESC"]], limit });
  return rows.map((m) => ({ id: m.id, from: m.fromAddress, to: m.toAddresses, subject: m.subject, text: m.textBody, createdAt: m.createdAt }));
}
