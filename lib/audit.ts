import { AuditEvent } from "@/models";

export interface Actor {
  id: string;
  email: string;
}

/** Append one row to the audit log. */
export async function recordAudit(
  actor: Actor | null,
  action: string,
  targetType: string,
  targetId: string | null,
  detail?: string,
): Promise<void> {
  await AuditEvent.create({
    actorId: actor?.id ?? null,
    actorEmail: actor?.email ?? null,
    action,
    targetType,
    targetId,
    detail: detail ?? null,
  });
}
