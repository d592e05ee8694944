import type { Sequelize } from 'sequelize';
import { HttpError } from '../lib/http-error';

/**
 * The database's limit on one statement (`max_allowed_packet`), asked once per connection pool.
 * A network version is one JSON document in one INSERT; past this limit MariaDB refuses the
 * statement and the save used to end in a 500. Refusing it here turns that into a 413 that says
 * why. Our own MariaDB starts with 64 MB (server/scripts/services.sh), which holds every network
 * inside the import limits; a database set lower refuses the largest ones with this message.
 */
const cache = new WeakMap<Sequelize, Promise<number>>();

export function maxStatementBytes(db: Sequelize): Promise<number> {
  let p = cache.get(db);
  if (!p) {
    p = db.query('SELECT @@max_allowed_packet AS v', { plain: true }).then((row) => Number((row as { v: unknown } | null)?.v) || 16 * 1024 * 1024);
    p.catch(() => cache.delete(db)); // ask again next time (database not up yet)
    cache.set(db, p);
  }
  return p;
}

/**
 * Bytes the text takes inside a statement: UTF-8 plus the escapes of the driver's text protocol
 * (quote, backslash, NUL, newline, CR, Ctrl-Z each gain one byte).
 */
export function statementBytes(text: string): number {
  let escapes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 34 || c === 39 || c === 92 || c === 0 || c === 10 || c === 13 || c === 26) escapes++;
  }
  return Buffer.byteLength(text, 'utf8') + escapes;
}

/** Room left in a statement for everything but the big value (SQL text, other columns). */
const OVERHEAD = 64 * 1024;

/** 413 naming the size and the database setting when `text` cannot go into one statement. */
export async function assertStorable(db: Sequelize, text: string, what: string): Promise<void> {
  const limit = await maxStatementBytes(db);
  const bytes = statementBytes(text);
  if (bytes + OVERHEAD <= limit) return;
  const mb = (x: number) => (x / (1024 * 1024)).toFixed(1);
  throw new HttpError(
    413,
    `${what} needs ${mb(bytes)} MB in the database, but the database accepts ${mb(limit - OVERHEAD)} MB per write (its max_allowed_packet setting). Split the network into regions, or ask your administrator to raise max_allowed_packet to 64 MB.`,
    { code: 'too_large_to_store' },
  );
}
