// The saved-setups lists: all of them newest first (optional search, keyset pagination), and the
// upcoming ones soonest first. Both read only the summary columns and the plan's window, not the
// whole plan, so long lists stay cheap.
import type { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import { isUuid } from '../gear/ids.js';
import type { SavedSetupSummaryDto } from './dto/setup.dto.js';

interface Row {
  id: string;
  name: string;
  venue: string | null;
  notes: string | null;
  date: string;
  time_zone: string;
  window_start: string | null;
  window_end: string | null;
  author_id: string | null;
  author_name: string | null;
  created_at: Date;
  updated_at: Date;
  cursor_ts: string;
}

/** Cursors carry the last row's exact created_at (microseconds, as PostgreSQL prints it) and id. */
function encodeCursor(row: Row): string {
  return Buffer.from(`${row.cursor_ts}|${row.id}`, 'utf8').toString('base64url');
}

function decodeCursor(cursor: string): { ts: string; id: string } {
  const [ts, id] = Buffer.from(cursor, 'base64url').toString('utf8').split('|');
  if (
    ts &&
    isUuid(id) &&
    /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?$/.test(ts)
  ) {
    return { ts, id };
  }
  throw new DomainError('invalid_input', 'The cursor is not valid.', [
    { field: 'cursor', reason: 'is not a cursor this API returned' },
  ]);
}

const SUMMARY_COLUMNS = `s.id, s.name, s.venue, s.notes, s.shoot_date::text AS date, s.time_zone,
  s.plan->'window'->>'start' AS window_start, s.plan->'window'->>'end' AS window_end,
  u.id AS author_id, u.name AS author_name, s.created_at, s.updated_at,
  s.created_at::text AS cursor_ts`;

function toSummary(r: Row): SavedSetupSummaryDto {
  return {
    id: r.id,
    name: r.name,
    venue: r.venue,
    notes: r.notes,
    date: r.date,
    timeZone: r.time_zone,
    windowStart: r.window_start,
    windowEnd: r.window_end,
    createdBy: r.author_id ? { id: r.author_id, name: r.author_name ?? '' } : null,
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

/** `%`, `_` and `\` in a search are literal characters, not LIKE wildcards. */
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export async function listSetups(
  ds: DataSource,
  organizationId: string,
  opts: { limit: number; cursor?: string; q?: string },
): Promise<{ data: SavedSetupSummaryDto[]; nextCursor: string | null }> {
  const after = opts.cursor ? decodeCursor(opts.cursor) : null;
  const q = opts.q?.trim() ? likePattern(opts.q.trim()) : null;
  const rows: Row[] = await ds.query(
    `SELECT ${SUMMARY_COLUMNS}
       FROM setups s LEFT JOIN users u ON u.id = s.created_by_user_id
      WHERE s.organization_id = $1
        AND ($2::text IS NULL OR s.name ILIKE $2 OR s.venue ILIKE $2 OR s.notes ILIKE $2)
        AND ($3::timestamptz IS NULL OR (s.created_at, s.id) < ($3::timestamptz, $4::uuid))
      ORDER BY s.created_at DESC, s.id DESC
      LIMIT $5`,
    [organizationId, q, after?.ts ?? null, after?.id ?? null, opts.limit + 1],
  );
  const more = rows.length > opts.limit;
  const page = more ? rows.slice(0, opts.limit) : rows;
  const last = page[page.length - 1];
  return {
    data: page.map(toSummary),
    nextCursor: more && last ? encodeCursor(last) : null,
  };
}

/**
 * The next shoots, soonest first: setups whose shooting window has not ended at `now`. A setup
 * with no window (the sun never sets or never rises that day) counts until its local date ends.
 */
export async function listUpcomingSetups(
  ds: DataSource,
  organizationId: string,
  limit: number,
  now: Date = new Date(),
): Promise<SavedSetupSummaryDto[]> {
  const rows: Row[] = await ds.query(
    `SELECT ${SUMMARY_COLUMNS}
       FROM setups s LEFT JOIN users u ON u.id = s.created_by_user_id
      WHERE s.organization_id = $1
        AND COALESCE((s.plan->'window'->>'end')::timestamptz >= $2,
                     s.shoot_date >= ($2::timestamptz AT TIME ZONE s.time_zone)::date)
      ORDER BY COALESCE((s.plan->'window'->>'start')::timestamptz,
                        s.shoot_date::timestamp AT TIME ZONE s.time_zone), s.id
      LIMIT $3`,
    [organizationId, now.toISOString(), limit],
  );
  return rows.map(toSummary);
}
