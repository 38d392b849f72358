import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { Pool } from 'pg';

const PgStore = connectPgSimple(session);

/** How long a user row read with a session may wait for its request's passport step. */
const USER_ROW_FRESH_MS = 2_000;

export interface SessionStoreOptions {
  pool: Pool;
  /** Remove expired rows every so many seconds; false leaves them (tests). */
  pruneSeconds: number | false;
  /**
   * Idle sessions are extended at most this often. Every request still sends
   * the cookie with a fresh expiry, but the session row is only written when
   * the last write is older than this, instead of on every request.
   */
  touchSeconds: number;
}

/** The signed-in user's row as PostgreSQL gives it (snake_case columns). */
export type UserRow = Record<string, unknown>;

// The user id passport keeps in the session ({ id, since }, server/auth/passport-setup.ts), read only when it is a plain number.
const SESSION_USER_ID = `CASE WHEN s.sess #>> '{passport,user,id}' ~ '^[0-9]{1,9}$' THEN (s.sess #>> '{passport,user,id}')::int END`;

/**
 * Sessions in PostgreSQL, writing the expiry of an unchanged session at most
 * once per `touchSeconds`. A signed-in session is read together with its
 * user's row, so a request needs one query for both; passport takes the row
 * with `takeUser` in the same request.
 */
export class SessionStore extends PgStore {
  /** When each session's row was last written by this process. */
  private readonly written = new Map<string, number>();
  /** User rows read with a session, waiting for that request's passport step. */
  private readonly usersRead = new Map<string, { row: UserRow | null; at: number }>();
  private readonly touchMs: number;
  private readonly pool: Pool;

  constructor({ pool, pruneSeconds, touchSeconds }: SessionStoreOptions) {
    super({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: pruneSeconds });
    this.touchMs = touchSeconds * 1000;
    this.pool = pool;
  }

  override get(sid: string, callback: (err: unknown, session?: session.SessionData | null) => void): void {
    this.pool
      .query<{ sess: unknown; id: number | null } & UserRow>(
        `SELECT s.sess, u.* FROM session s LEFT JOIN users u ON u.id = ${SESSION_USER_ID} WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`,
        [sid, Math.ceil(Date.now() / 1000)],
      )
      .then(
        (answer) => this.loaded(sid, answer.rows[0], callback),
        (err: unknown) => callback(err),
      );
  }

  private loaded(sid: string, found: ({ sess: unknown; id: number | null } & UserRow) | undefined, callback: (err: unknown, session?: session.SessionData | null) => void): void {
    if (!found) return callback(null, null);
    let data: session.SessionData & { passport?: { user?: unknown } };
    try {
      data = typeof found.sess === 'string' ? JSON.parse(found.sess) : (found.sess as session.SessionData);
    } catch {
      // An unreadable session is ended, as connect-pg-simple does.
      return this.destroy(sid, (e) => callback(e, null));
    }
    if (data.passport?.user !== undefined) {
      const { sess: _sess, ...user } = found;
      this.keepUser(sid, found.id === null ? null : user);
    }
    callback(null, data);
  }

  /**
   * The user row read with this session in the same request, once; undefined
   * when there is none waiting (passport then reads the user itself).
   */
  takeUser(sid: string): { row: UserRow | null } | undefined {
    const kept = this.usersRead.get(sid);
    if (!kept) return undefined;
    this.usersRead.delete(sid);
    // A row read for a request that never reached passport is not used later.
    return Date.now() - kept.at < USER_ROW_FRESH_MS ? { row: kept.row } : undefined;
  }

  private keepUser(sid: string, row: UserRow | null): void {
    const now = Date.now();
    this.usersRead.set(sid, { row, at: now });
    if (this.usersRead.size > 1_000) {
      for (const [id, kept] of this.usersRead) if (now - kept.at >= USER_ROW_FRESH_MS) this.usersRead.delete(id);
    }
  }

  override set(sid: string, data: session.SessionData, callback?: (err?: unknown) => void): void {
    super.set(sid, data, (err?: unknown) => {
      if (!err) this.remember(sid);
      callback?.(err);
    });
  }

  override touch(sid: string, data: session.SessionData, callback?: () => void): void {
    const last = this.written.get(sid);
    if (last !== undefined && Date.now() - last < this.touchMs) {
      callback?.();
      return;
    }
    super.touch(sid, data, (...args: unknown[]) => {
      // connect-pg-simple passes an error as the first argument when the write failed.
      if (!args[0]) this.remember(sid);
      (callback as ((...a: unknown[]) => void) | undefined)?.(...args);
    });
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    this.written.delete(sid);
    super.destroy(sid, callback);
  }

  private remember(sid: string): void {
    const now = Date.now();
    this.written.set(sid, now);
    // Forget sessions not seen for a while, so the map stays small.
    if (this.written.size > 10_000) {
      for (const [id, at] of this.written) if (now - at >= this.touchMs) this.written.delete(id);
    }
  }
}
