import type { Knex } from 'knex';
import bcrypt from 'bcryptjs';
import { DEMO_ACCOUNTS } from './demo/accounts';

/**
 * The demo scenario: an invented studio in an invented town, four invented
 * clients (two with portal sign-ins). Phone numbers are from the range kept
 * for fiction (07700 900xxx); e-mail domains end in the reserved ".test".
 * Re-running the seed resets what it inserts.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.raw('TRUNCATE session, users, clients, stock_fabrics, outbox_mails, webhook_events RESTART IDENTITY CASCADE');

  const clients = await knex('clients')
    .insert([
      {
        name: DEMO_ACCOUNTS.clientA.name,
        email: 'rosalind.achterwell@post.test',
        phone: '07700 900412',
        address: '14 Weaver Row\nThistlecombe',
        notes: 'Memory quilt from her late husband\u2019s work shirts. Prefers e-mail.',
        portfolio_consent: true,
      },
      {
        name: DEMO_ACCOUNTS.clientB.name,
        email: 'callum.dewberry@post.test',
        phone: '+44 7700 900733',
        address: 'Flat 2, The Old Dye House\nMill Lane\nThistlecombe',
        notes: 'Cushions for his two daughters from their grandmother\u2019s dresses.',
        portfolio_consent: false,
      },
      {
        name: 'Ines Valcourt-Reyne',
        email: 'ines.vr@post.test',
        phone: '07700 900158',
        address: '3 Selvedge Close\nBramblecote',
        notes: 'Baby quilt enquiry for a first grandchild, due in spring.',
        portfolio_consent: false,
      },
      {
        name: 'Priya Sundersby',
        email: null,
        phone: '07700 900947',
        address: null,
        notes: 'Asked by phone about a wall hanging from school uniforms.',
        portfolio_consent: false,
      },
    ])
    .returning(['id', 'name']);

  const idOf = (name: string) => clients.find((c: { name: string }) => c.name === name)!.id as number;
  const hash = (password: string) => bcrypt.hashSync(password, 10);

  await knex('users').insert([
    { email: DEMO_ACCOUNTS.owner.email, name: DEMO_ACCOUNTS.owner.name, role: 'owner', password_hash: hash(DEMO_ACCOUNTS.owner.password) },
    { email: DEMO_ACCOUNTS.workroom.email, name: DEMO_ACCOUNTS.workroom.name, role: 'workroom', password_hash: hash(DEMO_ACCOUNTS.workroom.password) },
    {
      email: DEMO_ACCOUNTS.clientA.email,
      name: DEMO_ACCOUNTS.clientA.name,
      role: 'client',
      client_id: idOf(DEMO_ACCOUNTS.clientA.name),
      password_hash: hash(DEMO_ACCOUNTS.clientA.password),
    },
    {
      email: DEMO_ACCOUNTS.clientB.email,
      name: DEMO_ACCOUNTS.clientB.name,
      role: 'client',
      client_id: idOf(DEMO_ACCOUNTS.clientB.name),
      password_hash: hash(DEMO_ACCOUNTS.clientB.password),
    },
  ]);
}
