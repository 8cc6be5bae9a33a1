/** All models, initialised on the process's single connection when this module loads. */
import { getSequelize } from "@/lib/db";
import { initUser, User } from "./user";
import { initAuditEvent, AuditEvent } from "./audit-event";
import { initInvite, Invite } from "./invite";
import { initMailMessage, MailMessage } from "./mail-message";
import { initApiToken, ApiToken } from "./api-token";

const sequelize = getSequelize();

initUser(sequelize);
initAuditEvent(sequelize);
initInvite(sequelize);
initMailMessage(sequelize);
initApiToken(sequelize);

export { sequelize, User, AuditEvent, Invite, MailMessage, ApiToken };
