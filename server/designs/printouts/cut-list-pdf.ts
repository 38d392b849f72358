import { keptFeatureId, keptFeaturePieces, keptFeaturePlaces, keptLines, pieceLine, pieceNumber, stepText, type PanelPlan, type UnitSystem } from '@keepstitch/shared';
import { ensureSpace, heading, measures, newDocument, toBuffer, today } from './pdf-document';
import type { PrintableDesign } from './printable';
import { drawQuiltTop, drawTopKey, keptMark } from './quilt-top-pdf';

/**
 * The cut list by source: the top drawn with its fabrics and kept features,
 * then each garment and studio fabric, its panels, their cuts in order, with
 * a diagram. A piece cut around a kept feature is named in its line, its cut
 * and its diagram.
 */
export async function cutListPdf(p: PrintableDesign): Promise<Buffer> {
  const { commission, version, sources, fabrics } = p;
  const system: UnitSystem = version.body.units;
  const m = measures(system);
  const doc = newDocument(`Cut list: ${commission.title}`);
  heading(doc, 'Cut list', [
    `${commission.title}, design version ${version.version}, printed ${today()}`,
    `Sizes in ${system === 'imperial' ? 'inches' : 'centimetres'}; cut sizes include the 1/4 in (6 mm) seam allowance. Cuts are straight, edge to edge, in the order given: strips first, then sub-cuts.`,
  ]);
  const pieces = new Map(version.derived.pieces.map((x) => [x.id, x]));
  const kept = keptFeaturePlaces(version.body, version.derived, keptFeaturePieces(version.plan, sources));
  const featureRects = new Map(sources.garments.flatMap((g) => g.panels.flatMap((pp) => (pp.features ?? []).map((f, i) => [keptFeatureId(pp.id, i), f] as const))));

  // The top, so the piece kept around a feature can be found in it.
  ensureSpace(doc, 200);
  doc.font('Lato-Bold').fontSize(13).text('The top');
  const topY = doc.y + 4;
  const left0 = doc.page.margins.left;
  const drawn = drawQuiltTop(doc, left0, topY, 200, 260, version.body, version.derived, fabrics, kept);
  const keyBottom = drawTopKey(doc, left0 + 216, topY, doc.page.width - doc.page.margins.right - left0 - 216, version.body, version.derived, fabrics, kept);
  doc.x = left0;
  doc.y = Math.max(topY + drawn, keyBottom) + 14;

  const placementsBy = new Map<string, typeof version.plan.plan.placements>();
  for (const pl of version.plan.plan.placements) placementsBy.set(pl.panelId, [...(placementsBy.get(pl.panelId) ?? []), pl]);
  const sections: { title: string; note?: string; colour: string; garmentId?: number; panels: PanelPlan[]; label: (pp: PanelPlan) => string }[] = [];
  for (const g of sources.garments) {
    const panels = version.plan.plan.panels.filter((pp) => pp.garmentId === String(g.id) && pp.piecesCut > 0);
    if (!panels.length) continue;
    const names = new Map(g.panels.map((x) => [`panel-${x.id}`, x.name]));
    sections.push({
      title: `From the ${g.description}${g.colour ? ` (${g.colour})` : ''}`,
      note: [g.construction === 'knit' ? 'Knit: fuse a stabiliser to the back of each panel before cutting.' : '', g.print === 'directional' ? 'Directional print: pieces are laid the right way up; do not turn them.' : ''].filter(Boolean).join(' ') || undefined,
      colour: fabrics.find((f) => f.key === `garment:${g.id}`)?.hex ?? '#888',
      garmentId: g.id,
      panels,
      label: (pp) => `${names.get(pp.panelId) ?? pp.panelId}, ${m.at(pp.width)} x ${m.at(pp.height)}`,
    });
  }
  for (const s of sources.stock) {
    const panels = version.plan.plan.panels.filter((pp) => pp.fabricId === `stock-${s.id}` && pp.piecesCut > 0);
    if (!panels.length) continue;
    sections.push({ title: `From the studio fabric: ${s.name}`, colour: fabrics.find((f) => f.key === `stock:${s.id}`)?.hex ?? '#888', panels, label: (pp) => `${m.at(pp.width)} wide, ${m.at(pp.height)} of its length` });
  }

  for (const section of sections) {
    ensureSpace(doc, 120);
    doc.font('Lato-Bold').fontSize(13).text(section.title);
    doc.font('Lato').fontSize(10);
    // Counts by piece kind from this source.
    const counts = new Map<string, number>();
    for (const pp of section.panels) for (const pl of placementsBy.get(pp.panelId) ?? []) counts.set(pl.pieceId, (counts.get(pl.pieceId) ?? 0) + 1);
    const keptHere = kept.filter((k) => section.garmentId === k.garmentId);
    for (const [id, n] of counts) {
      doc.font('Lato').text(`  ${pieceNumber(id)}: ${pieceLine(pieces.get(id)!, n, m.cut)}`);
      for (const note of keptLines(id, keptHere)) doc.font('Lato-Bold').text('Kept feature: ', { indent: 24, continued: true }).font('Lato').text(note);
    }
    doc.font('Lato');
    if (section.note) doc.fillColor('#7a3b00').text(section.note).fillColor('#000');
    doc.moveDown(0.4);
    for (const pp of section.panels) {
      ensureSpace(doc, 170);
      const top = doc.y;
      const left = doc.page.margins.left;
      doc.font('Lato-Bold').fontSize(10).text(section.label(pp), left, top);
      const diagramTop = doc.y + 4;
      const maxW = 150;
      const maxH = 150;
      const scale = Math.min(maxW / pp.width, maxH / pp.height);
      doc.save();
      doc.lineWidth(0.5);
      doc.rect(left, diagramTop, pp.width * scale, pp.height * scale).fillAndStroke('#e6e6e6', '#000');
      for (const pl of placementsBy.get(pp.panelId) ?? []) {
        doc.rect(left + pl.x * scale, diagramTop + pl.y * scale, pl.width * scale, pl.height * scale).fillAndStroke(section.colour, '#000');
        const feature = pl.featureId !== undefined ? featureRects.get(pl.featureId) : undefined;
        if (pl.featureId !== undefined) {
          // The piece kept around a feature: marked, with the feature's outline where it lies on the panel.
          const box = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]];
          keptMark(doc, box(left + pl.x * scale, diagramTop + pl.y * scale, pl.width * scale, pl.height * scale), Math.min(pl.width, pl.height) * scale);
          if (feature) {
            doc.save().lineWidth(0.6).dash(1.5, { space: 1 });
            doc.rect(left + Number(feature.xMm) * scale, diagramTop + Number(feature.yMm) * scale, Number(feature.widthMm) * scale, Number(feature.heightMm) * scale).stroke('#000');
            doc.undash().restore();
          }
        }
        const label = pieceNumber(pl.pieceId);
        const inset = pl.featureId !== undefined ? 3 : 1;
        doc.fillColor('#000').fontSize(6).text(label, left + pl.x * scale + inset, diagramTop + pl.y * scale + inset, { lineBreak: false });
      }
      doc.restore();
      const textLeft = left + maxW + 14;
      doc.font('Lato').fontSize(8.5);
      doc.x = textLeft;
      doc.y = diagramTop;
      const width = doc.page.width - doc.page.margins.right - textLeft;
      for (const step of pp.cuts) {
        if (doc.y > doc.page.height - doc.page.margins.bottom - 12) {
          doc.addPage();
          doc.x = textLeft;
        }
        doc.text(stepText(step, pieces, m.at, kept), textLeft, doc.y, { width });
      }
      doc.x = left;
      doc.y = Math.max(doc.y, diagramTop + pp.height * scale) + 12;
    }
    doc.moveDown(0.5);
  }

  const short = version.plan.shortfall;
  if (short.length || version.plan.minimumsShort.length) {
    ensureSpace(doc, 80);
    doc.font('Lato-Bold').fontSize(13).fillColor('#8a1c1c').text('Short: not in this cut list').fillColor('#000');
    doc.font('Lato').fontSize(10);
    for (const s of short) doc.text(`${s.count} x ${s.label}: ${s.detail} ${s.remedies[0] ?? ''}`);
    for (const g of version.plan.minimumsShort) doc.text(`${g.description}: ${g.achieved} of the ${g.required} pieces asked for. ${g.detail}`);
  }
  return toBuffer(doc);
}
