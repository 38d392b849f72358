/**
 * npm run fault:services — the mail server and the card-payment service
 * stopped and started again under the real server (its own process, against a
 * database of this run's own that scripts/with-fault-db.sh makes). Both fakes
 * (scripts/fakes/) run in this process, so the run can stop them and read what
 * they received.
 *
 * Mail: quotes are sent, the mail server is stopped just as one of them is
 * being delivered, more are sent while it is down, and it is started again.
 * Every mail in the outbox must reach it exactly once (counted by Message-ID),
 * with nothing restarted.
 * Payments: the payment service falls over in the middle of a deposit
 * checkout, and a second checkout is asked for while it is down. Both must be
 * answered 503 with a message saying nothing was charged, leaving no payment
 * row; once it is back the checkout must work and its webhook mark the
 * deposit paid once.
 */
import { startFakePayments } from './fakes/fake-payments';
import { startFakeSmtp } from './fakes/fake-smtp';
import { addCommission } from '../server/testing/fixtures';
import { sendQuote } from '../server/testing/money-fixtures';
import { addUser, signedIn } from '../server/testing/test-app';
import { migratedDatabase, run, serverEnv, sleep, startServer, verdict } from './fault-lib';

const PORT = Number(process.env['FAULT_PORT'] ?? 4465);
const [SMTP_PORT, MAIL_API_PORT, PAYMENTS_PORT] = [4462, 4463, 4464];
const BASE = `http://127.0.0.1:${PORT}`;

async function main(): Promise<void> {
  const env = serverEnv(PORT, { APP_URL: BASE, SMTP_HOST: '127.0.0.1', SMTP_PORT: String(SMTP_PORT), PAYMENTS_API_URL: `http://127.0.0.1:${PAYMENTS_PORT}` });
  const knex = migratedDatabase(env);
  const smtp = await startFakeSmtp({ smtpPort: SMTP_PORT, apiPort: MAIL_API_PORT, quiet: true });
  const payments = await startFakePayments({ port: PAYMENTS_PORT, webhookUrl: `${BASE}/api/payments/webhook`, quiet: true });
  const { email } = await addUser(knex, 'owner');
  const c = await addUser(knex, 'client');
  await knex('clients').where('id', c.clientId!).update({ name: 'Tamsin Verity', email: 'tamsin@post.test' });
  const commissions: number[] = [];
  for (let i = 1; i <= 7; i++) commissions.push(await addCommission(knex, c.clientId!, { title: `Baby clothes quilt ${i}` }));
  const server = await startServer(env);
  const checks: Array<[string, boolean]> = [];
  try {
    const owner = await signedIn(BASE, email);
    const client = await signedIn(BASE, c.email);
    const quotes: number[] = [];
    const send = async (commission: number) => quotes.push((await sendQuote(owner, commission)).id);
    const until = async (done: () => Promise<boolean> | boolean, seconds: number) => {
      for (const end = Date.now() + seconds * 1000; Date.now() < end && !(await done()); ) await sleep(100);
    };

    // Mail: two quotes delivered; the mail server stopped as the third is being delivered; three more sent while it is down.
    await send(commissions[0]!);
    await send(commissions[1]!);
    await until(() => smtp.mails.length >= 2, 10);
    const arriving = smtp.receiving();
    await send(commissions[2]!);
    await arriving;
    const stopping = smtp.stopSmtp();
    const downAt = Date.now();
    for (const commission of commissions.slice(3, 6)) await send(commission);
    await stopping;
    await sleep(Math.max(0, downAt + 6000 - Date.now()));
    const receivedWhileUp = smtp.mails.length;
    const failures = (await knex('outboxMails').whereNotNull('lastError')).map((m) => String(m.lastError));
    await smtp.startSmtp();
    const backAt = Date.now();
    console.log(`\nMail server stopped for ${((backAt - downAt) / 1000).toFixed(1)} s as the mail of the 3rd of 6 quotes was arriving; it had received ${receivedWhileUp} by then`);
    console.log(`  meanwhile ${failures.length} deliveries failed and wait to be retried: ${[...new Set(failures)].join('; ') || 'none'}`);

    // Payments: the service falls over mid-call, then is asked while down; then back.
    const depositQuote = quotes[0]!;
    const checkout = () => client.post(`/api/quotes/${depositQuote}/deposit-checkout`);
    await client.post(`/api/quotes/${depositQuote}/accept`, { name: 'Tamsin Verity' });
    const arrived = payments.hold();
    const during = checkout();
    await arrived;
    await payments.stop();
    const answers = [await during, await checkout()];
    const rowsWhileDown = await knex('payments').where('commissionId', commissions[0]!);
    const listed = await client.get(`/api/commissions/${commissions[0]}/payments`);
    await payments.start();
    const started = await checkout();
    const sessionId = new URL(String(started.body.url ?? 'http://x/none')).pathname.split('/').pop()!;
    const webhook = started.status === 200 ? await payments.pay(sessionId) : 0;
    const rowsAfter = await knex('payments').where('commissionId', commissions[0]!);
    const booked = await knex('stageMoves').where({ commissionId: commissions[0]!, toStage: 'booked' });
    const stage = (await knex('commissions').where('id', commissions[0]!).first()).stage;
    console.log(`\nPayment service cut off mid-checkout, then down: answers ${answers.map((a) => a.status).join(', ')}: "${answers[0]!.body.error?.message}"`);
    console.log(`  payment rows while down: ${rowsWhileDown.length}, listed to the client: ${listed.body.items?.length}`);
    console.log(`  back: checkout ${started.status}, webhook ${webhook}; payment rows ${rowsAfter.map((r) => `${r.kind} ${r.status}`).join(', ')}; commission ${stage}, booked ${booked.length} time(s)`);
    checks.push(
      ['checkout while the payment service fails or is down: 503 saying nothing was charged', answers.every((a) => a.status === 503 && /Nothing was charged/.test(a.body.error?.message ?? ''))],
      ['no payment row written while it was down, none listed', rowsWhileDown.length === 0 && listed.body.items?.length === 0],
      ['checkout works once it is back', started.status === 200 && sessionId.startsWith('cs_test_')],
      ['its webhook marks the deposit paid once and books the commission once', webhook === 200 && rowsAfter.length === 1 && rowsAfter[0].status === 'paid' && rowsAfter[0].checkoutSessionId === sessionId && stage === 'booked' && booked.length === 1],
    );

    // One more quote with the mail server back, then wait for the outbox to empty on its own.
    await send(commissions[6]!);
    const pending = async () => Number((await knex('outboxMails').whereNot('status', 'sent').count({ n: '*' }).first())!['n']);
    await until(async () => (await pending()) === 0, 120);
    const doneAt = Date.now();
    const outbox = await knex('outboxMails').orderBy('id');
    const received = new Map<string, number>();
    for (const m of smtp.mails) received.set(m.messageId ?? '', (received.get(m.messageId ?? '') ?? 0) + 1);
    const once = outbox.filter((m) => m.messageId && received.get(m.messageId) === 1).length;
    const waited = outbox.filter((m) => m.attempts > 1);
    console.log(`\nOutbox: ${outbox.length} mails (${outbox.filter((m) => m.kind === 'quote').length} quotes, ${outbox.filter((m) => m.kind.startsWith('receipt')).length} receipt); ${outbox.filter((m) => m.status === 'sent').length} sent, ${waited.length} of them after a failed attempt`);
    console.log(`  the mail server received ${smtp.mails.length} mails; ${once} of ${outbox.length} outbox Message-IDs exactly once`);
    console.log(`  the last mail delivered ${((doneAt - backAt) / 1000).toFixed(1)} s after the mail server was back (the outbox retries a failed mail after 30 s, then doubles)`);
    checks.push(
      ['every quote sent is in the outbox', outbox.filter((m) => m.kind === 'quote').length === quotes.length],
      ['every outbox mail delivered with the mail server back, nothing restarted', outbox.every((m) => m.status === 'sent')],
      ['each delivered exactly once (by Message-ID), nothing else received', once === outbox.length && smtp.mails.length === outbox.length],
      ['some mails did wait for the mail server', waited.length > 0],
    );
    console.log('');
    verdict(checks);
  } finally {
    await server.stop();
    await Promise.all([smtp.close(), payments.close(), knex.destroy()]);
  }
}

run(main);
