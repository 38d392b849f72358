// From a design to everything the workroom needs before cutting: the finished
// size against the target, each block position and its fabric, every piece to
// cut (shared cut-size maths, seam allowance included) with its count, the
// sewing order with counts, the full-size templates and the finishing sizes.

import { DomainError } from '../errors';
import { Length } from '../measure';
import { RulerStep } from '../rounding';
import { Assignment, BlockSpec, DesignBody, FabricRef, fabricKey } from './design-body';
import { garmentGroupProblems } from './garment-groups';
import { designLayout } from './design-layout';
import { blockKind, type CutShape, type KindCuts } from './kinds';
import { plural, storedLength as L } from './kinds/block-kind';

export { positionCount } from './design-layout';
export { bladeJoins } from './kinds/wedge-kinds';

export type { PieceGroup, DerivedPiece, DerivedPosition, SewingStep, SewingSection, Template, SizeNote, DesignDerivation } from './derivation-types';
import type { DerivedPiece, SewingStep, SewingSection, Template, DesignDerivation } from './derivation-types';


const mm = (l: Length) => l.mm.toString();

/** A block's pieces as its kind cuts them, once the block's units (when it has them) are 1 to 12. */
function blockCuts(spec: BlockSpec, side: Length, opts: { ruler: RulerStep }): KindCuts {
  const field = `block ${spec.id}`;
  const units = spec.units ?? 1;
  if (!Number.isInteger(units) || units < 1 || units > 12) {
    throw new DomainError('out-of-range', `Expected ${field} to have 1 to 12 units; got ${units}.`, `${field} units`);
  }
  return blockKind(spec.kind).cuts(spec, side, opts);
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
  const { byPosition, byPiece } = assignmentLookup(body.assignments);
  const { finished, centre, across, down, positions, layoutPieces } = designLayout(body, pattern, side, ruler);

  // Fabric of each role at each position.
  const specs = new Map(body.blocks.map((b) => [b.id, b]));
  for (const p of positions) {
    const spec = specs.get(p.blockId)!;
    for (const role of blockKind(spec.kind).roles) {
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
    const kind = blockKind(spec.kind);
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
    sewing.push({ title: `Block ${spec.id}, ${spec.name}: ${plural(here.length, 'block')}`, ...kind.sewing(spec, here.length, cuts) });
    if (kind.templates) templates.push(...kind.templates(spec, cuts));
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
