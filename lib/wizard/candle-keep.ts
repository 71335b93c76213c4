// How much of a candle to keep, in words: shared by the engine's headlines and how-to steps and by
// the answer screen, so both say the same thing.

export function fractionWords(k: { min: number; max: number }): string {
  const word = (x: number) => (x <= 0.34 ? 'a third' : x <= 0.5 ? 'a half' : x <= 0.67 ? 'two-thirds' : 'three-quarters');
  return `about ${word(k.min)} to ${word(k.max)}`;
}

/** "keep about a third to a half of this candle". */
export function candleKeepText(k: { min: number; max: number }): string {
  return `keep ${fractionWords(k)} of this candle`;
}
