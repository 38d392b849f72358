import { createTransport } from './mailer';
import { deliverDue, retryDelayMs } from './outbox-service';
import { loadConfig } from '../core/config';
import { startFakeSmtp, type FakeSmtp } from '../../scripts/fakes/fake-smtp';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';

describe('mail outbox', () => {
  let t: TestApp;
  let smtp: FakeSmtp;
  let owner: ApiAgent;
  let clientId: number;

  const transport = () => createTransport({ ...loadConfig({ NODE_ENV: 'test', DATABASE_URL: 'postgres://x@127.0.0.1/x', SESSION_SECRET: 'x'.repeat(40) }), smtp: { host: '127.0.0.1', port: smtp.smtpPort, secure: false } });

  beforeAll(async () => {
    t = await startTestApp();
    smtp = await startFakeSmtp({ quiet: true });
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Mina Hartwell', email: 'mina@post.test' });
  });
  afterAll(async () => {
    await smtp.close();
    await t.close();
  });

  it('delivers a sent quote with its PDF, which the receiving side parses', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Denim picnic quilt' });
    const q = await sendQuote(owner, commission);
    expect(await deliverDue(t.knex, transport(), 'Studio <studio@keepstitch.test>')).toEqual({ sent: 1, failed: 0 });
    const mail = smtp.mails.find((m) => m.subject.includes('Denim picnic quilt'))!;
    expect(mail.to).toEqual(['mina@post.test']);
    expect(mail.text).toContain(`/portal/${commission}?quote=${q.id}`);
    expect(mail.html).toContain('Open your quote');
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0]).toMatchObject({ filename: `quote-${commission}-v1.pdf`, contentType: 'application/pdf' });
    expect(mail.attachments[0]!.content.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await t.knex('outboxMails').where('commissionId', commission).first()).status).toBe('sent');
  });

  it('keeps a mail while the mail server is down and delivers it exactly once when it is back', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Flannel throw' });
    await sendQuote(owner, commission);
    await smtp.stopSmtp();
    const now = new Date();
    expect(await deliverDue(t.knex, transport(), 'studio@keepstitch.test', now)).toEqual({ sent: 0, failed: 1 });
    const pending = await t.knex('outboxMails').where('commissionId', commission).first();
    expect(pending).toMatchObject({ status: 'pending', attempts: 1 });
    expect(pending.lastError).toBeTruthy();
    expect(pending.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(now.getTime() + retryDelayMs(1) - 1000);
    // The owner sees it waiting.
    expect((await owner.get('/api/mail/outbox')).body.items.map((m: { commissionId: number }) => m.commissionId)).toContain(commission);

    await smtp.startSmtp();
    // Not due yet: nothing is sent early.
    expect(await deliverDue(t.knex, transport(), 'studio@keepstitch.test', now)).toEqual({ sent: 0, failed: 0 });
    const later = new Date(now.getTime() + retryDelayMs(1) + 1000);
    expect(await deliverDue(t.knex, transport(), 'studio@keepstitch.test', later)).toEqual({ sent: 1, failed: 0 });
    expect(await deliverDue(t.knex, transport(), 'studio@keepstitch.test', new Date(later.getTime() + 86_400_000))).toEqual({ sent: 0, failed: 0 });
    expect(smtp.mails.filter((m) => m.subject.includes('Flannel throw'))).toHaveLength(1);
  });

  it('waits longer after each failure, up to an hour', () => {
    expect([1, 2, 3, 10, 20].map(retryDelayMs)).toEqual([30_000, 60_000, 120_000, 3_600_000, 3_600_000]);
  });
});
