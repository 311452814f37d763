/** The request path, set by proxy.ts on every page request (the not-found and forbidden pages have no params). */
export const REQUEST_PATH_HEADER = 'x-setwell-path';
