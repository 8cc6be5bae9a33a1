/** Engine version, recorded on every report; bump it when any verdict-relevant code changes. */
export const ENGINE_VERSION = "0.1.0";
