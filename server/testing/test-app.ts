import type { Express } from 'express';
import type { Knex } from 'knex';
import { Pool } from 'pg';
import request from 'supertest';
import bcrypt from 'bcryptjs';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createApp } from '../app';
import { loadConfig, type AppConfig } from '../core/config';
import type { Role } from '../core/roles';
import { createTestDatabase } from './test-database';

export interface TestApp {
  app: Express;
  /** The configuration the app was built with (for a second app on the same database). */
  config: AppConfig;
  knex: Knex;
  /** The test database's own address. */
  url: string;
  uploadDir: string;
  /** The pool the session store reads and writes with. */
  sessionPool: Pool;
  close(): Promise<void>;
}

/** The real app against a fresh real database of its own. */
export async function startTestApp(overrides: Partial<AppConfig> = {}): Promise<TestApp> {
  const db = await createTestDatabase();
  const uploadDir = mkdtempSync(path.join(tmpdir(), 'keepstitch-uploads-'));
  const config: AppConfig = {
    ...loadConfig({
      NODE_ENV: 'test',
      DATABASE_URL: db.url,
      SESSION_SECRET: 'test-secret-'.padEnd(48, 'x'),
      SIGN_IN_LIMIT: '1000',
      SIGN_IN_ADDRESS_LIMIT: '1000',
      WEB_ROOT: '/nonexistent',
      UPLOAD_DIR: uploadDir,
    }),
    ...overrides,
  };
  const sessionPool = new Pool({ connectionString: db.url, max: 3 });
  // As in server/index.ts: an idle connection that PostgreSQL ends (here, the test database dropped at
  // close while a connection still idles) is reported on the pool; without a listener it would crash the run.
  sessionPool.on('error', (err) => {
    if (process.env['TEST_SERVER_LOG']) console.error('Session pool:', err.message);
  });
  const app = createApp({ config, knex: db.knex, sessionPool, log: process.env['TEST_SERVER_LOG'] ? (e) => console.error(e) : () => undefined });
  return {
    app,
    config,
    knex: db.knex,
    url: db.url,
    uploadDir,
    sessionPool,
    async close() {
      await sessionPool.end();
      await db.drop();
      rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}

export const TEST_PASSWORD = 'correct horse battery';

let userCounter = 0;

/** Inserts a user (and, for a client, their client record unless one is given). */
export async function addUser(knex: Knex, role: Role, clientId?: number) {
  userCounter++;
  let linked = clientId ?? null;
  if (role === 'client' && linked === null) {
    const [client] = await knex('clients').insert({ name: `Client ${userCounter}` }).returning('id');
    linked = client.id;
  }
  const [user] = await knex('users')
    .insert({
      email: `${role}${userCounter}@example.test`,
      name: `${role} ${userCounter}`,
      role,
      clientId: linked,
      passwordHash: bcrypt.hashSync(TEST_PASSWORD, 4),
    })
    .returning(['id', 'email', 'clientId']);
  return user as { id: number; email: string; clientId: number | null };
}

function cookieValue(res: request.Response, name: string): string | undefined {
  const raw: unknown = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? raw.map(String) : typeof raw === 'string' ? [raw] : [];
  for (const c of list) {
    const [pair] = c.split(';');
    const eq = pair!.indexOf('=');
    if (pair!.slice(0, eq) === name) return decodeURIComponent(pair!.slice(eq + 1));
  }
  return undefined;
}

/**
 * A cookie-keeping client of the API that sends the CSRF header as the Angular
 * app does: of an app in this process, or of a server's address.
 */
export class ApiAgent {
  readonly agent;
  csrf = '';
  /** The raw session cookie value last set by the server. */
  sessionCookie = '';

  constructor(app: Express | string) {
    this.agent = request.agent(app);
  }

  private keep(res: request.Response): request.Response {
    this.csrf = cookieValue(res, 'XSRF-TOKEN') ?? this.csrf;
    this.sessionCookie = cookieValue(res, 'ks.sid') ?? this.sessionCookie;
    return res;
  }

  /** The headers that make a request of this agent's session, for a request sent some other way. */
  get headers(): Record<string, string> {
    return { Cookie: `ks.sid=${encodeURIComponent(this.sessionCookie)}; XSRF-TOKEN=${encodeURIComponent(this.csrf)}`, 'X-XSRF-TOKEN': this.csrf };
  }

  /** The session id inside the signed session cookie. */
  get sessionId(): string {
    return this.sessionCookie.replace(/^s:/, '').split('.')[0] ?? '';
  }

  async start(): Promise<this> {
    this.keep(await this.agent.get('/api/auth/me'));
    return this;
  }

  async signIn(email: string, password = TEST_PASSWORD): Promise<request.Response> {
    if (!this.csrf) await this.start();
    return this.keep(await this.agent.post('/api/auth/sign-in').set('X-XSRF-TOKEN', this.csrf).send({ email, password }));
  }

  async get(url: string) {
    return this.keep(await this.agent.get(url));
  }

  async send(method: 'post' | 'patch' | 'put' | 'delete', url: string, body?: unknown) {
    const req = this.agent[method](url).set('X-XSRF-TOKEN', this.csrf);
    return this.keep(await (body === undefined ? req : req.send(body as object)));
  }

  post = (url: string, body?: unknown) => this.send('post', url, body);
  patch = (url: string, body?: unknown) => this.send('patch', url, body);
  delete = (url: string) => this.send('delete', url);
}

/** Signs in a new agent as the given user. */
export async function signedIn(app: Express | string, email: string): Promise<ApiAgent> {
  const agent = new ApiAgent(app);
  const res = await agent.signIn(email);
  if (res.status !== 200) throw new Error(`Sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
