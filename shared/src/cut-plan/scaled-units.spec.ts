import { SCALE, fromSteps, stepsDown, stepsUp } from './scaled-units';

describe('scaled units', () => {
  it('keeps quarter, eighth and sixteenth inch values exact', () => {
    // derived: quarters and eighths are whole thousandths (1/8 = 0.125); an odd
    // sixteenth (0.0625) is not, so it rounds up for a piece and down for a panel.
    expect(stepsUp(6.5)).toBe(6500);
    expect(stepsUp(19.5)).toBe(19500);
    expect(stepsUp(2.125)).toBe(2125); // 2 1/8 in
    expect(stepsUp(1 / 16)).toBe(63); // 0.0625 in -> 0.063 in, rounded up
    expect(stepsDown(1 / 16)).toBe(62);
  });

  it('rounds a piece up and a panel down for metric-derived values', () => {
    // derived: 200 mm = 200 / 25.4 in = 7.874015748... in (inch = 25.4 mm exactly,
    // published: NIST SP 811 appendix B).
    const inches = 200 / 25.4;
    expect(stepsUp(inches)).toBe(7875);
    expect(stepsDown(inches)).toBe(7874);
  });

  it('does not let float noise move a value off its step', () => {
    // derived: 0.1 + 0.2 = 0.30000000000000004 in IEEE 754 doubles.
    expect(stepsUp(0.1 + 0.2)).toBe(300);
    expect(stepsDown(13 / 2 - 1e-12)).toBe(6500);
  });

  it('converts back to the caller unit', () => {
    expect(fromSteps(6500)).toBe(6.5);
    expect(fromSteps(SCALE)).toBe(1);
  });
});
