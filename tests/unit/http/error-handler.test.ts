import type { Request, Response } from 'express';
import { QueryFailedError } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { errorHandler } from '../../../backend/src/http/error-handler.js';

function answer(err: unknown): { status: number; body: { error: string } } {
  const out = { status: 0, body: { error: '' } };
  const res = {
    status(code: number) {
      out.status = code;
      return this;
    },
    json(body: { error: string }) {
      out.body = body;
      return this;
    },
  } as unknown as Response;
  errorHandler(err, { log: { error: () => {}, warn: () => {} } } as unknown as Request, res, () => {});
  return out;
}

describe('the error handler', () => {
  it('answers 409 "changed at the same time" when MariaDB chose this request as a deadlock victim (ER_LOCK_DEADLOCK 1213)', () => {
    const deadlock = new QueryFailedError(
      'UPDATE membership …',
      [],
      Object.assign(new Error('Deadlock found when trying to get lock'), { errno: 1213, code: 'ER_LOCK_DEADLOCK' }),
    );
    const out = answer(deadlock);
    expect(out.status).toBe(409);
    expect(out.body.error).toMatch(/same time/);
  });

  it('answers 409 when a lock could not be had in time (ER_LOCK_WAIT_TIMEOUT 1205)', () => {
    const timeout = new QueryFailedError(
      'SELECT … FOR UPDATE',
      [],
      Object.assign(new Error('Lock wait timeout exceeded'), { errno: 1205, code: 'ER_LOCK_WAIT_TIMEOUT' }),
    );
    expect(answer(timeout).status).toBe(409);
  });

  it('answers 500 without detail for any other database failure', () => {
    const other = new QueryFailedError('SELECT', [], Object.assign(new Error('Table is full'), { errno: 1114 }));
    const out = answer(other);
    expect(out.status).toBe(500);
    expect(out.body.error).not.toMatch(/Table/);
  });
});
