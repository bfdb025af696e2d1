// The one error handler: which failures read as "database down" (503) and which are logged as unexpected (500).
import { describe, expect, it } from 'vitest';
import { ConnectionRefusedError } from 'sequelize';
import { errorHandler } from '../../server/http/error-handler';

function answer(err: unknown) {
  const logged: string[] = [];
  const res = {
    headersSent: false,
    statusCode: 0,
    body: undefined as unknown,
    status(code: number) { this.statusCode = code; return this; },
    json(body: unknown) { this.body = body; return this; },
  };
  errorHandler((msg) => logged.push(msg))(err, {} as never, res as never, () => undefined);
  return { status: res.statusCode, body: res.body as { error: string }, logged };
}

describe('error handler', () => {
  it('answers 503 when the database refuses connections', () => {
    const r = answer(new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), { code: 'ECONNREFUSED' })));
    expect(r.status).toBe(503);
    expect(r.body.error).toBe('service.db-down');
    expect(r.logged).toEqual([]);
  });

  it('logs a refused connection elsewhere (a file store) as unexpected, not as the database', () => {
    const r = answer(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:9'), { code: 'ECONNREFUSED' }));
    expect(r.status).toBe(500);
    expect(r.logged).toEqual(['unexpected error']);
  });
});
