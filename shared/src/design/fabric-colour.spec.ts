import { UNKNOWN_FABRIC_COLOUR, fabricColour, garmentColour, groupStripes, meanColour } from './fabric-colour';

describe('fabric colours', () => {
  it('draws a garment from its colour words, then its description', () => {
    // The word table: navy is #26355d; "pale" mixes 35% toward white.
    expect(garmentColour({ colour: 'Navy', description: 'Knit polo' })).toBe('#26355d');
    expect(garmentColour({ colour: null, description: 'Navy knit polo' })).toBe('#26355d');
    expect(garmentColour({ colour: 'Pale blue', description: 'Oxford shirt' })).toBe(fabricColour('pale blue'));
  });

  it("draws a group in stripes of its garments' colours, in the group's order, not in its first garment's colour", () => {
    const colours: Record<number, string> = { 8: '#9db7d5', 9: '#26355d' };
    expect(groupStripes([9, 8], (id) => colours[id])).toEqual(['#26355d', '#9db7d5']);
    expect(groupStripes([8, 12], (id) => colours[id])).toEqual(['#9db7d5', UNKNOWN_FABRIC_COLOUR]);
    expect(groupStripes([], (id) => colours[id])).toEqual([]);
  });

  it('stands for stripes with their mean where one colour must do', () => {
    // Derived: (0x9d + 0x26) / 2 = 97.5 -> 98 = 0x62; (0xb7 + 0x35) / 2 = 118 = 0x76; (0xd5 + 0x5d) / 2 = 153 = 0x99.
    expect(meanColour(['#9db7d5', '#26355d'])).toBe('#627699');
    expect(meanColour(['#123456'])).toBe('#123456');
    expect(meanColour([])).toBe(UNKNOWN_FABRIC_COLOUR);
  });
});
