import { CutPlanInputError } from './cut-plan-input-error';

describe('CutPlanInputError', () => {
  it('carries every problem and a stable code', () => {
    const error = new CutPlanInputError(['piece "a": width must be above 0', 'duplicate panel id "p"']);
    expect(error).toBeInstanceOf(Error);
    expect(error.code).toBe('invalid-cut-plan-input');
    expect(error.problems).toHaveLength(2);
    expect(error.message).toContain('duplicate panel id "p"');
  });
});
