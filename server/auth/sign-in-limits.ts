import { createHmac, randomBytes } from 'node:crypto';
import { setTimeout as sleep } from 'node:timers/promises';
import type { CookieOptions, Request, Response } from 'express';
import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '../core/app-error';

/** The signed cookie of a browser that has signed in before (path-limited to the sign-in routes). */
export const KNOWN_BROWSER_COOKIE = 'ks.known';
const KNOWN_BROWSER_DAYS = 180;
/** Accounts one browser is remembered for (a shared studio computer). */
const KNOWN_ACCOUNTS_PER_BROWSER = 8;
/** An address past this many times its limit is refused outright, not only slowed. */
export const ADDRESS_REFUSE_FACTOR = 10;

/**
 * The key cookie-parser signs cookies with: made from the session secret but
 * not equal to it, so a signed cookie can never pass as a session cookie.
 */
export function signedCookieSecret(sessionSecret: string): string {
  return createHmac('sha256', sessionSecret).update('keepstitch signed cookies').digest('base64url');
}

export interface SignInLimitOptions {
  /** The pool the counters are kept with (table sign_in_limits, made by a migration). */
  pool: Pool;
  /** Names accounts in the known-browser cookie without their e-mail (cookie-parser signs the cookie). */
  secret: string;
  secureCookies: boolean;
  accountLimit: number;
  addressLimit: number;
  windowMs: number;
  delayMs: number;
}

/**
 * Limits on guessing passwords, kept in PostgreSQL so every app process and
 * restart sees the same counts. Only failed attempts count: an attempt takes a
 * point before its password is checked (so parallel guesses cannot slip past)
 * and a right password gives it back.
 *
 * - Per account: `accountLimit` failed attempts at one account, from anywhere,
 *   per window; then that account is refused (429) until the window ends.
 *   This is what stops guessing at one account from many addresses.
 * - Per address: past `addressLimit` failed attempts from one address each
 *   further attempt waits `delayMs` before its password is checked. A studio's
 *   shared Wi-Fi or a proxy puts many people behind one address, so one
 *   person's (or one attacker's) mistakes only slow the others down; a right
 *   password is still accepted. Past ADDRESS_REFUSE_FACTOR times the limit the
 *   address is refused, so one address cannot spray guesses over every account.
 * - A known browser: a successful sign-in leaves a signed cookie saying this
 *   browser signed in to this account. Its attempts at that account skip the
 *   account and address limits above (an attacker elsewhere cannot lock its
 *   owner out) and have their own limit of `accountLimit` failures per window.
 */
export class SignInLimits {
  private readonly accounts: RateLimiterPostgres;
  private readonly addresses: RateLimiterPostgres;
  private readonly browsers: RateLimiterPostgres;
  private readonly linkAddresses: RateLimiterPostgres;
  private readonly linkAccounts: RateLimiterPostgres;

  constructor(private readonly options: SignInLimitOptions) {
    const limiter = (keyPrefix: string, points: number, clearExpiredByTimeout: boolean) =>
      new RateLimiterPostgres({
        storeClient: options.pool,
        storeType: 'pool',
        tableName: 'sign_in_limits',
        tableCreated: true,
        keyPrefix,
        points,
        duration: options.windowMs / 1000,
        // Every five minutes, rows whose window ended an hour ago are deleted: all kinds at once, so once is enough.
        clearExpiredByTimeout,
      });
    this.accounts = limiter('account', options.accountLimit, true);
    this.addresses = limiter('address', options.addressLimit * ADDRESS_REFUSE_FACTOR, false);
    this.browsers = limiter('browser', options.accountLimit, false);
    this.linkAddresses = limiter('link-address', options.addressLimit, false);
    this.linkAccounts = limiter('link-account', options.accountLimit, false);
  }

  /**
   * Runs `check` (the password check) within the limits for this e-mail from
   * this request's address and browser; refuses with 429 when a limit is used
   * up. A right password (a truthy answer) clears the account's failures and
   * marks the browser as known for the account.
   */
  async signIn<T>(req: Request, res: Response, email: string, check: () => Promise<T | false>): Promise<T | false> {
    const account = this.accountName(email);
    const known = this.knownBrowser(req);
    if (known?.accounts.includes(account)) {
      const key = `${known.id}:${account}`;
      await this.take(this.browsers, key, 'Too many wrong passwords for this account from this browser.');
      const user = await check();
      if (user) {
        await this.browsers.delete(key);
        this.rememberBrowser(req, res, account);
      }
      return user;
    }

    const address = req.ip ?? 'unknown';
    const fromAddress = await this.take(this.addresses, address, 'Too many sign-in attempts from here.');
    try {
      await this.take(this.accounts, account, 'Too many wrong passwords for this account.', 'or sign in from a browser you have signed in with before');
    } catch (err) {
      await this.addresses.reward(address);
      throw err;
    }
    if (fromAddress.consumedPoints > this.options.addressLimit && this.options.delayMs > 0) await sleep(this.options.delayMs);
    const user = await check();
    if (user) {
      await Promise.all([this.addresses.reward(address), this.accounts.delete(account)]);
      this.rememberBrowser(req, res, account);
    }
    return user;
  }

  /**
   * Runs `check` (a password change, which checks the current password) within
   * the signed-in user's own limit, so a left-open session cannot be used to
   * guess the password. `wrong` tells whether an error was the wrong password.
   */
  async checkCurrentPassword<T>(userId: number, check: () => Promise<T>, wrong: (err: unknown) => boolean): Promise<T> {
    const key = `password:${userId}`;
    await this.take(this.accounts, key, 'Too many wrong current passwords.');
    try {
      const done = await check();
      await this.accounts.delete(key);
      return done;
    } catch (err) {
      if (!wrong(err)) await this.accounts.reward(key);
      throw err;
    }
  }

  /**
   * Runs a "forgot password" request within its limits: `addressLimit`
   * requests from one address and `accountLimit` for one e-mail per window.
   * The e-mail's counter is kept whether or not it has a sign-in, so a refusal
   * says nothing about the address.
   */
  async resetRequest<T>(req: Request, email: string, run: () => Promise<T>): Promise<T> {
    const address = req.ip ?? 'unknown';
    await this.take(this.linkAddresses, address, 'Too many requests for a new password from here.');
    await this.take(this.linkAccounts, `reset:${this.accountName(email)}`, 'Too many requests for a new password for this e-mail address.');
    return run();
  }

  /**
   * Runs the use of a password link within its address's limit: only links
   * that fail (unknown, used or old) count, so guessing at tokens is refused.
   */
  async useLink<T>(req: Request, run: () => Promise<T>): Promise<T> {
    const address = req.ip ?? 'unknown';
    await this.take(this.linkAddresses, address, 'Too many tries with password links from here.');
    try {
      const done = await run();
      await this.linkAddresses.reward(address);
      return done;
    } catch (err) {
      if (!(err instanceof AppError && err.code === 'bad_link')) await this.linkAddresses.reward(address);
      throw err;
    }
  }

  /** Takes one point from a counter, or refuses with 429 and the wait when none is left. */
  private async take(limiter: RateLimiterPostgres, key: string, what: string, orElse?: string): Promise<RateLimiterRes> {
    try {
      return await limiter.consume(key);
    } catch (err) {
      if (!(err instanceof RateLimiterRes)) throw err;
      const minutes = Math.max(1, Math.ceil(err.msBeforeNext / 60_000));
      throw new AppError(
        429,
        'rate_limited',
        `${what} Please wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again${orElse ? `, ${orElse}` : ''}.`,
      );
    }
  }

  /** An account as the known-browser cookie names it: a keyed hash of its e-mail, never the e-mail itself. */
  private accountName(email: string): string {
    return createHmac('sha256', this.options.secret).update(`sign-in:${email.trim().toLowerCase()}`).digest('base64url').slice(0, 22);
  }

  private knownBrowser(req: Request): { id: string; accounts: string[] } | undefined {
    const value: unknown = req.signedCookies?.[KNOWN_BROWSER_COOKIE];
    if (typeof value !== 'string') return undefined;
    const [id, list] = value.split('.');
    if (!id || !list) return undefined;
    return { id, accounts: list.split(',') };
  }

  private rememberBrowser(req: Request, res: Response, account: string): void {
    const known = this.knownBrowser(req);
    const id = known?.id ?? randomBytes(12).toString('base64url');
    const accounts = [account, ...(known?.accounts ?? []).filter((a) => a !== account)].slice(0, KNOWN_ACCOUNTS_PER_BROWSER);
    res.cookie(KNOWN_BROWSER_COOKIE, `${id}.${accounts.join(',')}`, this.knownCookieOptions());
  }

  private knownCookieOptions(): CookieOptions {
    return {
      signed: true,
      httpOnly: true,
      sameSite: 'lax',
      secure: this.options.secureCookies,
      path: '/api/auth',
      maxAge: KNOWN_BROWSER_DAYS * 24 * 3600 * 1000,
    };
  }
}
