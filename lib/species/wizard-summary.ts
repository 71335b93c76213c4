import { toWizardSpecies, type SpeciesRecord } from '@/lib/validation/species';
import { techniqueOf, type Technique } from '@/lib/wizard/groups';

// What the wizard does for each group that makes no candles, in the engine's own terms.
const nonPine: Partial<Record<Technique, string>> = {
  'scale-foliage':
    'Scale or needle foliage: the wizard suggests trimming long new shoots with scissors back to a fork that has green beyond it, never shearing or pulling tips off with fingers, and never cutting into the bare inner part of a branch.',
  spruce:
    'Buds along the shoot: the wizard suggests shortening strong new shoots while soft, and cutting hardened ones back to a side bud in late summer or autumn.',
  fir: 'Firs bud less readily: the wizard suggests shortening only strong shoots, to a visible side bud, and leaving weak ones whole.',
  larch: 'Deciduous: the wizard lets long shoots grow out in spring and shortens them to a bud or spur in summer; there are no needles to count.',
  yew: 'Regrows from old wood: the wizard suggests trimming new shoots once they have grown out, in early summer.',
  cedar: 'The wizard suggests shortening long soft shoots to a side shoot or tuft of needles; it has no published source for cedar technique.',
  unknown: 'Candlewise has no sound rule for this group yet, so the wizard suggests no cuts.',
};

/**
 * A plain-language account of how a species' traits steer the wizard's answer. Derived from the
 * traits alone, so it changes when an editor changes them.
 */
export function wizardSummary(rec: SpeciesRecord): string[] {
  const t = rec.traits;
  const out: string[] = [];
  const makesCandles = rec.group === 'pine';
  if (!makesCandles) {
    out.push(
      `This is not a pine: there are no candles and the wizard never suggests decandling. ${nonPine[techniqueOf(toWizardSpecies(rec, 1))] ?? ''}`.trim(),
    );
  } else if (t.flushHabit.value === 'double') {
    out.push(
      'Double flush: on a strong, established tree the wizard may suggest cutting the spring candles in early summer so a second, shorter flush follows. On a weak or newly repotted tree it says to let it grow instead.',
    );
  } else if (t.flushHabit.value === 'polycyclic') {
    out.push(
      'Several growth units a season (polycyclic): new shoots keep coming after the spring candle, so the wizard suggests shortening each as it extends and never removing a candle whole.',
    );
  } else {
    out.push(
      'Single flush: the spring candle is the whole season’s growth, so the wizard suggests pinching or shortening candles and never removing one whole.',
    );
  }
  if (makesCandles && t.shootHabit.value === 'multinodal') {
    out.push('Multinodal spring shoots carry more than one whorl of buds, so the wizard points out that a shortened candle can be cut back to an inner whorl.');
  }
  if (t.feedingNeedleResponse.value === 'strong') {
    out.push(
      'Feeding lengthens its needles strongly: for a tree in refinement the feeding plan holds back spring feeding until the new needles have hardened, then feeds through summer and autumn.',
    );
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
