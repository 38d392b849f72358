import Decimal from 'decimal.js';
import { deriveDesign } from '../derive-design';
import { designDrawing } from '../design-drawing';
import { fabricKey, type BlockSpec, type DesignBody } from '../design-body';
import { BLOCK_KIND_MODULES, blockInputsByName, type BlockKind, type BlockParams, type KindInput } from './index';

const inch = (n: number) => new Decimal(n).times('25.4').toString();

// Checked by tsc (shared/tsconfig.json includes the specs), without listing the kinds so a new one needs no change here:
// a stored block's fields are typed by the kinds' inputs, a choice to its options, and a kind to the registry's keys.
export const typedByTheInputs: BlockParams[] = [{ units: 2, method: 'stitch-and-flip', blades: 20, outerRadiusMm: '127', innerRadiusMm: '38.1', meanStripWidthMm: '38.1' }];
// @ts-expect-error a method the flying geese do not offer
export const notAChoice: BlockParams = { method: 'sideways' };
export const aKind: BlockKind = 'flying-geese';
// @ts-expect-error the studio's old key for flying geese is not a kind
export const notAKind: BlockKind = 'flying_geese';

describe('the block kind registry', () => {
  it('lists each kind once, each with a label, roles and a labour line', () => {
    const kinds = BLOCK_KIND_MODULES.map((k) => k.kind);
    expect(new Set(kinds).size).toBe(kinds.length);
    for (const k of BLOCK_KIND_MODULES) {
      expect(k.label.trim()).not.toBe('');
      expect(k.roles.length).toBeGreaterThan(0);
      expect(new Set(k.roles).size).toBe(k.roles.length);
      expect(k.labour.label.trim()).not.toBe('');
      expect(k.labour.minutes).toBeGreaterThan(0);
    }
  });

  it('has kinds that share a field declare it alike (one check for it in the design schema)', () => {
    const check = (i: KindInput) => (i.type === 'count' ? { type: i.type, min: i.min, max: i.max } : i.type === 'choice' ? { type: i.type, options: i.options.map((o) => o.value) } : { type: i.type });
    for (const [name, inputs] of blockInputsByName()) {
      for (const input of inputs) expect([name, check(input)]).toEqual([name, check(inputs[0]!)]);
    }
  });

  it('starts each count and choice inside what it allows', () => {
    for (const k of BLOCK_KIND_MODULES) {
      for (const input of k.inputs) {
        if (input.type === 'count') expect(input.default >= input.min && input.default <= input.max).toBe(true);
        if (input.type === 'choice') expect(input.options.map((o) => o.value)).toContain(input.default);
      }
    }
  });
});

describe('every kind, derived and drawn from the registry', () => {
  // A row of one 12 in block of each kind at its inputs' starting values (a plate's or fan's radii 5 and 1 1/2 in, which
  // derivation needs), each role given a fabric of its own.
  const lengths: Record<string, string> = { outerRadiusMm: inch(5), innerRadiusMm: inch(1.5) };
  const blocks: BlockSpec[] = BLOCK_KIND_MODULES.map((k, i) => ({
    id: 'ABCDEFGHIJKL'[i]!,
    name: k.label,
    kind: k.kind,
    ...Object.fromEntries(k.inputs.flatMap((input) => (input.type !== 'length' ? [[input.name, input.default]] : lengths[input.name] ? [[input.name, lengths[input.name]]] : []))),
  })) as BlockSpec[];
  let stock = 0;
  const assignments = blocks.flatMap((b) => BLOCK_KIND_MODULES.find((k) => k.kind === b.kind)!.roles.map((role) => ({ target: { kind: 'piece' as const, key: `block:${b.id}:${role}` }, fabric: { kind: 'stock' as const, stockId: ++stock } })));
  const body: DesignBody = {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(12 * blocks.length), lengthMm: inch(12) },
    layout: { setting: 'straight', rows: 1, columns: blocks.length, blockMm: inch(12), sashing: null, borders: [] },
    blocks,
    pattern: blocks.map((b) => b.id),
    assignments,
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
    rules: { minimumPerGarment: 0 },
  };
  const d = deriveDesign(body);
  const drawing = designDrawing(body, d);

  it.each(blocks.map((b) => [b.kind, b] as const))('%s: cuts pieces of every role, sews them, and draws every role in its block', (_kind, b) => {
    const roles = BLOCK_KIND_MODULES.find((k) => k.kind === b.kind)!.roles;
    for (const role of roles) expect(d.pieces.filter((p) => p.key === `block:${b.id}:${role}`).reduce((n, p) => n + p.count, 0)).toBeGreaterThan(0);
    expect(d.sewing.find((s) => s.title.startsWith(`Block ${b.id},`))?.steps.length).toBeGreaterThan(0);
    const position = d.positions.find((p) => p.blockId === b.id)!;
    const fills = new Set(drawing.shapes.filter((s) => s.position === position.index).map((s) => s.fill));
    expect(fills).toEqual(new Set(roles.map((role) => fabricKey(assignments.find((a) => a.target.key === `block:${b.id}:${role}`)!.fabric))));
  });
});
