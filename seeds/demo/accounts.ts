/**
 * The demo scenario's sign-ins: an invented studio, its owner, one workroom
 * assistant and two clients with portal sign-ins. Printed by `npm start` and
 * used by the end-to-end tests. Demo only: never reuse these passwords.
 */
export const DEMO_STUDIO = 'Larkspur Bobbin Room';

export const DEMO_ACCOUNTS = {
  owner: { email: 'maker@keepstitch.test', password: 'demo-owner-pass', name: 'Maren Oakhollow' },
  workroom: { email: 'workroom@keepstitch.test', password: 'demo-workroom-pass', name: 'Tobin Fennimore' },
  clientA: { email: 'rosalind@keepstitch.test', password: 'demo-client-pass', name: 'Rosalind Achterwell' },
  clientB: { email: 'callum@keepstitch.test', password: 'demo-client-pass', name: 'Callum Dewberry' },
} as const;
