/**
 * A network document that does not fit into one database statement is refused with a 413 that
 * names the sizes and the setting (it used to reach MariaDB and end in a 500). The limit is the
 * database's own max_allowed_packet, asked once per connection pool.
 */
import type { Sequelize } from 'sequelize';
import { assertStorable, maxStatementBytes, statementBytes } from '../../../server/services/db-limits';
import { HttpError } from '../../../server/lib/http-error';

function fakeDb(limit: number) {
  let asked = 0;
  const db = { query: async () => { asked++; return { v: String(limit) }; } } as unknown as Sequelize;
  return { db, asked: () => asked };
}

describe('database statement size', () => {
  test('bytes count UTF-8 and the escapes of the text protocol', () => {
    expect(statementBytes('abc')).toBe(3);
    expect(statementBytes('{"a":"b"}')).toBe(9 + 4); // four quotes, each escaped
    expect(statementBytes('é\\\n')).toBe(2 + 2 + 2);
  });

  test('a document over the limit: 413 naming both sizes and max_allowed_packet', async () => {
    const { db } = fakeDb(1024 * 1024);
    const text = 'x'.repeat(2 * 1024 * 1024);
    const err = await assertStorable(db, text, 'This network (3 depots, 2 lanes)').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(HttpError);
    expect((err as HttpError).status).toBe(413);
    expect((err as HttpError).message).toBe('This network (3 depots, 2 lanes) needs 2.0 MB in the database, but the database accepts 0.9 MB per write (its max_allowed_packet setting). Split the network into regions, or ask your administrator to raise max_allowed_packet to 64 MB.');
  });

  test('a document within the limit passes, and the limit is asked once', async () => {
    const { db, asked } = fakeDb(64 * 1024 * 1024);
    await expect(assertStorable(db, 'x'.repeat(1000), 'This network')).resolves.toBeUndefined();
    await assertStorable(db, 'y', 'This network');
    expect(await maxStatementBytes(db)).toBe(64 * 1024 * 1024);
    expect(asked()).toBe(1);
  });
});
