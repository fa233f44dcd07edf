import { ENDPOINTS, type Endpoint, type UsageEventFilter } from './api/usage';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** The events filter from the URL; unknown or malformed values are dropped, not sent. */
export function filterFromParams(params: URLSearchParams, pageSize = 50): UsageEventFilter {
  const filter: UsageEventFilter = { limit: String(pageSize) };
  const endpoint = params.get('endpoint');
  if (endpoint && (ENDPOINTS as readonly string[]).includes(endpoint)) {
    filter.endpoint = endpoint as Endpoint;
  }
  const status = params.get('status');
  if (status && /^[1-5]\d\d$/.test(status)) filter.status = status;
  const keyId = params.get('keyId');
  if (keyId) filter.keyId = keyId;
  const from = params.get('from');
  if (from && DAY.test(from)) filter.from = from;
  const to = params.get('to');
  if (to && DAY.test(to)) filter.to = nextDay(to);
  const cursor = params.get('cursor');
  if (cursor) filter.cursor = cursor;
  return filter;
}

/** The form shows an inclusive "to" day; the API's `to` is exclusive, so send the day after. */
export function nextDay(day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString().slice(0, 10);
}

/** The summary's range from the URL (inclusive UTC days; the server defaults to this month). */
export function rangeFromParams(params: URLSearchParams): { from?: string; to?: string } {
  const range: { from?: string; to?: string } = {};
  const from = params.get('from');
  const to = params.get('to');
  if (from && DAY.test(from)) range.from = from;
  if (to && DAY.test(to)) range.to = to;
  return range;
}

/** Every day from `from` to `to` inclusive, so days without calls still get a (zero) bar. */
export function daysBetween(from: string, to: string, max = 400): string[] {
  const days: string[] = [];
  const date = new Date(`${from}T00:00:00Z`);
  const end = new Date(`${to}T00:00:00Z`);
  while (date <= end && days.length < max) {
    days.push(date.toISOString().slice(0, 10));
    date.setUTCDate(date.getUTCDate() + 1);
  }
  return days;
}
