import { formatPounds } from '@keepstitch/shared';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function html(paragraphs: string[], link?: { href: string; label: string }, list: readonly string[] = []): string {
  const items = list.length ? `\n<ul>${list.map((l) => `<li>${escape(l)}</li>`).join('')}</ul>` : '';
  const body = paragraphs.map((p) => `<p>${escape(p).replace(/\n/g, '<br>')}</p>`).join('\n') + items;
  const button = link ? `<p><a href="${escape(link.href)}" style="display:inline-block;padding:10px 18px;background:#4a6650;color:#fff;text-decoration:none;border-radius:6px">${escape(link.label)}</a></p>` : '';
  return `<!doctype html><html><body style="font-family:Lato,Arial,sans-serif;line-height:1.5;color:#222">${body}${button}</body></html>`;
}

export interface Mail {
  subject: string;
  text: string;
  html: string;
}

/**
 * The quote. A client with no sign-in yet gets `invitationLink` too: the
 * one-time link to choose a password, which then opens their page.
 */
export function quoteMail(p: { clientName: string; studioName: string; title: string; version: number; totalPence: number; depositPence: number; validUntil: string; link: string; invitationLink?: string | null }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `Your quote for "${p.title}" (version ${p.version}) is attached as a PDF. The total is ${formatPounds(p.totalPence)}, with a deposit of ${formatPounds(p.depositPence)} to book your place.`,
  ];
  const subject = `Your quote from ${p.studioName}: ${p.title}`;
  if (p.invitationLink) {
    lines.push(
      `The quote is valid until ${p.validUntil}. You can read it, accept it or decline it, and pay the deposit, on your own page. You do not have a sign-in yet: choose a password with this link (it works once, for ${INVITATION_DAYS} days), then open the quote:`,
    );
    return {
      subject,
      text: `${lines.join('\n\n')}\n${p.invitationLink}\n\nYour quote: ${p.link}\n\nWith thanks,\n${p.studioName}\n`,
      html: html(lines, { href: p.invitationLink, label: 'Choose your password' }),
    };
  }
  lines.push(`The quote is valid until ${p.validUntil}. You can read it, accept it or decline it, and pay the deposit, when signed in to your page:`);
  return {
    subject,
    text: `${lines.join('\n\n')}\n${p.link}\n\nWith thanks,\n${p.studioName}\n`,
    html: html([...lines], { href: p.link, label: 'Open your quote' }) + '',
  };
}

/** Days an invitation link works (the server's LINK_LIFETIME_MS says the same). */
export const INVITATION_DAYS = 7;

/** To a client: an invitation to their page, with the one-time link to choose a password. */
export function invitationMail(p: { clientName: string; studioName: string; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `${p.studioName} has made you a page where you can follow your commissions, read and accept quotes and pay.`,
    `Choose a password with this link to sign in. It works once, for ${INVITATION_DAYS} days; if it has run out, ask ${p.studioName} to send it again.`,
  ];
  return { subject: `Your page at ${p.studioName}: choose a password`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Choose your password' }) };
}

/** To anyone who asked on the sign-in page: the one-time link to choose a new password. */
export function passwordResetMail(p: { name: string; studioName: string; link: string }): Mail {
  const lines = [
    `Dear ${p.name},`,
    'Someone, probably you, asked to choose a new password for your sign-in. Use this link within an hour; it works once.',
    'If you did not ask, ignore this e-mail: your password stays as it is.',
  ];
  return { subject: `Choose a new password for ${p.studioName}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Choose a new password' }) };
}

export function receiptMail(p: { clientName: string; studioName: string; title: string; kind: 'deposit' | 'balance'; amountPence: number; paidAt: Date; link: string }): Mail {
  const what = p.kind === 'deposit' ? 'deposit' : 'balance';
  const lines = [
    `Dear ${p.clientName},`,
    `Thank you: we have received your ${what} of ${formatPounds(p.amountPence)} for "${p.title}" on ${p.paidAt.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' })}.`,
    p.kind === 'deposit' ? 'Your commission is booked into the workroom.' : 'Your piece is paid in full.',
    'You can see your payments and the progress of your piece on your page:',
  ];
  return { subject: `Receipt: ${what} for ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'See your commission' }) };
}

export function readyMail(p: { clientName: string; studioName: string; title: string; balancePence: number; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `Your piece "${p.title}" is finished and ready.`,
    p.balancePence > 0 ? `The balance of ${formatPounds(p.balancePence)} can be paid on your page before delivery.` : 'It is paid in full.',
  ];
  return { subject: `Your piece is ready: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Open your page' }) };
}

/** To the studio: a card payment that is not the amount asked, held until the owner accepts or refunds it. */
export function paymentHeldMail(p: { studioName: string; clientName: string; title: string; kind: 'deposit' | 'balance'; askedPence: number; receivedPence: number; link: string }): Mail {
  const lines = [
    `${p.clientName} paid ${formatPounds(p.receivedPence)} by card for the ${p.kind} of "${p.title}", but ${formatPounds(p.askedPence)} was asked.`,
    p.kind === 'deposit'
      ? 'The payment is held and the commission is not booked until you decide. No receipt has gone to the client.'
      : 'The payment is held and does not count towards the balance until you decide. No receipt has gone to the client.',
    `On the commission page, under Payments, accept ${formatPounds(p.receivedPence)} if you agreed it with the client (what is still owed is worked out from it), or refund it to the client's card so they can pay the right amount.`,
  ];
  return { subject: `Payment held for your review: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Open the commission' }) };
}

/** To the studio: a second card payment for something already paid, and whether its refund went through. */
export function overpaymentMail(p: { studioName: string; clientName: string; title: string; kind: 'deposit' | 'balance'; receivedPence: number; link: string }): Mail {
  const lines = [
    `${p.clientName} paid the ${p.kind} of "${p.title}" a second time: ${formatPounds(p.receivedPence)} arrived for a ${p.kind} that was already paid.`,
    'Keepstitch asks the card payment service to refund it straight away. The commission page shows, under Payments, whether the refund has gone through; if it has not, use Refund there.',
  ];
  return { subject: `Paid twice, being refunded: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Open the commission' }) };
}

/** To the client on delivery: the care card is attached, and each garment says what comes back. */
export function deliveredMail(p: { clientName: string; studioName: string; title: string; comesBack: readonly string[]; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `Your piece "${p.title}" has been delivered. Its care card is attached as a PDF: how to wash it, and what went into it.`,
  ];
  const list = p.comesBack.length ? ['What comes back to you with it:', p.comesBack.map((l) => `- ${l}`).join('\n')] : [];
  const text = `${[...lines, ...list].join('\n\n')}\n\nYou can see your commission on your page:\n${p.link}\n\nWith thanks,\n${p.studioName}\n`;
  const paragraphs = p.comesBack.length ? [...lines, 'What comes back to you with it:'] : lines;
  return { subject: `Delivered: ${p.title}`, text, html: html(paragraphs, { href: p.link, label: 'Open your page' }, p.comesBack) };
}

const longDate = (day: string) => new Date(`${day}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** Reminder to the client: a sent quote runs out soon. */
export function quoteExpiryMail(p: { clientName: string; studioName: string; title: string; version: number; validUntil: string; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `A reminder that your quote for "${p.title}" (version ${p.version}) is valid until ${longDate(p.validUntil)}.`,
    'If you would like to go ahead, you can accept it and pay the deposit on your page before then. If you have questions, just reply to this e-mail.',
  ];
  return { subject: `Your quote runs out on ${longDate(p.validUntil)}: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\nWith thanks,\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Open your quote' }) };
}

/** Reminder to the client: the balance is due before the piece is delivered. */
export function balanceDueMail(p: { clientName: string; studioName: string; title: string; balancePence: number; deadline: string; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `Your piece "${p.title}" is due on ${longDate(p.deadline)}. The balance of ${formatPounds(p.balancePence)} is due before delivery.`,
    'You can pay it on your page:',
  ];
  return { subject: `Balance due before delivery: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Pay the balance' }) };
}

/** Reminder to the client: garments the studio is still waiting for. */
export function garmentsLateMail(p: { clientName: string; studioName: string; title: string; garments: string[]; days: number; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `For "${p.title}" we are still waiting for ${p.garments.length === 1 ? 'this garment' : 'these garments'}, listed ${p.days} or more days ago:`,
    p.garments.map((g) => `- ${g}`).join('\n'),
    'When you send them, you can tell us on your page. If they are already on their way, please ignore this e-mail.',
  ];
  return { subject: `Still waiting for your garments: ${p.title}`, text: `${lines.join('\n\n')}\n${p.link}\n\n${p.studioName}\n`, html: html(lines, { href: p.link, label: 'Open your page' }) };
}
