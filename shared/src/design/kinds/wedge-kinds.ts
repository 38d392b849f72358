// What the plate and the fan share: a ring (plate) or quarter ring (fan) of
// blades cut with templates, appliquéd on a background square with a centre
// circle or corner quarter circle over the hole.

import { DomainError } from '../../errors';
import { Length } from '../../measure';
import { cutSize, RulerStep } from '../../rounding';
import { squareCut } from '../../seam-allowance';
import { wedgeBlock } from '../../wedge-block';
import { centreCircle, backgroundSquare } from '../../centre-circle';
import type { DerivedPosition, SewingStep, Template } from '../derivation-types';
import { AddShape, fromUnit, KindCuts, KindInput, KindSewing, plural, rect, storedLength } from './block-kind';

type WedgeKind = 'plate' | 'fan';

interface WedgeSpec {
  id: string;
  blades?: number;
  outerRadiusMm?: string;
  innerRadiusMm?: string;
}

/** The inputs of a plate or fan: its blades and radii. */
export const wedgeInputs = (defaultBlades: number, placeholders: { outer?: string; inner?: string } = {}) =>
  [
    { name: 'blades', type: 'count', label: 'Blades', default: defaultBlades, min: 3, max: 120 },
    { name: 'outerRadiusMm', type: 'length', label: 'Outer radius', ...(placeholders.outer ? { placeholder: placeholders.outer } : {}) },
    { name: 'innerRadiusMm', type: 'length', label: 'Inner radius', ...(placeholders.inner ? { placeholder: placeholders.inner } : {}) },
  ] as const satisfies readonly KindInput[];

const centreRole = (kind: WedgeKind) => (kind === 'plate' ? 'centre' : 'corner');

export function wedgeCuts(kind: WedgeKind, defaultBlades: number, spec: WedgeSpec, side: Length, opts: { ruler: RulerStep }): KindCuts {
  const field = `block ${spec.id}`;
  const blades = spec.blades ?? defaultBlades;
  const outerRadius = spec.outerRadiusMm ? storedLength(spec.outerRadiusMm, `${field} outer radius`) : undefined;
  const innerRadius = storedLength(spec.innerRadiusMm ?? String(25.4 * 2), `${field} inner radius`);
  const wedge = wedgeBlock({ kind, blades, outerRadius, innerRadius, ...opts });
  const bg = backgroundSquare(wedge, opts);
  if (bg.minimumFinished.gt(side)) {
    throw new DomainError(
      'piece-does-not-fit',
      `The ${kind} of ${field} needs a block of at least ${bg.minimumFinished.to('in').toDecimalPlaces(3)} in (1 in margin); the layout's block is ${side.to('in').toDecimalPlaces(3)} in.`,
      `${field} outer radius`,
    );
  }
  const circle = centreCircle(wedge);
  // Two blades cut head to toe from one strip fill a rectangle (cut top + cut bottom) wide.
  const pair = cutSize(wedge.cut.top.exact.plus(wedge.cut.bottom.exact), opts.ruler);
  const centreSide = kind === 'plate' ? cutSize(circle.fabricDiameter, opts.ruler) : circle.fanSquare!;
  const background = squareCut(side, opts);
  return {
    wedge,
    roles: [
      { role: 'blades', piece: { shape: 'blade pair', width: pair, height: wedge.stripWidth, diagonalCuts: 0, piecesEach: 2, note: 'two blades head to toe with the template' }, perBlock: (b) => Math.ceil((b * blades) / 2) },
      {
        role: centreRole(kind),
        piece: { shape: 'circle square', width: centreSide, height: centreSide, diagonalCuts: 0, piecesEach: 1, note: kind === 'plate' ? 'cut the circle with the template' : 'cut the quarter circle with the template' },
        perBlock: (b) => b,
      },
      { role: 'background', piece: fromUnit(background, 0), perBlock: (b) => b },
    ],
  };
}

/** The order a ring of blades is joined in: pairs, then fours, then the ring (or fan). */
export function bladeJoins(blades: number): SewingStep[] {
  const steps: SewingStep[] = [];
  const pairs = Math.floor(blades / 2);
  const single = blades % 2;
  steps.push({ text: `Sew the blades into ${plural(pairs, 'pair')}${single ? ', one blade left single' : ''}`, count: pairs });
  const fours = Math.floor(pairs / 2);
  if (fours > 0) {
    const leftover = pairs % 2;
    steps.push({ text: `Join the pairs into ${plural(fours, 'set')} of four${leftover ? ', one pair left over' : ''}`, count: fours });
  }
  return steps;
}

export function wedgeSewing(kind: WedgeKind, blocks: number, cuts: KindCuts): KindSewing {
  const wedge = cuts.wedge!;
  const plate = kind === 'plate';
  const steps = bladeJoins(wedge.blades);
  steps.push({ text: plate ? 'Join the sets into one ring' : `Join the sets into one fan of ${wedge.blades} blades`, count: blocks });
  steps.push({ text: `Appliqué the ${plate ? 'ring centred on the background square' : 'fan into the corner of the background square'}`, count: blocks });
  steps.push({ text: plate ? 'Turn the centre circle over its card, press, and appliqué it over the hole' : 'Turn the curved edge of the quarter circle over its card and appliqué it into the corner', count: blocks });
  return { steps, pressing: 'Press the blade seams all one way round; press the appliqué from the back on a towel.' };
}

export function wedgeTemplates(kind: WedgeKind, spec: WedgeSpec, cuts: KindCuts): Template[] {
  const wedge = cuts.wedge!;
  const mm = (l: Length) => l.mm.toString();
  const circle = centreCircle(wedge);
  const plate = kind === 'plate';
  return [
    {
      id: `${spec.id}-blade`,
      name: `Block ${spec.id} blade (${wedge.blades} of ${wedge.sweepDegrees} degrees)`,
      kind: 'blade',
      blockId: spec.id,
      finished: wedge.finished.outline,
      cut: wedge.cut.outline,
      sizeText: [
        { label: 'cut top', mm: mm(wedge.cut.top.exact) },
        { label: 'cut bottom', mm: mm(wedge.cut.bottom.exact) },
        { label: 'cut height', mm: mm(wedge.cut.height.exact) },
        { label: 'strip width', mm: mm(wedge.stripWidth.rounded) },
      ],
    },
    {
      id: `${spec.id}-${plate ? 'circle' : 'quarter'}`,
      name: plate ? `Block ${spec.id} centre circle` : `Block ${spec.id} corner quarter circle`,
      kind: plate ? 'circle' : 'quarter-circle',
      blockId: spec.id,
      cardRadiusMm: circle.cardRadius.toNumber('mm'),
      fabricRadiusMm: circle.fabricRadius.toNumber('mm'),
      allowanceMm: wedge.allowance.toNumber('mm'),
      sizeText: [
        { label: 'card diameter', mm: mm(circle.cardDiameter) },
        { label: 'fabric diameter', mm: mm(circle.fabricDiameter) },
      ],
    },
  ];
}

export function wedgeShapes(kind: WedgeKind, defaultBlades: number, spec: WedgeSpec, { x, y, side: s }: DerivedPosition, add: AddShape): void {
  add(rect(x, y, s, s), 'background');
  const blades = spec.blades ?? defaultBlades;
  const R = Number(spec.outerRadiusMm ?? s / 2 - 25.4);
  const r0 = Number(spec.innerRadiusMm ?? 50.8);
  const plate = kind === 'plate';
  const cx = plate ? x + s / 2 : x;
  const cy = plate ? y + s / 2 : y + s;
  const sweep = plate ? 2 * Math.PI : Math.PI / 2;
  const start = plate ? 0 : -Math.PI / 2;
  const at = (rad: number, a: number): [number, number] => [cx + rad * Math.cos(a), cy + rad * Math.sin(a)];
  for (let i = 0; i < blades; i++) {
    const a0 = start + (i * sweep) / blades;
    const a1 = start + ((i + 1) * sweep) / blades;
    add([at(r0, a0), at(R, a0), at(R, a1), at(r0, a1)], 'blades');
  }
  const circle: [number, number][] = [];
  const steps = plate ? 36 : 10;
  for (let i = 0; i <= steps; i++) circle.push(at(r0 + 6.35, start + (i * sweep) / steps));
  if (!plate) circle.push([cx, cy]);
  add(circle, centreRole(kind));
}
