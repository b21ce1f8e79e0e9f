/** Base path of the versioned HTTP API; the server mounts every route below it and the client calls it. */
export const API_PREFIX = '/api/v1';
