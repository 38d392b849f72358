// Printed by `npm start` once the server answers.
import { DEMO_ACCOUNTS, DEMO_STUDIO } from '../seeds/demo/accounts';

const port = process.env['PORT'] ?? '4300';
const rows = Object.entries(DEMO_ACCOUNTS).map(([who, a]) => `  ${who.padEnd(9)} ${a.email.padEnd(28)} ${a.password}`);
console.log(
  [
    '',
    `Keepstitch is open at http://127.0.0.1:${port}  (demo studio: ${DEMO_STUDIO})`,
    'Demo sign-ins:',
    ...rows,
    'Press Ctrl-C to stop.',
    '',
  ].join('\n'),
);
