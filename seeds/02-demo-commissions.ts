import type { Knex } from 'knex';
import { readdir, unlink } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { DATA_DIR } from '../server/core/config';
import { storeImageBuffer } from '../server/photos/image-store';
import { DEMO_ACCOUNTS } from './demo/accounts';

/** A fabric-like picture drawn here (checks or stripes), standing in for a photo of a garment. */
async function fabricPicture(colours: string[], kind: 'check' | 'stripe'): Promise<Buffer> {
  const bands = colours
    .map((c, i) => `<rect x="${kind === 'check' ? i * 40 : 0}" y="${kind === 'stripe' ? i * 30 : 0}" width="${kind === 'check' ? 40 : 640}" height="${kind === 'stripe' ? 30 : 480}" fill="${c}" opacity="${kind === 'check' ? 0.6 : 1}"/>`)
    .join('');
  const pattern = kind === 'check'
    ? `<pattern id="p" width="${colours.length * 40}" height="${colours.length * 40}" patternUnits="userSpaceOnUse">${bands}${colours.map((c, i) => `<rect y="${i * 40}" width="${colours.length * 40}" height="40" fill="${c}" opacity="0.5"/>`).join('')}</pattern>`
    : `<pattern id="p" width="640" height="${colours.length * 30}" patternUnits="userSpaceOnUse">${bands}</pattern>`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480"><defs>${pattern}</defs><rect width="640" height="480" fill="url(#p)"/></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 85 }).toBuffer();
}

const inches = (n: number) => String(n * 25.4);

/**
 * Two demo commissions: a memory quilt from work shirts with garments
 * received, stored and measured; and cushions from dresses still arriving.
 * Their photos are pictures drawn by this script.
 */
export async function seed(knex: Knex): Promise<void> {
  const uploadDir = process.env['UPLOAD_DIR'] ?? path.join(DATA_DIR, 'uploads');
  // The earlier demo's photos go with its rows: only files named the way the photo store names them.
  const stale = await readdir(uploadDir).catch(() => [] as string[]);
  await Promise.all(
    stale.filter((f) => /^[0-9a-f-]{36}(\.thumb)?\.(jpg|png|webp)$/.test(f)).map((f) => unlink(path.join(uploadDir, f))),
  );

  const users = await knex('users').select('id', 'email', 'clientId');
  const byEmail = (e: string) => users.find((u) => u.email === e)!;
  const owner = byEmail(DEMO_ACCOUNTS.owner.email);
  const rosalind = byEmail(DEMO_ACCOUNTS.clientA.email);
  const callum = byEmail(DEMO_ACCOUNTS.clientB.email);
  const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

  const [quilt] = await knex('commissions')
    .insert({
      clientId: rosalind.clientId,
      title: 'Work-shirt memory quilt',
      kind: 'memory_quilt',
      recipient: 'Rosalind, from her late husband\u2019s shirts',
      ageGroup: 'adult',
      occasion: 'Remembrance',
      sizePreset: 'UK double',
      widthMm: inches(72),
      lengthMm: inches(88),
      deadline: day(45),
      budgetPence: 48000,
      notes: 'Every shirt should appear at least twice. Keep the breast pocket of the green shirt whole.',
      stage: 'preparation',
    })
    .returning('id');
  const [cushions] = await knex('commissions')
    .insert({
      clientId: callum.clientId,
      title: 'Two cushions from Nana\u2019s dresses',
      kind: 'cushion',
      recipient: 'His daughters, aged 2 and 6',
      ageGroup: 'child_under_3',
      occasion: 'Birthday',
      widthMm: inches(16),
      lengthMm: inches(16),
      deadline: day(-3),
      budgetPence: 12000,
      stage: 'booked',
    })
    .returning('id');

  for (const [id, stages] of [[quilt.id, ['enquiry', 'quoted', 'booked', 'garments_in', 'preparation']], [cushions.id, ['enquiry', 'booked']]] as const) {
    let from: string | null = null;
    for (const [i, to] of stages.entries()) {
      await knex('stageMoves').insert({ commissionId: id, fromStage: from, toStage: to, movedBy: owner.id, movedAt: new Date(Date.now() - (30 - i * 5) * 86_400_000), note: i === 0 ? 'Opened' : null });
      from = to;
    }
  }
  await knex('hoursLogged').insert([
    { commissionId: quilt.id, stage: 'preparation', hours: '2.50', workedOn: day(-4), note: 'Unpicked and pressed four shirts', userId: owner.id },
    { commissionId: quilt.id, stage: 'preparation', hours: '1.25', workedOn: day(-2), note: 'Stabiliser on the knit polo', userId: owner.id },
  ]);

  const shirts = [
    { description: 'Blue oxford work shirt', whose: 'Edmund', story: 'The shirt he wore every Monday to the depot.', fibre: 'cotton', colour: 'Pale blue', print: 'plain', colours: ['#9db7d5', '#b8cde3'], kind: 'stripe' as const, panels: [['back', 22, 27], ['left front', 10.5, 24], ['right front', 10.5, 24], ['left sleeve', 9, 22]] },
    { description: 'Green checked flannel shirt', whose: 'Edmund', story: 'Sunday walks on the ridge.', fibre: 'flannel', colour: 'Green and cream check', print: 'non_directional', colours: ['#4f7a52', '#e9e2c9', '#2f4a33'], kind: 'check' as const, features: [{ kind: 'pocket', position: 'left chest' }], panels: [['back', 21, 26.5], ['left front', 13, 23.5, [{ name: 'breast pocket', x: 4, y: 4, width: 5, height: 5.5 }]]] },
    { description: 'Navy knit polo', whose: 'Edmund', story: 'Bowls club summers.', fibre: 'knit_jersey', construction: 'knit', colour: 'Navy', print: 'plain', colours: ['#23335a', '#2c3f6b'], kind: 'stripe' as const, panels: [['back', 19.5, 25]] },
    { description: 'Red and grey striped shirt', whose: 'Edmund', story: 'His wedding-anniversary shirt.', fibre: 'cotton', colour: 'Red and grey stripe', print: 'directional', colours: ['#a33b3b', '#c8c8c8', '#a33b3b', '#ffffff'], kind: 'stripe' as const, panels: [['back', 22.5, 28]] },
  ];
  for (const [i, s] of shirts.entries()) {
    const [g] = await knex('garments')
      .insert({
        commissionId: quilt.id, description: s.description, whose: s.whose, story: s.story, fibre: s.fibre, construction: s.construction ?? 'woven',
        colour: s.colour, print: s.print, features: JSON.stringify(s.features ?? []), prewash: 'washed', colourRun: 'passed',
        returnsToClient: i === 1 ? 'Collar and cuffs' : 'All offcuts', createdBy: rosalind.id,
      })
      .returning('id');
    await knex('custodyEvents').insert([
      { garmentId: g.id, kind: 'announced', note: 'Added by the client in the portal', userId: rosalind.id, at: new Date(Date.now() - 28 * 86_400_000) },
      { garmentId: g.id, kind: 'received', note: 'Handed over in person', userId: owner.id, at: new Date(Date.now() - 20 * 86_400_000) },
      { garmentId: g.id, kind: 'washed', userId: owner.id, at: new Date(Date.now() - 19 * 86_400_000) },
      { garmentId: g.id, kind: 'stored', place: `Box A${i + 1}`, userId: owner.id, at: new Date(Date.now() - 19 * 86_400_000 + 3_600_000) },
    ]);
    // A panel may list its kept features in inches from its top-left corner.
    const panels = s.panels as [string, number, number, { name: string; x: number; y: number; width: number; height: number }[]?][];
    await knex('panels').insert(
      panels.map(([name, w, h, features = []]) => ({
        garmentId: g.id, name, widthMm: inches(w), heightMm: inches(h), grain: 'vertical',
        features: JSON.stringify(features.map((f) => ({ name: f.name, xMm: inches(f.x), yMm: inches(f.y), widthMm: inches(f.width), heightMm: inches(f.height) }))),
      })),
    );
    const image = await storeImageBuffer(uploadDir, `${s.description.toLowerCase().replace(/\W+/g, '-')}.jpg`, await fabricPicture(s.colours, s.kind));
    await knex('photos').insert({ ...image, commissionId: quilt.id, garmentId: g.id, kind: 'garment', uploadedBy: rosalind.id, caption: s.story });
  }
  const progress = await storeImageBuffer(uploadDir, 'pressed-shirts.jpg', await fabricPicture(['#9db7d5', '#4f7a52', '#23335a', '#a33b3b'], 'stripe'));
  await knex('photos').insert({ ...progress, commissionId: quilt.id, garmentId: null, kind: 'progress', uploadedBy: owner.id, caption: 'All four shirts washed and pressed' });

  const dresses = [
    { description: 'Yellow floral tea dress', whose: 'Nana June', story: 'She wore it to every christening.', fibre: 'cotton', colour: 'Yellow floral', received: true, features: [{ kind: 'buttons', position: 'back bodice' }] },
    { description: 'Lilac cotton lawn dress', whose: 'Nana June', story: 'Her garden-party dress.', fibre: 'cotton', colour: 'Lilac', received: false, features: [] },
  ];
  for (const d of dresses) {
    const [g] = await knex('garments')
      .insert({ commissionId: cushions.id, description: d.description, whose: d.whose, story: d.story, fibre: d.fibre, colour: d.colour, features: JSON.stringify(d.features), createdBy: callum.id })
      .returning('id');
    await knex('custodyEvents').insert({ garmentId: g.id, kind: 'announced', note: 'Added by the client in the portal', userId: callum.id, at: new Date(Date.now() - 10 * 86_400_000) });
    if (d.received) {
      await knex('custodyEvents').insert({ garmentId: g.id, kind: 'received', note: 'Arrived by post', userId: owner.id, at: new Date(Date.now() - 6 * 86_400_000) });
      await knex('custodyEvents').insert({ garmentId: g.id, kind: 'stored', place: 'Shelf C2', userId: owner.id, at: new Date(Date.now() - 6 * 86_400_000 + 600_000) });
    }
  }

  await knex('stockFabrics').insert([
    { name: 'Unbleached calico', colour: 'Natural', fibre: 'cotton', widthMm: inches(108), lengthMm: String(6000), costPence: 1450, costUnit: 'metre', supplier: 'Bolt-end wholesale (invented)', notes: 'Wide backing' },
    { name: 'Navy quilting cotton', colour: 'Navy', fibre: 'cotton', widthMm: inches(44), lengthMm: String(3500), costPence: 1200, costUnit: 'metre', supplier: 'Local haberdasher', notes: 'Binding and sashing' },
    { name: 'Cotton wadding 80/20', colour: 'Cream', fibre: 'blend', widthMm: inches(96), lengthMm: inches(180), costPence: 1100, costUnit: 'yard', supplier: null, notes: null },
  ]);
}
