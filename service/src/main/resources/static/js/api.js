// The API client: the key lives in this tab's session storage only (gone when the tab closes).
'use strict';
import { problemDetail } from './fields.js';

const KEY = 'kwanta.key';
export const key = () => sessionStorage.getItem(KEY) || '';
export const setKey = (k) => sessionStorage.setItem(KEY, k);
export const clearKey = () => sessionStorage.removeItem(KEY);

export class ApiError extends Error {
  constructor(status, detail) {
    super(status + (detail ? ': ' + detail : ''));
    this.status = status;
  }
}

function headers(extra) {
  const h = { Accept: 'application/json', ...extra };
  if (key()) h.Authorization = 'Bearer ' + key();
  return h;
}

async function failure(r) {
  let detail = r.statusText;
  try { detail = problemDetail(await r.json()) || detail; } catch (e) { /* not JSON */ }
  return new ApiError(r.status, detail);
}

async function call(method, path, body) {
  const h = headers(body === undefined ? {} : { 'Content-Type': 'application/json' });
  const r = await fetch(path, { method, headers: h, body: body === undefined ? undefined : JSON.stringify(body) });
  if (!r.ok) throw await failure(r);
  return r.status === 204 ? null : r.json();
}

/**
 * A GET asked again with the earlier answer's ETag: { json, tag, at, notModified }. On 304 Not Modified
 * (no body sent) the earlier answer comes back with notModified set; `at` stays the time it was received.
 */
export async function getIfChanged(path, earlier) {
  const h = headers(earlier && earlier.tag ? { 'If-None-Match': earlier.tag } : {});
  const r = await fetch(path, { headers: h, cache: 'no-store' });
  if (r.status === 304 && earlier) return { ...earlier, notModified: true };
  if (!r.ok) throw await failure(r);
  return { json: await r.json(), tag: r.headers.get('ETag'), at: Date.now(), notModified: false };
}

export const get = (path) => call('GET', path);
export const post = (path, body) => call('POST', path, body);
export const put = (path, body) => call('PUT', path, body);
