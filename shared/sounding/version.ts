/**
 * Version of the sounding engine's results. Bump it whenever any analysis value can change
 * (method, constant, convention): the server caches analyses by it.
 */
export const ENGINE_VERSION = '2.2.0';
