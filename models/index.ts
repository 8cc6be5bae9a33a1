/** All models, initialised on the process's single connection when this module loads. */
import { getSequelize } from "@/lib/db";
import { initUser, User } from "./user";
import { initAuditEvent, AuditEvent } from "./audit-event";
import { initInvite, Invite } from "./invite";
import { initMailMessage, MailMessage } from "./mail-message";
import { initApiToken, ApiToken } from "./api-token";
import { initBatch, Batch } from "./batch";
import { initFamily, Family, initBatchFamily, BatchFamily, initFamilyVariant, FamilyVariant } from "./family";
import { initScreeningRun, ScreeningRun } from "./screening-run";
import { initRegistryEntry, RegistryEntry, initVerdictChange, VerdictChange } from "./registry-entry";
import { initBatchRun, BatchRun, initOutgoingMail, OutgoingMail, initJobMark, JobMark } from "./queue";

const sequelize = getSequelize();

initUser(sequelize);
initAuditEvent(sequelize);
initInvite(sequelize);
initMailMessage(sequelize);
initApiToken(sequelize);
initBatch(sequelize);
initFamily(sequelize);
initBatchFamily(sequelize);
initFamilyVariant(sequelize);
initScreeningRun(sequelize);
initRegistryEntry(sequelize);
initVerdictChange(sequelize);
initBatchRun(sequelize);
initOutgoingMail(sequelize);
initJobMark(sequelize);

export { sequelize, User, AuditEvent, Invite, MailMessage, ApiToken, Batch, Family, BatchFamily, FamilyVariant, ScreeningRun, RegistryEntry, VerdictChange };
export { BatchRun, OutgoingMail, JobMark };
