// The cut list by source: the top drawn with its fabrics and kept features,
// then each garment and studio fabric, its pieces, and each panel's cuts in
// order with a diagram. A piece cut around a kept feature is named in its
// line, its cut and its diagram.

import type { CutRegion, PanelPlan } from '../cut-plan/cut-plan-types';
import { fabricKey } from '../design/design-body';
import { designDrawing } from '../design/design-drawing';
import { designKeptFeatures, keptFeatureLabel } from '../design/kept-feature-places';
import { keptFeatureId, panelId, stockFabricId } from '../design/plan-input';
import { keptLines, pieceLine, pieceNumber, stepText } from '../design/cut-list-words';
import { NO_DESIGN_YET, measuresIn, versionLine, type PrintOptions, type PrintableDesign } from './printable-design';
import type { Block, KeyFabric, PanelFigure, PrintoutContent, Section } from './printout-content';

/** The planner's choice of any garment, as the drawing hatches it. */
export const ANY_FABRIC: KeyFabric = { key: 'any', name: 'Planner chooses (any garment)', hex: '#f1efe8', stripes: ['#f1efe8', '#d8d3c4'] };
const UNKNOWN_HEX = '#888';

export function cutListPrintout(d: PrintableDesign, options: PrintOptions): PrintoutContent {
  const v = d.version;
  if (!v) return { title: 'Cut list', meta: [], sections: [{ blocks: [{ kind: 'paragraph', text: NO_DESIGN_YET }] }], layout: 'flow' };
  const system = v.body.units;
  const m = measuresIn(system);
  const pieces = new Map(v.derived.pieces.map((p) => [p.id, p]));
  const kept = designKeptFeatures(v, d);
  const features = new Map(d.garments.flatMap((g) => g.panels.flatMap((p) => (p.features ?? []).map((f, i) => [keptFeatureId(p.id, i), f] as const))));
  const hexOf = (key: string) => d.fabrics.find((f) => f.key === key)?.hex ?? UNKNOWN_HEX;
  const placements = v.plan.plan.placements;

  // The top's key: the fabrics it shows in the legend's order (garments, studio fabrics, groups), then the planner's choice.
  const fills = new Set(designDrawing(v.body, v.derived).shapes.map((s) => s.fill));
  const key: KeyFabric[] = [
    ...d.fabrics.filter((f) => fills.has(f.key)).map((f) => (f.stripes ? { ...f, name: `${f.name} (a group: stripes of its garments)` } : f)),
    ...[...fills].filter((k) => !d.fabrics.some((f) => f.key === k)).map((k) => ({ ...ANY_FABRIC, key: k })),
  ];
  const top: Section = {
    heading: 'The top',
    mark: 'cut-list-top',
    blocks: [{ kind: 'figure', figure: { kind: 'quilt-top', body: v.body, derived: v.derived, fabrics: d.fabrics, key, kept, keptKey: kept.map((k) => `${keptFeatureLabel(k)}: that block's piece is cut with the feature centred.`) } }],
  };

  const source = (heading: string, note: string | null, hex: string, panels: PanelPlan[], label: (p: PanelPlan) => string, garmentId: number | null): Section => {
    const here = kept.filter((k) => k.garmentId === garmentId);
    const holds = (r: CutRegion) => r.content === 'piece' && here.some((k) => k.pieceId === r.pieceId && k.copy === r.copy);
    const counts = new Map<string, number>();
    for (const pp of panels) for (const pl of placements) if (pl.panelId === pp.panelId) counts.set(pl.pieceId, (counts.get(pl.pieceId) ?? 0) + 1);
    const blocks: Block[] = [
      { kind: 'list', style: 'lines', items: [...counts].map(([id, n]) => ({ text: `${pieceNumber(id)}: ${pieceLine(pieces.get(id)!, n, m.cut)}`, notes: keptLines(id, here).map((text) => ({ label: 'Kept feature:', text })) })) },
    ];
    if (note) blocks.push({ kind: 'paragraph', text: note, tone: 'note' });
    for (const pp of panels) {
      const figure: PanelFigure = {
        kind: 'panel',
        width: pp.width,
        height: pp.height,
        hex,
        pieces: placements
          .filter((pl) => pl.panelId === pp.panelId)
          .map((pl) => {
            const held = here.find((k) => k.pieceId === pl.pieceId && k.copy === pl.copy);
            const f = pl.featureId !== undefined ? features.get(pl.featureId) : undefined;
            return {
              x: pl.x,
              y: pl.y,
              width: pl.width,
              height: pl.height,
              label: pieceNumber(pl.pieceId),
              kept: held ? `Piece ${pieceNumber(pl.pieceId)} keeps the ${held.feature}` : null,
              feature: f ? { x: Number(f.xMm), y: Number(f.yMm), width: Number(f.widthMm), height: Number(f.heightMm) } : null,
            };
          }),
      };
      blocks.push({ kind: 'figure', figure, title: label(pp), beside: pp.cuts.map((c) => ({ text: stepText(c, pieces, m.at, here), emphasis: holds(c.cutsOff) || holds(c.remaining) })) });
    }
    return { heading, mark: 'cut-source', blocks };
  };

  const sources: Section[] = [];
  for (const g of d.garments) {
    const panels = v.plan.plan.panels.filter((p) => p.garmentId === String(g.id) && p.piecesCut > 0);
    if (!panels.length) continue;
    const names = new Map(g.panels.map((p) => [panelId(p.id), p.name]));
    const note = [g.construction === 'knit' ? 'Knit: fuse a stabiliser to the back of each panel before cutting.' : '', g.print === 'directional' ? 'Directional print: pieces are laid the right way up; do not turn them.' : ''].filter(Boolean).join(' ');
    sources.push(source(`From the ${g.description}${g.colour ? ` (${g.colour})` : ''}`, note || null, hexOf(fabricKey({ kind: 'garment', garmentId: g.id })), panels, (p) => `${names.get(p.panelId) ?? p.panelId}, ${m.at(p.width)} × ${m.at(p.height)}`, g.id));
  }
  for (const s of d.stock) {
    const panels = v.plan.plan.panels.filter((p) => p.fabricId === stockFabricId(s.id) && p.piecesCut > 0);
    if (panels.length) sources.push(source(`From the studio fabric: ${s.name}`, null, hexOf(fabricKey({ kind: 'stock', stockId: s.id })), panels, (p) => `${m.at(p.width)} wide, ${m.at(p.height)} of its length`, null));
  }

  const short = v.plan.shortfall;
  const shortfall: Section[] =
    short.length || v.plan.minimumsShort.length
      ? [
          {
            heading: 'Short: not in this cut list',
            tone: 'alert',
            mark: 'cut-short',
            blocks: [
              ...short.map((s): Block => ({ kind: 'paragraph', text: [`${s.count} × ${s.label}: ${s.detail}`, s.remedies[0]].filter(Boolean).join(' ') })),
              ...v.plan.minimumsShort.map((g): Block => ({ kind: 'paragraph', text: `${g.description}: ${g.achieved} of the ${g.required} pieces asked for. ${g.detail}` })),
            ],
          },
        ]
      : [];

  return {
    title: 'Cut list',
    meta: [
      versionLine(d, options),
      `Sizes in ${system === 'imperial' ? 'inches' : 'centimetres'}; cut sizes include the 1/4 in (6 mm) seam allowance. Cuts are straight, edge to edge, in the order given: strips first, then sub-cuts.`,
    ],
    sections: [top, ...sources, ...shortfall],
    layout: 'flow',
  };
}
