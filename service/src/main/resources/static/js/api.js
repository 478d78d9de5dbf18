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

async function call(method, path, body) {
  const headers = { Accept: 'application/json' };
  if (key()) headers.Authorization = 'Bearer ' + key();
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  const r = await fetch(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
  if (!r.ok) {
    let detail = r.statusText;
    try { detail = problemDetail(await r.json()) || detail; } catch (e) { /* not JSON */ }
    throw new ApiError(r.status, detail);
  }
  return r.status === 204 ? null : r.json();
}

export const get = (path) => call('GET', path);
export const post = (path, body) => call('POST', path, body);
export const put = (path, body) => call('PUT', path, body);
