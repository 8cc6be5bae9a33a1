/** Upload limits, stated on the Submit page and enforced by the API. */
export const MAX_FILES_PER_UPLOAD = 20;
/** Per file; the engine's own limit (spec MAX_FILE_BYTES) is checked again while parsing. */
export const MAX_UPLOAD_FILE_BYTES = 2 * 1024 * 1024;
export const MAX_UPLOAD_TOTAL_BYTES = 8 * 1024 * 1024;
export const MAX_FILE_NAME_LENGTH = 200;
