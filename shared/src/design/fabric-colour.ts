// A colour to draw a fabric with, from the colour words a maker wrote for it
// ("Pale blue", "Green and cream check"). The first colour word found wins,
// softened by "pale"/"light" and deepened by "dark"; unknown words get a
// steady colour of their own from the text. A group of garments is drawn in
// stripes of its garments' colours, by the app and the printouts alike.

const WORDS: readonly [RegExp, string][] = [
  [/\bnavy\b/, '#26355d'],
  [/\bblue\b/, '#6f93c4'],
  [/\bteal\b/, '#2f7f7a'],
  [/\bgreen\b/, '#4f7a52'],
  [/\bolive\b/, '#707a3a'],
  [/\bred\b/, '#a33b3b'],
  [/\bpink\b/, '#d98ca3'],
  [/\blilac|lavender|purple|violet\b/, '#a48cc4'],
  [/\byellow|mustard\b/, '#e0c25a'],
  [/\borange\b/, '#d9823b'],
  [/\bbrown|tan\b/, '#8a6242'],
  [/\bgr[ae]y\b/, '#9a9a9a'],
  [/\bblack\b/, '#2b2b2b'],
  [/\bcream|natural|calico|ivory\b/, '#efe6cf'],
  [/\bwhite\b/, '#f6f6f2'],
];

function mix(hex: string, toward: number, amount: number): string {
  const n = parseInt(hex.slice(1), 16);
  const ch = [(n >> 16) & 255, (n >> 8) & 255, n & 255].map((c) => Math.round(c + (toward - c) * amount));
  return `#${ch.map((c) => c.toString(16).padStart(2, '0')).join('')}`;
}

/** A drawing colour (#rrggbb) for a fabric described by its colour words and name. */
export function fabricColour(words: string | null | undefined): string {
  const text = (words ?? '').toLowerCase();
  for (const [re, hex] of WORDS) {
    if (re.test(text)) {
      if (/\b(pale|light)\b/.test(text)) return mix(hex, 255, 0.35);
      if (/\bdark|deep\b/.test(text)) return mix(hex, 0, 0.3);
      return hex;
    }
  }
  let h = 0;
  for (const c of text) h = (h * 31 + c.charCodeAt(0)) % 360;
  const hue = h;
  // HSL(hue, 35%, 60%) to hex.
  const s = 0.35;
  const l = 0.6;
  const k = (m: number) => (m + hue / 30) % 12;
  const a = s * Math.min(l, 1 - l);
  const f = (m: number) => Math.round(255 * (l - a * Math.max(-1, Math.min(k(m) - 3, 9 - k(m), 1))));
  return `#${[f(0), f(8), f(4)].map((c) => c.toString(16).padStart(2, '0')).join('')}`;
}

/** The colour a fabric is drawn in when nothing is known of it (a garment a group names that is not found). */
export const UNKNOWN_FABRIC_COLOUR = '#b9a98a';

/** The drawing colour of a garment: from its colour words, then its description. */
export function garmentColour(garment: { colour: string | null; description: string }): string {
  return fabricColour(`${garment.colour ?? ''} ${garment.description}`);
}

/**
 * A group of garments is drawn in stripes, not in the colour of any one of
 * them: one stripe of each garment's colour, in the group's order.
 */
export function groupStripes(garmentIds: readonly number[], colourOf: (garmentId: number) => string | null | undefined): string[] {
  return garmentIds.map((id) => colourOf(id) ?? UNKNOWN_FABRIC_COLOUR);
}

/** One colour standing for stripes where only one can be shown: their mean, channel by channel. */
export function meanColour(colours: readonly string[]): string {
  if (colours.length === 0) return UNKNOWN_FABRIC_COLOUR;
  const channels = colours.map((hex) => {
    const n = parseInt(hex.slice(1), 16);
    return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
  });
  const sums = [0, 1, 2].map((c) => channels.reduce((sum, ch) => sum + ch[c]!, 0));
  return `#${sums.map((s) => Math.round(s / colours.length).toString(16).padStart(2, '0')).join('')}`;
}
