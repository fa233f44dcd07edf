// Ids from paths and bodies: a malformed id is treated like an unknown one (404), never a 500.
import { DomainError } from '../common/errors/domain-error.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const isUuid = (v: unknown): v is string => typeof v === 'string' && UUID.test(v);

/** 404 problem naming the field that held the unknown id. */
export function notFound(what: string, field: string): DomainError {
  return new DomainError('not_found', `No ${what} with this id in your organisation.`, [
    { field, reason: `is not a ${what} of your organisation` },
  ]);
}

/** Postgres unique violations (23505) become 409 problems naming the field. */
export function isUniqueViolation(e: unknown): boolean {
  return (
    (e as { code?: string; driverError?: { code?: string } })?.driverError?.code === '23505' ||
    (e as { code?: string })?.code === '23505'
  );
}

export function duplicateName(what: string, field = 'name'): DomainError {
  return new DomainError('conflict', `Your organisation already has a ${what} with this name.`, [
    { field, reason: `is already used by another ${what}` },
  ]);
}
