import { evaluate } from '@/lib/wizard/engine';
import type { WizardSpecies } from '@/lib/validation/species';
import type { ContainerInput, Health, Hemisphere, ShootState, Stage, WizardResult } from '@/lib/wizard/types';
import { addDays, daysBetween, type DayTemps } from './degree-days';
import { expectedShoot, seasonStart, shiftTimeline, shootTimeline, thermalSeason, tropical, type ShootTimeline } from './thermal';

// A tree's plan for the season. The timing comes from thermal time (thermal.ts); WHAT to do on
// each day comes from the wizard engine itself: the plan asks `evaluate` about every day of the
// season year with the shoot state expected that day, and turns the days on which it gives the
// same task into a window. The plan holds no rule of its own about pinching, decandling, pruning,
// thinning or feeding, so it follows whatever rules the engine has.

export const planTasks = ['candle-work', 'decandle', 'prune', 'thin', 'feed', 'repot'] as const;
export type PlanTask = (typeof planTasks)[number];
type PlanBasis = 'degree-days' | 'latitude' | 'observed';

const taskLabels: Record<PlanTask, string> = {
  'candle-work': 'Pinch or shorten candles',
  decandle: 'Decandle',
  prune: 'Prune hardened shoots',
  thin: 'Select buds and thin old needles',
  feed: 'Feed',
  repot: 'Repot, if due',
};

export interface PlanTree {
  stage: Stage;
  health: Health;
  recentlyCollected: boolean;
  backBuds?: boolean;
  repottedThisYear?: boolean;
  container?: ContainerInput;
}

export interface PlanObservation {
  date: string;
  /** A shoot state seen that day. */
  shoot?: ShootState;
  /** A task marked done that day. */
  task?: PlanTask;
}

export interface PlanRecord {
  /** This season's measured days. */
  thisYear: DayTemps[];
  /** Earlier season years, each that year's days. */
  earlierYears: DayTemps[][];
}

export interface PlanInput {
  species: WizardSpecies;
  tree: PlanTree;
  today: string;
  hemisphere: Hemisphere;
  latitude: number;
  record?: PlanRecord | null;
  observations?: PlanObservation[];
}

export interface PlanWindow {
  task: PlanTask;
  label: string;
  from: string;
  to: string;
  basis: PlanBasis;
  reasons: string[];
  /** The date it was marked done, if it was. */
  doneOn: string | null;
}

export interface TreePlan {
  seasonStart: string;
  basis: PlanBasis;
  timeline: ShootTimeline | null;
  degreeDaysToDate: number | null;
  annualDegreeDays: number | null;
  windows: PlanWindow[];
  notes: string[];
}

/** The shoot state a finished task shows was present that day. */
const shootOfTask: Partial<Record<PlanTask, ShootState>> = {
  'candle-work': 'candle-extending',
  decandle: 'needles-hardened',
  prune: 'needles-hardened',
  thin: 'needles-hardened',
};

const taskOfAction = (r: WizardResult): PlanTask | null =>
  r.action === 'pinch' ? 'candle-work' : r.action === 'decandle' || r.action === 'prune' || r.action === 'thin' ? r.action : null;

/** Days to move the modelled timeline so that the observed state holds on the observed day. */
export function anchorShift(tl: ShootTimeline, obs: { date: string; shoot: ShootState }): number {
  const starts: Record<ShootState, string> = {
    'dormant-bud': addDays(tl.candleStart, -365),
    'candle-extending': tl.candleStart,
    'needles-opening': tl.needlesOpen,
    'needles-hardened': tl.hardened,
  };
  const ends: Record<ShootState, string | null> = {
    'dormant-bud': tl.candleStart,
    'candle-extending': tl.needlesOpen,
    'needles-opening': tl.hardened,
    'needles-hardened': null,
  };
  const start = starts[obs.shoot];
  const end = ends[obs.shoot];
  if (obs.date < start) return daysBetween(start, obs.date);
  if (end && obs.date >= end) return daysBetween(end, obs.date) + 1;
  return 0;
}

function latestAnchor(observations: PlanObservation[], from: string, today: string) {
  const seen = observations
    .map((o) => ({ date: o.date, shoot: o.shoot ?? (o.task ? shootOfTask[o.task] : undefined) }))
    .filter((o): o is { date: string; shoot: ShootState } => !!o.shoot && o.date >= from && o.date <= today);
  seen.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
  return seen.at(-1) ?? null;
}

export function planForTree(input: PlanInput): TreePlan {
  const { species, tree, today, hemisphere } = input;
  const latitude = hemisphere === 'south' ? -Math.abs(input.latitude) : Math.abs(input.latitude);
  const start = seasonStart(today, hemisphere);
  const hasRecord = !!input.record && (input.record.thisYear.length > 0 || input.record.earlierYears.some((y) => y.length > 0));
  const notes: string[] = [];
  if (tropical(latitude) && !hasRecord) {
    notes.push('Within the tropics calendar seasons do not apply: ask the wizard about each shoot as you see it.');
    return { seasonStart: start, basis: 'latitude', timeline: null, degreeDaysToDate: null, annualDegreeDays: null, windows: [], notes };
  }

  const thermal = thermalSeason({ start, latitude, thisYear: input.record?.thisYear, earlierYears: input.record?.earlierYears });
  let timeline = shootTimeline(thermal);
  let basis: PlanBasis = hasRecord ? 'degree-days' : 'latitude';
  const anchor = latestAnchor(input.observations ?? [], start, today);
  let shift = 0;
  if (anchor) {
    shift = anchorShift(timeline, anchor);
    if (shift !== 0) {
      timeline = shiftTimeline(timeline, shift);
      basis = 'observed';
      notes.push(`Moved ${Math.abs(shift)} days ${shift < 0 ? 'earlier' : 'later'} by what you saw on ${anchor.date}.`);
    } else {
      basis = 'observed';
      notes.push(`What you saw on ${anchor.date} agrees with the expected timing.`);
    }
  }

  const todayIndex = daysBetween(start, today);
  const degreeDaysToDate =
    hasRecord && thermal.measuredThrough >= 0 ? Math.round(thermal.cumulative[Math.min(thermal.measuredThrough, Math.max(0, todayIndex))] * 10) / 10 : null;

  const timingReason = (task: PlanTask) => {
    const how =
      basis === 'degree-days'
        ? 'the club’s temperature record and its earlier years'
        : basis === 'observed'
          ? 'your own observation of this tree'
          : `a climate estimate for latitude ${Math.abs(latitude)}° (no temperature record yet)`;
    const share =
      task === 'repot'
        ? 'as the buds swell, before the candles extend'
        : 'shoots expected to finish extending at about 41% of the year’s heat sum above +5 °C (“Intra-annual height increment of Pinus sylvestris at high latitudes in Finland”, Tree Physiology 27(9):1347–1353 (2007))';
    return `Timed from ${how}: ${share}.`;
  };

  // Ask the engine about each day of the season year.
  const days: { date: string; tasks: PlanTask[]; result: WizardResult }[] = [];
  for (let i = 0; i < 365; i++) {
    const date = addDays(start, i);
    const ddIndex = Math.min(364, Math.max(0, i - shift));
    const result = evaluate(
      {
        species: species.slug,
        branching: tree.stage === 'refinement' ? 'tertiary' : 'secondary',
        date,
        hemisphere,
        latitude,
        shoot: expectedShoot(timeline, date),
        position: 'beyond-silhouette',
        health: tree.health,
        recentlyCollected: tree.recentlyCollected,
        backBuds: tree.backBuds,
        candleStrength: 'strong',
        repottedThisYear: tree.repottedThisYear,
        degreeDays: Math.round(thermal.cumulative[ddIndex]),
        container: tree.container,
      },
      species,
      { hemisphere, latitude, today: date },
    );
    const tasks: PlanTask[] = [];
    const t = taskOfAction(result);
    if (t) tasks.push(t);
    if (result.fertilizer.feedNow) tasks.push('feed');
    if (tree.stage !== 'recovery' && !tree.repottedThisYear && date >= timeline.budSwell && date < timeline.candleStart) tasks.push('repot');
    days.push({ date, tasks, result });
  }

  // Runs of days with the same task become windows.
  const windows: PlanWindow[] = [];
  for (const task of planTasks) {
    let from = -1;
    for (let i = 0; i <= days.length; i++) {
      const on = i < days.length && days[i].tasks.includes(task);
      if (on && from < 0) from = i;
      if (!on && from >= 0) {
        const first = days[from].result;
        const engineReasons =
          task === 'feed'
            ? [first.fertilizer.window, first.fertilizer.purpose].filter(Boolean)
            : task === 'repot'
              ? ['Repot as the tree comes out of dormancy; pines go first (common practice, no published source). Not in a year you decandle.']
              : first.reasons.slice(0, 3).map((r) => r.text);
        const w: PlanWindow = {
          task,
          label: taskLabels[task],
          from: days[from].date,
          to: days[i - 1].date,
          basis,
          reasons: [timingReason(task), ...engineReasons],
          doneOn: null,
        };
        const done = (input.observations ?? []).filter((o) => o.task === task && o.date >= addDays(w.from, -14) && o.date <= addDays(w.to, 14));
        if (done.length)
          w.doneOn = done
            .map((o) => o.date)
            .sort()
            .at(-1)!;
        windows.push(w);
        from = -1;
      }
    }
  }
  windows.sort((a, b) => (a.from < b.from ? -1 : a.from > b.from ? 1 : a.task < b.task ? -1 : 1));
  return { seasonStart: start, basis, timeline, degreeDaysToDate, annualDegreeDays: Math.round(thermal.annualSum), windows, notes };
}

/** Windows of a plan open now or starting within `days` days, not yet done. */
export function dueSoon(plan: TreePlan, today: string, days = 14): PlanWindow[] {
  const until = addDays(today, days);
  return plan.windows.filter((w) => w.from <= until && w.to >= today && !w.doneOn);
}
