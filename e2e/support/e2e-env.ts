import path from 'node:path';

export const ROOT = path.resolve(__dirname, '..', '..');
export const E2E_PORT = Number(process.env['E2E_PORT'] ?? 4311);
export const BASE_URL = `http://127.0.0.1:${E2E_PORT}`;
export const SCREENSHOT_DIR = path.join(ROOT, 'test-output', 'screenshots');
