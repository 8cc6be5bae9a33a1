/** The one authorization module: roles, route-handler guards, page guards, tokens. */
export { ROLES, ROLE_LABELS, hasRole, isRole, type Role } from "./roles";
export { withRole, withAnyone, jsonError, readJson, internalError } from "./api";
export { authOptions } from "./options";
export type { CurrentUser } from "./current-user";
