/**
 * Which errors count as "the database cannot be reached" (answered 503, retryable) rather than a
 * fault of ours (500). SQLSTATE classes from the PostgreSQL manual, appendix "PostgreSQL Error
 * Codes"; the driver and pool messages as the pg and knex packages word them (from their source).
 */
import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailable } from '@/lib/api/errors';

const withCode = (code: string, message = 'x') => Object.assign(new Error(message), { code });

describe('isDatabaseUnavailable', () => {
  it('socket errors of the connection', () => {
    for (const code of ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND']) {
      expect(isDatabaseUnavailable(withCode(code)), code).toBe(true);
    }
  });

  it('SQLSTATE class 08 (connection exception) and 57P01-57P03 (shutdown, crash, cannot connect now)', () => {
    for (const code of ['08000', '08003', '08006', '08001', '08P01', '57P01', '57P02', '57P03']) {
      expect(isDatabaseUnavailable(withCode(code)), code).toBe(true);
    }
  });

  it('pool and driver messages: acquire timeout, a connection lost mid-transaction, a failed rollback', () => {
    expect(isDatabaseUnavailable(Object.assign(new Error('Knex: Timeout acquiring a connection.'), { name: 'KnexTimeoutError' }))).toBe(true);
    expect(isDatabaseUnavailable(new Error('Connection terminated unexpectedly'))).toBe(true);
    expect(isDatabaseUnavailable(new Error('Connection ended unexpectedly'))).toBe(true);
    expect(isDatabaseUnavailable(new Error('ROLLBACK - Client has encountered a connection error and is not queryable'))).toBe(true);
    expect(isDatabaseUnavailable(withCode('57P03', 'the database system is starting up'))).toBe(true);
  });

  it('looks inside cause and AggregateError', () => {
    expect(isDatabaseUnavailable(new Error('wrapped', { cause: withCode('ECONNREFUSED') }))).toBe(true);
    expect(isDatabaseUnavailable(new AggregateError([withCode('ECONNREFUSED'), withCode('ECONNREFUSED')], ''))).toBe(true);
  });

  it('not for errors of the query itself or of the program', () => {
    for (const code of ['23505', '22P02', '42P01', '40001', '57014']) expect(isDatabaseUnavailable(withCode(code)), code).toBe(false);
    expect(isDatabaseUnavailable(new TypeError('x is undefined'))).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
    expect(isDatabaseUnavailable('ECONNREFUSED')).toBe(false);
  });
});
