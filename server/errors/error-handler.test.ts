import { describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import pino from 'pino';
import { correctiveActionSchema, countersignSchema } from '@shared/schemas/holds';
import { recordSearchSchema } from '@shared/schemas/records';
import { databaseUnreachable, errorHandler } from './error-handler';

// What a client is told when the database cannot be reached, against a plain fault of the server. The errors are
// shaped as Sequelize and the mariadb connector raise them (their names and causes), as tests outside server/db
// may not import the ORM.
const sequelizeError = (name: string, parent: object) =>
  Object.assign(new Error(name), { name, parent, original: parent });
function appThrowing(err: unknown) {
  const app = express();
  app.get('/x', () => {
    throw err;
  });
  app.use(errorHandler(pino({ level: 'silent' })));
  return app;
}

describe('a database that does not answer', () => {
  it('when the connection is refused, then the answer is 503 with Retry-After and words, not a 500', async () => {
    const refused = sequelizeError('SequelizeConnectionRefusedError', { code: 'ECONNREFUSED' });
    const res = await request(appThrowing(refused)).get('/x');
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('5');
    expect(res.body.code).toBe('database_unavailable');
    expect(res.body.message).toMatch(/not answering/);
  });

  it('when a Galera node is not ready or the pool times out, then it counts as unreachable; a bad query does not', () => {
    expect(databaseUnreachable({ name: 'SequelizeDatabaseError', parent: { errno: 1047 } })).toBe(true);
    expect(databaseUnreachable({ name: 'SqlError', code: 'ER_GET_CONNECTION_TIMEOUT' })).toBe(true);
    // A refused connection elsewhere (the photo store, the mail server) is not the records database.
    expect(
      databaseUnreachable(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' })),
    ).toBe(false);
    const syntax = sequelizeError('SequelizeDatabaseError', { errno: 1064, code: 'ER_PARSE_ERROR' });
    expect(databaseUnreachable(syntax)).toBe(false);
    expect(databaseUnreachable(new Error('boom'))).toBe(false);
  });

  it('when the server fails for another reason, then it is still a 500 that says nothing was saved', async () => {
    const res = await request(appThrowing(new Error('boom'))).get('/x');
    expect(res.status).toBe(500);
    expect(res.body.code).toBe('internal');
  });
});

// What zod refused, as the server answers it: the schema's own message (a catalogue key) in the asking screen's
// language, the issues in English for a developer.
const refusalOf = (parse: () => unknown) => {
  try {
    parse();
  } catch (err) {
    return err;
  }
  throw new Error('the input was not refused');
};

describe('input a schema refuses', () => {
  const keptWithoutReason = refusalOf(() => countersignSchema.parse({ decision: 'keep', pin: '4821' }));

  it('when a German screen asks, then the message reads in German and the issues in English', async () => {
    const res = await request(appThrowing(keptWithoutReason))
      .get('/x')
      .set('Accept-Language', 'de-DE,de;q=0.9');
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('invalid_input');
    expect(res.body.message).toBe('Geben Sie an, warum die Sperre bleibt.');
    expect(res.body.issues).toEqual([{ path: 'reason', message: 'Say why the hold stays.' }]);
  });

  it('when a screen names no language, then the message reads in English, as before', async () => {
    const res = await request(appThrowing(keptWithoutReason)).get('/x');
    expect(res.body.message).toBe('Say why the hold stays.');
    const backwards = refusalOf(() => recordSearchSchema.parse({ from: '2026-02-01', to: '2026-01-01' }));
    expect((await request(appThrowing(backwards)).get('/x')).body.message).toBe(
      'The start date is after the end date.',
    );
  });

  it('when the message names a figure, then a German screen reads it with the figure, and the issues in English', async () => {
    const tooLong = refusalOf(() => correctiveActionSchema.parse({ text: 'x'.repeat(2001), pin: '4821' }));
    const res = await request(appThrowing(tooLong)).get('/x').set('Accept-Language', 'de');
    expect(res.body.message).toBe('Eine Abhilfemaßnahme hat höchstens 2000 Zeichen.');
    expect(res.body.issues).toEqual([
      { path: 'text', message: 'A corrective action is at most 2000 characters.' },
    ]);
  });

  it('when zod refuses in its own words, then they stay as zod writes them, in any language', async () => {
    const wrongType = refusalOf(() => countersignSchema.parse({ decision: 'keep', reason: 7, pin: '4821' }));
    const res = await request(appThrowing(wrongType)).get('/x').set('Accept-Language', 'de');
    expect(res.body.message).toMatch(/^reason: Invalid input: expected string/);
    expect(res.body.issues[0].message).toMatch(/^Invalid input: expected string/);
  });
});
