import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { Pool } from 'pg';

const PgStore = connectPgSimple(session);

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

/** Sessions in PostgreSQL, writing the expiry of an unchanged session at most once per `touchSeconds`. */
export class SessionStore extends PgStore {
  /** When each session's row was last written by this process. */
  private readonly written = new Map<string, number>();
  private readonly touchMs: number;

  constructor({ pool, pruneSeconds, touchSeconds }: SessionStoreOptions) {
    super({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: pruneSeconds });
    this.touchMs = touchSeconds * 1000;
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
