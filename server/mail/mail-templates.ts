import { formatPounds } from '@keepstitch/shared';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function html(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escape(p).replace(/\n/g, '<br>')}</p>`).join('\n');
  const button = link ? `<p><a href="${escape(link.href)}" style="display:inline-block;padding:10px 18px;background:#4a6650;color:#fff;text-decoration:none;border-radius:6px">${escape(link.label)}</a></p>` : '';
  return `<!doctype html><html><body style="font-family:Lato,Arial,sans-serif;line-height:1.5;color:#222">${body}${button}</body></html>`;
}

export interface Mail {
  subject: string;
  text: string;
  html: string;
}

export function quoteMail(p: { clientName: string; studioName: string; title: string; version: number; totalPence: number; depositPence: number; validUntil: string; link: string }): Mail {
  const lines = [
    `Dear ${p.clientName},`,
    `Your quote for "${p.title}" (version ${p.version}) is attached as a PDF. The total is ${formatPounds(p.totalPence)}, with a deposit of ${formatPounds(p.depositPence)} to book your place.`,
    `The quote is valid until ${p.validUntil}. You can read it, accept it or decline it, and pay the deposit, when signed in to your page:`,
  ];
  return {
    subject: `Your quote from ${p.studioName}: ${p.title}`,
    text: `${lines.join('\n\n')}\n${p.link}\n\nWith thanks,\n${p.studioName}\n`,
    html: html([...lines], { href: p.link, label: 'Open your quote' }) + '',
  };
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
