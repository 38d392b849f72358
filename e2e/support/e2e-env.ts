import path from 'node:path';

export const ROOT = path.resolve(__dirname, '..', '..');
export const E2E_PORT = Number(process.env['E2E_PORT'] ?? 4311);
/** The end-to-end database, dropped and made afresh by each run. */
export const E2E_DB = /^[a-z_][a-z0-9_]*$/.test(process.env['E2E_DB'] ?? '') ? process.env['E2E_DB']! : 'keepstitch_e2e';
export const BASE_URL = `http://127.0.0.1:${E2E_PORT}`;
export const SCREENSHOT_DIR = path.join(ROOT, 'test-output', 'screenshots');
export const FAKE_SMTP_PORT = Number(process.env['E2E_SMTP_PORT'] ?? 4325);
export const FAKE_MAIL_API_PORT = Number(process.env['E2E_MAIL_API_PORT'] ?? 4326);
export const FAKE_PAYMENTS_PORT = Number(process.env['E2E_PAYMENTS_PORT'] ?? 4327);
export const FAKE_MAIL_API = `http://127.0.0.1:${FAKE_MAIL_API_PORT}`;
export const FAKE_PAYMENTS_URL = `http://127.0.0.1:${FAKE_PAYMENTS_PORT}`;
