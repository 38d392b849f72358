// From a design to everything the workroom needs before cutting: the finished
// size against the target, each block position and its fabric, every piece to
// cut (shared cut-size maths, seam allowance included) with its count, the
// sewing order with counts, the full-size templates and the finishing sizes.

import Decimal from 'decimal.js';
import { DomainError } from '../errors';
import { Length, Size } from '../measure';
import { RulerStep, cutSize, CutSize } from '../rounding';
import { squareCut, rectangleCut, UnitCut } from '../seam-allowance';
import { halfSquareTriangleCut, quarterSquareTriangleCut } from '../triangle-cut';
import { flyingGeeseCut } from '../flying-geese';
import { foundationBlock } from '../foundation-block';
import { wedgeBlock, WedgeBlock, TemplatePoint } from '../wedge-block';
import { centreCircle, backgroundSquare } from '../centre-circle';
import { gridLayout, StripGroup, BorderPlan } from '../grid-layout';
import { onPointLayout } from '../on-point';
import { DEFAULT_USABLE_WIDTH } from '../fabric-width';
import { Assignment, BLOCK_ROLES, BlockSpec, DesignBody, FabricRef, fabricKey } from './design-body';
import { garmentGroupProblems } from './garment-groups';

export type PieceGroup = 'block' | 'sashing' | 'cornerstones' | 'border' | 'setting';

/** One kind of piece to cut from one fabric, with how many. */
export interface DerivedPiece {
  /** The piece kind, e.g. "block:A:square", "sashing", "border:1". */
  key: string;
  /** Position of this line in the list; also the planner's piece id ("p12"). */
  id: string;
  label: string;
  group: PieceGroup;
  blockId?: string;
  role: string;
  shape: 'square' | 'rectangle' | 'strip' | 'blade pair' | 'circle square';
  /** Cut size as laid on the ruler (rounded up to the ruler step), exact mm. */
  widthMm: string;
  heightMm: string;
  /** 0: used whole; 1: cut once on the diagonal; 2: cut twice (an X). */
  diagonalCuts: 0 | 1 | 2;
  /** Pieces each cut shape gives after its diagonal cuts (a blade pair gives 2 blades). */
  piecesEach: number;
  count: number;
  fabric: FabricRef | null;
  /** Long strips keep the lengthwise grain along their length. */
  lengthwise: boolean;
  note?: string;
}

export interface DerivedPosition {
  index: number;
  blockId: string;
  /** Finished block square in the top's coordinates (mm from the top-left corner), before any turn. */
  x: number;
  y: number;
  side: number;
  /** On point: the block is turned 45 degrees about its centre. */
  onPoint: boolean;
  /** Fabric of each role of the block here (null: the planner chooses from any garment). */
  fabrics: Record<string, FabricRef | null>;
}

export interface SewingStep {
  text: string;
  count?: number;
}

export interface SewingSection {
  title: string;
  steps: SewingStep[];
  pressing: string;
}

export type Template =
  | { id: string; name: string; kind: 'blade'; blockId: string; finished: TemplatePoint[]; cut: TemplatePoint[]; sizeText: SizeNote[] }
  | { id: string; name: string; kind: 'circle' | 'quarter-circle'; blockId: string; cardRadiusMm: number; fabricRadiusMm: number; allowanceMm: number; sizeText: SizeNote[] };

/** A labelled length for printing in either unit system. */
export interface SizeNote {
  label: string;
  mm: string;
}

export interface DesignDerivation {
  ruler: RulerStep;
  allowanceMm: string;
  finished: { widthMm: string; lengthMm: string };
  target: { widthMm: string; lengthMm: string };
  /** Finished minus target (negative: smaller than asked). */
  difference: { widthMm: string; lengthMm: string };
  centre: { widthMm: string; lengthMm: string };
  /** Finished widths across and heights down (borders, sashing, blocks), for drawing. */
  parts: { across: string[]; down: string[] };
  positions: DerivedPosition[];
  pieces: DerivedPiece[];
  sewing: SewingSection[];
  templates: Template[];
  /** Fabric for sashing, cornerstones, each border and the setting triangles, as assigned. */
  layoutFabrics: Record<string, FabricRef | null>;
  totals: { blocks: number; pieces: number };
}

const mm = (l: Length) => l.mm.toString();
const L = (text: string, field: string): Length => {
  const d = new Decimal(text);
  if (!d.isFinite() || d.lte(0)) throw new DomainError('not-positive', `Expected ${field} to be above zero.`, field);
  return Length.millimetres(d);
};

/** Positions a straight or on-point layout holds. */
export function positionCount(layout: DesignBody['layout']): number {
  const { rows, columns } = layout;
  return layout.setting === 'on-point' ? rows * columns + (rows - 1) * (columns - 1) : rows * columns;
}

interface BlockCuts {
  /** Per role: the unit cut it comes from, units per block, and pieces of the cut it takes. */
  roles: { role: string; piece: CutShape; perBlock: (blocks: number) => number }[];
  wedge?: WedgeBlock;
}

interface CutShape {
  shape: DerivedPiece['shape'];
  width: CutSize;
  height: CutSize;
  diagonalCuts: 0 | 1 | 2;
  piecesEach: number;
  note?: string;
}

function fromUnit(cut: UnitCut, index: number, note?: string): CutShape {
  const p = cut.pieces[index]!;
  return { shape: p.shape, width: p.width, height: p.height, diagonalCuts: p.diagonalCuts, piecesEach: p.piecesEach, note };
}

function blockCuts(spec: BlockSpec, side: Length, opts: { ruler: RulerStep }): BlockCuts {
  const field = `block ${spec.id}`;
  const units = spec.units ?? 1;
  if (!Number.isInteger(units) || units < 1 || units > 12) {
    throw new DomainError('out-of-range', `Expected ${field} to have 1 to 12 units; got ${units}.`, `${field} units`);
  }
  switch (spec.kind) {
    case 'square': {
      const cut = squareCut(side, opts);
      return { roles: [{ role: 'square', piece: fromUnit(cut, 0), perBlock: (b) => b }] };
    }
    case 'rectangles': {
      const cut = rectangleCut({ width: side, height: side.dividedBy(units) }, opts);
      return { roles: [{ role: 'rail', piece: fromUnit(cut, 0), perBlock: (b) => b * units }] };
    }
    case 'hst':
    case 'qst': {
      const unit = side.dividedBy(units);
      const cut = spec.kind === 'hst' ? halfSquareTriangleCut(unit, opts) : quarterSquareTriangleCut(unit, opts);
      const perBlock = (b: number) => Math.ceil((b * units * units) / cut.unitsPerBatch);
      const note = spec.kind === 'hst' ? 'cut once on the diagonal' : 'cut twice on the diagonal';
      return {
        roles: [
          { role: 'dark', piece: fromUnit(cut, 0, note), perBlock },
          { role: 'light', piece: fromUnit(cut, 0, note), perBlock },
        ],
      };
    }
    case 'flying-geese': {
      if (units % 2 !== 0) {
        throw new DomainError('shape-mismatch', `Expected an even number of geese down each column of ${field} (a goose is twice as wide as tall).`, `${field} units`);
      }
      const height = side.dividedBy(units);
      const cut = flyingGeeseCut({ width: height.times(2), height }, { ...opts, method: spec.method ?? 'four-at-a-time' });
      const geese = (b: number) => b * units * (units / 2);
      const batches = (b: number) => Math.ceil(geese(b) / cut.unitsPerBatch);
      const fourAtATime = cut.unitsPerBatch === 4;
      return {
        roles: [
          { role: 'goose', piece: fromUnit(cut, 0, fourAtATime ? 'cut twice on the diagonal' : undefined), perBlock: (b) => batches(b) * cut.pieces[0]!.quantity },
          { role: 'sky', piece: fromUnit(cut, 1, fourAtATime ? 'sew four at a time' : 'sew on the diagonal, trim'), perBlock: (b) => batches(b) * cut.pieces[1]!.quantity },
        ],
      };
    }
    case 'foundation': {
      const mean = spec.meanStripWidthMm ? L(spec.meanStripWidthMm, `${field} strip width`) : Length.inches('1.5');
      const f = foundationBlock({ finished: side, meanStripWidth: mean, ...opts });
      const strips = f.strips!;
      const stripLength = cutSize(strips.totalLength.dividedBy(strips.count), opts.ruler);
      const foundation = cutSize(f.foundation.width, opts.ruler);
      return {
        roles: [
          {
            role: 'strip',
            piece: { shape: 'strip', width: strips.cutWidth, height: stripLength, diagonalCuts: 0, piecesEach: 1, note: `average length; trim block to ${f.trimmed.width.rounded.to('in').toDecimalPlaces(3)} in` },
            perBlock: (b) => b * strips.count,
          },
          { role: 'foundation', piece: { shape: 'square', width: foundation, height: foundation, diagonalCuts: 0, piecesEach: 1, note: 'oversized, trimmed after sewing' }, perBlock: (b) => b },
        ],
      };
    }
    case 'plate':
    case 'fan': {
      const blades = spec.blades ?? (spec.kind === 'plate' ? 20 : 5);
      const outerRadius = spec.outerRadiusMm ? L(spec.outerRadiusMm, `${field} outer radius`) : undefined;
      const innerRadius = L(spec.innerRadiusMm ?? String(25.4 * 2), `${field} inner radius`);
      const wedge = wedgeBlock({ kind: spec.kind, blades, outerRadius, innerRadius, ...opts });
      const bg = backgroundSquare(wedge, opts);
      if (bg.minimumFinished.gt(side)) {
        throw new DomainError(
          'piece-does-not-fit',
          `The ${spec.kind} of ${field} needs a block of at least ${bg.minimumFinished.to('in').toDecimalPlaces(3)} in (1 in margin); the layout's block is ${side.to('in').toDecimalPlaces(3)} in.`,
          `${field} outer radius`,
        );
      }
      const circle = centreCircle(wedge);
      // Two blades cut head to toe from one strip fill a rectangle (cut top + cut bottom) wide.
      const pair = cutSize(wedge.cut.top.exact.plus(wedge.cut.bottom.exact), opts.ruler);
      const centreSide = spec.kind === 'plate' ? cutSize(circle.fabricDiameter, opts.ruler) : circle.fanSquare!;
      const background = squareCut(side, opts);
      return {
        wedge,
        roles: [
          { role: 'blades', piece: { shape: 'blade pair', width: pair, height: wedge.stripWidth, diagonalCuts: 0, piecesEach: 2, note: 'two blades head to toe with the template' }, perBlock: (b) => Math.ceil((b * blades) / 2) },
          {
            role: spec.kind === 'plate' ? 'centre' : 'corner',
            piece: { shape: 'circle square', width: centreSide, height: centreSide, diagonalCuts: 0, piecesEach: 1, note: spec.kind === 'plate' ? 'cut the circle with the template' : 'cut the quarter circle with the template' },
            perBlock: (b) => b,
          },
          { role: 'background', piece: fromUnit(background, 0), perBlock: (b) => b },
        ],
      };
    }
  }
}

function assignmentLookup(assignments: readonly Assignment[]) {
  const byPosition = new Map<number, FabricRef>();
  const byPiece = new Map<string, FabricRef>();
  for (const a of assignments) {
    if (a.target.kind === 'position') byPosition.set(a.target.index, a.fabric);
    else byPiece.set(a.target.key, a.fabric);
  }
  return { byPosition, byPiece };
}

/** Everything derived from a design: sizes, positions, pieces, sewing order and templates. */
export function deriveDesign(body: DesignBody): DesignDerivation {
  if (body.blocks.length === 0) throw new DomainError('out-of-range', 'Expected at least one block.', 'blocks');
  const ids = new Set(body.blocks.map((b) => b.id));
  if (ids.size !== body.blocks.length) throw new DomainError('out-of-range', 'Each block needs its own id.', 'blocks');
  const [groupProblem] = Object.entries(garmentGroupProblems(body));
  if (groupProblem) throw new DomainError('out-of-range', groupProblem[1], groupProblem[0]);
  const pattern = body.pattern.length ? body.pattern : [body.blocks[0]!.id];
  for (const id of pattern) {
    if (!ids.has(id)) throw new DomainError('out-of-range', `The pattern names block "${id}", which the design does not have.`, 'pattern');
  }
  const ruler: RulerStep = body.units === 'metric' ? 'millimetre' : 'eighth-inch';
  const opts = { ruler };
  const side = L(body.layout.blockMm, 'block size');
  const sashing = body.layout.sashing ? { width: L(body.layout.sashing.widthMm, 'sashing width'), cornerstones: body.layout.sashing.cornerstones } : undefined;
  const borders = body.layout.borders.map((b, i) => L(b, `border ${i + 1} width`));
  const usableWidth = DEFAULT_USABLE_WIDTH;
  const { byPosition, byPiece } = assignmentLookup(body.assignments);

  // Layout: finished size, positions and the pieces of the layout itself.
  const positions: DerivedPosition[] = [];
  const layoutPieces: { key: string; label: string; group: PieceGroup; piece: CutShape; count: number; lengthwise: boolean }[] = [];
  let finished: Size;
  let centre: Size;
  let across: Length[];
  let down: Length[];
  const blockAt = (i: number) => pattern[i % pattern.length]!;
  const stripPieces = (key: string, label: string, group: PieceGroup, s: StripGroup) => {
    if (s.piecing.wofStrips > 1) {
      // Longer than the fabric is wide: cut width-of-fabric strips and join them.
      const wof = cutSize(usableWidth, ruler);
      layoutPieces.push({ key, label: `${label} (joined)`, group, piece: { shape: 'strip', width: wof, height: s.cut.width, diagonalCuts: 0, piecesEach: 1, note: `join ${s.piecing.wofStrips} to make each ${s.cut.length.rounded.to('in').toDecimalPlaces(3)} in strip` }, count: s.count * s.piecing.wofStrips, lengthwise: false });
    } else {
      layoutPieces.push({ key, label, group, piece: { shape: 'strip', width: s.cut.width, height: s.cut.length, diagonalCuts: 0, piecesEach: 1 }, count: s.count, lengthwise: true });
    }
  };
  const borderPieces = (list: BorderPlan[]) => {
    for (const b of list) {
      const wof = cutSize(usableWidth, ruler);
      layoutPieces.push({
        key: `border:${b.number}`,
        label: `Border ${b.number}`,
        group: 'border',
        piece: { shape: 'strip', width: wof, height: b.sides.cut.width, diagonalCuts: 0, piecesEach: 1, note: `join end to end; cut 2 sides ${b.sides.cut.length.rounded.to('in').toDecimalPlaces(3)} in, then top and bottom ${b.topAndBottom.cut.length.rounded.to('in').toDecimalPlaces(3)} in` },
        count: b.wofStrips,
        lengthwise: false,
      });
    }
  };

  if (body.layout.setting === 'straight') {
    const grid = gridLayout({ rows: body.layout.rows, columns: body.layout.columns, block: side, sashing, borders, ruler, usableWidth });
    finished = grid.finished;
    centre = grid.centre;
    across = grid.parts.across;
    down = grid.parts.down;
    const borderTotal = Length.sum(borders);
    const pitch = side.plus(sashing ? sashing.width : Length.zero);
    for (let r = 0; r < grid.rows; r++) {
      for (let c = 0; c < grid.columns; c++) {
        const index = r * grid.columns + c;
        positions.push({ index, blockId: blockAt(index), x: borderTotal.plus(pitch.times(c)).toNumber('mm'), y: borderTotal.plus(pitch.times(r)).toNumber('mm'), side: side.toNumber('mm'), onPoint: false, fabrics: {} });
      }
    }
    for (const s of grid.sashing?.strips ?? []) stripPieces('sashing', `Sashing, ${s.name}`, 'sashing', s);
    const cs = grid.sashing?.cornerstones;
    if (cs) layoutPieces.push({ key: 'cornerstones', label: 'Cornerstones', group: 'cornerstones', piece: { shape: 'square', width: cs.cut, height: cs.cut, diagonalCuts: 0, piecesEach: 1 }, count: cs.count, lengthwise: false });
    borderPieces(grid.borders);
  } else {
    if (sashing) throw new DomainError('out-of-range', 'Sashing is for straight settings; on point, set the blocks edge to edge.', 'sashing');
    const op = onPointLayout({ across: body.layout.columns, down: body.layout.rows, block: side, borders, ruler, usableWidth });
    finished = op.finished;
    centre = op.centre;
    across = [...borders].reverse().concat([op.centre.width], borders);
    down = [...borders].reverse().concat([op.centre.height], borders);
    const borderTotal = Length.sum(borders).toNumber('mm');
    const d = op.blockDiagonal.toNumber('mm');
    const s = side.toNumber('mm');
    let index = 0;
    const place = (cx: number, cy: number) => {
      positions.push({ index, blockId: blockAt(index), x: borderTotal + cx - s / 2, y: borderTotal + cy - s / 2, side: s, onPoint: true, fabrics: {} });
      index++;
    };
    // Row by row from the top: whole blocks on the outer lattice, the ones between on the inner.
    for (let r = 0; r < op.down; r++) {
      for (let c = 0; c < op.across; c++) place((c + 0.5) * d, (r + 0.5) * d);
      if (r < op.down - 1) for (let c = 0; c < op.across - 1; c++) place((c + 1) * d, (r + 1) * d);
    }
    const sideCut = op.sideTriangles.cut.pieces[0]!;
    const cornerCut = op.cornerTriangles.cut.pieces[0]!;
    layoutPieces.push({ key: 'setting-triangles', label: 'Side setting triangles', group: 'setting', piece: { shape: 'square', width: sideCut.width, height: sideCut.height, diagonalCuts: 2, piecesEach: 4, note: 'cut twice on the diagonal' }, count: op.sideTriangles.squares, lengthwise: false });
    layoutPieces.push({ key: 'setting-triangles', label: 'Corner setting triangles', group: 'setting', piece: { shape: 'square', width: cornerCut.width, height: cornerCut.height, diagonalCuts: 1, piecesEach: 2, note: 'cut once on the diagonal' }, count: op.cornerTriangles.squares, lengthwise: false });
    borderPieces(op.borders);
  }

  // Fabric of each role at each position.
  const specs = new Map(body.blocks.map((b) => [b.id, b]));
  for (const p of positions) {
    const spec = specs.get(p.blockId)!;
    for (const role of BLOCK_ROLES[spec.kind]) {
      p.fabrics[role] = byPiece.get(`block:${spec.id}:${role}`) ?? byPosition.get(p.index) ?? null;
    }
  }

  // Block pieces: blocks counted per block id, role and fabric.
  const pieces: DerivedPiece[] = [];
  const push = (line: Omit<DerivedPiece, 'id' | 'widthMm' | 'heightMm'> & { shapeCut: CutShape }) => {
    const { shapeCut, ...rest } = line;
    if (rest.count <= 0) return;
    pieces.push({ ...rest, id: `p${pieces.length + 1}`, widthMm: mm(shapeCut.width.rounded), heightMm: mm(shapeCut.height.rounded) });
  };
  const templates: Template[] = [];
  const sewing: SewingSection[] = [];
  for (const spec of body.blocks) {
    const here = positions.filter((p) => p.blockId === spec.id);
    if (here.length === 0) continue;
    const cuts = blockCuts(spec, side, opts);
    for (const r of cuts.roles) {
      const byFabric = new Map<string, { fabric: FabricRef | null; blocks: number }>();
      for (const p of here) {
        const f = p.fabrics[r.role] ?? null;
        const k = fabricKey(f);
        const entry = byFabric.get(k) ?? { fabric: f, blocks: 0 };
        entry.blocks++;
        byFabric.set(k, entry);
      }
      for (const { fabric, blocks } of byFabric.values()) {
        push({
          key: `block:${spec.id}:${r.role}`,
          label: `Block ${spec.id} (${spec.name}): ${r.role}`,
          group: 'block',
          blockId: spec.id,
          role: r.role,
          shape: r.piece.shape,
          shapeCut: r.piece,
          diagonalCuts: r.piece.diagonalCuts,
          piecesEach: r.piece.piecesEach,
          count: r.perBlock(blocks),
          fabric,
          lengthwise: false,
          note: r.piece.note,
        });
      }
    }
    sewing.push(sewingFor(spec, here.length, cuts.wedge));
    if (cuts.wedge) templates.push(...templatesFor(spec, cuts.wedge));
  }
  const layoutFabrics: Record<string, FabricRef | null> = {};
  for (const lp of layoutPieces) {
    const fabric = byPiece.get(lp.key) ?? null;
    layoutFabrics[lp.key] = fabric;
    push({ key: lp.key, label: lp.label, group: lp.group, role: lp.group, shape: lp.piece.shape, shapeCut: lp.piece, diagonalCuts: lp.piece.diagonalCuts, piecesEach: lp.piece.piecesEach, count: lp.count, fabric, lengthwise: lp.lengthwise, note: lp.piece.note });
  }
  sewing.push(topSewing(body, positions.length));

  const target = { width: L(body.target.widthMm, 'target width'), height: L(body.target.lengthMm, 'target length') };
  return {
    ruler,
    allowanceMm: mm(Length.inches('0.25')),
    finished: { widthMm: mm(finished.width), lengthMm: mm(finished.height) },
    target: { widthMm: mm(target.width), lengthMm: mm(target.height) },
    difference: { widthMm: mm(finished.width.minus(target.width)), lengthMm: mm(finished.height.minus(target.height)) },
    centre: { widthMm: mm(centre.width), lengthMm: mm(centre.height) },
    parts: { across: across.map(mm), down: down.map(mm) },
    positions,
    pieces,
    sewing,
    templates,
    layoutFabrics,
    totals: { blocks: positions.length, pieces: pieces.reduce((n, p) => n + p.count, 0) },
  };
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
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

function sewingFor(spec: BlockSpec, blocks: number, wedge?: WedgeBlock): SewingSection {
  const units = spec.units ?? 1;
  const title = `Block ${spec.id}, ${spec.name}: ${plural(blocks, 'block')}`;
  switch (spec.kind) {
    case 'square':
      return { title, steps: [{ text: 'Nothing to piece: each block is one square, ready for the rows', count: blocks }], pressing: 'Press each square flat before it goes into a row.' };
    case 'rectangles':
      return {
        title,
        steps: [
          { text: `Chain-piece the rails in pairs down their long edges (${units} rails a block)`, count: blocks * Math.floor(units / 2) },
          { text: `Join the rails of each block until it is ${units} rails deep`, count: blocks },
        ],
        pressing: 'Press every seam towards the darker rail.',
      };
    case 'hst':
    case 'qst': {
      const total = blocks * units * units;
      const steps: SewingStep[] =
        spec.kind === 'hst'
          ? [{ text: 'Chain-piece a dark and a light triangle along the long (bias) edge, without stretching it', count: total }, { text: 'Trim each unit square to its unfinished size', count: total }]
          : [
              { text: 'Chain-piece the triangles in pairs along a short edge, a dark to a light', count: total * 2 },
              { text: 'Join the pairs into hourglass units, matching the centre', count: total },
              { text: 'Trim each unit square to its unfinished size', count: total },
            ];
      if (units > 1) steps.push({ text: `Sew the units into rows of ${units}, then the rows into blocks`, count: blocks * units });
      return { title, steps, pressing: 'Press towards the dark fabric; press, do not iron back and forth, on the bias.' };
    }
    case 'flying-geese': {
      const geese = blocks * units * (units / 2);
      return {
        title,
        steps: [
          { text: spec.method === 'stitch-and-flip' ? 'Stitch a sky square on each end of a goose rectangle along the diagonal, trim and flip' : 'Make the geese four at a time: two small squares on the large one, sew each side of the diagonal, cut, repeat', count: geese },
          { text: 'Trim each goose to its unfinished size, keeping 1/4 in above the point', count: geese },
          { text: `Sew the geese into columns of ${units}, points up`, count: blocks * (units / 2) },
          ...(units > 2 ? [{ text: 'Join the columns of each block', count: blocks }] : []),
        ],
        pressing: 'Press towards the goose; press the column seams open to keep the points flat.',
      };
    }
    case 'foundation':
      return {
        title,
        steps: [
          { text: 'Lay the first strip right side up across the middle of the foundation', count: blocks },
          { text: 'Stitch and flip each next strip, right sides together, then press it open' },
          { text: 'Trim each block to its unfinished size from the back', count: blocks },
        ],
        pressing: 'Press each strip open before the next; stay-stitch 1/8 in round the edge before trimming.',
      };
    case 'plate':
    case 'fan': {
      const steps = bladeJoins(wedge!.blades);
      steps.push({ text: spec.kind === 'plate' ? 'Join the sets into one ring' : `Join the sets into one fan of ${wedge!.blades} blades`, count: blocks });
      steps.push({ text: `Appliqué the ${spec.kind === 'plate' ? 'ring centred on the background square' : 'fan into the corner of the background square'}`, count: blocks });
      steps.push({ text: spec.kind === 'plate' ? 'Turn the centre circle over its card, press, and appliqué it over the hole' : 'Turn the curved edge of the quarter circle over its card and appliqué it into the corner', count: blocks });
      return { title, steps, pressing: 'Press the blade seams all one way round; press the appliqué from the back on a towel.' };
    }
  }
}

function topSewing(body: DesignBody, blocks: number): SewingSection {
  const steps: SewingStep[] = [];
  const { rows, columns } = body.layout;
  if (body.layout.setting === 'straight') {
    steps.push({ text: body.layout.sashing ? `Sew ${plural(rows, 'row')} of ${columns} blocks with a sashing strip between each` : `Sew ${plural(rows, 'row')} of ${columns} blocks`, count: rows });
    if (body.layout.sashing?.cornerstones && rows > 1) steps.push({ text: 'Sew the sashing rows: strips and cornerstones', count: rows - 1 });
    steps.push({ text: body.layout.sashing ? 'Join the block rows and sashing rows, matching the cornerstones' : 'Join the rows, matching the block corners', count: rows - 1 });
  } else {
    const diagonals = rows + columns - 1;
    steps.push({ text: `Sew the ${blocks} blocks into ${diagonals} diagonal rows with a side setting triangle at each end`, count: diagonals });
    steps.push({ text: 'Join the diagonal rows, then add the four corner triangles', count: diagonals - 1 });
  }
  body.layout.borders.forEach((_, i) => steps.push({ text: `Border ${i + 1}: measure through the middle, sew on the sides, then the top and bottom` }));
  steps.push({ text: 'Layer backing (right side down), wadding and top; baste and quilt' });
  steps.push({ text: 'Trim, join the binding strips on the diagonal, fold in half and bind' });
  return { title: 'The top', steps, pressing: 'Press row seams in alternate directions so the seams nest; press border seams towards the border.' };
}

function templatesFor(spec: BlockSpec, wedge: WedgeBlock): Template[] {
  const circle = centreCircle(wedge);
  const allowance = wedge.allowance.toNumber('mm');
  const out: Template[] = [
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
  ];
  out.push({
    id: `${spec.id}-${spec.kind === 'plate' ? 'circle' : 'quarter'}`,
    name: spec.kind === 'plate' ? `Block ${spec.id} centre circle` : `Block ${spec.id} corner quarter circle`,
    kind: spec.kind === 'plate' ? 'circle' : 'quarter-circle',
    blockId: spec.id,
    cardRadiusMm: circle.cardRadius.toNumber('mm'),
    fabricRadiusMm: circle.fabricRadius.toNumber('mm'),
    allowanceMm: allowance,
    sizeText: [
      { label: 'card diameter', mm: mm(circle.cardDiameter) },
      { label: 'fabric diameter', mm: mm(circle.fabricDiameter) },
    ],
  });
  return out;
}
