import {
  ENDPOINTS,
  type Endpoint,
  type UsageEventFilter,
  type UsageSummaryFilter,
} from './api/usage';

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const STATUS = /^[1-5]\d\d$/;

function validDay(value: string | null): value is string {
  if (!value || !DAY.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

/** The filters the URL holds that the page can use; the rest are listed by `ignoredParams`. */
function readParams(params: URLSearchParams) {
  const endpoint = params.get('endpoint');
  const status = params.get('status');
  const outcome = params.get('outcome');
  let from = params.get('from');
  let to = params.get('to');
  if (!validDay(from)) from = null;
  if (!validDay(to)) to = null;
  // A range that ends before it starts is dropped whole (ignoredParams says why).
  if (from && to && from > to) from = to = null;
  return {
    endpoint:
      endpoint && (ENDPOINTS as readonly string[]).includes(endpoint)
        ? (endpoint as Endpoint)
        : undefined,
    status: status && STATUS.test(status) ? Number(status) : undefined,
    outcome: outcome === 'ok' || outcome === 'error' ? (outcome as 'ok' | 'error') : undefined,
    keyId: params.get('keyId') || undefined,
    from: from ?? undefined,
    to: to ?? undefined,
  };
}

/** Drop undefined values, so query keys and URLs stay short. */
function defined<T extends object>(value: T): T {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as T;
}

/** The events filter from the URL; unknown or malformed values are dropped, not sent. */
export function filterFromParams(params: URLSearchParams, pageSize = 50): UsageEventFilter {
  const p = readParams(params);
  return defined({
    limit: pageSize,
    endpoint: p.endpoint,
    status: p.status,
    outcome: p.outcome,
    keyId: p.keyId,
    from: p.from,
    to: p.to === undefined ? undefined : nextDay(p.to),
    cursor: params.get('cursor') || undefined,
  });
}

/** The summary's filter from the URL: inclusive UTC days (the server defaults to this month). */
export function summaryFromParams(params: URLSearchParams): UsageSummaryFilter {
  const p = readParams(params);
  return defined({
    from: p.from,
    to: p.to,
    endpoint: p.endpoint,
    status: p.status,
    outcome: p.outcome,
    keyId: p.keyId,
  });
}

/** Sentences for URL filters the page left out, so a shared link never filters silently wrong. */
export function ignoredParams(params: URLSearchParams): string[] {
  const out: string[] = [];
  const endpoint = params.get('endpoint');
  if (endpoint && !(ENDPOINTS as readonly string[]).includes(endpoint))
    out.push(`endpoint “${endpoint}” is not one of ours`);
  const status = params.get('status');
  if (status && !STATUS.test(status)) out.push(`status “${status}” is not an HTTP status`);
  const outcome = params.get('outcome');
  if (outcome && outcome !== 'ok' && outcome !== 'error')
    out.push(`outcome “${outcome}” is neither ok nor error`);
  const from = params.get('from');
  const to = params.get('to');
  if (from && !validDay(from)) out.push(`from “${from}” is not a YYYY-MM-DD day`);
  if (to && !validDay(to)) out.push(`to “${to}” is not a YYYY-MM-DD day`);
  if (validDay(from) && validDay(to) && from > to)
    out.push(`the range ${from} to ${to} ends before it starts`);
  return out;
}

/** The form shows an inclusive "to" day; the API's `to` is exclusive, so send the day after. */
export function nextDay(day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString().slice(0, 10);
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
