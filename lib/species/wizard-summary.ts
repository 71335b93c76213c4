import type { SpeciesRecord } from '@/lib/validation/species';

/**
 * A plain-language account of how a species' traits steer the wizard's answer. Derived from the
 * traits alone, so it changes when an editor changes them.
 */
export function wizardSummary(rec: SpeciesRecord): string[] {
  const t = rec.traits;
  const out: string[] = [];
  const makesCandles = rec.group === 'pine';
  if (!makesCandles) {
    out.push('This is not a pine: there are no candles, so the wizard never suggests decandling and works with pinching, shortening and thinning shoots.');
  } else if (t.flushHabit.value === 'double') {
    out.push('Double flush: on a strong, established tree the wizard may suggest cutting the spring candles in early summer so a second, shorter flush follows. On a weak or newly repotted tree it says to let it grow instead.');
  } else if (t.flushHabit.value === 'polycyclic') {
    out.push('Several growth units a season (polycyclic): new shoots keep coming after the spring candle, so the wizard suggests shortening each as it extends and never removing a candle whole.');
  } else {
    out.push('Single flush: the spring candle is the whole season’s growth, so the wizard suggests pinching or shortening candles and never removing one whole.');
  }
  if (makesCandles && t.shootHabit.value === 'multinodal') {
    out.push('Multinodal spring shoots carry more than one whorl of buds, so the wizard points out that a shortened candle can be cut back to an inner whorl.');
  }
  if (t.feedingNeedleResponse.value === 'strong') {
    out.push('Feeding lengthens its needles strongly: for a tree in refinement the feeding plan holds back spring feeding until the new needles have hardened, then feeds through summer and autumn.');
  } else if (t.feedingNeedleResponse.value === 'slight') {
    out.push('Feeding barely lengthens its needles: the feeding plan runs from spring through autumn.');
  } else {
    out.push('Feeding lengthens its needles somewhat: the feeding plan eases off while new needles extend on trees in refinement.');
  }
  if (t.vigour.value === 'low') out.push('Low vigour: the wizard leans towards lighter work and waiting a season when the tree is not clearly strong.');
  if (t.vigour.value === 'high') out.push('High vigour: strong areas are worked harder than weak ones to keep the tree in balance.');
  if (t.backBudding.value === 'low') out.push('It buds back poorly: the wizard warns against cutting back beyond the last foliage.');
  if (rec.cautions.length) out.push('Its cautions below are shown with every answer for this species.');
  return out;
}
