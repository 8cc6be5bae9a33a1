// Integration: the mails of the background jobs through the outgoing queue — retried while the
// SMTP server is down (the run is not failed), delivered once it is back, the "batch screened"
// counts, preferences, and the curators' digest. Uses the project's fake SMTP server.
import { describe, it, expect, beforeAll, afterAll } from "vitest";
import net from "node:net";
import type { SMTPServer } from "smtp-server";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams } from "../helpers/requests";
import { usersByRole, kdvSweep, storeYaml, verdictReport } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";
import type { EngineRunner } from "@/lib/queue/thread-pool";

createMigratedDatabase({ seed: true });

let users: Record<Role, CurrentUser>;
let smtp: SMTPServer | null = null;

function closedPort(): Promise<number> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

beforeAll(async () => {
  users = await usersByRole();
  process.env.SMTP_URL = `smtp://127.0.0.1:${await closedPort()}`; // nobody listens: SMTP is down
});
afterAll(() => new Promise<void>((resolve) => (smtp ? smtp.close(() => resolve()) : resolve())));

/** A runner that answers at once with the given reducibility verdicts, in order (no engine threads). */
function scriptedRunner(verdicts: string[]): EngineRunner {
  let i = 0;
  return {
    size: 1,
    async execute(_job, hooks) {
      hooks.onStage("reducibility");
      const v = verdicts[i++ % verdicts.length];
      return { kind: "done", reportJson: verdictReport("0.1.0", v, "passes"), engine: "0.1.0" };
    },
    async close() {},
  };
}

async function screenWith(verdicts: string[], drainMail: boolean) {
  const { startWorker } = await import("@/lib/queue/worker");
  return startWorker({ runner: scriptedRunner(verdicts), stopWhenIdle: true, pollMs: 20, drainMail, log: () => undefined }).done;
}

describe("batch finished mail", () => {
  let batchId = "";

  it("is queued when the batch finishes; SMTP down means a retry later, and the runs stay done", async () => {
    const stored = await storeYaml(users.researcher, "three.yaml", kdvSweep("mail-three", 3));
    batchId = stored.id;
    await screenWith(["reducible", "not-reducible", "undecided"], false);
    const { ScreeningRun, OutgoingMail, Batch } = await import("@/models");
    expect((await ScreeningRun.findAll({ where: { batchId } })).map((r) => r.state)).toEqual(["done", "done", "done"]);
    expect((await Batch.findByPk(batchId))?.state).toBe("done");

    const { drainOutgoingMail } = await import("@/lib/mail/queue");
    const now = new Date();
    expect(await drainOutgoingMail({ now })).toEqual({ sent: 0, failed: 0, retrying: 1 });
    const mail = await OutgoingMail.findOne({ where: { dedupeKey: `batch-done:${batchId}` } });
    expect(mail).toMatchObject({ state: "queued", attempts: 1 });
    expect(mail?.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(mail!.nextAttemptAt.getTime() - now.getTime()).toBe(30_000); // first retry after 30 s
    expect(await drainOutgoingMail({ now: new Date(now.getTime() + 1000) })).toEqual({ sent: 0, failed: 0, retrying: 0 }); // not due yet
    expect((await ScreeningRun.findAll({ where: { batchId } })).every((r) => r.state === "done")).toBe(true);
  });

  it("is delivered once SMTP is back, with the verdict counts and the batch link", async () => {
    const { startFakeSmtp } = await import("@/lib/mail/fake-smtp-server");
    const started = await startFakeSmtp(0);
    smtp = started.server;
    process.env.SMTP_URL = `smtp://127.0.0.1:${started.port}`;
    const { drainOutgoingMail } = await import("@/lib/mail/queue");
    const { OutgoingMail, MailMessage } = await import("@/models");
    const queued = await OutgoingMail.findOne({ where: { dedupeKey: `batch-done:${batchId}` } });
    expect(await drainOutgoingMail({ now: new Date(queued!.nextAttemptAt.getTime() + 1) })).toEqual({ sent: 1, failed: 0, retrying: 0 });
    await queued!.reload();
    expect(queued).toMatchObject({ state: "sent", attempts: 2 });
    const received = await MailMessage.findOne({ where: { toAddresses: users.researcher.email } });
    expect(received?.subject).toBe("Batch screened: three.yaml");
    expect(received?.textBody).toMatch(/reducible:\s+1\n\s+not reducible:\s+1\n\s+undecided:\s+1/);
    expect(received?.textBody).toContain(`/batches/${batchId}`);
  });

  it("is sent by the worker loop itself between runs", async () => {
    const stored = await storeYaml(users.researcher, "two.yaml", kdvSweep("mail-two", 2, 3));
    await screenWith(["reducible"], true);
    const { OutgoingMail, MailMessage } = await import("@/models");
    expect((await OutgoingMail.findOne({ where: { dedupeKey: `batch-done:${stored.id}` } }))?.state).toBe("sent");
    expect(await MailMessage.count({ where: { subject: "Batch screened: two.yaml" } })).toBe(1);
  });

  it("is not sent when the owner turned it off on My account", async () => {
    const { PATCH } = await import("@/app/api/account/route");
    const res = await PATCH(await request("PATCH", "/api/account", { user: users.researcher, body: { notifyBatchDone: false } }), noParams);
    expect((await res.json()).user.notifyBatchDone).toBe(false);
    const stored = await storeYaml(users.researcher, "quiet.yaml", kdvSweep("mail-quiet", 1, 7));
    await screenWith(["reducible"], true);
    const { OutgoingMail, Batch } = await import("@/models");
    expect((await Batch.findByPk(stored.id))?.state).toBe("done");
    expect(await OutgoingMail.count({ where: { dedupeKey: `batch-done:${stored.id}` } })).toBe(0);
  });

  it("gives up after max_attempts failures", async () => {
    const { enqueueMail, drainOutgoingMail } = await import("@/lib/mail/queue");
    const mail = await enqueueMail({ kind: "test", to: "nobody@wavesieve.test", subject: "x", text: "y" });
    await mail!.update({ maxAttempts: 2 });
    process.env.SMTP_URL = `smtp://127.0.0.1:${await closedPort()}`;
    let now = Date.now();
    expect((await drainOutgoingMail({ now: new Date(now) })).retrying).toBe(1);
    now += 3_600_001;
    expect((await drainOutgoingMail({ now: new Date(now) })).failed).toBe(1);
    await mail!.reload();
    expect(mail).toMatchObject({ state: "failed", attempts: 2 });
    process.env.SMTP_URL = `smtp://127.0.0.1:${(smtp!.server.address() as net.AddressInfo).port}`;
  });
});

describe("curators' daily digest", () => {
  it("lists new candidates and changed verdicts to curators who want it, once", async () => {
    const { queueDailyDigest } = await import("@/lib/mail/notifications");
    const { drainOutgoingMail } = await import("@/lib/mail/queue");
    const { RegistryEntry, VerdictChange, FamilyVariant, MailMessage } = await import("@/models");
    const entry = await RegistryEntry.findOne({ where: { slug: "mail-three" } });
    const variant = await FamilyVariant.findOne({ where: { familyId: entry!.familyId, variantIndex: 1 } });
    await VerdictChange.create({
      entryId: entry!.id, variantId: variant!.id, oldEngine: "0.0.1", newEngine: "0.1.0",
      oldVerdicts: JSON.stringify({ reducibility: "reducible", painleve: "passes", agreement: "agree" }),
      newVerdicts: JSON.stringify({ reducibility: "not-reducible", painleve: "passes", agreement: "agree" }),
    });
    const pause = () => new Promise((r) => setTimeout(r, 20));
    await pause();
    const now = new Date();
    const result = await queueDailyDigest(now);
    expect(result).toMatchObject({ candidates: 3, changes: 1, mails: 2 }); // three families stored above; curator + admin
    expect((await drainOutgoingMail({ now })).sent).toBe(2);
    const digest = await MailMessage.findOne({ where: { toAddresses: users.curator.email } });
    expect(digest?.subject).toMatch(/3 new candidates, 1 changed verdicts/);
    expect(digest?.textBody).toContain("mail-three");
    expect(digest?.textBody).toContain("mail-three #1 (engine 0.0.1 → 0.1.0): reducibility reducible → not-reducible");

    // Nothing new since: no mail. Then the admin opts out and a new candidate arrives.
    await pause();
    expect((await queueDailyDigest()).mails).toBe(0);
    const { PATCH } = await import("@/app/api/account/route");
    await PATCH(await request("PATCH", "/api/account", { user: users.admin, body: { notifyDigest: false } }), noParams);
    await storeYaml(users.researcher, "late.yaml", kdvSweep("mail-late", 1, 11));
    await pause();
    const next = await queueDailyDigest();
    expect(next).toMatchObject({ candidates: 1, changes: 0, mails: 1 });
  });
});
